import { formulationCharts } from "@/db/queries/charts";
import { NotFoundError } from "@/lib/errors";
import { route } from "@/lib/http/route";

/**
 * GET /api/formulations/:id/charts : the formulation's control charts — per
 * numeric specification the batch results with the I-MR chart, run rules and
 * Cpk; per material line the weighing deviation (%). Production sees only a
 * formulation with a released revision, and only its released revisions' batches.
 */
export const GET = route<{ id: string }>({ permission: "batch:read" }, async (_req, { team, params, releasedOnly }) => {
  const charts = await formulationCharts(team.id, params.id, { releasedOnly });
  if (!charts) throw new NotFoundError("formulation");
  return Response.json(charts);
});
