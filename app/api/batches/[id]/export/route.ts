import { getBatch } from "@/db/queries/batches";
import { NotFoundError } from "@/lib/errors";
import { fileResponse } from "@/lib/http/files";
import { route } from "@/lib/http/route";
import { batchWorkbook } from "@/lib/spreadsheet/batch-record";

/** GET /api/batches/:id/export : the batch record as .xlsx. */
export const GET = route<{ id: string }>({ permission: "batch:read" }, async (_req, { team, params }) => {
  const batch = await getBatch(team.id, params.id);
  if (!batch) throw new NotFoundError("batch record");
  return fileResponse(batchWorkbook(batch), `${batch.formulationName}-r${batch.revisionNumber}-batch-${batch.id.slice(0, 8)}`, "xlsx");
});
