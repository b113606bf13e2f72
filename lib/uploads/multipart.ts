/** Reading a multipart/form-data upload with a size limit checked before the body is read. */
import { readBodyBytes } from "@/lib/http/body";
import { ApiError } from "@/lib/http/errors";
import { FORM_OVERHEAD_BYTES } from "@/lib/server/body-limit";

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
  let body: Uint8Array<ArrayBuffer>;
  try {
    body = await readBodyBytes(req, maxBytes + FORM_OVERHEAD_BYTES, tooLarge);
  } catch (err) {
    if (err instanceof ApiError && err.code === "unreadable_body") {
      throw new ApiError(400, "bad_upload", "The upload could not be read; try again.", { file: "Choose a file." });
    }
    throw err;
  }
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
