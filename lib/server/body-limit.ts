/**
 * Byte limits on request bodies, enforced by the HTTP front while the bytes
 * arrive, before Next.js, better-auth or any of our handlers sees the request.
 * A declared Content-Length over the limit is refused at once; a chunked body
 * is counted as it comes in and cut off at the limit, so no body larger than
 * its route's limit is ever held in memory.
 */
import type { IncomingMessage, ServerResponse } from "node:http";
import { sendRefusal } from "./refusal";
import { MAX_PDF_BYTES } from "@/lib/uploads/pdf";
import { IMPORT_LIMITS } from "@/lib/spreadsheet/template";

/** Room for the multipart boundaries and the other fields beside an uploaded file. */
export const FORM_OVERHEAD_BYTES = 64 * 1024;

/** The most a JSON body to one of our API routes may hold (the calculator's largest formulation fits many times over). */
export const MAX_JSON_BODY_BYTES = 1_000_000;

/** Sign-in, sign-up, password reset and the other sign-in library routes: a few short fields. */
export const MAX_AUTH_BODY_BYTES = 64 * 1024;

/** Anything else (pages take no bodies). */
export const MAX_OTHER_BODY_BYTES = 64 * 1024;

/** After the limit is passed, this much more is read and thrown away so the client can read our answer; beyond it the connection is closed. */
export const DISCARD_AFTER_LIMIT_BYTES = 4 * 1024 * 1024;

/**
 * The byte limit for a request's body.
 *
 * @example bodyLimitFor("POST", "/api/imports") // 5,308,416 (5 MB file + 64 kB of form)
 */
export function bodyLimitFor(method: string, pathname: string): number {
  if (method === "GET" || method === "HEAD") return 0;
  if (pathname === "/api/imports") return IMPORT_LIMITS.maxBytes + FORM_OVERHEAD_BYTES;
  if (pathname === "/api/attachments") return MAX_PDF_BYTES + FORM_OVERHEAD_BYTES;
  if (pathname.startsWith("/api/auth/")) return MAX_AUTH_BODY_BYTES;
  if (pathname.startsWith("/api/")) return MAX_JSON_BODY_BYTES;
  return MAX_OTHER_BODY_BYTES;
}

type Push = (chunk: unknown, encoding?: BufferEncoding) => boolean;

/**
 * Holds `req` to `limit` bytes. Returns false when the declared length is
 * already over it (the front answers 413 itself; do not hand the request on);
 * otherwise counts the bytes as Node's HTTP parser pushes them into the
 * request stream. Bytes past the limit are never pushed into the stream, so
 * nothing downstream buffers them. A sender at most DISCARD_AFTER_LIMIT_BYTES
 * over is read to the end (and the bytes dropped) before the 413, so that a
 * browser or fetch that is still sending sees the answer; a larger one is
 * answered at once and hung up on.
 */
export function limitBody(req: IncomingMessage, res: ServerResponse, limit: number): boolean {
  const declared = req.headers["content-length"];
  if (declared !== undefined && Number(declared) > limit) {
    if (Number(declared) - limit <= DISCARD_AFTER_LIMIT_BYTES) {
      req.on("data", () => undefined);
      req.on("end", () => refuse(req, res, limit));
    } else {
      refuse(req, res, limit);
    }
    return false;
  }
  const chunked = declared === undefined && req.headers["transfer-encoding"] !== undefined;
  if (!chunked) return true; // Node's parser stops at Content-Length; no body when neither is sent.
  let seen = 0;
  let over = false;
  const push = req.push.bind(req) as Push;
  (req as unknown as { push: Push }).push = (chunk, encoding) => {
    if (chunk === null || chunk === undefined) {
      // The end of the body: the handler never sees it when the body was too large.
      if (!over) return push(chunk, encoding);
      refuse(req, res, limit);
      return true;
    }
    seen += (chunk as Buffer).length;
    if (seen > limit + DISCARD_AFTER_LIMIT_BYTES) {
      refuse(req, res, limit);
      return true;
    }
    if (over || seen > limit) {
      over = true;
      return true;
    }
    return push(chunk, encoding);
  };
  return true;
}

function refuse(req: IncomingMessage, res: ServerResponse, limit: number): void {
  if (res.headersSent) {
    // Answered already (413 sent, or the handler began its answer): hang up.
    req.socket?.destroy();
    return;
  }
  // With "connection: close" Node closes the socket once the answer is out;
  // what the client still sends is dropped (see limitBody), never buffered.
  sendRefusal(res, { status: 413, code: "too_large", message: `The request body is larger than ${limit} bytes, the most this address accepts.` });
}
