/**
 * Export content: the produced workbook is opened with the same library and
 * its cells checked; formula-injection neutralising in every exported cell.
 * Expected numbers are the engine's own result (the export must copy them
 * unchanged); the neutralising rule is OWASP "CSV Injection" (common
 * practice, no other source).
 */
import * as XLSX from "xlsx";
import { describe, expect, it } from "vitest";
import { referenceMaterials } from "@/data/materials";
import { computeFormulation, type FormulationInput } from "@/lib/formulation";
import { demoInputs } from "@/lib/spreadsheet/example";
import { batchSheetCsv, revisionWorkbook, safeFileName, type RevisionForExport } from "@/lib/spreadsheet/export-formulation";
import { materialsCsv, materialsWorkbook } from "@/lib/spreadsheet/export-materials";
import { neutraliseText, restoreText } from "@/lib/spreadsheet/neutralise";
import { parseCsv } from "@/lib/spreadsheet/csv";
import { sourcePropertyKey, sourcePropertyLabel } from "@/lib/spreadsheet/source-properties";
import { toCsv } from "@/lib/spreadsheet/write";

const released = demoInputs().find((d) => d.name === "Visor hard coat HC-3" && d.revision === 2)!;

function revision(input: FormulationInput, name = released.name): RevisionForExport {
  return {
    formulationName: name,
    project: released.project,
    number: 2,
    state: "released",
    input,
    result: computeFormulation(input),
    computeError: null,
    authorName: "Flora Formulator",
    engineVersion: "test",
    approvedAt: new Date("2026-03-01T10:00:00Z"),
    releasedAt: new Date("2026-03-02T10:00:00Z"),
    reviews: [{ decision: "approved", reviewerName: "Rhys Reviewer", createdAt: new Date("2026-03-01T10:00:00Z"), comment: "Cure within the margin." }],
  };
}

function open(bytes: Buffer) {
  return XLSX.read(bytes, { type: "buffer" });
}
function grid(wb: XLSX.WorkBook, sheet: string): unknown[][] {
  return XLSX.utils.sheet_to_json(wb.Sheets[sheet]!, { header: 1, raw: true, defval: null });
}
function sheetXml(bytes: Buffer, index: number): string {
  const zip = XLSX.CFB.read(bytes, { type: "buffer" });
  return Buffer.from(XLSX.CFB.find(zip, `/xl/worksheets/sheet${index}.xml`)!.content as Uint8Array).toString("utf8");
}

