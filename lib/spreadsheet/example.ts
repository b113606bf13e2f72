/**
 * Filled examples of our template from the demo scenario, offered for
 * download beside the import, and the demo inputs with reference materials
 * inlined (also used by the round-trip tests).
 */
import { DEMO_FORMULATIONS, demoMaterialRefs, type DemoInput } from "@/db/demo";
import { referenceMaterials } from "@/data/materials";
import type { FormulationInput, Material } from "@/lib/formulation";
import { inputSheets, materialSheets } from "./input-sheets";
import { readMeRows, SHEET } from "./template";
import { buildWorkbook, toCsv } from "./write";

/** A demo input with its reference materials inlined (material ids are reference ids). */
export function demoInput(input: DemoInput): FormulationInput {
  const byId = new Map(referenceMaterials.map((m) => [m.id, m]));
  const materials: Material[] = demoMaterialRefs(input).map((id) => {
    const material = byId.get(id);
    if (!material) throw new Error(`demo data refers to unknown reference material ${id}`);
    return material;
  });
  return { ...input, materials } as FormulationInput;
}

/** Every demo revision's input, with the formulation it belongs to. */
export function demoInputs(): { name: string; project: string; description: string; revision: number; input: FormulationInput }[] {
  return DEMO_FORMULATIONS.flatMap((f) =>
    f.revisions.map((r, index) => ({ name: f.name, project: f.project, description: f.description, revision: index + 1, input: demoInput(r.input) })),
  );
}

function templateSheets() {
  const demo = DEMO_FORMULATIONS[0]!;
  const input = demoInput(demo.revisions[demo.revisions.length - 1]!.input);
  return inputSheets(input, { name: `${demo.name} (example)`, project: demo.project, description: demo.description });
}

/** The formulation template, filled with the demo's released visor hard coat (renamed so it imports as new). */
export function formulationTemplate(): Buffer {
  return buildWorkbook([{ name: SHEET.readMe, header: [], rows: readMeRows("formulation"), widths: [36, 120] }, ...templateSheets()]);
}

/** The same template as one CSV file: the Input table, then each further table after a "[Sheet name]" line. */
export function formulationTemplateCsv(): string {
  return toCsv(templateSheets().map((s) => ({ name: s.name, rows: [...s.header, ...s.rows] })));
}

/** The materials template: the reference materials the demo uses, as an example. */
export function materialsTemplate(format: "xlsx" | "csv"): Buffer | string {
  const examples = referenceMaterials.filter((m) => ["teos", "gptms", "ethanol", "water-di", "hcl-37", "polycarbonate"].includes(m.id));
  const sheets = materialSheets(examples);
  if (format === "csv") return toCsv(sheets.map((s) => ({ name: s.name, rows: [...s.header, ...s.rows] })));
  return buildWorkbook([{ name: SHEET.readMe, header: [], rows: readMeRows("materials"), widths: [36, 120] }, ...sheets]);
}
