/**
 * An engine worker thread: answers { id, text } messages with
 * { id, reply } (see computeFromText). Started by lib/compute/pool.ts from
 * this source file (lib/worker-threads.ts).
 */
import { parentPort } from "node:worker_threads";
import { computeFromText } from "./from-text";

parentPort?.on("message", (message: { id: number; text: string }) => {
  parentPort?.postMessage({ id: message.id, reply: computeFromText(message.text) });
});
