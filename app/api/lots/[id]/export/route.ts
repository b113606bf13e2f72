import { listLotAdjustments } from "@/db/queries/lot-adjustments";
import { getLot } from "@/db/queries/lots";
import { NotFoundError } from "@/lib/errors";
import { readQuery } from "@/lib/http/body";
import { fileResponse } from "@/lib/http/files";
import { route } from "@/lib/http/route";
import { lotTraceCsv, lotTraceWorkbook } from "@/lib/spreadsheet/trace";
import { traceFormatSchema } from "@/lib/validations/lots";

/** GET /api/lots/:id/export?format=csv|xlsx : every batch that used the lot (for a supplier recall) and its stock adjustments. */
export const GET = route<{ id: string }>({ permission: "lot:read" }, async (req, { team, params }) => {
  const { format = "xlsx" } = readQuery(req, traceFormatSchema);
  const lot = await getLot(team.id, params.id);
  if (!lot) throw new NotFoundError("material lot");
  const adjustments = (await listLotAdjustments(team.id, params.id))?.rows ?? [];
  const trace = { ...lot, adjustments };
  const name = `lot-${lot.materialName}-${lot.supplierLot}-batches`;
  return fileResponse(format === "csv" ? lotTraceCsv(trace) : lotTraceWorkbook(trace), name, format);
});
