/**
 * Import: every error class located by sheet, row and column; linking to
 * the library by name or CAS number; file-level limits and refusals. The
 * expected rows and columns are read off the template layout built in each
 * test (row 1 is the header), no arithmetic beyond the sums shown.
 */
import { threadId } from "node:worker_threads";
import * as XLSX from "xlsx";
import { describe, expect, it } from "vitest";
import { referenceMaterials } from "@/data/materials";
import type { FormulationInput } from "@/lib/formulation";
import { demoInputs } from "@/lib/spreadsheet/example";
import { inputSheets, materialSheets } from "@/lib/spreadsheet/input-sheets";
import { previewFormulationImport } from "@/lib/spreadsheet/import-formulation";
import { previewMaterialsImport, type LibraryEntry } from "@/lib/spreadsheet/import-materials";
import { readUpload, UploadError } from "@/lib/spreadsheet/read";
import { readWorkbookInWorker, spareWorkersReady } from "@/lib/spreadsheet/worker";
import { FORMULATION_INPUT_SHEETS, IMPORT_LIMITS, MATERIALS_INPUT_SHEETS, SHEET } from "@/lib/spreadsheet/template";
import type { Cell, ImportProblem } from "@/lib/spreadsheet/types";
import { buildWorkbook, toCsv, type SheetSpec } from "@/lib/spreadsheet/write";

const library: LibraryEntry[] = referenceMaterials.map((m) => ({ id: `lib-${m.id}`, name: m.name, casNumber: m.casNumber ?? null, material: { ...m, id: `lib-${m.id}` } }));
const demo = demoInputs().find((d) => d.name === "Visor hard coat HC-3" && d.revision === 2)!;
let counter = 0;
const newId = () => `new-${++counter}`;

function sheetsOf(input: FormulationInput, name = "Imported coat"): SheetSpec[] {
  return inputSheets(input, { name, project: "Import tests" });
}
function edit(sheets: SheetSpec[], name: string, fn: (rows: Cell[][]) => void): SheetSpec[] {
  const sheet = sheets.find((s) => s.name === name)!;
  fn(sheet.rows);
  return sheets;
}
async function previewXlsx(sheets: SheetSpec[], taken: string[] = []) {
  const parsed = await readUpload(buildWorkbook(sheets), "f.xlsx", { wanted: FORMULATION_INPUT_SHEETS, defaultSheet: SHEET.input });
  return previewFormulationImport(parsed.sheets, library, new Set(taken.map((t) => t.toLowerCase())), newId);
}
const errors = (problems: ImportProblem[]) => problems.filter((p) => p.level === "error");
const rowOf = (sheets: SheetSpec[], sheet: string, first: string) => sheets.find((s) => s.name === sheet)!.rows.findIndex((r) => r[0] === first) + 2;

