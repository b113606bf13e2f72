import { enterResult, listResults } from "@/db/queries/results";
import { NotFoundError } from "@/lib/errors";
import { readJson } from "@/lib/http/body";
import { route } from "@/lib/http/route";
import { enterResultSchema } from "@/lib/quality/bodies";
import { notifyOutOfSpec } from "@/lib/quality/notify-results";

/** GET /api/batches/:id/results : the batch's specifications, results and disposition. */
export const GET = route<{ id: string }>({ permission: "batch:read" }, async (_req, { team, params }) => {
  const found = await listResults(team.id, params.id);
  if (!found) throw new NotFoundError("batch record");
  return Response.json(found);
});

/** POST /api/batches/:id/results { specId, value, instrument? } : enters a result (409 once the batch is disposed); mails the reviewers when out of specification. */
export const POST = route<{ id: string }>({ permission: "batch:qc" }, async (req, { actor, params }) => {
  const body = await readJson(req, enterResultSchema);
  const entered = await enterResult(actor, params.id, body);
  await notifyOutOfSpec(actor.teamId, entered);
  return Response.json({ id: entered.id, outOfSpec: entered.outOfSpec }, { status: 201 });
});
