/**
 * The fields engine v2 added, through the sheets: modifier materials and the
 * Modifiers sheet, the carried solvent by name, the two precursor flags, heat
 * deflection and inert degradation onset, the water conventions, and each
 * step's stage and atmosphere; old sheets without any of them; bad cells
 * located by row and column. Expected values are the reference data itself
 * (identity), no arithmetic.
 */
import { describe, expect, it } from "vitest";
import { referenceMaterial, referenceMaterials } from "@/data/materials";
import type { FormulationInput, Material } from "@/lib/formulation";
import { materialsWorkbook } from "@/lib/spreadsheet/export-materials";
import { inputSheets, materialSheets } from "@/lib/spreadsheet/input-sheets";
import { previewFormulationImport } from "@/lib/spreadsheet/import-formulation";
import { previewMaterialsImport, type LibraryEntry } from "@/lib/spreadsheet/import-materials";
import { readUpload } from "@/lib/spreadsheet/read";
import { FORMULATION_INPUT_SHEETS, MATERIAL_COLUMNS, MATERIALS_INPUT_SHEETS, SHEET, STEP_COLUMNS } from "@/lib/spreadsheet/template";
import type { Cell, ImportProblem } from "@/lib/spreadsheet/types";
import { buildWorkbook, type SheetSpec } from "@/lib/spreadsheet/write";

let counter = 0;
const newId = () => `new-${++counter}`;
const errors = (problems: ImportProblem[]) => problems.filter((p) => p.level === "error");
const strip = (m: Material) => JSON.parse(JSON.stringify({ ...m, id: undefined })) as unknown;

async function materialsPreview(sheets: SheetSpec[], library: LibraryEntry[] = []) {
  const parsed = await readUpload(buildWorkbook(sheets), "m.xlsx", { wanted: MATERIALS_INPUT_SHEETS, defaultSheet: SHEET.materials });
  return previewMaterialsImport(parsed.sheets, library, newId);
}
async function formulationPreview(sheets: SheetSpec[], library: LibraryEntry[]) {
  const parsed = await readUpload(buildWorkbook(sheets), "f.xlsx", { wanted: FORMULATION_INPUT_SHEETS, defaultSheet: SHEET.input });
  return previewFormulationImport(parsed.sheets, library, new Set(), newId);
}
const libraryOf = (materials: Material[]): LibraryEntry[] => materials.map((m) => ({ id: m.id, name: m.name, casNumber: m.casNumber ?? null, material: m }));

describe("materials library sheets with the engine v2 fields", () => {
  it("exports and imports every reference material unchanged, the carried solvent by name to the new solvent's id", async () => {
    const parsed = await readUpload(materialsWorkbook(referenceMaterials), "library.xlsx", { wanted: MATERIALS_INPUT_SHEETS, defaultSheet: SHEET.materials });
    const preview = previewMaterialsImport(parsed.sheets, [], newId);
    expect(errors(preview.problems)).toEqual([]);
    const byName = new Map(preview.materials.map((p) => [p.name, p]));
    for (const reference of referenceMaterials) {
      const back = byName.get(reference.name)!;
      const expected = reference.solventId ? { ...reference, solventId: byName.get(referenceMaterial(reference.solventId).name)!.id } : reference;
      expect(strip(back.material), reference.name).toEqual(strip(expected));
    }
    const zr = byName.get(referenceMaterial("zr-propoxide-70").name)!.material;
    expect(zr.solventId).toBe(byName.get(referenceMaterial("1-propanol").name)!.id);
    expect(zr.fastHydrolysing).toBe(true);
    expect(byName.get(referenceMaterial("acac").name)!.material.modifier).toEqual(referenceMaterial("acac").modifier);
    expect(byName.get(referenceMaterial("triethyl-phosphate").name)!.material.moistureSensitive).toBe(false);
    expect(byName.get(referenceMaterial("polycarbonate").name)!.material.thermal?.heatDeflectionC).toBe(132);
    expect(byName.get(referenceMaterial("peg-2000").name)!.material.thermal?.degradationOnsetInertC).toBe(340);
  });

  it("links a carried solvent named in the file to the team's library material", async () => {
    const zr = referenceMaterial("zr-propoxide-70");
    const library = libraryOf([{ ...referenceMaterial("1-propanol"), id: "team-propanol" }]);
    const preview = await materialsPreview(materialSheets([zr]), library);
    expect(errors(preview.problems)).toEqual([]);
    expect(preview.materials[0]!.material.solventId).toBe("team-propanol");
  });

  it("names the row and cell of a bad flag, an unknown carried solvent and a carried material that is not a solvent", async () => {
    const flagColumn = MATERIAL_COLUMNS.findIndex((c) => c.path === "fastHydrolysing");
    const solventColumn = MATERIAL_COLUMNS.findIndex((c) => c.path === "solventId");
    const sheets = materialSheets([
      { ...referenceMaterial("ti-isopropoxide") },
      { ...referenceMaterial("zr-propoxide-70"), solventId: "Butanol of nowhere" },
      { ...referenceMaterial("al-sec-butoxide"), solventId: "teos" },
      referenceMaterial("teos"),
    ]);
    sheets[0]!.rows[0]![flagColumn] = "maybe";
    const preview = await materialsPreview(sheets);
    const problems = errors(preview.problems);
    expect(problems).toContainEqual(expect.objectContaining({ sheet: "Materials", row: 2, column: MATERIAL_COLUMNS[flagColumn]!.header, message: expect.stringContaining("“maybe” is not yes or no") }));
    expect(problems).toContainEqual(expect.objectContaining({ row: 3, column: MATERIAL_COLUMNS[solventColumn]!.header, message: expect.stringContaining("“Butanol of nowhere” is neither on the Materials sheet nor in your team's library") }));
    expect(problems).toContainEqual(expect.objectContaining({ row: 4, message: expect.stringContaining("is precursor, not a solvent") }));
  });

  it("reads a modifier row: kind modifier with the ligand columns", async () => {
    const acac = referenceMaterial("acac");
    const preview = await materialsPreview(materialSheets([acac]));
    expect(errors(preview.problems)).toEqual([]);
    expect(preview.materials[0]).toMatchObject({ kind: "modifier", material: { modifier: acac.modifier, hazards: acac.hazards } });
  });
});

