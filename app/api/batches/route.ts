import { listBatches, startBatch } from "@/db/queries/batches";
import { readJson, route } from "@/lib/api";
import { can } from "@/lib/permissions";
import { batchListQuerySchema } from "@/lib/spreadsheet/api-schemas";
import { requireContext } from "@/lib/session";
import { parseQuery, startBatchBodySchema } from "@/lib/validations/api";

/** GET /api/batches?formulationId=&revisionId=&state= : the team's batch records, newest first. */
export const GET = route(async (req) => {
  const ctx = await requireContext(req.headers, "batch:read");
  return Response.json(await listBatches(ctx.teamId, parseQuery(req.url, batchListQuerySchema)));
});

/** POST /api/batches { revisionId, notes?, balanceResolutionGrams? } : starts a batch from a released revision. */
export const POST = route(async (req) => {
  const ctx = await requireContext(req.headers, "batch:create");
  const body = await readJson(req, startBatchBodySchema);
  const releasedOnly = !can(ctx.role, "formulation:readUnreleased");
  return Response.json(await startBatch(ctx, body.revisionId, { ...body, releasedOnly }), { status: 201 });
});
