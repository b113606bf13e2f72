import { dispositionStatus, disposeBatch } from "@/db/queries/dispositions";
import { NotFoundError } from "@/lib/errors";
import { readJson } from "@/lib/http/body";
import { route } from "@/lib/http/route";
import { disposeSchema } from "@/lib/validations/lots";

/** GET /api/batches/:id/disposition : the disposition, or what blocks a release. */
export const GET = route<{ id: string }>({ permission: "batch:read" }, async (_req, { team, actor, params }) => {
  const status = await dispositionStatus(team.id, params.id, actor.userId);
  if (!status) throw new NotFoundError("batch record");
  return Response.json(status);
});

/**
 * POST /api/batches/:id/disposition { disposition, justification?, acknowledgedDeviations?: [{ lineIndex, note }] } :
 * releases or rejects a closed batch (403 for someone who made it; 422 with the blocking items; 409 when a lot is short).
 */
export const POST = route<{ id: string }>({ permission: "batch:dispose" }, async (req, { actor, params }) => {
  const body = await readJson(req, disposeSchema);
  return Response.json(await disposeBatch(actor, params.id, body));
});
