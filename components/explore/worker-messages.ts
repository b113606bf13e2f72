/**
 * Messages between the explorer page and its Web Worker (explore.worker.ts).
 * The figures come back as transferred Float64Arrays, not copies.
 */
import type { Grid, OutputKey, Search } from "@/lib/explore/spec";
import type { ExplorationRun } from "@/lib/explore/types";
import type { FormulationInput } from "@/lib/formulation";

/** Page → worker: compute this grid on this input. */
export interface RunRequest {
  type: "run";
  base: FormulationInput;
  grid: Grid;
  outputs: OutputKey[];
  search?: Search;
}

/** Worker → page: points done so far. */
export interface ProgressMessage {
  type: "progress";
  done: number;
  total: number;
}

/** Worker → page: the run, without its plan (the page planned the same grid). */
export interface DoneMessage {
  type: "done";
  outputs: ExplorationRun["outputs"];
  values: Float64Array[];
  status: Uint8Array;
  refusals: ExplorationRun["refusals"];
  candidates?: ExplorationRun["candidates"];
  /** ms the worker spent computing. */
  ms: number;
}

/** Worker → page: the run could not be made (a message for the screen). */
export interface FailedMessage {
  type: "failed";
  message: string;
}

export type WorkerMessage = ProgressMessage | DoneMessage | FailedMessage;
