import { NotFoundError } from "@/lib/errors";
import { readQuery } from "@/lib/http/body";
import { fileResponse } from "@/lib/http/files";
import { route } from "@/lib/http/route";
import { formulationTemplate, formulationTemplateCsv, materialsTemplate } from "@/lib/spreadsheet/example";
import { downloadQuerySchema } from "@/lib/validations/query";

/**
 * GET /api/templates/formulation | /api/templates/materials ?format=xlsx|csv :
 * our import template, filled with an example from the demo scenario.
 */
export const GET = route<{ kind: string }>({ access: "member" }, async (req, { params }) => {
  const { format = "xlsx" } = readQuery(req, downloadQuerySchema);
  if (params.kind === "formulation") {
    if (format === "csv") return fileResponse(formulationTemplateCsv(), "gelwright-formulation-template", "csv");
    return fileResponse(formulationTemplate(), "gelwright-formulation-template", "xlsx");
  }
  if (params.kind === "materials") return fileResponse(materialsTemplate(format), "gelwright-materials-template", format);
  throw new NotFoundError("template", 'No such template: use "formulation" or "materials".');
});
