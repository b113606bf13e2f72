/**
 * Starting a worker thread from a TypeScript entry, the same way in every way
 * the app runs. Write it as
 *
 *   new Worker(new URL("./my-worker.ts", import.meta.url), workerOptions(import.meta.url, { resourceLimits }))
 *
 * (that literal form is what the bundler recognises). In a build (`next build`,
 * then scripts/server.ts; the development server) the bundler makes the worker
 * its own JavaScript entry and `import.meta.url` is a .js chunk. Run from
 * source (vitest, tsx scripts) both are .ts files, and the worker loads its
 * .ts entry through tsx's require hook, with our path aliases.
 */
import type { WorkerOptions } from "node:worker_threads";

/** `options`, plus tsx's require hook when `callerUrl` (the caller's import.meta.url) is a TypeScript source file. */
export function workerOptions(callerUrl: string, options: WorkerOptions = {}): WorkerOptions {
  if (!/\.tsx?$/.test(new URL(callerUrl).pathname)) return options;
  return { ...options, execArgv: [...(options.execArgv ?? []), "--require", "tsx/cjs"] };
}
