/**
 * A stand-in engine worker that speaks the pool's protocol (lib/compute/pool.ts):
 * "wait:N" answers after N ms with its thread id, "exit" ends the thread,
 * "hang" never answers.
 */
import { parentPort, threadId } from "node:worker_threads";

parentPort?.on("message", ({ id, text }: { id: number; text: string }) => {
  if (text === "exit") process.exit(3);
  if (text === "hang") return;
  const ms = Number(text.split(":")[1] ?? 0);
  setTimeout(() => parentPort?.postMessage({ id, reply: { ok: true, json: JSON.stringify({ text, threadId }) } }), ms);
});
