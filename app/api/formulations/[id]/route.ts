import { getFormulation } from "@/db/queries/formulations";
import { notFound, route } from "@/lib/api";
import { can } from "@/lib/permissions";
import { requireContext } from "@/lib/session";

export const GET = route<{ id: string }>(async (req, { params }) => {
  const ctx = await requireContext(req.headers, "formulation:read");
  const { id } = await params;
  const f = await getFormulation(ctx.teamId, id, { releasedOnly: !can(ctx.role, "formulation:readUnreleased") });
  if (!f) throw notFound("formulation");
  return Response.json(f);
});
