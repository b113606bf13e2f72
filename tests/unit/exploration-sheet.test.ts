import * as XLSX from "xlsx";
import { describe, expect, it } from "vitest";
import { planAndRun } from "@/lib/explore/run";
import type { Search } from "@/lib/explore/spec";
import { visorCoat } from "@/lib/explore/test-fixtures";
import type { ExplorationRun } from "@/lib/explore/types";
import { decimalModel } from "@/lib/formulation/numeric/figures";
import { parseCsv } from "@/lib/spreadsheet/csv";
import { EXPLORATION_SHEETS, explorationCsv, explorationWorkbook } from "@/lib/spreadsheet/exploration-sheet";

const base = visorCoat(0.05);
const search: Search = { constraints: [{ output: "organicContent", min: 0.5 }], thermal: "caution", objective: { goal: "max", output: "refractiveIndex" } };
const result = planAndRun({
  base,
  grid: { kind: "sweep", variables: [{ kind: "weightFraction", materialId: "ti-isopropoxide", from: 0, to: 0.2, step: 0.05 }] },
  outputs: ["refractiveIndex", "dryThicknessNm"],
  search,
  model: decimalModel(base.materials),
});
if ("message" in result) throw new Error(result.message);
const run: ExplorationRun = result;
const exploration = { formulationName: '=HYPERLINK("x") visor', revisionLabel: "Revision 2", explorationName: "Titania, index", base, run, search };

describe("explorationWorkbook", () => {
  it("has an About sheet and a Points sheet with one row per point, read back with XLSX.read", () => {
    const wb = XLSX.read(explorationWorkbook(exploration), { type: "buffer" });
    expect(wb.SheetNames).toEqual([EXPLORATION_SHEETS.about, EXPLORATION_SHEETS.points]);
    const about = XLSX.utils.sheet_to_json<unknown[]>(wb.Sheets.About!, { header: 1 });
    expect(about[0]).toEqual(["Item", "Value"]);
    expect(about.some((row) => row[0] === "Note" && row[1] === "figures from the numeric path; recipes come from the full engine")).toBe(true);
    // a formula-like name is neutralised (stored as text, never a formula)
    const formulation = about.find((row) => row[0] === "Formulation")!;
    expect(String(formulation[1])).toContain("HYPERLINK");
    expect(String(formulation[1]).startsWith("=")).toBe(false);
    const points = XLSX.utils.sheet_to_json<unknown[]>(wb.Sheets.Points!, { header: 1 });
    expect(points).toHaveLength(1 + 5);
    expect(points[0]).toContain("Dry film thickness (nm)");
    expect(points[0]).toContain("Thermal check");
    expect(points[3]![0]).toBe(10);
    expect(points[3]![1]).toBeCloseTo(run.values[0]![2]!, 12);
    // the search appended organicContent to the outputs: it is a column too
    expect(points[0]).toContain("Organic content of the dry composite (burn-off) (wt%)");
  });
});

describe("explorationCsv", () => {
  it("writes the About table, then [Points] with one row per point (RFC 4180)", () => {
    const text = explorationCsv(exploration);
    expect(text.startsWith("\uFEFF")).toBe(true);
    expect(text).toContain("\r\n");
    const { rows } = parseCsv(text);
    const start = rows.findIndex((row) => row[0] === "[Points]");
    expect(start).toBeGreaterThan(5);
    expect(rows[0]).toEqual(["Item", "Value"]);
    const header = rows[start + 1]!;
    expect(header[0]).toContain("weight fraction of the dry composite (wt%)");
    expect(rows.slice(start + 2)).toHaveLength(5);
    expect(rows[start + 2]![0]).toBe("0");
    expect(rows[start + 6]![0]).toBe("20");
    expect(Number(rows[start + 3]![1])).toBe(run.values[0]![1]);
    expect(rows[start + 3]![header.indexOf("Thermal check")]).toBe("caution");
    // a cell with a comma and quotes stays one cell
    const about = rows.slice(0, start);
    expect(about.find((row) => row[0] === "Exploration")?.[1]).toBe("Titania, index");
  });
});