describe("revision workbook", () => {
  const rev = revision(released.input);
  const bytes = revisionWorkbook(rev);
  const wb = open(bytes);

  it("returns the overview, batch sheet, dry composite, thermal check and the full input sheets", () => {
    // The Coating and VOC sheet follows the batch sheet only when the revision has a coating or a VOC figure (engine 2.1 on).
    const coat = rev.input.coating !== undefined || rev.result?.voc !== undefined ? ["Coating and VOC"] : [];
    expect(wb.SheetNames).toEqual([
      "Overview",
      "Batch sheet",
      ...coat,
      "Dry composite",
      "Thermal check",
      "Input",
      "Components",
      "Modifiers",
      "Coating",
      "Process steps",
      "Addition order",
      "Materials",
      "Material sources",
      "Read me",
    ]);
    const overview = grid(wb, "Overview");
    const value = (item: string) => overview.find((row) => row[0] === item)?.[1];
    expect(value("Formulation")).toBe("Visor hard coat HC-3");
    expect(value("Revision")).toBe(2);
    expect(value("State")).toBe("released");
    expect(String(value("Approval"))).toContain("Rhys Reviewer");
    expect(String(value("Basis"))).toBe("sol mass 500 g at solids content 0.2");
    expect(overview.some((row) => row[0] === "Safety caution")).toBe(true);
  });

  it("writes the batch sheet with numeric target masses and volumes as supplied, units in the headers and blank columns to fill in", () => {
    const rows = grid(wb, "Batch sheet");
    expect(rows[0]).toEqual([
      "Order",
      "Material",
      "Role",
      "Lot number",
      "Target mass as supplied (g)",
      "Target volume as supplied (mL)",
      "Actual mass (g)",
      "Time (hh:mm)",
      "Initials",
    ]);
    const lines = rev.result!.lines.filter((l) => l.massGrams > 0);
    expect(rows.length - 1).toBe(lines.length);
    lines.forEach((line, i) => {
      const row = rows[i + 1]!;
      expect(row[0]).toBe(i + 1);
      expect(row[1]).toBe(rev.input.materials.find((m) => m.id === line.materialId)!.name);
      // Same double as the engine's, not a rounded copy.
      expect(row[4]).toBe(line.massGrams);
      expect(row[5]).toBe(line.volumeMl);
      expect([row[3], row[6], row[7], row[8]]).toEqual([null, null, null, null]);
    });
    const cell = wb.Sheets["Batch sheet"]!["E2"]!;
    expect(cell.t).toBe("n");
  });

  it("keeps each exact mass in its cell with a number format that shows the balance resolution", () => {
    const formatted = XLSX.read(bytes, { type: "buffer", cellNF: true }).Sheets["Batch sheet"]!;
    const lines = rev.result!.lines.filter((l) => l.massGrams > 0);
    lines.forEach((line, i) => {
      const mass = formatted[`E${i + 2}`] as XLSX.CellObject;
      const volume = formatted[`F${i + 2}`] as XLSX.CellObject;
      expect([mass.v, mass.z]).toEqual([line.massGrams, "0.00"]); // default balance: 0.01 g
      expect([volume.v, volume.z]).toEqual([line.volumeMl, "0.00"]); // 0.01 mL
    });
    const milligram = XLSX.read(revisionWorkbook(rev, { balanceResolutionGrams: 0.001 }), { type: "buffer", cellNF: true }).Sheets["Batch sheet"]!;
    expect((milligram.E2 as XLSX.CellObject).z).toBe("0.000");
  });

  it("writes the dry composite's weight and volume fractions, densities, porosity and shrinkage", () => {
    const rows = grid(wb, "Dry composite");
    const c = rev.result!.composite;
    c.phases.forEach((phase, i) => {
      expect(rows[i + 1]!.slice(2, 5)).toEqual([phase.weightFraction, phase.volumeFraction, phase.density]);
    });
    const value = (label: string) => rows.find((row) => row[0] === label)?.[2];
    expect(value("Theoretical density (g/cm³)")).toBe(c.theoreticalDensity);
    expect(value("Shrinkage, sol to dense solid, volumetric (fraction)")).toBe(c.denseShrinkage.volumetric);
    expect(value("Porosity (fraction)")).toBe(c.porosity ?? null);
  });

  it("writes the thermal check as materials × steps with the binding limit", () => {
    const rows = grid(wb, "Thermal check");
    expect(rows[0]!.slice(4)).toEqual(rev.input.steps.map((s) => `${s.name} (${s.stage ?? "curing"}, ${s.atmosphere === "inert" ? "inert gas" : "air"}, ${s.temperatureC} °C, ${s.durationH} h)`));
    // The demo sets each step's stage: the sol stage shows as such.
    expect(rows[0]!.slice(4).some((heading) => String(heading).includes("(sol, air,"))).toBe(true);
    const pc = rows.find((row) => row[0] === "Polycarbonate (bisphenol A)")!;
    expect(pc).toBeDefined();
    // Cure at 120 °C is within 20 °C of the polycarbonate's hard limit: a caution (demo comment on HC-3 r2).
    expect(String(pc[4 + 3])).toMatch(/^caution/);
    const t = rev.result!.thermal;
    expect(rows.find((row) => row[0] === "Highest allowed step temperature (°C)")?.[1]).toBe(t.maxAllowedC);
    expect(String(rows.find((row) => row[0] === "Bound by")?.[1])).toContain("Polycarbonate");
  });

  it("freezes the header rows and sets column widths on every sheet", () => {
    for (let i = 1; i <= 10; i++) {
      const xml = sheetXml(bytes, i);
      expect(xml).toMatch(/<pane ySplit="1" topLeftCell="A2" activePane="bottomLeft" state="frozen"\/>/);
      expect(xml).toMatch(/<cols><col /);
    }
  });

  it("returns the batch sheet as CSV with the same lines, masses rounded to the balance and volumes to 0.01 mL", () => {
    const csv = batchSheetCsv(rev);
    expect(csv.startsWith('\uFEFF"Order","Material","Role","Lot number","Target mass as supplied (g)"')).toBe(true);
    // The batch table ends where the "[Coating and VOC]" table starts (when the revision has one).
    const all = parseCsv(csv).rows;
    const end = all.findIndex((r) => r[0] === "[Coating and VOC]");
    const rows = (end < 0 ? all : all.slice(0, end)).filter((r) => r.some((c) => c !== null));
    const lines = rev.result!.lines.filter((l) => l.massGrams > 0);
    expect(rows.length).toBe(lines.length + 1);
    lines.forEach((line, i) => {
      const [mass, volume] = [String(rows[i + 1]![4]), String(rows[i + 1]![5])];
      // Two decimals for the default 0.01 g balance, within half a step of the exact figure.
      expect(mass).toMatch(/^\d+\.\d{2}$/);
      expect(Math.abs(Number(mass) - line.massGrams)).toBeLessThanOrEqual(0.005 + 1e-12);
      expect(volume).toMatch(/^\d+\.\d{2}$/);
      expect(Math.abs(Number(volume) - line.volumeMl)).toBeLessThanOrEqual(0.005 + 1e-12);
    });
    const tenth = parseCsv(batchSheetCsv(rev, { balanceResolutionGrams: 0.1 })).rows;
    expect(String(tenth[1]![4])).toMatch(/^\d+\.\d$/);
  });
});

