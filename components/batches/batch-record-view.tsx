"use client";

import { AttachmentsPanel } from "@/components/attachments/attachments-panel";
import { DownloadLinks } from "@/components/exports/download-links";
import { ErrorPanel } from "@/components/ui/error-panel";
import { Panel } from "@/components/ui/panel";
import { batchUrls, useBatch, type Batch } from "@/lib/client/batches";
import { fmtMass } from "@/lib/format";
import { toleranceWords } from "./batch-deviation";
import { CompositionPanel } from "./composition-panel";
import { RecordLines } from "./record-lines";
import { ResultsPanel } from "@/components/quality/results-panel";

interface BatchRecordViewProps {
  initial: Batch;
  /** Whether the viewer may record weighings and add documents (production, open record). */
  canRecord: boolean;
  /** May enter test results (batch:qc) and acknowledge out-of-specification ones (batch:dispose). */
  quality?: { canEnter: boolean; canAcknowledge: boolean };
}

/** A batch record as read by anyone in the team: lines with deviations, composition made, documents, download. */
export function BatchRecordView({ initial, canRecord, quality }: BatchRecordViewProps) {
  const { data, error, mutate } = useBatch(initial.id, { initial });
  const batch = data ?? initial;
  const res = batch.balanceResolutionGrams;
  const open = batch.state === "open";
  return (
    <div className="flex flex-col gap-4">
      {error ? <ErrorPanel title="Could not refresh this record" message={error.message} onRetry={() => mutate()} /> : null}
      <DownloadLinks links={[{ href: batchUrls.export(batch.id), label: "Batch record (.xlsx)", description: "Download the batch record as a workbook" }]} />
      <p className="num text-sm" data-testid="record-summary">
        {batch.summary.weighed} of {batch.summary.lines} lines weighed ·{" "}
        {batch.summary.outside === 0 ? "no line outside tolerance" : <strong className="text-fail">{batch.summary.outside} outside tolerance</strong>} · tolerance{" "}
        {toleranceWords(batch.toleranceFraction)}, balance resolution {fmtMass(res, res)}
      </p>
      <Panel title="Weighings" id="weighings">
        <RecordLines batch={batch} />
      </Panel>
      <CompositionPanel batch={batch} />
      <ResultsPanel batchId={batch.id} canEnter={quality?.canEnter ?? false} canAcknowledge={quality?.canAcknowledge ?? false} />
      <Panel title="Notes" id="notes">
        <p className="text-sm whitespace-pre-wrap">{batch.notes ?? <span className="text-muted">No notes.</span>}</p>
      </Panel>
      <AttachmentsPanel
        ownerType="batch"
        ownerId={batch.id}
        canChange={canRecord && open}
        defaultKind="coa"
        readOnlyReason={!open ? "This record is closed: its documents can no longer change." : undefined}
      />
    </div>
  );
}