describe("formulation import", () => {
  it("returns a clean preview for the unchanged template and links every material by name", async () => {
    const preview = await previewXlsx(sheetsOf(demo.input));
    expect(errors(preview.problems)).toEqual([]);
    // Seven materials and acetylacetone, the modifier chelating the titanium isopropoxide.
    expect(preview.counts).toMatchObject({ materials: 8, toLink: 8, toCreate: 0, components: 3, steps: 4, errors: 0 });
    expect(preview.input?.modifiers).toEqual([{ materialId: "lib-acac", precursorId: "lib-ti-isopropoxide", molPerMetal: 1 }]);
    expect(preview.materials.every((m) => m.id.startsWith("lib-"))).toBe(true);
    expect(preview.computed.ok).toBe(true);
    expect(preview.input?.components.map((c) => c.materialId)).toEqual(["lib-gptms", "lib-teos", "lib-ti-isopropoxide"]);
  });

  it("reports an unknown material with its sheet, row and column", async () => {
    const sheets = edit(sheetsOf(demo.input), SHEET.components, (rows) => {
      rows[1]![0] = "Unobtainium ethoxide";
    });
    const preview = await previewXlsx(sheets);
    expect(errors(preview.problems)).toContainEqual({
      level: "error",
      sheet: "Components",
      row: 3,
      column: "Material",
      columnLetter: "A",
      message: "Unknown material “Unobtainium ethoxide”: it is neither on the Materials sheet nor in your team's library.",
    });
    expect(preview.input).toBeNull();
  });

  it("reports a missing density on the Materials sheet", async () => {
    const sheets = sheetsOf(demo.input);
    const teosRow = rowOf(sheets, SHEET.materials, "Tetraethoxysilane (TEOS)");
    edit(sheets, SHEET.materials, (rows) => {
      rows[teosRow - 2]![0] = "TEOS, new grade";
      rows[teosRow - 2]![2] = null; // CAS blank, so it does not link by CAS either
      rows[teosRow - 2]![5] = null;
    });
    edit(sheets, SHEET.components, (rows) => {
      rows[1]![0] = "TEOS, new grade";
    });
    const preview = await previewXlsx(sheets);
    expect(errors(preview.problems)).toContainEqual(
      expect.objectContaining({ sheet: "Materials", row: teosRow, column: "Density as supplied (g/cm³)", columnLetter: "F" }),
    );
    expect(errors(preview.problems).find((p) => p.sheet === "Materials")!.message).toMatch(/no density/);
  });

  it("reports weight fractions that do not sum to one on the last component row", async () => {
    const sheets = edit(sheetsOf(demo.input), SHEET.components, (rows) => {
      rows[0]![1] = 0.68; // 0.68 + 0.25 + 0.05 = 0.98
    });
    const preview = await previewXlsx(sheets);
    expect(errors(preview.problems)).toEqual([
      { level: "error", sheet: "Components", row: 4, column: "Weight fraction (mass fraction of the dry composite)", columnLetter: "B", message: "Weight fractions sum to 0.98; they must sum to 1." },
    ]);
  });

  it("accepts fractions within 0.5 % of one, as the engine does (it scales them to 1 with a notice)", async () => {
    // 0.698 + 0.25 + 0.05 = 0.998: inside the engine's 0.5 % band (lib/formulation/constants.ts), so not a sheet error.
    const sheets = edit(sheetsOf(demo.input), SHEET.components, (rows) => {
      rows[0]![1] = 0.698;
    });
    const preview = await previewXlsx(sheets);
    expect(errors(preview.problems)).toEqual([]);
  });

  it("reports a number with a unit in it, a decimal comma and a percentage", async () => {
    const sheets = sheetsOf(demo.input);
    const solMass = rowOf(sheets, SHEET.input, "Sol mass");
    const solids = rowOf(sheets, SHEET.input, "Solids content");
    edit(sheets, SHEET.input, (rows) => {
      rows[solMass - 2]![1] = "500 g";
      rows[solids - 2]![1] = "20 %";
    });
    edit(sheets, SHEET.steps, (rows) => {
      rows[0]![1] = "25,5";
    });
    const preview = await previewXlsx(sheets);
    const found = errors(preview.problems);
    expect(found).toContainEqual(
      expect.objectContaining({ sheet: "Input", row: solMass, column: "Value", columnLetter: "B", message: "Sol mass: “500 g” has a unit in it: write the number alone (500); the unit is in the column header (g)." }),
    );
    expect(found).toContainEqual(expect.objectContaining({ sheet: "Input", row: solids, message: expect.stringContaining("20 % → 0.2") }));
    expect(found).toContainEqual(
      expect.objectContaining({ sheet: "Process steps", row: 2, column: "Temperature (°C)", columnLetter: "B", message: "Temperature: “25,5” uses a decimal comma: write 25.5 with a point." }),
    );
  });

  it("reports a duplicate material name and a formulation name already in use", async () => {
    const sheets = sheetsOf(demo.input, "Visor hard coat HC-3");
    let dupRow = 0;
    edit(sheets, SHEET.materials, (rows) => {
      rows.push([...rows[0]!]);
      dupRow = rows.length + 1;
    });
    const preview = await previewXlsx(sheets, ["visor hard coat hc-3"]);
    const found = errors(preview.problems);
    expect(found).toContainEqual(
      expect.objectContaining({ sheet: "Materials", row: dupRow, column: "Name", columnLetter: "A", message: expect.stringMatching(/duplicate name: it already appears in row 2/) }),
    );
    expect(found).toContainEqual(
      expect.objectContaining({ sheet: "Input", row: 2, column: "Value", message: "A formulation named “Visor hard coat HC-3” already exists in this team: choose another name." }),
    );
  });

  it("links a material by CAS number, proposes creating an unknown one, and warns when file values differ from the library", async () => {
    const input = structuredClone(demo.input);
    const teos = input.materials.find((m) => m.id === "teos")!;
    teos.name = "Ethyl silicate 99.9 %";
    const gptms = input.materials.find((m) => m.id === "gptms")!;
    gptms.density = 1.08; // library: 1.07
    input.materials.push({ id: "new-polymer", name: "In-house epoxy resin", kind: "organic", density: 1.15, phaseDensity: 1.18 });
    const preview = await previewXlsx(sheetsOf(input));
    expect(errors(preview.problems)).toEqual([]);
    const byName = new Map(preview.materials.map((m) => [m.name, m]));
    expect(byName.get("Ethyl silicate 99.9 %")).toMatchObject({ action: "link", id: "lib-teos", matchedBy: "casNumber" });
    expect(byName.get("In-house epoxy resin")).toMatchObject({ action: "create" });
    expect(byName.get("In-house epoxy resin")!.id).toMatch(/^new-/);
    const warnings = preview.problems.filter((p) => p.level === "warning").map((p) => p.message);
    expect(warnings.some((w) => w.includes("by its CAS number 78-10-4"))).toBe(true);
    expect(warnings.some((w) => w.includes("differs from the library's"))).toBe(true);
  });

  it("reads the same template from a CSV file with [Sheet] lines and reports CSV line numbers", async () => {
    const sheets = edit(sheetsOf(demo.input), SHEET.components, (rows) => {
      rows[2]![1] = "0.05 wt";
    });
    const csv = toCsv(sheets.map((s) => ({ name: s.name, rows: [...s.header, ...s.rows] })));
    const lines = csv.split("\r\n");
    const expectedLine = lines.findIndex((l) => l.startsWith('"Titanium')) + 1;
    const parsed = await readUpload(Buffer.from(csv), "f.csv", { wanted: FORMULATION_INPUT_SHEETS, defaultSheet: SHEET.input });
    const preview = previewFormulationImport(parsed.sheets, library, new Set(), newId);
    expect(errors(preview.problems)).toContainEqual(expect.objectContaining({ sheet: "Components", row: expectedLine, columnLetter: "B" }));
  });
});

