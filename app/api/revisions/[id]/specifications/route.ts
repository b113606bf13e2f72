import { getSpecifications, replaceSpecifications } from "@/db/queries/specifications";
import { NotFoundError } from "@/lib/errors";
import { readJson } from "@/lib/http/body";
import { route } from "@/lib/http/route";
import { replaceSpecificationsSchema } from "@/lib/quality/bodies";

/** GET /api/revisions/:id/specifications : the revision's test specifications and its version (production: released revisions only). */
export const GET = route<{ id: string }>({ permission: "formulation:read" }, async (_req, { team, params, releasedOnly }) => {
  const found = await getSpecifications(team.id, params.id, { releasedOnly });
  if (!found) throw new NotFoundError("revision");
  return Response.json(found);
});

/** PUT /api/revisions/:id/specifications { specifications, version } : replaces a draft's specifications (409 when not a draft or stale). */
export const PUT = route<{ id: string }>({ permission: "formulation:update" }, async (req, { actor, params }) => {
  const body = await readJson(req, replaceSpecificationsSchema);
  return Response.json(await replaceSpecifications(actor, params.id, body));
});
