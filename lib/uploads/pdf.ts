/** Checking that an upload is a PDF by its content. */

/** Most accepted for a safety data sheet or certificate of analysis: 10 MB. */
export const MAX_PDF_BYTES = 10 * 1024 * 1024;

/**
 * Why bytes are not an acceptable PDF, or null when they are: the file must
 * start with the PDF header "%PDF-" and carry the end-of-file marker "%%EOF"
 * near its end (ISO 32000-1, 7.5.2 and 7.5.5).
 *
 * @example
 * ```ts
 * pdfProblem(new TextEncoder().encode("%PDF-1.7\n…\n%%EOF\n")); // null
 * ```
 */
export function pdfProblem(bytes: Uint8Array): string | null {
  if (bytes.byteLength === 0) return "The file is empty.";
  const head = Buffer.from(bytes.subarray(0, 5)).toString("latin1");
  if (head !== "%PDF-") return "This file is not a PDF (its content does not start with a PDF header). Upload the safety data sheet or certificate as a PDF.";
  const tail = Buffer.from(bytes.subarray(Math.max(0, bytes.byteLength - 2048))).toString("latin1");
  if (!tail.includes("%%EOF")) return "This PDF is incomplete or damaged (no end-of-file marker). Download it again from the supplier and upload it.";
  return null;
}
