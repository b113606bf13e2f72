import { getFormulation } from "@/db/queries/formulations";
import { createExploration, listExplorations } from "@/db/queries/explorations";
import { NotFoundError } from "@/lib/errors";
import { readJson, readQuery } from "@/lib/http/body";
import { route } from "@/lib/http/route";
import { EXPLORATION_BODY_MAX_BYTES, explorationListQuerySchema, saveExplorationSchema } from "@/lib/validations/explorations";

/** GET /api/formulations/:id/explorations(?revision=<id>): the saved explorations, newest first. */
export const GET = route<{ id: string }>({ permission: "formulation:readUnreleased" }, async (req, { team, params }) => {
  const { revision } = readQuery(req, explorationListQuerySchema);
  const f = await getFormulation(team.id, params.id);
  if (!f) throw new NotFoundError("formulation");
  return Response.json({ rows: await listExplorations(team.id, params.id, { revisionId: revision }) });
});

/** POST /api/formulations/:id/explorations: saves an exploration of one of its revisions (the revision is not changed). */
export const POST = route<{ id: string }>({ permission: "formulation:update" }, async (req, { actor, params }) => {
  const body = await readJson(req, saveExplorationSchema, EXPLORATION_BODY_MAX_BYTES);
  return Response.json(await createExploration(actor, params.id, body), { status: 201 });
});
