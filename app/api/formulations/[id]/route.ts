import { getFormulation } from "@/db/queries/formulations";
import { NotFoundError } from "@/lib/errors";
import { route } from "@/lib/http/route";

/** A formulation with its revisions; production sees it only with a released revision. */
export const GET = route<{ id: string }>({ permission: "formulation:read" }, async (_req, { team, params, releasedOnly }) => {
  const f = await getFormulation(team.id, params.id, { releasedOnly });
  if (!f) throw new NotFoundError("formulation");
  return Response.json(f);
});
