import { getRevision } from "@/db/queries/formulations";
import { saveDraft } from "@/db/queries/revisions";
import { NotFoundError } from "@/lib/errors";
import { readJson } from "@/lib/http/body";
import { route } from "@/lib/http/route";
import { saveDraftSchema } from "@/lib/validations/formulations";

/** A revision with its result and reviews; production sees released revisions only. */
export const GET = route<{ id: string }>({ permission: "formulation:read" }, async (_req, { team, params, releasedOnly }) => {
  const rev = await getRevision(team.id, params.id, { releasedOnly });
  if (!rev) throw new NotFoundError("revision");
  return Response.json(rev);
});

/** Saves a draft; the body carries the version it was read at (409 when stale). */
export const PUT = route<{ id: string }>({ permission: "formulation:update" }, async (req, { actor, params }) => {
  const body = await readJson(req, saveDraftSchema);
  return Response.json(await saveDraft(actor, params.id, body));
});