/** An input with a modifier, a carried solvent, water per precursor not counting carried water, and staged steps. */
function v2Input(): FormulationInput {
  const ids = ["teos", "zr-propoxide-70", "acac", "water-di", "1-propanol", "hcl-37"];
  const materials = ids.map((id) => referenceMaterial(id));
  return {
    materials,
    basis: { type: "solidMass", grams: 10 },
    components: [
      { materialId: "teos", weightFraction: 0.8 },
      { materialId: "zr-propoxide-70", weightFraction: 0.2 },
    ],
    water: { materialId: "water-di", ratio: "perPrecursor", referenceId: "teos", value: 12, countCarried: false },
    solvent: { materialId: "1-propanol", mode: "molPerNetworkAtom", value: 2 },
    catalyst: { materialId: "hcl-37", molPerNetworkAtom: 0.01 },
    modifiers: [{ materialId: "acac", precursorId: "zr-propoxide-70", molPerMetal: 1 }],
    steps: [
      { name: "Stir", temperatureC: 25, durationH: 1, stage: "sol" },
      { name: "Dry", temperatureC: 60, durationH: 24, stage: "drying", atmosphere: "air" },
      { name: "Anneal", temperatureC: 400, durationH: 1, stage: "curing", atmosphere: "inert" },
    ],
  };
}

