/** The materials library as .xlsx or CSV, in the template the import reads. */
import type { Material } from "@/lib/formulation";
import { materialSheets } from "./input-sheets";
import { readMeRows, SHEET } from "./template";
import { buildWorkbook, toCsv } from "./write";

/** The library as a workbook: Read me, Materials, Material sources. */
export function materialsWorkbook(materials: readonly Material[]): Buffer {
  return buildWorkbook([{ name: SHEET.readMe, header: [], rows: readMeRows("materials"), widths: [36, 120] }, ...materialSheets(materials)]);
}

/** The library as CSV: the Materials table, then a [Material sources] table. */
export function materialsCsv(materials: readonly Material[]): string {
  return toCsv(materialSheets(materials).map((s) => ({ name: s.name, rows: [...s.header, ...s.rows] })));
}
