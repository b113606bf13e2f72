/** Reading a multipart/form-data upload with a size limit checked before the body is read. */
import { ApiError } from "@/lib/api";

/** Room for the multipart boundaries and the other fields beside the file. */
const FORM_OVERHEAD_BYTES = 64 * 1024;

/** The request body, or `tooLarge()` as soon as more than `limit` bytes have arrived (the rest is never read). */
async function readBodyUpTo(req: Request, limit: number, tooLarge: () => ApiError): Promise<Uint8Array<ArrayBuffer>> {
  if (!req.body) return new Uint8Array(0);
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    let step: ReadableStreamReadResult<Uint8Array>;
    try {
      step = await reader.read();
    } catch {
      throw new ApiError(400, "bad_upload", "The upload could not be read; try again.", { file: "Choose a file." });
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

export interface UploadedFile {
  fileName: string;
  declaredType: string;
  bytes: Uint8Array;
  fields: Record<string, string>;
}

/**
 * Reads the "file" field and the text fields of a multipart request.
 * 413 when the request or the file is larger than `maxBytes` (checked from
 * Content-Length first, and while the body arrives, so a chunked body is
 * never buffered beyond the limit); 400 when it is not multipart or has no file.
 *
 * @example
 * ```ts
 * const { bytes, fileName, fields } = await readUploadedFile(req, 5 * 1024 * 1024);
 * ```
 */
export async function readUploadedFile(req: Request, maxBytes: number): Promise<UploadedFile> {
  const tooLarge = () =>
    new ApiError(413, "too_large", `The file is larger than ${(maxBytes / 1024 / 1024).toFixed(0)} MB, the most accepted here.`, {
      file: `At most ${(maxBytes / 1024 / 1024).toFixed(0)} MB.`,
    });
  const length = Number(req.headers.get("content-length") ?? 0);
  if (length > maxBytes + FORM_OVERHEAD_BYTES) throw tooLarge();
  if (!(req.headers.get("content-type") ?? "").toLowerCase().startsWith("multipart/form-data")) {
    throw new ApiError(400, "not_multipart", "Send the file as multipart/form-data with a field named “file”.", { file: "Choose a file." });
  }
  // Read at most the limit, also when no Content-Length was sent (a chunked body), before parsing the form.
  const body = await readBodyUpTo(req, maxBytes + FORM_OVERHEAD_BYTES, tooLarge);
  let form: FormData;
  try {
    form = await new Response(body, { headers: { "content-type": req.headers.get("content-type") ?? "" } }).formData();
  } catch {
    throw new ApiError(400, "bad_upload", "The upload could not be read; try again.", { file: "Choose a file." });
  }
  const file = form.get("file");
  if (!file || typeof file === "string") throw new ApiError(400, "no_file", "No file was sent (field “file”).", { file: "Choose a file." });
  if (file.size > maxBytes) throw tooLarge();
  const fields: Record<string, string> = {};
  for (const [key, value] of form.entries()) if (typeof value === "string" && key !== "file") fields[key] = value.slice(0, 1000);
  return {
    fileName: (file.name || "upload").replace(/[\r\n"\\/]/g, "_").slice(0, 255),
    declaredType: file.type,
    bytes: new Uint8Array(await file.arrayBuffer()),
    fields,
  };
}