describe("formula-injection neutralising", () => {
  const triggers = ["=1+2", "+1", "-1", "@SUM(A1)", "\tTAB", "\rCR"];

  it("prefixes text starting with = + - @ tab or carriage return with an apostrophe and leaves other text alone", () => {
    for (const t of triggers) expect(neutraliseText(t)).toBe(`'${t}`);
    expect(neutraliseText("TEOS")).toBe("TEOS");
    expect(neutraliseText("1-propanol")).toBe("1-propanol");
    expect(neutraliseText("")).toBe("");
    for (const t of triggers) expect(restoreText(neutraliseText(t))).toBe(t);
    expect(restoreText("'plain")).toBe("'plain");
  });

  it("neutralises every text cell of an exported workbook and CSV, and keeps numbers numeric", () => {
    const input = structuredClone(released.input);
    const gptms = input.materials.find((m) => m.id === "gptms")!;
    gptms.name = '=HYPERLINK("http://example.invalid","x")';
    input.steps = [...input.steps, { name: "@cmd", temperatureC: -20, durationH: 1 }];
    const rev = revision(input, "+Formulation");
    const wb = open(revisionWorkbook(rev));
    const texts: string[] = [];
    for (const name of wb.SheetNames) {
      const ws = wb.Sheets[name]!;
      for (const [addr, cell] of Object.entries(ws)) {
        if (addr.startsWith("!")) continue;
        const c = cell as XLSX.CellObject;
        expect(c.f).toBeUndefined();
        if (c.t === "s") texts.push(String(c.v));
      }
    }
    for (const text of texts) expect(/^[=+\-@\t\r]/.test(text)).toBe(false);
    expect(texts).toContain(`'=HYPERLINK("http://example.invalid","x")`);
    expect(texts).toContain("'+Formulation");
    expect(texts).toContain("'@cmd");
    const steps = grid(wb, "Process steps");
    expect(steps.find((row) => row[0] === "'@cmd")?.[1]).toBe(-20);

    const csv = batchSheetCsv(rev);
    expect(csv).toContain(`"'=HYPERLINK(""http://example.invalid"",""x"")"`);
    for (const row of parseCsv(csv).rows) for (const cell of row) if (typeof cell === "string") expect(/^[=+\-@\t\r]/.test(cell)).toBe(false);
    expect(toCsv([{ name: "t", rows: [["-2", -2, "\tx"]] }])).toBe('\uFEFF"\'-2","-2","\'\tx"\r\n');
  });
});

/**
 * The complete rule of OWASP "CSV Injection"
 * (https://owasp.org/www-community/attacks/CSV_Injection): no cell may begin
 * with = + - @ tab (0x09) or carriage return (0x0D), prefixed with a single
 * quote; in CSV every cell is also wrapped in double quotes with embedded
 * double quotes doubled, so a separator or a quote inside a cell cannot start
 * a new cell. We also treat a leading line feed (0x0A) and the full-width and
 * small forms of = + - @ (＝ ＋ － ＠, ﹦ ﹢ ﹣ ﹫; spreadsheet programs in East
 * Asian locales read them as the ASCII operators) as triggers, and spaces
 * before a trigger (common practice, no other source).
 */
