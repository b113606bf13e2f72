/**
 * The batch record workbook: deviations, the composition made, and masses
 * shown to the balance resolution (the exact value stays in the cell).
 * The arithmetic itself is tested in lib/batches.
 */
import * as XLSX from "xlsx";
import { describe, expect, it } from "vitest";
import { referenceMaterials } from "@/data/materials";
import { actualComposition, batchLinesFrom } from "@/lib/batches";
import { computeFormulation, type FormulationInput } from "@/lib/formulation";
import { batchWorkbook } from "@/lib/spreadsheet/batch-record";

describe("batchWorkbook", () => {
  const teos = referenceMaterials.find((m) => m.id === "teos")!;
  const pdms = referenceMaterials.find((m) => m.id === "pdms-silanol")!;
  const water = referenceMaterials.find((m) => m.id === "water-di")!;
  const input: FormulationInput = {
    materials: [teos, pdms, water],
    basis: { type: "solidMass", grams: 10 },
    components: [
      { materialId: "teos", weightFraction: 0.7 },
      { materialId: "pdms-silanol", weightFraction: 0.3 },
    ],
    water: { materialId: "water-di", ratio: "R", value: 4 },
    steps: [{ name: "Dry", temperatureC: 60, durationH: 24 }],
  };
  const result = computeFormulation(input);
  const lines = batchLinesFrom(input, result);
  const weigh = (factor: Record<string, number>) =>
    lines.map((l) => ({ ...l, actualGrams: l.targetGrams! * (factor[l.materialId] ?? 1), lotNumber: "L1" }));

  it("exports the record with deviations and the composition made", () => {
    const weighed = weigh({ teos: 1.1 });
    const bytes = batchWorkbook({
      id: "b-1",
      formulationName: "Monolith",
      revisionNumber: 1,
      state: "closed",
      startedByName: "Pat Production",
      closedByName: "Pat Production",
      createdAt: new Date("2026-04-01T08:00:00Z"),
      closedAt: new Date("2026-04-01T09:00:00Z"),
      toleranceFraction: 0.01,
      balanceResolutionGrams: 0.01,
      notes: "=not a formula",
      lines: weighed,
      composition: actualComposition(input, result, weighed),
    });
    const wb = XLSX.read(bytes, { type: "buffer" });
    expect(wb.SheetNames).toEqual(["Overview", "Batch record", "Composition made"]);
    const rows = XLSX.utils.sheet_to_json<unknown[]>(wb.Sheets["Batch record"]!, { header: 1, raw: true, defval: null });
    const teosRow = rows.find((r) => r[1] === "Tetraethoxysilane (TEOS)")!;
    // +10 % of the target: deviation = 0.1 × target, fraction 0.1, outside ±1 %.
    expect(teosRow[6]).toBeCloseTo(0.1 * (teosRow[3] as number), 9);
    expect(teosRow[7]).toBeCloseTo(0.1, 12);
    expect(teosRow[9]).toBe("outside tolerance");
    const overview = XLSX.utils.sheet_to_json<unknown[]>(wb.Sheets.Overview!, { header: 1, raw: true, defval: null });
    expect(overview.find((r) => r[0] === "Notes")?.[1]).toBe("'=not a formula");
  });

  it("keeps the exact masses in the cells, shown to the balance resolution, and volumes to 0.01 mL", () => {
    const weighed = weigh({ teos: 1.1 });
    const record = (balanceResolutionGrams: number) =>
      XLSX.read(
        batchWorkbook({
          id: "b-2",
          formulationName: "Monolith",
          revisionNumber: 1,
          state: "closed",
          startedByName: null,
          closedByName: null,
          createdAt: new Date("2026-04-01T08:00:00Z"),
          closedAt: null,
          toleranceFraction: 0.01,
          balanceResolutionGrams,
          notes: null,
          lines: weighed,
          composition: null,
        }),
        { type: "buffer", cellNF: true },
      ).Sheets["Batch record"]!;
    const ws = record(0.1);
    weighed.forEach((line, i) => {
      const cell = (column: string) => ws[`${column}${i + 2}`] as XLSX.CellObject;
      // Target (D), actual (F), deviation (G) and tolerance (I) in g at 0.1 g; target volume (E) at 0.01 mL.
      expect([cell("D").v, cell("D").z]).toEqual([line.targetGrams, "0.0"]);
      expect([cell("F").v, cell("F").z]).toEqual([line.actualGrams, "0.0"]);
      expect([cell("G").z, cell("I").z, cell("E").z]).toEqual(["0.0", "0.0", "0.00"]);
      expect(cell("E").v).toBe(line.targetMl);
    });
    expect((record(0.001).D2 as XLSX.CellObject).z).toBe("0.000");
  });
});
