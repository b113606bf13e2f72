/**
 * The fields the coat predictions added, through the sheets: the materials'
 * refractive index, residue refractive index, boiling point, EEW, AHEW and
 * price per kg; the Coating sheet (dip, spin, wet film, target and area);
 * old sheets without any of them; bad cells located by sheet, row and cell;
 * the batch sheet's Coating and VOC table and the workbook's coat predictions.
 *
 * Expected values are the input itself (identity) or figures placed in a
 * stated result (the export must copy them unchanged); the rounding to three
 * significant figures is worked out by hand beside each check. The values of
 * the material fields are plausible figures from memory (GPTMS EEW 236.34 g/eq
 * is its molar mass, chemistry.md; APTES AHEW 221.37 / 2 = 110.69 g/eq), used
 * only as data to carry.
 */
import * as XLSX from "xlsx";
import { describe, expect, it } from "vitest";
import { referenceMaterial } from "@/data/materials";
import { computeFormulation, type CoatingSpec, type FormulationInput, type FormulationResult, type Material } from "@/lib/formulation";
import { significantStep } from "@/lib/spreadsheet/coat-rows";
import { parseCsv } from "@/lib/spreadsheet/csv";
import { demoInputs } from "@/lib/spreadsheet/example";
import { batchSheetCsv, revisionWorkbook, type RevisionForExport } from "@/lib/spreadsheet/export-formulation";
import { materialsWorkbook } from "@/lib/spreadsheet/export-materials";
import { previewFormulationImport } from "@/lib/spreadsheet/import-formulation";
import { previewMaterialsImport, type LibraryEntry } from "@/lib/spreadsheet/import-materials";
import { inputSheets, materialSheets } from "@/lib/spreadsheet/input-sheets";
import { readUpload } from "@/lib/spreadsheet/read";
import { FORMULATION_INPUT_SHEETS, MATERIAL_COLUMNS, MATERIALS_INPUT_SHEETS, SHEET } from "@/lib/spreadsheet/template";
import type { Cell, ImportProblem } from "@/lib/spreadsheet/types";
import { buildWorkbook, toCsv, type SheetSpec } from "@/lib/spreadsheet/write";

let counter = 0;
const newId = () => `new-${++counter}`;
const errors = (problems: ImportProblem[]) => problems.filter((p) => p.level === "error");
const stored = (value: unknown) => JSON.parse(JSON.stringify(value)) as unknown;
const libraryOf = (materials: Material[]): LibraryEntry[] => materials.map((m) => ({ id: m.id, name: m.name, casNumber: m.casNumber ?? null, material: m }));

async function formulationPreview(sheets: SheetSpec[], library: LibraryEntry[]) {
  const parsed = await readUpload(buildWorkbook(sheets), "f.xlsx", { wanted: FORMULATION_INPUT_SHEETS, defaultSheet: SHEET.input });
  return previewFormulationImport(parsed.sheets, library, new Set(), newId);
}
async function formulationPreviewCsv(sheets: SheetSpec[], library: LibraryEntry[]) {
  const text = toCsv(sheets.map((s) => ({ name: s.name, rows: [...s.header, ...s.rows] })));
  const parsed = await readUpload(Buffer.from(text, "utf8"), "f.csv", { wanted: FORMULATION_INPUT_SHEETS, defaultSheet: SHEET.input });
  return previewFormulationImport(parsed.sheets, library, new Set(), newId);
}

/** The new material fields on a few reference materials (values from memory, see the header). */
function withCoatFields(): Material[] {
  const gptms = referenceMaterial("gptms");
  return [
    { ...gptms, refractiveIndex: 1.429, boilingPointC: 290, epoxyEquivalentWeight: 236.34, pricePerKg: 48.5, precursor: { ...gptms.precursor!, residueRefractiveIndex: 1.5 } },
    { ...referenceMaterial("teos"), boilingPointC: 168, pricePerKg: 21, precursor: { ...referenceMaterial("teos").precursor!, residueRefractiveIndex: 1.46 } },
    { ...referenceMaterial("ethanol"), boilingPointC: 78.37, refractiveIndex: 1.3611, pricePerKg: 2.4 },
    { ...referenceMaterial("polycarbonate"), refractiveIndex: 1.586 },
  ];
}