describe("formulation sheets with the engine v2 fields", () => {
  it("round-trips modifiers, the water convention and each step's stage and atmosphere", async () => {
    const input = v2Input();
    const preview = await formulationPreview(inputSheets(input, { name: "Zirconia-silica" }), libraryOf(input.materials));
    expect(errors(preview.problems)).toEqual([]);
    expect(JSON.parse(JSON.stringify(preview.input))).toEqual(JSON.parse(JSON.stringify(input)));
    expect(preview.computed.ok).toBe(true);
  });

  it("writes the water convention and the stage in words", () => {
    const sheets = inputSheets(v2Input(), { name: "Zirconia-silica" });
    const settings = sheets.find((s) => s.name === SHEET.input)!.rows;
    expect(settings.find((r) => r[0] === "Water ratio")?.[1]).toBe("per precursor");
    expect(settings.find((r) => r[0] === "Water ratio reference precursor")?.[1]).toBe(referenceMaterial("teos").name);
    expect(settings.find((r) => r[0] === "Count water carried by other materials")?.[1]).toBe("no");
    const modifiers = sheets.find((s) => s.name === SHEET.modifiers)!;
    expect(modifiers.rows).toEqual([[referenceMaterial("acac").name, referenceMaterial("zr-propoxide-70").name, 1]]);
  });

  it("imports an old sheet without the new columns, settings and Modifiers sheet exactly as before", async () => {
    const input = v2Input();
    const old: FormulationInput = {
      ...input,
      materials: input.materials.filter((m) => m.id !== "acac").map((m) => ({ ...m, solventId: undefined, fastHydrolysing: undefined })),
      water: { materialId: "water-di", ratio: "R", value: 2 },
      steps: input.steps.map(({ name, temperatureC, durationH }) => ({ name, temperatureC, durationH })),
    };
    delete old.modifiers;
    const oldHeaders = new Set([
      "Name", "Kind", "CAS number", "Formula", "Molar mass (g/mol)", "Density as supplied (g/cm³)", "Assay (mass fraction)", "Water fraction (mass fraction)",
      "Solvent fraction (mass fraction)", "Water of crystallisation (mol per formula unit)", "Dry phase density (g/cm³)", "Residue formula", "Residue molar mass (g/mol)",
      "Residue units per molecule", "Residue density (g/cm³)", "Network-forming atoms per molecule", "Hydrolysable groups per molecule", "Leaving alcohol",
      "Leaving alcohol molar mass (g/mol)", "Conversion temperature (°C)", "Glass transition (°C)", "Melting point (°C)", "Degradation onset (°C)",
      "Maximum service temperature (°C)", "GHS hazard statements",
    ]);
    const keep = MATERIAL_COLUMNS.map((c, i) => (oldHeaders.has(c.header) ? i : -1)).filter((i) => i >= 0);
    expect(keep).toHaveLength(oldHeaders.size);
    const oldSettings = ["Water ratio reference precursor", "Count water carried by other materials"];
    const sheets: SheetSpec[] = inputSheets(old, { name: "Old sheet" })
      .filter((s) => s.name !== SHEET.modifiers && s.name !== SHEET.sources)
      .map((s) => {
        const cut = (row: Cell[]) => (s.name === SHEET.materials ? keep.map((i) => row[i] ?? null) : s.name === SHEET.steps ? row.slice(0, STEP_COLUMNS.length) : row);
        const rows = s.name === SHEET.input ? s.rows.filter((r) => !oldSettings.includes(String(r[0]))) : s.rows;
        return { ...s, header: s.header.map(cut), rows: rows.map(cut) };
      });
    const preview = await formulationPreview(sheets, []);
    expect(preview.problems).toEqual([]);
    const back = preview.input!;
    expect(back.modifiers).toBeUndefined();
    expect(back.water).toEqual({ materialId: expect.any(String), ratio: "R", value: 2 });
    expect(back.steps).toEqual(old.steps);
    expect(back.materials.some((m) => m.solventId !== undefined || m.fastHydrolysing !== undefined)).toBe(false);
  });

  it("names the row and cell of a bad stage, atmosphere, modifier ratio, an unknown modifier and a missing reference precursor", async () => {
    const input = v2Input();
    const sheets = inputSheets(input, { name: "Bad cells" });
    const steps = sheets.find((s) => s.name === SHEET.steps)!;
    steps.rows[0]![3] = "baking";
    steps.rows[1]![4] = "vacuum";
    const modifiers = sheets.find((s) => s.name === SHEET.modifiers)!;
    modifiers.rows.push(["Unobtainium dione", referenceMaterial("zr-propoxide-70").name, "1,5"]);
    const settings = sheets.find((s) => s.name === SHEET.input)!;
    settings.rows.find((r) => r[0] === "Water ratio reference precursor")![1] = null;
    const problems = errors((await formulationPreview(sheets, libraryOf(input.materials))).problems);
    expect(problems).toContainEqual(expect.objectContaining({ sheet: SHEET.steps, row: 2, columnLetter: "D", message: expect.stringContaining("Stage must be one of sol, drying, curing (not “baking”)") }));
    expect(problems).toContainEqual(expect.objectContaining({ sheet: SHEET.steps, row: 3, columnLetter: "E", message: expect.stringContaining("Atmosphere must be one of air, inert (not “vacuum”)") }));
    expect(problems).toContainEqual(expect.objectContaining({ sheet: SHEET.modifiers, row: 3, columnLetter: "A", message: expect.stringContaining("Unknown material “Unobtainium dione”") }));
    expect(problems).toContainEqual(expect.objectContaining({ sheet: SHEET.modifiers, row: 3, columnLetter: "C", message: expect.stringContaining("decimal comma") }));
    expect(problems).toContainEqual(expect.objectContaining({ sheet: SHEET.input, column: "Value", message: expect.stringContaining("Water ratio reference precursor is required") }));
  });
});
