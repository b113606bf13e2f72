import { deleteExploration, getExploration } from "@/db/queries/explorations";
import { NotFoundError } from "@/lib/errors";
import { route } from "@/lib/http/route";

/** GET /api/explorations/:id: one saved exploration. */
export const GET = route<{ id: string }>({ permission: "formulation:readUnreleased" }, async (_req, { team, params }) => {
  const row = await getExploration(team.id, params.id);
  if (!row) throw new NotFoundError("exploration");
  return Response.json(row);
});

/** DELETE /api/explorations/:id: removes a saved exploration (its revision is untouched). */
export const DELETE = route<{ id: string }>({ permission: "formulation:update" }, async (_req, { actor, params }) => {
  await deleteExploration(actor, params.id);
  return new Response(null, { status: 204 });
});
