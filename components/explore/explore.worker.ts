/**
 * The explorer's Web Worker: plans the grid, builds the numeric model of the
 * revision's materials once, runs every point (posting progress) and hands
 * the figures back as transferred buffers. The page cancels a run by
 * terminating the worker.
 */
import { isPlanError, planGrid } from "@/lib/explore/grid";
import { runExploration } from "@/lib/explore/run";
import { numericModel } from "@/lib/formulation/numeric/model";
import type { FailedMessage, RunRequest, WorkerMessage } from "./worker-messages";

/** The worker's global scope, typed by hand (the project's lib is the DOM's). */
interface WorkerScope {
  postMessage(message: WorkerMessage, transfer: Transferable[]): void;
  onmessage: ((event: MessageEvent<RunRequest>) => void) | null;
}

const scope = self as unknown as WorkerScope;

function post(message: WorkerMessage, transfer: Transferable[] = []): void {
  scope.postMessage(message, transfer);
}

scope.onmessage = async (event: MessageEvent<RunRequest>) => {
  const request = event.data;
  if (request?.type !== "run") return;
  const started = performance.now();
  try {
    const plan = planGrid(request.grid, request.base);
    if (isPlanError(plan)) {
      post({ type: "failed", message: plan.message });
      return;
    }
    const model = numericModel(request.base.materials);
    const run = await runExploration({
      base: request.base,
      plan,
      outputs: request.outputs,
      model,
      search: request.search,
      // About 20 progress reports a run: enough for the bar, few re-renders of the page.
      chunk: Math.max(250, Math.ceil(plan.count / 20)),
      onProgress: (done: number, total: number) => post({ type: "progress", done, total }),
    });
    const transfer: Transferable[] = [...run.values.map((v) => v.buffer as ArrayBuffer), run.status.buffer as ArrayBuffer];
    post(
      {
        type: "done",
        outputs: run.outputs,
        values: run.values,
        status: run.status,
        refusals: run.refusals,
        candidates: run.candidates,
        ms: performance.now() - started,
      },
      transfer,
    );
  } catch (error) {
    const failed: FailedMessage = { type: "failed", message: error instanceof Error ? `The exploration stopped: ${error.message}` : "The exploration stopped." };
    post(failed);
  }
};
