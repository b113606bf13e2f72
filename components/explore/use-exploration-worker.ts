"use client";

import { useCallback, useEffect, useRef, useState } from "react";
import type { Grid, OutputKey, Search } from "@/lib/explore/spec";
import type { ExplorationRun, GridPlan } from "@/lib/explore/types";
import type { FormulationInput } from "@/lib/formulation";
import type { RunRequest, WorkerMessage } from "./worker-messages";

export type RunPhase = "idle" | "running" | "done" | "cancelled" | "failed";

export interface ExplorationState {
  phase: RunPhase;
  done: number;
  total: number;
  run: ExplorationRun | null;
  /** The grid and search of the shown run (what Save stores). */
  grid: Grid | null;
  search: Search | null;
  message: string | null;
  /** ms from start to the figures back on the page. */
  ms: number | null;
}

export interface StartArgs {
  base: FormulationInput;
  grid: Grid;
  plan: GridPlan;
  outputs: OutputKey[];
  search?: Search;
}

const IDLE: ExplorationState = { phase: "idle", done: 0, total: 0, run: null, grid: null, search: null, message: null, ms: null };

const spawn = (): Worker => new Worker(new URL("./explore.worker.ts", import.meta.url), { type: "module" });

/**
 * Runs explorations in a Web Worker: progress as it goes, cancel by
 * terminating the worker, the figures rebuilt into an ExplorationRun with the
 * page's own plan of the same grid. A worker is started with the page (its
 * code loaded before the first Run) and kept for the next run; a cancelled
 * or failed one is replaced.
 */
export function useExplorationWorker(): ExplorationState & { start: (args: StartArgs) => void; cancel: () => void } {
  const [state, setState] = useState<ExplorationState>(IDLE);
  const worker = useRef<Worker | null>(null);
  const busy = useRef(false);

  const drop = useCallback(() => {
    worker.current?.terminate();
    worker.current = null;
    busy.current = false;
  }, []);

  const ready = useCallback((): Worker => {
    worker.current ??= spawn();
    return worker.current;
  }, []);

  useEffect(() => {
    ready();
    return drop;
  }, [ready, drop]);

  const start = useCallback(
    ({ base, grid, plan, outputs, search }: StartArgs) => {
      if (busy.current) drop();
      const started = performance.now();
      const w = ready();
      busy.current = true;
      setState((s) => ({ ...s, phase: "running", done: 0, total: plan.count, message: null }));
      w.onmessage = (event: MessageEvent<WorkerMessage>) => {
        if (worker.current !== w) return;
        const m = event.data;
        if (m.type === "progress") {
          setState((s) => ({ ...s, done: m.done, total: m.total }));
        } else if (m.type === "done") {
          busy.current = false;
          const run: ExplorationRun = { plan, outputs: m.outputs, values: m.values, status: m.status, refusals: m.refusals, candidates: m.candidates };
          setState({ phase: "done", done: plan.count, total: plan.count, run, grid, search: search ?? null, message: null, ms: performance.now() - started });
        } else {
          drop();
          setState((s) => ({ ...s, phase: "failed", message: m.message }));
        }
      };
      w.onerror = (event) => {
        if (worker.current !== w) return;
        drop();
        setState((s) => ({ ...s, phase: "failed", message: `The exploration stopped: ${event.message || "the worker failed"}` }));
      };
      const request: RunRequest = { type: "run", base, grid, outputs, search };
      w.postMessage(request);
    },
    [drop, ready],
  );

  const cancel = useCallback(() => {
    if (!busy.current) return;
    drop();
    ready();
    setState((s) => ({ ...s, phase: "cancelled", message: `Stopped after ${s.done.toLocaleString("en")} of ${s.total.toLocaleString("en")} points; nothing was kept from this run.` }));
  }, [drop, ready]);

  return { ...state, start, cancel };
}
