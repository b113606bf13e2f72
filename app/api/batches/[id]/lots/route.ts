import { batchLots } from "@/db/queries/lots";
import { NotFoundError } from "@/lib/errors";
import { readQuery } from "@/lib/http/body";
import { fileResponse } from "@/lib/http/files";
import { route } from "@/lib/http/route";
import { batchTraceCsv, batchTraceWorkbook } from "@/lib/spreadsheet/trace";
import { traceFormatSchema } from "@/lib/validations/lots";

/** GET /api/batches/:id/lots[?format=csv|xlsx] : every lot in the batch, line by line (JSON, or a file with format). */
export const GET = route<{ id: string }>({ permission: "batch:read" }, async (req, { team, params }) => {
  const { format } = readQuery(req, traceFormatSchema);
  const lots = await batchLots(team.id, params.id);
  if (!lots) throw new NotFoundError("batch record");
  if (!format) return Response.json(lots);
  const name = `batch-${params.id.slice(0, 8)}-lots`;
  return fileResponse(format === "csv" ? batchTraceCsv(lots) : batchTraceWorkbook(lots), name, format);
});
