/** Reading request bodies within a byte limit: raw bytes, text, and JSON checked by a zod schema. */
import type { ZodType } from "zod";
import { MAX_JSON_BODY_BYTES } from "@/lib/server/body-limit";
import { ApiError, malformedJson, unreadableBody } from "./errors";

/**
 * Reads a request body as bytes, throwing `tooLarge()` as soon as more than
 * `limit` bytes have arrived (the rest is never read). The HTTP front,
 * lib/server/body-limit.ts, has already held the body to its route's limit;
 * this is the route's own, possibly smaller, one, and holds also where the
 * app is reached some other way.
 */
export async function readBodyBytes(req: Request, limit: number, tooLarge: () => ApiError): Promise<Uint8Array<ArrayBuffer>> {
  if (Number(req.headers.get("content-length") ?? 0) > limit) throw tooLarge();
  if (!req.body) return new Uint8Array(0);
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    let step: ReadableStreamReadResult<Uint8Array>;
    try {
      step = await reader.read();
    } catch {
      throw unreadableBody();
    }
    if (step.done) break;
    total += step.value.byteLength;
    if (total > limit) {
      void reader.cancel().catch(() => undefined);
      throw tooLarge();
    }
    chunks.push(step.value);
  }
  const out = new Uint8Array(total);
  let offset = 0;
  for (const chunk of chunks) {
    out.set(chunk, offset);
    offset += chunk.byteLength;
  }
  return out;
}

/** Reads a request body as text, refusing more than `maxBytes` with 413 while it streams in. */
export async function readText(req: Request, maxBytes = MAX_JSON_BODY_BYTES): Promise<string> {
  const tooLarge = () => new ApiError(413, "too_large", `The request body is larger than ${maxBytes} bytes.`);
  return Buffer.from(await readBodyBytes(req, maxBytes, tooLarge)).toString("utf8");
}

/** Reads and validates a JSON body: 413 when too large, 400 when not JSON, 422 when invalid. */
export async function readJson<T>(req: Request, schema: ZodType<T>, maxBytes = MAX_JSON_BODY_BYTES): Promise<T> {
  const text = await readText(req, maxBytes);
  let data: unknown;
  try {
    data = text.length ? JSON.parse(text) : {};
  } catch {
    throw malformedJson();
  }
  return schema.parse(data);
}

/** Parses a URL's search parameters with a schema (422 naming the parameter on a bad value). */
export function readQuery<T>(req: Request, schema: ZodType<T>): T {
  return schema.parse(Object.fromEntries(new URL(req.url).searchParams.entries()));
}
