import { listBatches, startBatch } from "@/db/queries/batches";
import { readJson, readQuery } from "@/lib/http/body";
import { route } from "@/lib/http/route";
import { batchListQuerySchema, startBatchSchema } from "@/lib/validations/batches";

/** GET /api/batches?formulationId=&revisionId=&state= : the team's batch records, newest first. */
export const GET = route({ permission: "batch:read" }, async (req, { team }) => {
  return Response.json(await listBatches(team.id, readQuery(req, batchListQuerySchema)));
});

/** POST /api/batches { revisionId, notes?, balanceResolutionGrams? } : starts a batch from a released revision. */
export const POST = route({ permission: "batch:create" }, async (req, { actor, releasedOnly }) => {
  const body = await readJson(req, startBatchSchema);
  return Response.json(await startBatch(actor, body.revisionId, { ...body, releasedOnly }), { status: 201 });
});
