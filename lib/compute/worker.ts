/**
 * An engine worker thread: answers { id, text } messages with
 * { id, reply } (see computeFromText). Started by lib/compute/pool.ts; the
 * bundler builds it as its own entry point.
 */
import { parentPort } from "node:worker_threads";
import { computeFromText } from "./from-text";

parentPort?.on("message", (message: { id: number; text: string }) => {
  parentPort?.postMessage({ id: message.id, reply: computeFromText(message.text) });
});
