import { z } from "zod";
import { listMaterials } from "@/db/queries/materials";
import { route } from "@/lib/api";
import { requireContext } from "@/lib/session";
import { materialsWorkbook, materialsCsv } from "@/lib/spreadsheet/export-materials";
import { fileResponse } from "@/lib/spreadsheet/http";
import { parseQuery } from "@/lib/validations/api";

const querySchema = z.object({ format: z.enum(["xlsx", "csv"], { error: 'format must be "xlsx" or "csv"' }).optional() });

/** GET /api/materials/export?format=xlsx|csv : the team's whole materials library in our template. */
export const GET = route(async (req) => {
  const ctx = await requireContext(req.headers, "material:read");
  const { format = "xlsx" } = parseQuery(req.url, querySchema);
  const all = [];
  for (let page = 1; page <= 200; page++) {
    const { rows, total } = await listMaterials(ctx.teamId, { page, pageSize: 500, sort: "name" });
    all.push(...rows);
    if (all.length >= total || rows.length === 0) break;
  }
  const base = `${ctx.teamName} materials`;
  return format === "csv" ? fileResponse(materialsCsv(all), base, "csv") : fileResponse(materialsWorkbook(all), base, "xlsx");
});