describe("formula-injection neutralising, the complete OWASP rule", () => {
  const triggers = [
    "=1+2",
    "+1",
    "-1",
    "@SUM(A1)",
    "\tTAB",
    "\rCR",
    "\nLF=cmd|' /C calc'!A0",
    "＝1+2",
    "＋1",
    "－1",
    "＠SUM(A1)",
    "﹦1+2",
    "﹢1",
    "﹣1",
    "﹫SUM(A1)",
    " =1+2",
    "\u00a0=1+2",
    "\u3000＝1+2",
  ];

  it("prefixes every trigger with a single quote, and the import removes it again", () => {
    for (const t of triggers) {
      expect(neutraliseText(t), JSON.stringify(t)).toBe(`'${t}`);
      expect(restoreText(neutraliseText(t)), JSON.stringify(t)).toBe(t);
    }
    for (const plain of ["TEOS", "1-propanol", "pH 4", "a=b", "x@y.example", "'quoted", "", "  spaced"]) expect(neutraliseText(plain)).toBe(plain);
    expect(restoreText("'plain")).toBe("'plain");
  });

  it("wraps every CSV cell in double quotes and doubles embedded quotes, so a separator or quote cannot open a new cell", () => {
    // OWASP's example payload that breaks out of a cell through a quote and a separator.
    const breakout = 'a";=1+2;"b';
    const csv = toCsv([{ name: "t", rows: [[breakout, "x,=2+3", "y;@SUM(A1)", 'He said "hi"', "TEOS"]] }]);
    expect(csv).toBe('\uFEFF"a"";=1+2;""b","x,=2+3","y;@SUM(A1)","He said ""hi""","TEOS"\r\n');
    const { rows } = parseCsv(csv);
    expect(rows).toEqual([[breakout, "x,=2+3", "y;@SUM(A1)", 'He said "hi"', "TEOS"]]);
  });

  it("writes the neutralised text of every trigger into quoted CSV cells that read back as the text", () => {
    const csv = toCsv([{ name: "t", rows: [triggers] }]);
    const { rows } = parseCsv(csv);
    expect(rows[0]).toEqual(triggers.map((t) => `'${t}`));
    const fields = csv.slice(1).replace(/\r\n$/, "");
    expect(fields.startsWith('"\'=1+2","\'+1"')).toBe(true);
  });

  it("keeps numbers numeric and unprefixed: -1.5 stays a number in the workbook and the CSV", () => {
    const csv = toCsv([{ name: "t", rows: [[-1.5, 0, 2e-7, -20, true, null, "-1.5"]] }]);
    expect(csv).toBe('\uFEFF"-1.5","0","2e-7","-20","true",,"\'-1.5"\r\n');
    const input = structuredClone(released.input);
    input.steps = [...input.steps, { name: "－cool", temperatureC: -1.5, durationH: 1 }];
    const wb = open(revisionWorkbook(revision(input)));
    const step = grid(wb, "Process steps").find((row) => row[0] === "'－cool");
    expect(step?.[1]).toBe(-1.5);
  });
});

describe("materials library export", () => {
  const materials = released.input.materials;

  it("returns the Materials and Material sources sheets with units in the headers", () => {
    const wb = open(materialsWorkbook(materials));
    expect(wb.SheetNames).toEqual(["Read me", "Materials", "Material sources"]);
    const rows = grid(wb, "Materials");
    expect(rows[0]).toContain("Density as supplied (g/cm³)");
    const teos = rows.find((row) => row[0] === "Tetraethoxysilane (TEOS)")!;
    // data/materials.ts: TEOS 208.329 g/mol, 0.933 g/cm³ (CRC Handbook).
    expect(teos[4]).toBe(208.329);
    expect(teos[5]).toBe(0.933);
    expect(grid(wb, "Material sources").length).toBeGreaterThan(materials.length);
  });

  it("returns CSV with the sources table after a [Material sources] line", () => {
    const csv = materialsCsv(materials);
    expect(csv).toContain('\r\n\r\n"[Material sources]"\r\n"Material","Property","Source"\r\n');
  });

  describe("edge cases", () => {
    it("makes file names safe for headers and file systems", () => {
      expect(safeFileName('Visor "HC-3" / r2', "xlsx")).toBe("Visor-HC-3-r2.xlsx");
      expect(safeFileName("", "csv")).toBe("export.csv");
    });
  });
});

describe("words in the sheets", () => {
  const engineName = /\b[a-z]+[A-Z][a-z]|[A-Za-z]\.[A-Za-z]/; // camelCase or a dotted path, e.g. precursor.leavingAlcohol

  it("names every heading, label and source property in plain words, never an engine field name", () => {
    const wb = open(revisionWorkbook(revision(released.input)));
    const properties = grid(wb, "Material sources")
      .slice(1)
      .map((row) => String(row[1]));
    expect(properties).toContain("Leaving alcohol (name and molar mass)");
    expect(properties).toContain("Residue density (g/cm³)");
    for (const property of properties) expect(property).not.toMatch(engineName);
    for (const name of wb.SheetNames.filter((n) => n !== "Read me")) {
      const rows = grid(wb, name);
      const labels = [...(rows[0] ?? []), ...rows.map((row) => row[0])].filter((cell): cell is string => typeof cell === "string");
      for (const label of labels) expect(label, `${name}: ${label}`).not.toMatch(engineName);
    }
  });

  it("reads each property's words back to the same key on import", () => {
    const keys = new Set(referenceMaterials.flatMap((m) => Object.keys(m.sources ?? {})));
    expect(keys.has("precursor.leavingAlcohol")).toBe(true);
    for (const key of [...keys, "storage.shelfLifeDays"]) expect(sourcePropertyKey(sourcePropertyLabel(key)), key).toBe(key);
    // A property without words of its own keeps its key in brackets, after the words.
    expect(sourcePropertyLabel("storage.shelfLifeDays")).toBe("Storage shelf life days [storage.shelfLifeDays]");
    expect(sourcePropertyKey("density as supplied")).toBe("density");
  });
});
