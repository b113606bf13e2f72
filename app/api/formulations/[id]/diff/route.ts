import { diffFormulationRevisions } from "@/db/queries/formulations";
import { NotFoundError } from "@/lib/errors";
import { readQuery } from "@/lib/http/body";
import { route } from "@/lib/http/route";
import { diffQuerySchema } from "@/lib/validations/formulations";

/** What changed between two revisions (?from=1&to=2): inputs and key results. */
export const GET = route<{ id: string }>({ permission: "formulation:readUnreleased" }, async (req, { team, params }) => {
  const { from, to } = readQuery(req, diffQuerySchema);
  const diff = await diffFormulationRevisions(team.id, params.id, from, to);
  if (!diff) throw new NotFoundError("revision");
  return Response.json(diff);
});
