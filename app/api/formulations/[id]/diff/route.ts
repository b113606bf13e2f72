import { diffFormulationRevisions } from "@/db/queries/formulations";
import { notFound, route } from "@/lib/api";
import { requireContext } from "@/lib/session";
import { diffQuerySchema, parseQuery } from "@/lib/validations/api";

/** What changed between two revisions (?from=1&to=2): inputs and key results. */
export const GET = route<{ id: string }>(async (req, { params }) => {
  const ctx = await requireContext(req.headers, "formulation:readUnreleased");
  const { id } = await params;
  const { from, to } = parseQuery(req.url, diffQuerySchema);
  const diff = await diffFormulationRevisions(ctx.teamId, id, from, to);
  if (!diff) throw notFound("revision");
  return Response.json(diff);
});
