/**
 * A saved exploration's export (up to EXPLORE_MAX_POINTS points, an .xlsx
 * of 20,000 rows takes seconds to write) runs in a worker thread of its
 * own, never in the thread that serves requests: one worker per export,
 * capped in memory, stopped after EXPORT_LIMITS.ms, and at most
 * EXPORT_LIMITS.concurrent at once (more answer 503).
 */
import { startTypeScriptWorker } from "@/lib/worker-threads";
import { ApiError } from "@/lib/http/errors";
import { RuleError } from "@/lib/errors";
import type { Grid, OutputKey, Search } from "@/lib/explore/spec";
import type { FormulationInput } from "@/lib/formulation";

/** Time, memory and concurrency limits of exports. */
export const EXPORT_LIMITS = { ms: 30_000, concurrent: 2, heapMb: 512 } as const;

/** What the worker computes and writes. */
export interface ExportJob {
  format: "csv" | "xlsx";
  formulationName: string;
  revisionLabel: string;
  explorationName: string;
  base: FormulationInput;
  grid: Grid;
  outputs: OutputKey[];
  search?: Search;
}

/** The worker's answer: the file, or why the grid no longer fits the revision. */
export type ExportReply = { ok: true; bytes: Uint8Array } | { ok: false; field: string; message: string };

let running = 0;

/**
 * The export file's bytes, computed in a worker thread. Rejects with a
 * RuleError (422) when the grid no longer fits the revision, and with an
 * ApiError 503 when the server is busy with other exports, the export ran
 * out of time or memory.
 *
 * @example
 * ```ts
 * const bytes = await exportExploration({ format: "csv", formulationName, revisionLabel: "Revision 3", explorationName, base, grid, outputs });
 * ```
 */
export async function exportExploration(job: ExportJob): Promise<Uint8Array> {
  if (running >= EXPORT_LIMITS.concurrent) {
    throw new ApiError(503, "busy", "Other exports are being prepared; try again in a few seconds.");
  }
  running += 1;
  try {
    return await new Promise<Uint8Array>((resolve, reject) => {
      const worker = startTypeScriptWorker(import.meta.url, "./exploration-export-worker.ts", {
        workerData: job,
        resourceLimits: { maxOldGenerationSizeMb: EXPORT_LIMITS.heapMb, maxYoungGenerationSizeMb: 64, stackSizeMb: 4 },
      });
      let settled = false;
      const finish = (fn: () => void) => {
        if (settled) return;
        settled = true;
        clearTimeout(timer);
        void worker.terminate();
        fn();
      };
      const timer = setTimeout(
        () => finish(() => reject(new ApiError(503, "export_timeout", `Preparing this export took longer than ${EXPORT_LIMITS.ms / 1000} s and was stopped; try again later.`))),
        EXPORT_LIMITS.ms,
      );
      worker.once("message", (reply: ExportReply) =>
        finish(() => (reply.ok ? resolve(reply.bytes) : reject(new RuleError("grid_no_longer_fits", `This exploration no longer fits ${job.revisionLabel.toLowerCase()}: ${reply.message}`, reply.field)))),
      );
      worker.once("error", (err: Error & { code?: string }) => {
        if (err.code !== "ERR_WORKER_OUT_OF_MEMORY") console.error("[export] worker failed:", err);
        finish(() => reject(new ApiError(503, "export_failed", "The export could not be prepared (it needed too much memory or failed); nothing was changed. Try again later.")));
      });
      worker.once("exit", (code) => finish(() => reject(new ApiError(503, "export_failed", `The export stopped unexpectedly (code ${code}); try again later.`))));
    });
  } finally {
    running -= 1;
  }
}
