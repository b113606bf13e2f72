import { z } from "zod";
import { ApiError, route } from "@/lib/api";
import { requireContext } from "@/lib/session";
import { formulationTemplate, formulationTemplateCsv, materialsTemplate } from "@/lib/spreadsheet/example";
import { fileResponse } from "@/lib/spreadsheet/http";
import { parseQuery } from "@/lib/validations/api";

const querySchema = z.object({ format: z.enum(["xlsx", "csv"], { error: 'format must be "xlsx" or "csv"' }).optional() });

/**
 * GET /api/templates/formulation | /api/templates/materials ?format=xlsx|csv :
 * our import template, filled with an example from the demo scenario.
 */
export const GET = route<{ kind: string }>(async (req, { params }) => {
  await requireContext(req.headers);
  const { kind } = await params;
  const { format = "xlsx" } = parseQuery(req.url, querySchema);
  if (kind === "formulation") {
    if (format === "csv") return fileResponse(formulationTemplateCsv(), "gelwright-formulation-template", "csv");
    return fileResponse(formulationTemplate(), "gelwright-formulation-template", "xlsx");
  }
  if (kind === "materials") return fileResponse(materialsTemplate(format), "gelwright-materials-template", format);
  throw new ApiError(404, "not_found", 'No such template: use "formulation" or "materials".');
});
