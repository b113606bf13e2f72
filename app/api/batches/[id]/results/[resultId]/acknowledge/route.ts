import { acknowledgeResult } from "@/db/queries/results";
import { readJson } from "@/lib/http/body";
import { route } from "@/lib/http/route";
import { acknowledgeResultSchema } from "@/lib/quality/bodies";

/** POST /api/batches/:id/results/:resultId/acknowledge { note } : a reviewer or admin acknowledges an out-of-specification result. */
export const POST = route<{ id: string; resultId: string }>({ permission: "batch:dispose" }, async (req, { actor, params }) => {
  const { note } = await readJson(req, acknowledgeResultSchema);
  return Response.json(await acknowledgeResult(actor, params.id, params.resultId, note));
});
