import "server-only";
import type { Worker } from "node:worker_threads";
import { ApiError, malformedJson } from "@/lib/http/errors";
import { FormulationError } from "@/lib/formulation/errors";
import { settings } from "@/lib/settings";
import { startTypeScriptWorker } from "@/lib/worker-threads";
import { computeFromText, type EngineReply } from "./from-text";

/**
 * Engine worker threads for the calculator route. The engine's work (parse,
 * validate, decimal arithmetic, JSON of the result) runs beside the thread
 * that serves requests, so a large formulation never holds up other users'
 * requests, and the engine's code stays warm in a thread of its own instead
 * of being evicted by the framework's code between two calls.
 */

/** A calculation still running after this long is stopped, and its worker with it. */
export const COMPUTE_TIMEOUT_MS = 10_000;
/** Memory a worker may use before it is stopped (a safety net; a calculation needs a few MB). */
const WORKER_LIMITS = { maxOldGenerationSizeMb: 256, maxYoungGenerationSizeMb: 32 };

export interface EnginePoolOptions {
  /** Worker threads at most (1 or more). */
  size: number;
  /** Starts one worker (the app's runs lib/compute/worker.ts). */
  spawn: () => Worker;
  /** See COMPUTE_TIMEOUT_MS. */
  timeoutMs: number;
}

interface Job {
  resolve: (reply: EngineReply) => void;
  reject: (err: Error) => void;
  timer: ReturnType<typeof setTimeout>;
}

interface Slot {
  worker: Worker;
  jobs: Map<number, Job>;
  gone: boolean;
}

const restarted = () =>
  new ApiError(503, "calculator_restarted", "The calculator had to restart while working on this. Nothing was saved; try again.");

/**
 * A few engine workers, started when first needed. Each calculation goes to
 * the worker with the fewest waiting (a new one while fewer than `size` run
 * and all are busy). A worker that fails, runs out of memory or overruns the
 * time limit is stopped and replaced by the next calculation; what it still
 * had to do is answered with 503.
 */
export class EnginePool {
  private readonly slots: Slot[] = [];
  private nextId = 0;
  /** Workers started so far. */
  started = 0;

  constructor(private readonly options: EnginePoolOptions) {}

  /** Runs computeFromText(text) in a worker. Rejects with a 503 ApiError when the worker is lost. */
  run(text: string): Promise<EngineReply> {
    const slot = this.pick();
    const id = this.nextId++;
    return new Promise<EngineReply>((resolve, reject) => {
      const timer = setTimeout(() => {
        slot.jobs.delete(id);
        const seconds = this.options.timeoutMs / 1000;
        reject(new ApiError(503, "compute_timeout", `The calculation took longer than ${seconds} s and was stopped. Nothing was saved.`));
        this.retire(slot);
      }, this.options.timeoutMs);
      timer.unref();
      slot.jobs.set(id, { resolve, reject, timer });
      slot.worker.postMessage({ id, text });
    });
  }

  /** Workers running now. */
  get size(): number {
    return this.slots.length;
  }

  /** Stops every worker; calculations still waiting get 503. */
  close(): void {
    for (const slot of [...this.slots]) this.retire(slot);
  }

  private pick(): Slot {
    let best: Slot | undefined;
    for (const slot of this.slots) if (!best || slot.jobs.size < best.jobs.size) best = slot;
    if (best && (best.jobs.size === 0 || this.slots.length >= this.options.size)) return best;
    return this.start();
  }

  private start(): Slot {
    const worker = this.options.spawn();
    this.started += 1;
    // The server's own listeners keep the process alive, not an idle engine.
    worker.unref();
    const slot: Slot = { worker, jobs: new Map(), gone: false };
    worker.on("message", (message: { id: number; reply: EngineReply }) => {
      const job = slot.jobs.get(message.id);
      if (!job) return;
      slot.jobs.delete(message.id);
      clearTimeout(job.timer);
      job.resolve(message.reply);
    });
    worker.on("error", (err) => {
      console.error("[compute] engine worker failed:", err instanceof Error ? err.message : err);
      this.retire(slot);
    });
    worker.on("exit", () => this.retire(slot));
    this.slots.push(slot);
    return slot;
  }

  private retire(slot: Slot): void {
    if (slot.gone) return;
    slot.gone = true;
    const index = this.slots.indexOf(slot);
    if (index >= 0) this.slots.splice(index, 1);
    for (const job of slot.jobs.values()) {
      clearTimeout(job.timer);
      job.reject(restarted());
    }
    slot.jobs.clear();
    void slot.worker.terminate();
  }
}

/**
 * Engine threads for /api/compute: GELWRIGHT_COMPUTE_WORKERS (0 to 8; 0
 * computes in the request's thread; see lib/settings.ts for the default).
 */
export function computeWorkerCount(): number {
  return settings().workers.compute;
}

function spawnEngineWorker(): Worker {
  return startTypeScriptWorker(import.meta.url, "./worker.ts", { resourceLimits: WORKER_LIMITS });
}

let pool: EnginePool | undefined;
/** The pool of the previous copy of this module, which the development server's reloads leave behind. */
const shared = globalThis as typeof globalThis & { gelwrightEnginePool?: EnginePool };

/**
 * The result JSON for a calculator request body, or the error to answer
 * with: 400 for a body that is not JSON, the engine's FormulationError
 * (422, naming the field), 503 when the worker was lost.
 */
export async function computeJson(text: string): Promise<string> {
  const size = computeWorkerCount();
  if (size === 0) return unwrap(computeFromText(text));
  if (!pool) {
    // After a reload in development, stop the old copy's workers (they run the old engine).
    shared.gelwrightEnginePool?.close();
    pool = shared.gelwrightEnginePool = new EnginePool({ size, spawn: spawnEngineWorker, timeoutMs: COMPUTE_TIMEOUT_MS });
  }
  return unwrap(await pool.run(text));
}

/** The JSON of a reply, or the error it stands for. */
export function unwrap(reply: EngineReply): string {
  if (reply.ok) return reply.json;
  switch (reply.kind) {
    case "malformed_json":
      throw malformedJson();
    case "formulation":
      throw new FormulationError(reply.code, reply.field, reply.message, reply.issues);
    case "internal":
      throw new Error(`engine: ${reply.message}`);
  }
}
