"use client";

import { Button } from "@/components/ui/button";
import type { RunPhase } from "./use-exploration-worker";

interface RunProgressProps {
  phase: RunPhase;
  done: number;
  total: number;
  message: string | null;
  ms: number | null;
  onCancel: () => void;
}

/** The progress bar of a running exploration with its Cancel button, and how the last run ended. */
export function RunProgress({ phase, done, total, message, ms, onCancel }: RunProgressProps) {
  const percent = total > 0 ? Math.round((done / total) * 100) : 0;
  return (
    <div className="flex flex-col gap-2" aria-live="polite" data-testid="run-state" data-phase={phase}>
      {phase === "running" ? (
        <div className="flex flex-wrap items-center gap-3">
          <div
            role="progressbar"
            aria-label="Points computed"
            aria-valuemin={0}
            aria-valuemax={total}
            aria-valuenow={done}
            aria-valuetext={`${done.toLocaleString("en")} of ${total.toLocaleString("en")} points`}
            className="h-3 w-72 overflow-hidden rounded border border-rule bg-paper"
          >
            <div className="h-full bg-accent transition-[width]" style={{ width: `${percent}%` }} />
          </div>
          <span className="num text-sm">
            {done.toLocaleString("en")} of {total.toLocaleString("en")} points ({percent} %)
          </span>
          <Button variant="danger" onClick={onCancel}>
            Cancel the run
          </Button>
        </div>
      ) : null}
      {phase === "done" && ms !== null ? (
        <p className="num text-sm text-muted">
          {total.toLocaleString("en")} points computed in {Math.round(ms).toLocaleString("en")} ms.
        </p>
      ) : null}
      {(phase === "cancelled" || phase === "failed") && message ? (
        <p role={phase === "failed" ? "alert" : undefined} className={phase === "failed" ? "text-sm text-fail" : "text-sm"}>
          {message}
        </p>
      ) : null}
    </div>
  );
}
