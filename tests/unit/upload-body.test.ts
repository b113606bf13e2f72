/**
 * readUploadedFile: the multipart body is read with a byte limit, whether or
 * not the request says how long it is. A chunked request (no Content-Length)
 * must not be buffered whole before its size is known.
 */
import { describe, expect, it } from "vitest";
import { ApiError } from "@/lib/http/errors";
import { readUploadedFile } from "@/lib/uploads/multipart";

const MiB = 1024 * 1024;
const BOUNDARY = "----gelwright-test";

/** A multipart body streamed in 64 KiB chunks, `fileBytes` long, with no Content-Length header. */
function chunkedUpload(fileBytes: number): { req: Request; sent: () => number } {
  const head = new TextEncoder().encode(`--${BOUNDARY}\r\nContent-Disposition: form-data; name="file"; filename="big.csv"\r\nContent-Type: text/csv\r\n\r\n`);
  const tail = new TextEncoder().encode(`\r\n--${BOUNDARY}--\r\n`);
  const chunk = new Uint8Array(64 * 1024).fill(65);
  let sent = 0;
  let stage = 0;
  const body = new ReadableStream<Uint8Array>({
    pull(controller) {
      if (stage === 0) {
        stage = 1;
        sent += head.length;
        controller.enqueue(head);
      } else if (sent < fileBytes) {
        sent += chunk.length;
        controller.enqueue(chunk);
      } else if (stage === 1) {
        stage = 2;
        controller.enqueue(tail);
      } else controller.close();
    },
  });
  const req = new Request("http://localhost/api/imports", {
    method: "POST",
    headers: { "content-type": `multipart/form-data; boundary=${BOUNDARY}` },
    body,
    duplex: "half",
  } as RequestInit);
  return { req, sent: () => sent };
}

describe("readUploadedFile", () => {
  it("refuses a chunked body over the limit with 413 after reading little more than the limit", async () => {
    const { req, sent } = chunkedUpload(200 * MiB);
    const err = await readUploadedFile(req, 5 * MiB).then(
      () => null,
      (e: unknown) => e,
    );
    console.log(`chunked 200 MiB upload against a 5 MiB limit: ${(sent() / MiB).toFixed(2)} MiB read before the refusal`);
    expect(err).toBeInstanceOf(ApiError);
    expect((err as ApiError).status).toBe(413);
    expect(sent()).toBeLessThan(6 * MiB);
  });

  it("reads a chunked body under the limit", async () => {
    const { req } = chunkedUpload(1 * MiB);
    const upload = await readUploadedFile(req, 5 * MiB);
    expect(upload.fileName).toBe("big.csv");
    expect(upload.bytes.byteLength).toBe(1 * MiB);
  });
});
