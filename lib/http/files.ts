/** Responses that carry a file: .xlsx or CSV, never cached, always downloaded. */
import { safeFileName } from "@/lib/spreadsheet/export-formulation";

export const XLSX_TYPE = "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet";

/**
 * A download response with a safe file name.
 *
 * @example
 * ```ts
 * return fileResponse(bytes, "Visor hard coat HC-3 r2", "xlsx");
 * ```
 */
export function fileResponse(body: Buffer | string, baseName: string, format: "xlsx" | "csv"): Response {
  const name = safeFileName(baseName, format);
  const bytes = typeof body === "string" ? new TextEncoder().encode(body) : new Uint8Array(body);
  return new Response(bytes, {
    headers: {
      "Content-Type": format === "xlsx" ? XLSX_TYPE : "text/csv; charset=utf-8",
      "Content-Disposition": `attachment; filename="${name}"`,
      "Cache-Control": "private, no-store",
      "X-Content-Type-Options": "nosniff",
    },
  });
}
