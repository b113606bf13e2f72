"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { BalanceSelect } from "@/components/results/balance-select";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Field, inputClass } from "@/components/ui/field";
import { Panel } from "@/components/ui/panel";
import { startBatch } from "@/lib/client/batches";
import { errorMessage } from "@/lib/client/fetcher";
import { useInvalidate } from "@/lib/client/invalidate";
import { BALANCE_RESOLUTIONS, DEFAULT_BALANCE_RESOLUTION } from "@/lib/format";
import { toleranceWords } from "./batch-deviation";
import { BatchList } from "./batch-list";

interface StartBatchPanelProps {
  revisionId: string;
  revisionNumber: number;
  /** The team's batch settings. */
  toleranceFraction: number;
  balanceResolutionGrams: number;
  canStart: boolean;
}

/** Starts a batch record from a released revision, and lists the revision's records. */
export function StartBatchPanel({ revisionId, revisionNumber, toleranceFraction, balanceResolutionGrams, canStart }: StartBatchPanelProps) {
  const router = useRouter();
  const invalidate = useInvalidate();
  const initialResolution = (BALANCE_RESOLUTIONS as readonly number[]).includes(balanceResolutionGrams) ? balanceResolutionGrams : DEFAULT_BALANCE_RESOLUTION;
  const [resolution, setResolution] = useState(initialResolution);
  const [notes, setNotes] = useState("");
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<string | null>(null);

  async function start() {
    setBusy(true);
    setMessage(null);
    try {
      const created = await startBatch({ revisionId, notes: notes.trim() || null, balanceResolutionGrams: resolution });
      void invalidate("batches");
      router.push(`/batches/${created.id}/weigh`);
    } catch (err) {
      setMessage(`Not started: ${errorMessage(err)}`);
      setBusy(false);
    }
  }

  return (
    <Panel title="Batch records of this revision" id="batch-records" className="no-print">
      <div className="flex flex-col gap-3">
        <BatchList revisionId={revisionId} canRecord={canStart} empty={`No batch has been recorded from revision ${revisionNumber} yet.`} />
        {canStart ? (
          <div className="flex flex-col gap-2 border-t border-rule pt-3">
            <p className="text-sm text-muted">
              Record a batch as you make it: actual masses and lot numbers line by line, checked against a tolerance of {toleranceWords(toleranceFraction)} of each target.
            </p>
            <div className="flex flex-wrap items-end gap-3">
              <BalanceSelect value={resolution} onChange={setResolution} />
              <Field id="start-notes" label="Notes" hint="optional, e.g. batch lot number or balance id" className="min-w-[14rem] flex-1">
                <input id="start-notes" className={inputClass()} value={notes} maxLength={5000} onChange={(e) => setNotes(e.target.value)} />
              </Field>
              <Button variant="primary" onClick={start} busy={busy}>
                Start a batch record
              </Button>
            </div>
            <div aria-live="assertive">{message ? <Alert tone="fail">{message}</Alert> : null}</div>
          </div>
        ) : null}
      </div>
    </Panel>
  );
}
