import { getRevision, saveDraft } from "@/db/queries/formulations";
import { notFound, readJson, route } from "@/lib/api";
import { can } from "@/lib/permissions";
import { requireContext } from "@/lib/session";
import { saveDraftSchema } from "@/lib/validations/api";

export const GET = route<{ id: string }>(async (req, { params }) => {
  const ctx = await requireContext(req.headers, "formulation:read");
  const { id } = await params;
  const rev = await getRevision(ctx.teamId, id, { releasedOnly: !can(ctx.role, "formulation:readUnreleased") });
  if (!rev) throw notFound("revision");
  return Response.json(rev);
});

/** Saves a draft; the body carries the version it was read at (409 when stale). */
export const PUT = route<{ id: string }>(async (req, { params }) => {
  const ctx = await requireContext(req.headers, "formulation:update");
  const { id } = await params;
  const body = await readJson(req, saveDraftSchema);
  return Response.json(await saveDraft(ctx, id, body));
});
