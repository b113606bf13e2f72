"use client";

import useSWR from "swr";
import { AttachmentsPanel } from "@/components/attachments/attachments-panel";
import { DownloadLinks } from "@/components/exports/download-links";
import { ROLE_WORDS } from "@/components/results/words";
import { TD, TDN, TH, THN } from "@/components/results/table";
import { ErrorPanel } from "@/components/ui/error-panel";
import { Panel } from "@/components/ui/panel";
import { fetcher } from "@/lib/client/fetcher";
import { fmtDateTime, fmtMass, fmtPercent } from "@/lib/format";
import { deviationWords, ToleranceBadge } from "./batch-words";
import { CompositionPanel } from "./composition-panel";
import type { BatchDto } from "./types";

interface BatchRecordViewProps {
  initial: BatchDto;
  /** Whether the viewer may record weighings and add documents (production, open record). */
  canRecord: boolean;
}

/** A batch record as read by anyone in the team: lines with deviations, composition made, documents, download. */
export function BatchRecordView({ initial, canRecord }: BatchRecordViewProps) {
  const { data, error, mutate } = useSWR<BatchDto>(`/api/batches/${initial.id}`, fetcher, { fallbackData: initial });
  const batch = data ?? initial;
  const res = batch.balanceResolutionGrams;
  const open = batch.state === "open";
  return (
    <div className="flex flex-col gap-4">
      {error ? <ErrorPanel title="Could not refresh this record" message={error.message} onRetry={() => mutate()} /> : null}
      <DownloadLinks links={[{ href: `/api/batches/${batch.id}/export`, label: "Batch record (.xlsx)", description: "Download the batch record as a workbook" }]} />
      <p className="num text-sm" data-testid="record-summary">
        {batch.summary.weighed} of {batch.summary.lines} lines weighed ·{" "}
        {batch.summary.outside === 0 ? "no line outside tolerance" : <strong className="text-fail">{batch.summary.outside} outside tolerance</strong>} · tolerance ±
        {fmtPercent(batch.toleranceFraction, batch.toleranceFraction * 100 < 1 ? 1 : 0)}, balance resolution {fmtMass(res, res)}
      </p>
      <Panel title="Weighings" id="weighings">
        <div className="overflow-x-auto">
          <table className="w-full text-sm" data-testid="record-lines">
            <caption className="sr-only">Weighings of this batch, in order of addition</caption>
            <thead>
              <tr className="border-b border-rule">
                <th scope="col" className={TH}>
                  #
                </th>
                <th scope="col" className={TH}>
                  Material
                </th>
                <th scope="col" className={THN}>
                  Target mass
                </th>
                <th scope="col" className={THN}>
                  Actual mass
                </th>
                <th scope="col" className={THN}>
                  Deviation
                </th>
                <th scope="col" className={TH}>
                  Tolerance
                </th>
                <th scope="col" className={TH}>
                  Lot number
                </th>
                <th scope="col" className={TH}>
                  Weighed
                </th>
              </tr>
            </thead>
            <tbody>
              {batch.lines.map((l) => (
                <tr key={l.index} className={`border-b border-rule/60 last:border-0 ${l.deviation?.outside ? "bg-fail-soft/40" : ""}`}>
                  <td className={`${TD} num`}>{l.index + 1}</td>
                  <td className={TD}>
                    <span className="font-medium">{l.name ?? l.materialId}</span>
                    <span className="block text-xs text-muted">{l.role ? ROLE_WORDS[l.role] : ""}</span>
                  </td>
                  <td className={TDN}>{fmtMass(l.targetGrams, res)}</td>
                  <td className={`${TDN} font-semibold`}>{fmtMass(l.actualGrams, res)}</td>
                  <td className={TDN}>{l.deviation ? deviationWords(l.deviation, res) : "–"}</td>
                  <td className={TD}>
                    <ToleranceBadge deviation={l.deviation} toleranceFraction={batch.toleranceFraction} resolution={res} />
                  </td>
                  <td className={`${TD} font-mono text-xs`}>{l.lotNumber ?? (l.role === "water" ? "not needed" : "–")}</td>
                  <td className={`${TD} num text-xs whitespace-nowrap text-muted`}>
                    {l.at ? fmtDateTime(l.at) : "–"}
                    {l.initials ? ` · ${l.initials}` : ""}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </Panel>
      <CompositionPanel batch={batch} />
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
