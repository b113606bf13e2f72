import { getBatch } from "@/db/queries/batches";
import { notFound, route } from "@/lib/api";
import { batchWorkbook } from "@/lib/spreadsheet/batch-record";
import { safeFileName } from "@/lib/spreadsheet/export-formulation";
import { requireContext } from "@/lib/session";

const XLSX_TYPE = "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet";

/** GET /api/batches/:id/export : the batch record as .xlsx. */
export const GET = route<{ id: string }>(async (req, { params }) => {
  const ctx = await requireContext(req.headers, "batch:read");
  const { id } = await params;
  const batch = await getBatch(ctx.teamId, id);
  if (!batch) throw notFound("batch record");
  const bytes = batchWorkbook(batch);
  const name = safeFileName(`${batch.formulationName}-r${batch.revisionNumber}-batch-${batch.id.slice(0, 8)}`, "xlsx");
  return new Response(new Uint8Array(bytes), {
    headers: {
      "Content-Type": XLSX_TYPE,
      "Content-Disposition": `attachment; filename="${name}"`,
      "Cache-Control": "private, no-store",
    },
  });
});