describe("materials import", () => {
  it("proposes creating new materials and linking known ones, with a warning for a missing density", async () => {
    const sheets = materialSheets([
      referenceMaterials.find((m) => m.id === "ethanol")!,
      { id: "x", name: "Cerium(III) nitrate hexahydrate", kind: "precursor", casNumber: "10294-41-4" },
    ]);
    const csv = toCsv(sheets.map((s) => ({ name: s.name, rows: [...s.header, ...s.rows] })));
    const parsed = await readUpload(Buffer.from(csv), "m.csv", { wanted: MATERIALS_INPUT_SHEETS, defaultSheet: SHEET.materials });
    const preview = previewMaterialsImport(parsed.sheets, library, newId);
    expect(preview.counts).toMatchObject({ materials: 2, toLink: 1, toCreate: 1, errors: 0 });
    expect(preview.problems).toContainEqual(expect.objectContaining({ level: "warning", sheet: "Materials", row: 3, column: "Density as supplied (g/cm³)" }));
  });

  it("reports a bad kind, an invalid CAS check digit and a non-number with row and column", async () => {
    const sheets = materialSheets([{ id: "a", name: "Thing", kind: "solvent", density: 0.8 }]);
    sheets[0]!.rows[0]![1] = "goo";
    sheets[0]!.rows.push(["Other", "solvent", "78-10-5", null, "abc"]);
    const parsed = await readUpload(buildWorkbook(sheets), "m.xlsx", { wanted: MATERIALS_INPUT_SHEETS, defaultSheet: SHEET.materials });
    const preview = previewMaterialsImport(parsed.sheets, library, newId);
    const found = errors(preview.problems);
    expect(found).toContainEqual(expect.objectContaining({ row: 2, column: "Kind", columnLetter: "B" }));
    expect(found).toContainEqual(expect.objectContaining({ row: 3, column: "Molar mass (g/mol)", columnLetter: "E", message: "Molar mass: “abc” is not a number." }));
    expect(found).toContainEqual(expect.objectContaining({ row: 3, column: "CAS number", columnLetter: "C", message: "“Other”: CAS number check digit does not match." }));
  });
});

