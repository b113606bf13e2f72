import { getBatchSettings } from "@/db/queries/batches";
import { getRevision } from "@/db/queries/formulations";
import { NotFoundError } from "@/lib/errors";
import { readQuery } from "@/lib/http/body";
import { fileResponse } from "@/lib/http/files";
import { route } from "@/lib/http/route";
import { batchSheetCsv, revisionWorkbook } from "@/lib/spreadsheet/export-formulation";
import { downloadQuerySchema } from "@/lib/validations/query";

/**
 * GET /api/revisions/:id/export?format=xlsx|csv : the revision's workbook
 * (overview, batch sheet, dry composite, thermal check, full input), or its
 * batch sheet alone as CSV, masses at the team's balance resolution.
 * Production sees released revisions only.
 */
export const GET = route<{ id: string }>({ permission: "formulation:read" }, async (req, { team, params, releasedOnly }) => {
  const { format = "xlsx" } = readQuery(req, downloadQuerySchema);
  const rev = await getRevision(team.id, params.id, { releasedOnly });
  if (!rev) throw new NotFoundError("revision");
  const { balanceResolutionGrams } = await getBatchSettings(team.id);
  const base = `${rev.formulationName} r${rev.number}`;
  return format === "csv"
    ? fileResponse(batchSheetCsv(rev, { balanceResolutionGrams }), `${base} batch sheet`, "csv")
    : fileResponse(revisionWorkbook(rev, { balanceResolutionGrams }), base, "xlsx");
});
