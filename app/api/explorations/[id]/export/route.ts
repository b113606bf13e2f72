import { getExplorationWithInput } from "@/db/queries/explorations";
import { NotFoundError, RuleError } from "@/lib/errors";
import { planAndRun } from "@/lib/explore/run";
import { numericModel } from "@/lib/formulation/numeric/model";
import { readQuery } from "@/lib/http/body";
import { fileResponse } from "@/lib/http/files";
import { route } from "@/lib/http/route";
import { explorationCsv, explorationWorkbook } from "@/lib/spreadsheet/exploration-sheet";
import { downloadQuerySchema } from "@/lib/validations/query";

/**
 * GET /api/explorations/:id/export?format=xlsx|csv : the saved exploration's
 * points, computed again on the revision's stored input with the numeric path
 * (one row per point, headings with units, an About block). A grid that no
 * longer fits the revision (a draft changed since) is a 422 naming the grid's
 * field; another format is a 422 naming `format`.
 */
export const GET = route<{ id: string }>({ permission: "formulation:readUnreleased" }, async (req, { team, params }) => {
  const { format = "xlsx" } = readQuery(req, downloadQuerySchema);
  const e = await getExplorationWithInput(team.id, params.id);
  if (!e) throw new NotFoundError("exploration");
  const run = planAndRun({ base: e.input, grid: e.grid, outputs: e.outputs, search: e.search ?? undefined, model: numericModel(e.input.materials) });
  if ("message" in run) throw new RuleError("grid_no_longer_fits", `This exploration no longer fits revision ${e.revisionNumber}: ${run.message}`, run.field);
  const exported = {
    formulationName: e.formulationName,
    revisionLabel: `Revision ${e.revisionNumber}`,
    explorationName: e.name,
    base: e.input,
    run,
    search: e.search ?? undefined,
  };
  const base = `${e.formulationName} r${e.revisionNumber} ${e.name}`;
  return format === "csv" ? fileResponse(explorationCsv(exported), base, "csv") : fileResponse(explorationWorkbook(exported), base, "xlsx");
});
