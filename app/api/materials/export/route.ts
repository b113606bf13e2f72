import { listMaterials } from "@/db/queries/materials";
import { readQuery } from "@/lib/http/body";
import { fileResponse } from "@/lib/http/files";
import { route } from "@/lib/http/route";
import { materialsCsv, materialsWorkbook } from "@/lib/spreadsheet/export-materials";
import { downloadQuerySchema } from "@/lib/validations/query";

/** GET /api/materials/export?format=xlsx|csv : the team's whole materials library in our template. */
export const GET = route({ permission: "material:read" }, async (req, { team }) => {
  const { format = "xlsx" } = readQuery(req, downloadQuerySchema);
  const all = [];
  for (let page = 1; page <= 200; page++) {
    const { rows, total } = await listMaterials(team.id, { page, pageSize: 500, sort: "name" });
    all.push(...rows);
    if (all.length >= total || rows.length === 0) break;
  }
  const base = `${team.name} materials`;
  return format === "csv" ? fileResponse(materialsCsv(all), base, "csv") : fileResponse(materialsWorkbook(all), base, "xlsx");
});
