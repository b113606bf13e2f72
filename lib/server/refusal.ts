/** The front's own answers: one JSON error in the API's shape, after which the connection is closed. */
import type { ServerResponse } from "node:http";

export interface Refusal {
  status: number;
  code: string;
  message: string;
}

/**
 * Sends `refusal` as `{ error: { code, message } }` with "connection: close",
 * so Node hangs up once it is out and the rest of the request body is never read.
 */
export function sendRefusal(res: ServerResponse, refusal: Refusal): void {
  const body = JSON.stringify({ error: { code: refusal.code, message: refusal.message } });
  res.writeHead(refusal.status, {
    "content-type": "application/json",
    "content-length": Buffer.byteLength(body),
    "cache-control": "no-store",
    connection: "close",
  });
  res.end(body);
}
