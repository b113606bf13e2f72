/**
 * Running an exploration: every point of a plan through a NumericModel, the
 * chosen figures kept by output and point, then the target search. The
 * asynchronous form computes in chunks and yields to the event loop between
 * them, so a Web Worker can take a cancel message. Pure TypeScript.
 */
import type { FormulationInput } from "../formulation/input-schema";
import type { NumericEvaluator, NumericModel } from "../formulation/numeric/figures";
import { isPointRefusal, knobPlan, pointInput, pointKnobs as knobsAt, type KnobPlan } from "./apply";
import { isPlanError, planGrid } from "./grid";
import { evaluatorReader, outputReader, type EvaluatorReader, type OutputReader } from "./outputs";
import { bestCandidates, searchOutputs } from "./search";
import type { Grid, OutputKey, Search } from "./spec";
import { POINT_STATUSES, type ExplorationRun, type GridPlan, type PlanError } from "./types";

/** What a run needs. */
export interface RunOptions {
  /** The revision's input the plan was made over. */
  base: FormulationInput;
  plan: GridPlan;
  /** Figures to keep, in order; a search's figures missing here are appended. */
  outputs: OutputKey[];
  /** The figures of one point: numericModel (fast) or decimalModel (the reference). */
  model: NumericModel;
  search?: Search;
}

/** A run that can be cancelled and reports its progress. */
export interface AsyncRunOptions extends RunOptions {
  /** Aborting it stops the run between chunks; the promise then rejects with an AbortError. */
  signal?: AbortSignal;
  /** Called after each chunk with points done and the total. */
  onProgress?: (done: number, total: number) => void;
  /** Points per chunk (default 250). */
  chunk?: number;
}

const REFUSED = POINT_STATUSES.indexOf("refused");
/** Read once (an imported binding is a getter where modules are compiled one by one). */
const pointKnobs = knobsAt;
const STATUS_INDEX: Record<string, number> = { clear: 0, caution: 1, fail: 2 };

/** Points computed between two yields to the event loop, unless the caller says otherwise. */
export const DEFAULT_CHUNK = 250;

/** The prepared numeric path of a run: the model's evaluator, the plan's knobs and where each output is read. */
interface Prepared {
  evaluator: NumericEvaluator;
  knobs: KnobPlan;
  values: Float64Array;
  /** Per output: its slot in evaluator.figures, or −1 when `reads[o]` computes it. */
  slots: Int32Array;
  reads: ((evaluator: NumericEvaluator) => number)[];
  /** True when every output is a slot (no phase fraction, no |mismatch|). */
  slotsOnly: boolean;
  /** Scratch: the figures of up to BLOCK points, output by output (BLOCK numbers per output). */
  block: Float64Array;
}

interface RunState {
  run: ExplorationRun;
  readers: OutputReader[];
  options: RunOptions;
  prepared?: Prepared;
}

function prepared(options: RunOptions, outputs: readonly string[]): Prepared | undefined {
  if (!options.model.prepare) return undefined;
  const knobs = knobPlan(options.base, options.plan);
  const evaluator = options.model.prepare(options.base, knobs.knobs);
  const readers: EvaluatorReader[] = outputs.map(evaluatorReader);
  return {
    evaluator,
    knobs,
    values: new Float64Array(knobs.knobs.length),
    slots: Int32Array.from(readers, (r) => ("slot" in r ? r.slot : -1)),
    slotsOnly: readers.every((r) => "slot" in r),
    reads: readers.map((r) => ("read" in r ? r.read : () => Number.NaN)),
    block: new Float64Array(BLOCK * outputs.length),
  };
}

function start(options: RunOptions): RunState {
  const outputs = [...options.outputs];
  if (options.search) for (const key of searchOutputs(options.search)) if (!outputs.includes(key)) outputs.push(key);
  const count = options.plan.count;
  const fast = prepared(options, outputs);
  // the prepared path writes every point of every column (NaN where refused); the other path only computed ones
  const values = outputs.map(() => (fast ? new Float64Array(count) : new Float64Array(count).fill(Number.NaN)));
  const run: ExplorationRun = { plan: options.plan, outputs, values, status: new Uint8Array(count).fill(REFUSED), refusals: [] };
  return { run, readers: outputs.map(outputReader), options, prepared: fast };
}

/** Points whose figures are gathered before they are copied into the run's columns (one copy per column per block). */
const BLOCK = 64;

/** Computes points [from, to) into the run with the model's prepared evaluator: numbers in, numbers out. */
function computePrepared(state: RunState, p: Prepared, from: number, to: number): void {
  const { run, options } = state;
  const { evaluator, values, slots, reads, block } = p;
  const figures = evaluator.figures;
  const columns = run.values;
  const outputs = columns.length;
  for (let start = from; start < to; start += BLOCK) {
    const end = Math.min(to, start + BLOCK);
    for (let point = start, j = 0; point < end; point++, j++) {
      const refusal = pointKnobs(options.base, options.plan, p.knobs, point, values);
      const status = refusal ? -1 : evaluator.evaluate(values);
      if (status < 0) {
        run.refusals.push({ point, code: refusal ? refusal.code : evaluator.refusal.code, field: refusal ? refusal.field : evaluator.refusal.field });
        for (let o = 0, at = j; o < outputs; o++, at += BLOCK) block[at] = Number.NaN;
        continue;
      }
      run.status[point] = status;
      if (p.slotsOnly) for (let o = 0, at = j; o < outputs; o++, at += BLOCK) block[at] = figures[slots[o]!]!;
      else {
        for (let o = 0, at = j; o < outputs; o++, at += BLOCK) {
          const slot = slots[o]!;
          block[at] = slot >= 0 ? figures[slot]! : reads[o]!(evaluator);
        }
      }
    }
    // column by column: a run's columns are far apart in memory, a block is not
    for (let o = 0; o < outputs; o++) {
      const column = columns[o]!;
      for (let point = start, at = o * BLOCK; point < end; point++, at++) column[point] = block[at]!;
    }
  }
}

