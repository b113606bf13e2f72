import { getBatchSettings } from "@/db/queries/batches";
import { getRevision } from "@/db/queries/formulations";
import { getTeamSettings } from "@/db/queries/team-settings";
import { NotFoundError } from "@/lib/errors";
import { readQuery } from "@/lib/http/body";
import { fileResponse } from "@/lib/http/files";
import { route } from "@/lib/http/route";
import { batchSheetCsv, revisionWorkbook } from "@/lib/spreadsheet/export-formulation";
import { downloadQuerySchema } from "@/lib/validations/query";

/**
 * GET /api/revisions/:id/export?format=xlsx|csv : the revision's workbook
 * (overview with the coat predictions and costs in the team's currency,
 * batch sheet, coating and VOC, dry composite, thermal check, full input), or
 * its batch sheet (and coating and VOC table) alone as CSV, masses at the
 * team's balance resolution.
 * Production sees released revisions only.
 */
export const GET = route<{ id: string }>({ permission: "formulation:read" }, async (req, { team, params, releasedOnly }) => {
  const { format = "xlsx" } = readQuery(req, downloadQuerySchema);
  const rev = await getRevision(team.id, params.id, { releasedOnly });
  if (!rev) throw new NotFoundError("revision");
  const [{ balanceResolutionGrams }, { currency }] = await Promise.all([getBatchSettings(team.id), getTeamSettings(team.id)]);
  const base = `${rev.formulationName} r${rev.number}`;
  return format === "csv"
    ? fileResponse(batchSheetCsv(rev, { balanceResolutionGrams }), `${base} batch sheet`, "csv")
    : fileResponse(revisionWorkbook(rev, { balanceResolutionGrams, currency }), base, "xlsx");
});
