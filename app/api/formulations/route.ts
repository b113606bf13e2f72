import { createFormulation, listFormulations } from "@/db/queries/formulations";
import { readJson, readQuery } from "@/lib/http/body";
import { route } from "@/lib/http/route";
import { createFormulationSchema, formulationListQuerySchema } from "@/lib/validations/formulations";

/** The team's formulations, paged, sorted and filtered in SQL. */
export const GET = route({ permission: "formulation:read" }, async (req, { team, releasedOnly }) => {
  const query = readQuery(req, formulationListQuerySchema);
  return Response.json(await listFormulations(team.id, { ...query, releasedOnly }));
});

/** A new formulation with its first draft revision (409 naming `name` when the team has the name). */
export const POST = route({ permission: "formulation:create" }, async (req, { actor }) => {
  const body = await readJson(req, createFormulationSchema);
  return Response.json(await createFormulation(actor, body), { status: 201 });
});