/** Computes points [from, to) into the run. */
function computeRange(state: RunState, from: number, to: number): void {
  if (state.prepared) {
    computePrepared(state, state.prepared, from, to);
    return;
  }
  const { run, readers, options } = state;
  for (let p = from; p < to; p++) {
    const input = pointInput(options.base, options.plan, p);
    if (isPointRefusal(input)) {
      run.refusals.push({ point: p, code: input.code, field: input.field });
      continue;
    }
    const outcome = options.model.evaluate(input);
    if (!outcome.ok) {
      run.refusals.push({ point: p, code: outcome.code, field: outcome.field });
      continue;
    }
    const figures = outcome.figures;
    run.status[p] = STATUS_INDEX[figures.thermalStatus] ?? REFUSED;
    for (let o = 0; o < readers.length; o++) run.values[o]![p] = readers[o]!(figures);
  }
}

function finish(state: RunState): ExplorationRun {
  if (state.options.search) state.run.candidates = bestCandidates(state.run, state.options.search);
  return state.run;
}

/**
 * Runs every point of a plan at once (tests, the server's export, small grids).
 *
 * @returns values[o][p] for each output (search figures appended), the status of each point,
 *   the refusals with the engine's code and field, and the candidates when a search was given
 * @example
 * ```ts
 * const run = runExplorationSync({ base: input, plan, outputs: ["refractiveIndex"], model: decimalModel(input.materials) });
 * run.values[0][0]; // the index at the first point
 * ```
 */
export function runExplorationSync(options: RunOptions): ExplorationRun {
  const state = start(options);
  computeRange(state, 0, options.plan.count);
  return finish(state);
}

/** The error a cancelled run rejects with (name "AbortError", like fetch's). */
export function abortError(): Error {
  const error = new Error("the exploration was cancelled");
  error.name = "AbortError";
  return error;
}

/**
 * A way to wait for the next macrotask: a MessageChannel where there is one (no 4 ms clamp of nested
 * timers in browsers), else setTimeout 0. `close` releases the channel so Node can exit.
 */
function macrotasks(): { next: () => Promise<void>; close: () => void } {
  if (typeof MessageChannel === "undefined") {
    return { next: () => new Promise((resolve) => setTimeout(resolve, 0)), close: () => undefined };
  }
  const channel = new MessageChannel();
  const waiting: (() => void)[] = [];
  channel.port1.onmessage = () => waiting.shift()?.();
  return {
    next: () =>
      new Promise<void>((resolve) => {
        waiting.push(resolve);
        channel.port2.postMessage(null);
      }),
    close: () => {
      channel.port1.close();
      channel.port2.close();
    },
  };
}

/**
 * Runs every point of a plan in chunks, yielding to the event loop (a macrotask) between chunks so
 * that a Web Worker can receive a cancel message and the page stays responsive.
 *
 * @returns the same run as runExplorationSync
 * @throws an Error named "AbortError" when `signal` is aborted (checked before every chunk)
 * @example
 * ```ts
 * const controller = new AbortController();
 * const run = await runExploration({ base, plan, outputs, model, signal: controller.signal, onProgress: (done, total) => bar(done / total) });
 * ```
 */
export async function runExploration(options: AsyncRunOptions): Promise<ExplorationRun> {
  const chunk = Math.max(1, Math.floor(options.chunk ?? DEFAULT_CHUNK));
  const total = options.plan.count;
  const state = start(options);
  const tasks = macrotasks();
  try {
    for (let done = 0; done < total; ) {
      if (options.signal?.aborted) throw abortError();
      const next = Math.min(total, done + chunk);
      computeRange(state, done, next);
      done = next;
      options.onProgress?.(done, total);
      if (done < total) await tasks.next();
    }
    if (options.signal?.aborted) throw abortError();
    return finish(state);
  } finally {
    tasks.close();
  }
}

/**
 * Plans a stored grid over a revision and runs it at once: what an export route needs to turn a saved
 * exploration (grid, outputs, search) back into rows. A grid that can no longer be planned over the
 * revision gives its PlanError.
 *
 * @example
 * ```ts
 * const run = planAndRun({ base: revision.input, grid: saved.grid, outputs: saved.outputs, search: saved.search, model: decimalModel(revision.input.materials) });
 * if ("message" in run) return Response.json({ field: run.field, message: run.message }, { status: 422 });
 * ```
 */
export function planAndRun(options: Omit<RunOptions, "plan"> & { grid: Grid }): ExplorationRun | PlanError {
  const plan = planGrid(options.grid, options.base);
  if (isPlanError(plan)) return plan;
  return runExplorationSync({ ...options, plan });
}
