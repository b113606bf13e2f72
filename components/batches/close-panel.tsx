"use client";

import Link from "next/link";
import type { RefObject } from "react";
import { Alert } from "@/components/ui/alert";
import { Button, buttonClass } from "@/components/ui/button";
import { Field, inputClass } from "@/components/ui/field";
import { Panel } from "@/components/ui/panel";
import { plural } from "@/components/ui/plural";
import type { CloseBatchState } from "./use-close-batch";

interface ClosePanelProps {
  batchId: string;
  lineCount: number;
  counts: { weighed: number; outside: number; missingLot: number };
  state: CloseBatchState;
  /** The close button, where Enter on the last lot number lands. */
  closeRef: RefObject<HTMLButtonElement | null>;
}

/** Notes, what is still missing, and closing the record after one more question. */
export function ClosePanel({ batchId, lineCount, counts, state, closeRef }: ClosePanelProps) {
  const { notesStatus } = state;
  return (
    <Panel title="Close the batch record" id="close">
      <div className="flex flex-col gap-3">
        <Field
          id="batch-notes"
          label="Notes"
          hint="deviations, observations; saved when you leave the field"
          error={notesStatus && !notesStatus.saved ? notesStatus.text : null}
        >
          <textarea
            id="batch-notes"
            rows={3}
            maxLength={5000}
            className={inputClass()}
            value={state.notes}
            onChange={(e) => state.setNotes(e.target.value)}
            onBlur={state.saveNotes}
            aria-describedby="batch-notes-error"
          />
        </Field>
        {notesStatus?.saved ? (
          <p role="status" className="text-xs text-clear">
            {notesStatus.text}
          </p>
        ) : null}
        <ul className="num text-sm">
          <li>
            {counts.weighed} of {lineCount} lines have an actual mass.
          </li>
          <li>
            {counts.missingLot === 0
              ? "Every line that needs one has a lot number."
              : `${plural(counts.missingLot, "line")} without a lot number (water needs none).`}
          </li>
          <li className={counts.outside > 0 ? "font-medium text-fail" : ""}>
            {counts.outside === 0
              ? "No line is outside tolerance."
              : `${plural(counts.outside, "line is", "lines are")} outside tolerance: say why in the notes before closing.`}
          </li>
        </ul>
        {state.confirming ? (
          <Alert tone="caution" role="status" title="Closing is final: the record can no longer change.">
            <div className="mt-1 flex flex-wrap gap-2">
              <Button variant="primary" busy={state.closing} onClick={state.close} autoFocus>
                Close it now
              </Button>
              <Button onClick={() => state.setConfirming(false)} disabled={state.closing}>
                Keep it open
              </Button>
            </div>
          </Alert>
        ) : (
          <div className="flex flex-wrap gap-2">
            <button ref={closeRef} type="button" className={buttonClass("primary")} onClick={() => state.setConfirming(true)}>
              Close the batch record…
            </button>
            <Link href={`/batches/${batchId}`} className="inline-flex items-center px-2 text-sm text-accent underline underline-offset-2">
              View the record
            </Link>
          </div>
        )}
        <div aria-live="assertive">{state.closeMessage ? <Alert tone="fail">{state.closeMessage}</Alert> : null}</div>
      </div>
    </Panel>
  );
}