/** The input without its coating. */
function uncoated(input: FormulationInput): FormulationInput {
  const copy = { ...input };
  delete copy.coating;
  return copy;
}

/** The demo's released visor hard coat with the coat fields on its materials and a coating. */
function coatedInput(coating: CoatingSpec): FormulationInput {
  const demo = demoInputs().find((d) => d.name === "Visor hard coat HC-3" && d.revision === 2)!.input;
  const extra = new Map(withCoatFields().map((m) => [m.id, m]));
  return { ...demo, materials: demo.materials.map((m) => extra.get(m.id) ?? m), coating };
}

const DIP: CoatingSpec = { method: "dip", withdrawalMmPerS: 1.75, viscosityMPaS: 3.2, surfaceTensionMNPerM: 23.5, targetDryThicknessNm: 2500, areaM2: 0.125 };
const SPIN: CoatingSpec = { method: "spin", rpm: 3000, calibration: { rpm: 2000, dryThicknessNm: 850 }, targetDryThicknessNm: 600 };
const WET: CoatingSpec = { method: "wetFilm", wetThicknessUm: 24, areaM2: 2 };

describe("materials sheets with the coat fields", () => {
  it("exports and imports refractive index, residue refractive index, boiling point, EEW, AHEW and price per kg unchanged", async () => {
    const aptes: Material = { ...referenceMaterial("gptms"), id: "aptes-like", name: "Amine silane (test)", casNumber: undefined, epoxyEquivalentWeight: undefined, amineHydrogenEquivalentWeight: 110.69 };
    const materials = [...withCoatFields(), aptes];
    const parsed = await readUpload(materialsWorkbook(materials), "library.xlsx", { wanted: MATERIALS_INPUT_SHEETS, defaultSheet: SHEET.materials });
    const preview = previewMaterialsImport(parsed.sheets, [], newId);
    expect(errors(preview.problems)).toEqual([]);
    const byName = new Map(preview.materials.map((p) => [p.name, p.material]));
    for (const material of materials) {
      expect(stored({ ...byName.get(material.name), id: undefined }), material.name).toEqual(stored({ ...material, id: undefined }));
    }
    expect(byName.get("Amine silane (test)")!.amineHydrogenEquivalentWeight).toBe(110.69);
    expect(byName.get(referenceMaterial("gptms").name)!.precursor!.residueRefractiveIndex).toBe(1.5);
  });

  it("writes each new column's header with its unit", () => {
    const headers = MATERIAL_COLUMNS.map((c) => c.header);
    for (const words of ["Refractive index (n_D, 589 nm", "Residue refractive index (n_D, 589 nm", "Boiling point at 1 atm (°C)", "Epoxy equivalent weight, EEW (g/eq)", "Amine hydrogen equivalent weight, AHEW (g/eq)", "Price per kg as supplied (team's currency)"]) {
      expect(headers.some((h) => h.startsWith(words)), words).toBe(true);
    }
  });

  it("names the sheet, row and cell of text in a number cell and a price below zero", async () => {
    const sheets = materialSheets(withCoatFields());
    const index = (path: string) => MATERIAL_COLUMNS.findIndex((c) => c.path === path);
    sheets[0]!.rows[0]![index("refractiveIndex")] = "high";
    sheets[0]!.rows[2]![index("pricePerKg")] = -3;
    sheets[0]!.rows[1]![index("boilingPointC")] = "168 °C";
    const parsed = await readUpload(buildWorkbook(sheets), "m.xlsx", { wanted: MATERIALS_INPUT_SHEETS, defaultSheet: SHEET.materials });
    const problems = errors(previewMaterialsImport(parsed.sheets, [], newId).problems);
    const column = (path: string) => MATERIAL_COLUMNS[index(path)]!.header;
    expect(problems).toContainEqual(expect.objectContaining({ sheet: "Materials", row: 2, column: column("refractiveIndex"), message: expect.stringContaining("“high” is not a number") }));
    expect(problems).toContainEqual(expect.objectContaining({ sheet: "Materials", row: 3, column: column("boilingPointC"), message: expect.stringContaining("has a unit in it") }));
    expect(problems).toContainEqual(expect.objectContaining({ sheet: "Materials", row: 4, column: column("pricePerKg"), message: expect.stringContaining("price per kg must be between 0 and") }));
  });
});