describe("upload checks", () => {
  const small = { ...IMPORT_LIMITS, maxRows: 10, maxBytes: 50_000, maxSheets: 3 };
  const read = (bytes: Uint8Array, name: string, limits = small) =>
    readUpload(bytes, name, { wanted: MATERIALS_INPUT_SHEETS, defaultSheet: SHEET.materials, firstSheetFallback: true, limits });
  const refused = async (promise: Promise<unknown>) => {
    const err = await promise.then(() => null, (e: unknown) => e);
    expect(err).toBeInstanceOf(UploadError);
    return err as UploadError;
  };

  it("refuses a file above the size limit with 413", async () => {
    const err = await refused(read(new Uint8Array(60_000).fill(65), "big.csv"));
    expect([err.status, err.code]).toEqual([413, "too_large"]);
    expect(err.message).toMatch(/up to 0\.0?\d* MB|MB/);
  });

  it("refuses a PDF, an image and a binary file by content, whatever the name", async () => {
    const pdf = await refused(read(Buffer.from("%PDF-1.7\n%%EOF"), "library.xlsx"));
    expect([pdf.status, pdf.code]).toEqual([415, "not_a_spreadsheet"]);
    expect(pdf.message).toContain("a PDF document");
    expect((await refused(read(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0, 0]), "x.csv"))).status).toBe(415);
    expect((await refused(read(Buffer.from("plain text that is not a workbook"), "x.xlsx"))).code).toBe("not_a_spreadsheet");
  });

  it("refuses a corrupt archive with 422", async () => {
    const err = await refused(read(Buffer.concat([Buffer.from([0x50, 0x4b, 0x03, 0x04]), Buffer.from("not really a zip at all")]), "x.xlsx"));
    expect([err.status, err.code]).toEqual([422, "corrupt_file"]);
  });

  it("refuses a password-protected workbook and an old binary workbook", async () => {
    const cfb = XLSX.CFB.utils.cfb_new();
    XLSX.CFB.utils.cfb_add(cfb, "EncryptionInfo", Buffer.alloc(64, 1));
    XLSX.CFB.utils.cfb_add(cfb, "EncryptedPackage", Buffer.alloc(512, 2));
    const locked = await refused(read(XLSX.CFB.write(cfb, { type: "buffer" }) as Buffer, "locked.xlsx"));
    expect([locked.status, locked.code]).toEqual([422, "password_protected"]);
    const old = XLSX.CFB.utils.cfb_new();
    XLSX.CFB.utils.cfb_add(old, "Workbook", Buffer.alloc(512, 3));
    expect((await refused(read(XLSX.CFB.write(old, { type: "buffer" }) as Buffer, "old.xls"))).code).toBe("old_format");
  });

  it("refuses more rows than the limit, in CSV and in a workbook, and more sheets than the limit", async () => {
    const rows: Cell[][] = [["Name", "Kind"], ...Array.from({ length: 12 }, (_, i): Cell[] => [`M${i}`, "solvent"])];
    const csv = await refused(read(Buffer.from(toCsv([{ name: "Materials", rows }])), "m.csv"));
    expect([csv.status, csv.code]).toEqual([422, "bad_csv"]);
    expect(csv.message).toContain("more than 10 rows");
    const xlsx = await refused(read(buildWorkbook([{ name: "Materials", header: [], rows }]), "m.xlsx"));
    expect([xlsx.status, xlsx.code]).toEqual([422, "too_many_rows"]);
    const many = buildWorkbook(["A", "B", "C", "D"].map((name) => ({ name, header: [], rows: [["x"]] })));
    expect((await refused(read(many, "m.xlsx"))).code).toBe("too_many_sheets");
  });

  it("stops a parse that takes longer than the time limit", async () => {
    const rows: Cell[][] = [["Name", "Kind"], ["A", "solvent"]];
    // A cold worker (no warmed spare) cannot answer within 1 ms.
    process.env.GELWRIGHT_IMPORT_SPARE_WORKERS = "0";
    try {
      const err = await refused(read(buildWorkbook([{ name: "Materials", header: [], rows }]), "m.xlsx", { ...small, parseMs: 1 }));
      expect([err.status, err.code]).toEqual([422, "parse_timeout"]);
    } finally {
      delete process.env.GELWRIGHT_IMPORT_SPARE_WORKERS;
    }
  });

  it("reads each workbook in a worker of its own, warmed beforehand but never reused", async () => {
    const book = buildWorkbook([{ name: "Materials", header: [], rows: [["Name", "Kind"], ["A", "solvent"]] }]);
    expect(await spareWorkersReady()).toBe(1);
    const first = await readWorkbookInWorker(book, ["Materials"]);
    // Taken straight after, before a new spare can have warmed up: a fresh worker.
    const second = await readWorkbookInWorker(book, ["Materials"]);
    expect(first.worker.warmed).toBe(true);
    expect(second.worker.warmed).toBe(false);
    expect(new Set([first.worker.threadId, second.worker.threadId, threadId]).size).toBe(3);
    expect(first.sheets).toEqual(second.sheets);
    expect(second.sheets[0]!.rows).toEqual([["Name", "Kind"], ["A", "solvent"]]);
    // The spare started after the first read is again a different thread.
    await spareWorkersReady();
    const third = await readWorkbookInWorker(book, ["Materials"]);
    expect(third.worker.warmed).toBe(true);
    expect([first.worker.threadId, second.worker.threadId]).not.toContain(third.worker.threadId);
  });

  describe("edge cases", () => {
    it("reads the first sheet of a materials workbook whose sheet has another name", async () => {
      const parsed = await read(buildWorkbook([{ name: "Sheet1", header: [], rows: [["Name", "Kind", "Density as supplied (g/cm³)"], ["X", "solvent", 0.8]] }]), "m.xlsx");
      expect(parsed.sheets[0]!.rows[1]).toEqual(["X", "solvent", 0.8]);
    });

    it("never lets a __proto__ key from the file reach an object", async () => {
      const sheets = materialSheets([{ id: "a", name: "Thing", kind: "solvent", density: 0.8 }]);
      sheets[1]!.rows.push(["Thing", "__proto__", "polluted"]);
      const parsed = await read(buildWorkbook(sheets), "m.xlsx");
      const preview = previewMaterialsImport(parsed.sheets, library, newId);
      expect(({} as Record<string, unknown>).polluted).toBeUndefined();
      expect(errors(preview.problems)).toContainEqual(expect.objectContaining({ sheet: "Material sources", row: 2, column: "Property" }));
    });
  });
});
