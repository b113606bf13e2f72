/**
 * Starting a worker thread from its TypeScript source, the same way in every
 * way the app runs (scripts/server.ts after `next build`, the development
 * server, vitest, tsx scripts).
 *
 * Why from source: Next.js's bundler (Turbopack) does not build a
 * `new Worker(new URL("./x.ts", import.meta.url))` as an entry of its own; it
 * copies the .ts file unchanged into .next/server/assets, where its imports
 * no longer resolve. So the worker runs its own source file in the project,
 * through tsx's require hook (which also reads our "@/…" paths from
 * tsconfig.json). Inside a bundle `import.meta.url` is still the module's
 * source location, so the entry is found relative to the caller as usual.
 * The price is tsx's start-up (a few hundred ms) per worker: the engine
 * pool keeps its workers and the spreadsheet reader warms a spare ahead.
 */
import { fileURLToPath } from "node:url";
import { Worker, type WorkerOptions } from "node:worker_threads";

/** The options a TypeScript worker is started with: `options` plus tsx's require hook. */
export function typeScriptWorkerOptions(options: WorkerOptions = {}): WorkerOptions {
  return { ...options, execArgv: [...(options.execArgv ?? []), "--require", "tsx/cjs"] };
}

/**
 * Starts the worker whose TypeScript entry is `entry`, relative to the
 * caller's `import.meta.url`.
 *
 * @example
 * ```ts
 * const worker = startTypeScriptWorker(import.meta.url, "./worker.ts", { resourceLimits: { maxOldGenerationSizeMb: 256 } });
 * ```
 */
export function startTypeScriptWorker(callerUrl: string, entry: string, options: WorkerOptions = {}): Worker {
  return new Worker(fileURLToPath(new URL(entry, callerUrl)), typeScriptWorkerOptions(options));
}
