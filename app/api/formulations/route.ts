import { createFormulation, listFormulations } from "@/db/queries/formulations";
import { readJson, route } from "@/lib/api";
import { can } from "@/lib/permissions";
import { requireContext } from "@/lib/session";
import { createFormulationSchema, formulationListQuerySchema, parseQuery } from "@/lib/validations/api";

/** The team's formulations, paged, sorted and filtered in SQL. */
export const GET = route(async (req) => {
  const ctx = await requireContext(req.headers, "formulation:read");
  const query = parseQuery(req.url, formulationListQuerySchema);
  const releasedOnly = !can(ctx.role, "formulation:readUnreleased");
  return Response.json(await listFormulations(ctx.teamId, { ...query, releasedOnly }));
});

/** A new formulation with its first draft revision. */
export const POST = route(async (req) => {
  const ctx = await requireContext(req.headers, "formulation:create");
  const body = await readJson(req, createFormulationSchema);
  const created = await createFormulation(ctx, body);
  return Response.json(created, { status: 201 });
});
