import { z } from "zod";
import { getRevision } from "@/db/queries/formulations";
import { notFound, route } from "@/lib/api";
import { can } from "@/lib/permissions";
import { requireContext } from "@/lib/session";
import { batchSheetCsv, revisionWorkbook } from "@/lib/spreadsheet/export-formulation";
import { fileResponse } from "@/lib/spreadsheet/http";
import { parseQuery } from "@/lib/validations/api";

const querySchema = z.object({ format: z.enum(["xlsx", "csv"], { error: 'format must be "xlsx" or "csv"' }).optional() });

/**
 * GET /api/revisions/:id/export?format=xlsx|csv : the revision's workbook
 * (overview, batch sheet, dry composite, thermal check, full input), or its
 * batch sheet alone as CSV. Production sees released revisions only.
 */
export const GET = route<{ id: string }>(async (req, { params }) => {
  const ctx = await requireContext(req.headers, "formulation:read");
  const { id } = await params;
  const { format = "xlsx" } = parseQuery(req.url, querySchema);
  const rev = await getRevision(ctx.teamId, id, { releasedOnly: !can(ctx.role, "formulation:readUnreleased") });
  if (!rev) throw notFound("revision");
  const base = `${rev.formulationName} r${rev.number}`;
  return format === "csv"
    ? fileResponse(batchSheetCsv(rev), `${base} batch sheet`, "csv")
    : fileResponse(revisionWorkbook(rev), base, "xlsx");
});