describe("the Coating sheet", () => {
  it.each([
    ["dip", DIP],
    ["spin", SPIN],
    ["wet film", WET],
  ] as const)("round-trips a %s coating and the materials' coat fields through xlsx and CSV", async (_, coating) => {
    const input = coatedInput(coating);
    const sheets = inputSheets(input, { name: "Coated visor" });
    for (const preview of [await formulationPreview(sheets, libraryOf(input.materials)), await formulationPreviewCsv(sheets, libraryOf(input.materials))]) {
      expect(errors(preview.problems)).toEqual([]);
      expect(stored(preview.input)).toEqual(stored(input));
      expect(preview.computed.ok).toBe(true);
    }
  });

  it("round-trips a coating through the whole revision workbook", async () => {
    const input = coatedInput(DIP);
    const bytes = revisionWorkbook(revision(input, computeFormulation(input)));
    const parsed = await readUpload(bytes, "export.xlsx", { wanted: FORMULATION_INPUT_SHEETS, defaultSheet: SHEET.input });
    const preview = previewFormulationImport(parsed.sheets, libraryOf(input.materials), new Set(), newId);
    expect(errors(preview.problems)).toEqual([]);
    expect(stored(preview.input!.coating)).toEqual(stored(DIP));
  });

  it("writes the method in words, every setting with its unit, and blank values without a coating", () => {
    const rows = inputSheets(coatedInput(SPIN), { name: "Spun" }).find((s) => s.name === SHEET.coating)!.rows;
    const value = (label: string) => rows.find((r) => r[0] === label)?.[1];
    expect(value("Coating method")).toBe("spin");
    expect(value("Spin speed")).toBe(3000);
    expect(value("Calibration spin speed")).toBe(2000);
    expect(value("Calibration dry thickness")).toBe(850);
    expect(value("Withdrawal speed")).toBeNull();
    expect(rows.every((r) => typeof r[2] === "string" && r[2].length > 0)).toBe(true);
    const bare = uncoated(coatedInput(DIP));
    const empty = inputSheets(bare, { name: "Bare" }).find((s) => s.name === SHEET.coating)!.rows;
    expect(empty.map((r) => r[1])).toEqual(empty.map(() => null));
  });

  it("imports an old sheet without the Coating sheet and the new material columns, with no coating and no new fields", async () => {
    const input = coatedInput(DIP);
    const newColumns = new Set(["refractiveIndex", "precursor.residueRefractiveIndex", "boilingPointC", "epoxyEquivalentWeight", "amineHydrogenEquivalentWeight", "pricePerKg"]);
    const keep = MATERIAL_COLUMNS.map((c, i) => (newColumns.has(c.path) ? -1 : i)).filter((i) => i >= 0);
    expect(keep).toHaveLength(MATERIAL_COLUMNS.length - newColumns.size);
    const sheets = inputSheets(input, { name: "Old visor" })
      .filter((s) => s.name !== SHEET.coating && s.name !== SHEET.sources)
      .map((s) => {
        const cut = (row: Cell[]) => (s.name === SHEET.materials ? keep.map((i) => row[i] ?? null) : row);
        return { ...s, header: s.header.map(cut), rows: s.rows.map(cut) };
      });
    for (const preview of [await formulationPreview(sheets, []), await formulationPreviewCsv(sheets, [])]) {
      expect(preview.problems.filter((p) => p.level === "error")).toEqual([]);
      expect(preview.input!.coating).toBeUndefined();
      for (const m of preview.input!.materials) {
        expect([m.refractiveIndex, m.boilingPointC, m.epoxyEquivalentWeight, m.amineHydrogenEquivalentWeight, m.pricePerKg, m.precursor?.residueRefractiveIndex]).toEqual([undefined, undefined, undefined, undefined, undefined, undefined]);
      }
      expect(preview.computed.ok).toBe(true);
    }
  });

  describe("edge cases", () => {
    /** The Coating sheet of a dip-coated input with some values replaced; row numbers are spreadsheet rows (header = row 1). */
    async function withCells(coating: CoatingSpec, change: Record<string, Cell>) {
      const input = coatedInput(coating);
      const sheets = inputSheets(input, { name: "Bad coat" });
      const sheet = sheets.find((s) => s.name === SHEET.coating)!;
      for (const [label, value] of Object.entries(change)) sheet.rows.find((r) => r[0] === label)![1] = value;
      const rowOf = (label: string) => sheet.rows.findIndex((r) => r[0] === label) + 2;
      return { preview: await formulationPreview(sheets, libraryOf(input.materials)), rowOf };
    }

    it("names the row and Value cell of text in a number cell, a negative viscosity and a method that is not ours", async () => {
      const { preview, rowOf } = await withCells(DIP, { "Withdrawal speed": "fast", "Sol viscosity": -3 });
      const problems = errors(preview.problems);
      expect(problems).toContainEqual({ level: "error", sheet: "Coating", row: rowOf("Withdrawal speed"), column: "Value", columnLetter: "B", message: "Withdrawal speed: “fast” is not a number." });
      expect(problems).toContainEqual(expect.objectContaining({ sheet: "Coating", row: rowOf("Sol viscosity"), columnLetter: "B", message: expect.stringContaining("must be between 0.01 and") }));
      expect(preview.input).toBeNull();
      const sprayed = await withCells(DIP, { "Coating method": "spray gun" });
      expect(errors(sprayed.preview.problems)).toEqual([
        { level: "error", sheet: "Coating", row: sprayed.rowOf("Coating method"), column: "Value", columnLetter: "B", message: "Coating method must be one of dip, spin, wet film (not “spray gun”)." },
      ]);
    });

    it("names the calibration cells of a spin coating without its measured film", async () => {
      const { preview, rowOf } = await withCells(SPIN, { "Calibration spin speed": null, "Calibration dry thickness": null });
      const problems = errors(preview.problems);
      expect(problems).toHaveLength(2);
      expect(problems).toContainEqual(expect.objectContaining({ sheet: "Coating", row: rowOf("Calibration spin speed"), columnLetter: "B", message: expect.stringMatching(/^Calibration spin speed \(rpm\) is required for spin coating \(spin coating is calibrated on one measured film/) }));
      expect(problems).toContainEqual(expect.objectContaining({ sheet: "Coating", row: rowOf("Calibration dry thickness"), columnLetter: "B", message: expect.stringContaining("Calibration dry thickness (nm) is required for spin coating") }));
    });

    it("asks for a method when settings are given without one, and warns about a setting of another method", async () => {
      const { preview, rowOf } = await withCells(DIP, { "Coating method": null });
      expect(errors(preview.problems)).toEqual([expect.objectContaining({ sheet: "Coating", row: rowOf("Coating method"), message: expect.stringContaining("Coating method is required when coating settings are given") })]);
      const extra = await withCells(DIP, { "Spin speed": 3000 });
      expect(errors(extra.preview.problems)).toEqual([]);
      expect(extra.preview.problems).toContainEqual(expect.objectContaining({ level: "warning", row: extra.rowOf("Spin speed"), message: "Spin speed is not used with dip coating and is ignored." }));
      expect(stored(extra.preview.input!.coating)).toEqual(stored(DIP));
    });

    it("reads the method in other words (Dip coating, wet-film) and a Coating sheet of blank values as no coating", async () => {
      const dip = await withCells(DIP, { "Coating method": "Dip coating" });
      expect(dip.preview.input!.coating?.method).toBe("dip");
      const wet = await withCells(WET, { "Coating method": "wet-film" });
      expect(wet.preview.input!.coating?.method).toBe("wetFilm");
      const blank = await withCells(WET, { "Coating method": null, "Wet film thickness": null, "Area to coat": null });
      expect(blank.preview.problems).toEqual([]);
      expect(blank.preview.input!.coating).toBeUndefined();
    });
  });
});

/** A revision with a stated result, so the export's copy of each figure can be checked. */
function revision(input: FormulationInput, result: FormulationResult | null): RevisionForExport {
  return {
    formulationName: "Coated visor",
    project: "Visors",
    number: 3,
    state: "released",
    input,
    result,
    computeError: result ? null : "not computed",
    authorName: "Flora Formulator",
    engineVersion: "test",
    approvedAt: null,
    releasedAt: null,
    reviews: [],
  };
}

/** The engine's result for the input, with coat figures placed in it (chosen values, not computed). */
function statedResult(input: FormulationInput, extra: Partial<FormulationResult>): FormulationResult {
  const base: FormulationResult = { ...computeFormulation(input) };
  for (const key of ["coating", "optics", "voc", "cure", "cost"] as const) delete base[key];
  return { ...base, ...extra };
}

const FILM = { method: "dip" as const, solidVolumeFraction: 0.0712, wetThicknessUm: 31.4159, dryThicknessNm: 2236.07, coverageM2PerL: 31.831, solMlForArea: 3.92699, capillaryNumber: 0.000238, withdrawalMmPerSForTarget: 1.98765 };
const VOC = { massGrams: 351.234, gramsPerLitre: 712.468, gramsPerLitreLessWater: 745.5, waterMl: 21.7 };

describe("batch sheet exports with a coating", () => {
  const input = coatedInput(DIP);
  const rev = revision(input, statedResult(input, { coating: FILM, voc: VOC }));

  it("writes a Coating and VOC table after the batch table in the CSV: method, speeds, thicknesses, area, sol and VOC, each with its unit", () => {
    const rows = parseCsv(batchSheetCsv(rev)).rows;
    const start = rows.findIndex((r) => r[0] === "[Coating and VOC]");
    expect(start).toBeGreaterThan(0);
    const table = rows.slice(start + 2);
    expect(rows[start + 1]).toEqual(["Setting", "Value", "Unit"]);
    const line = (item: string) => table.find((r) => r[0] === item);
    // Three significant figures: 1.75 → "1.75"; 1.98765 → "1.99"; 31.4159 → "31.4"; 2236.07 → "2240"; 3.92699 → "3.93"; 712.468 → "712"; 745.5 → "746" (half up).
    expect(line("Coating method")).toEqual(["Coating method", "dip coating", ""]);
    expect(line("Withdrawal speed")).toEqual(["Withdrawal speed", "1.75", "mm/s"]);
    expect(line("Withdrawal speed for the target")).toEqual(["Withdrawal speed for the target", "1.99", "mm/s"]);
    expect(line("Expected wet film thickness")).toEqual(["Expected wet film thickness", "31.4", "µm"]);
    expect(line("Expected dry film thickness")).toEqual(["Expected dry film thickness", "2240", "nm"]);
    expect(line("Target dry thickness")).toEqual(["Target dry thickness", "2500", "nm"]);
    expect(line("Area to coat")).toEqual(["Area to coat", "0.125", "m²"]);
    expect(line("Sol needed for the area (no losses)")).toEqual(["Sol needed for the area (no losses)", "3.93", "mL"]);
    expect(line("VOC")).toEqual(["VOC", "712", "g/L of sol"]);
    expect(line("VOC less water")).toEqual(["VOC less water", "746", "g/L of sol less water"]);
    expect(line("VOC in the batch (hydrolysis alcohol included)")).toEqual(["VOC in the batch (hydrolysis alcohol included)", "351", "g"]);
  });

  it("writes the same table as a Coating and VOC sheet with exact numeric values and a number format per row", () => {
    const wb = XLSX.read(revisionWorkbook(rev), { type: "buffer", cellNF: true });
    expect(wb.SheetNames.slice(0, 3)).toEqual(["Overview", "Batch sheet", "Coating and VOC"]);
    const ws = wb.Sheets["Coating and VOC"]!;
    const rows = XLSX.utils.sheet_to_json<unknown[]>(ws, { header: 1, raw: true, defval: null });
    const at = rows.findIndex((r) => r[0] === "Withdrawal speed for the target");
    const cell = ws[XLSX.utils.encode_cell({ r: at, c: 1 })] as XLSX.CellObject;
    expect(cell.t).toBe("n");
    expect(cell.v).toBe(1.98765);
    expect(cell.z).toBe("0.00");
  });

  it("shows the spin speed and its target for a spin coating, and the wet thickness to lay for a wet film", () => {
    const spin = coatedInput(SPIN);
    const spun = parseCsv(batchSheetCsv(revision(spin, statedResult(spin, { coating: { ...FILM, method: "spin", capillaryNumber: undefined, withdrawalMmPerSForTarget: undefined, rpmForTarget: 6020.6 } })))).rows;
    expect(spun).toContainEqual(["Spin speed", "3000", "rpm"]);
    expect(spun).toContainEqual(["Spin speed for the target", "6020", "rpm"]); // 6020.6 to 3 significant figures: step 10 → 6020
    expect(spun.some((r) => r[0] === "Withdrawal speed")).toBe(false);
    const wet = coatedInput(WET);
    const laid = parseCsv(batchSheetCsv(revision(wet, statedResult(wet, { coating: { ...FILM, method: "wetFilm", wetThicknessUm: 24 } })))).rows;
    expect(laid).toContainEqual(["Wet film thickness to lay", "24.0", "µm"]);
    expect(laid.some((r) => r[0] === "Expected wet film thickness")).toBe(false);
  });

  describe("edge cases", () => {
    it("says nothing about a coating when the revision has none: VOC alone, or no table at all", () => {
      const bare = uncoated(coatedInput(DIP));
      const vocOnly = parseCsv(batchSheetCsv(revision(bare, statedResult(bare, { voc: VOC })))).rows;
      const start = vocOnly.findIndex((r) => r[0] === "[Coating and VOC]");
      expect(vocOnly.slice(start + 2).map((r) => r[0])).toEqual(["VOC", "VOC less water", "VOC in the batch (hydrolysis alcohol included)"]);
      const none = revision(bare, statedResult(bare, {}));
      const csv = batchSheetCsv(none);
      expect(csv).not.toContain("Coating");
      expect(csv).not.toContain("VOC");
      expect(XLSX.read(revisionWorkbook(none), { type: "buffer" }).SheetNames).not.toContain("Coating and VOC");
    });

    it("writes the coating settings even when the revision cannot be computed", () => {
      const input = coatedInput(DIP);
      const rows = parseCsv(batchSheetCsv(revision(input, null))).rows;
      expect(rows).toContainEqual(["Withdrawal speed", "1.75", "mm/s"]);
      expect(rows.some((r) => r[0] === "Expected dry film thickness" || r[0] === "VOC")).toBe(false);
    });
  });
});

describe("revision workbook coat predictions", () => {
  const input = coatedInput(DIP);
  const result = statedResult(input, {
    coating: { ...FILM, capillaryNumber: 0.0125 },
    optics: { refractiveIndex: 1.5123, substrateIndex: 1.586, mismatch: -0.0737 },
    voc: VOC,
    cure: { epoxyEq: 0.4321, amineHydrogenEq: 0.3012, ratio: 0.697 },
    cost: { total: 17.456, perKgDry: 174.56, perLitreSol: 31.2, perM2: 0.98012 },
  });

  it("shows thickness, index against the substrate, VOC, epoxy–amine ratio and cost in the overview, with units", () => {
    const wb = XLSX.read(revisionWorkbook(revision(input, result), { currency: "CHF" }), { type: "buffer" });
    const rows = XLSX.utils.sheet_to_json<unknown[]>(wb.Sheets.Overview!, { header: 1, raw: true, defval: null });
    const line = (item: string) => rows.find((r) => r[0] === item);
    expect(line("Coat: method")).toEqual(["Coat: method", "dip coating", ""]);
    expect(line("Coat: dry film thickness")).toEqual(["Coat: dry film thickness", 2236.07, "nm"]);
    expect(line("Coat: wet film thickness")).toEqual(["Coat: wet film thickness", 31.4159, "µm"]);
    expect(line("Coat: capillary number Ca")?.[2]).toBe("above 0.01: outside the Landau–Levich range");
    expect(line("Refractive index of the dry coat")).toEqual(["Refractive index of the dry coat", 1.5123, "n_D, 589 nm"]);
    expect(line("Refractive index of the substrate")).toEqual(["Refractive index of the substrate", 1.586, "n_D, 589 nm"]);
    // |−0.0737| > 0.01: fringes on a transparent substrate (chemistry.md, common practice, from memory).
    expect(line("Index mismatch, coat − substrate")).toEqual(["Index mismatch, coat − substrate", -0.0737, "more than 0.01: interference fringes likely on a transparent substrate"]);
    expect(line("VOC")).toEqual(["VOC", 712.468, "g/L of sol"]);
    expect(line("VOC less water")?.[1]).toBe(745.5);
    // 0.697 is outside 0.8–1.2 (Lee & Neville, 1967).
    expect(line("Epoxy–amine ratio")).toEqual(["Epoxy–amine ratio", 0.697, "amine-H eq per epoxy eq: outside 0.8–1.2"]);
    expect(line("Cost of the batch")).toEqual(["Cost of the batch", 17.456, "CHF"]);
    expect(line("Cost per m² coated")).toEqual(["Cost per m² coated", 0.98012, "CHF per m²"]);
    expect(line("Cost per kg of dry composite")?.[2]).toBe("CHF per kg");
  });

  it("keeps a negative mismatch a number, never prefixed against formula injection, in the workbook", () => {
    const wb = XLSX.read(revisionWorkbook(revision(input, result)), { type: "buffer", cellNF: true });
    const ws = wb.Sheets.Overview!;
    const rows = XLSX.utils.sheet_to_json<unknown[]>(ws, { header: 1, raw: true, defval: null });
    const at = rows.findIndex((r) => r[0] === "Index mismatch, coat − substrate");
    const cell = ws[XLSX.utils.encode_cell({ r: at, c: 1 })] as XLSX.CellObject;
    expect([cell.t, cell.v, cell.z]).toEqual(["n", -0.0737, "0.000"]);
    expect(rows.find((r) => r[0] === "Cost of the batch")?.[2]).toBe("team's currency");
  });

  it("leaves out every coat row the engine did not give", () => {
    const bare = uncoated(input);
    const wb = XLSX.read(revisionWorkbook(revision(bare, statedResult(bare, {}))), { type: "buffer" });
    const items = XLSX.utils.sheet_to_json<unknown[]>(wb.Sheets.Overview!, { header: 1, raw: true, defval: null }).map((r) => String(r[0]));
    expect(items.filter((i) => /^Coat|Refractive|VOC|Epoxy|Cost/.test(i))).toEqual([]);
  });
});

describe("significantStep", () => {
  it("returns the step of the last significant figure", () => {
    expect(significantStep(1.987, 3)).toBe(0.01);
    expect(significantStep(712.4, 3)).toBe(1);
    expect(significantStep(2236, 3)).toBe(10);
    expect(significantStep(0.0000123, 3)).toBe(0.0000001);
    expect(significantStep(-0.0737, 3)).toBe(0.0001);
  });

  describe("edge cases", () => {
    it("returns undefined for zero and non-finite values", () => {
      expect(significantStep(0)).toBeUndefined();
      expect(significantStep(Number.NaN)).toBeUndefined();
    });
  });
});
