/**
 * Batch record arithmetic, worked by hand in the comments: deviation from
 * target, the tolerance check (±1 % or the balance resolution, whichever is
 * larger) and the composition actually made.
 */
import * as XLSX from "xlsx";
import { describe, expect, it } from "vitest";
import { referenceMaterials } from "@/data/materials";
import { computeFormulation, type FormulationInput } from "@/lib/formulation";
import { actualComposition, batchLinesFrom, batchWorkbook, lineDeviation } from "@/lib/spreadsheet/batch-record";

describe("lineDeviation", () => {
  it("returns the absolute and relative deviation and flags nothing inside ±1 %", () => {
    // target 24.00 g, actual 24.20 g: +0.20 g; 0.20 / 24.00 = 0.0083333…; tolerance max(0.01 × 24 = 0.24 g, 0.01 g) = 0.24 g → inside.
    const d = lineDeviation(24, 24.2, 0.01, 0.01);
    expect(d.absoluteGrams).toBeCloseTo(0.2, 12);
    expect(d.relative).toBeCloseTo(0.2 / 24, 12);
    expect(d.toleranceGrams).toBe(0.24);
    expect(d.outside).toBe(false);
  });

  it("flags a line beyond ±1 % of its target", () => {
    // target 24.00 g, actual 23.70 g: −0.30 g; −0.30 / 24 = −0.0125 (−1.25 %); |−0.30| > 0.24 g → outside.
    const d = lineDeviation(24, 23.7, 0.01, 0.01);
    expect(d.absoluteGrams).toBeCloseTo(-0.3, 12);
    expect(d.relative).toBeCloseTo(-0.0125, 12);
    expect(d.outside).toBe(true);
  });

  it("uses the balance resolution when it is larger than 1 % of a small target", () => {
    // target 0.500 g: 1 % = 0.005 g < resolution 0.01 g → tolerance 0.01 g.
    // actual 0.508 g: +0.008 g → inside; actual 0.515 g: +0.015 g → outside.
    expect(lineDeviation(0.5, 0.508, 0.01, 0.01)).toMatchObject({ toleranceGrams: 0.01, outside: false });
    expect(lineDeviation(0.5, 0.515, 0.01, 0.01)).toMatchObject({ toleranceGrams: 0.01, outside: true });
  });

  describe("edge cases", () => {
    it("treats a deviation exactly at the tolerance as inside (decimal arithmetic, no binary rounding)", () => {
      // target 10 g, actual 10.1 g: deviation exactly 0.1 g = 1 % of 10 g. In binary floating point 10.1 − 10 = 0.0999999999999996.
      const d = lineDeviation(10, 10.1, 0.01, 0.01);
      expect(d.absoluteGrams).toBe(0.1);
      expect(d.outside).toBe(false);
    });

    it("returns a null relative deviation for a zero target", () => {
      expect(lineDeviation(0, 0.02, 0.01, 0.01)).toMatchObject({ relative: null, toleranceGrams: 0.01, outside: true });
    });
  });
});

describe("actualComposition", () => {
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

  it("returns the target composition when every line is weighed exactly", () => {
    const made = actualComposition(input, result, weigh({}))!;
    expect(made.components.map((c) => c.actualWeightFraction)).toEqual([0.7, 0.3]);
    expect(made.effectiveR.actual).toBeCloseTo(4, 12);
    expect(made.solidGrams.actual).toBeCloseTo(10, 12);
  });

  it("recomputes weight fractions and the water ratio after a 10 % overdose of TEOS", () => {
    // TEOS residue 7 g × 1.1 = 7.7 g; PDMS 3 g; dry composite 10.7 g.
    // Weight fractions 7.7 / 10.7 = 0.719626…, 3 / 10.7 = 0.280374….
    // Water W = 4 · n(Si) unchanged, Si atoms 1.1 · n(Si): R = 4 / 1.1 = 3.636364…; h = 4 / (4 × 1.1) = 0.909091….
    // Theoretical density (rule of mixtures; SiO2 2.20 g/cm³ CRC, PDMS 0.97 g/cm³ supplier value in data/materials.ts):
    // 1 / (0.719626 / 2.2 + 0.280374 / 0.97) = 1 / (0.327103 + 0.289045) = 1.622987 g/cm³.
    const made = actualComposition(input, result, weigh({ teos: 1.1 }))!;
    expect(made.solidGrams.actual).toBeCloseTo(10.7, 10);
    expect(made.components[0]!.actualWeightFraction).toBeCloseTo(0.7196261682, 9);
    expect(made.components[1]!.actualWeightFraction).toBeCloseTo(0.2803738318, 9);
    expect(made.effectiveR.actual).toBeCloseTo(3.6363636364, 9);
    expect(made.effectiveH.actual).toBeCloseTo(0.9090909091, 9);
    expect(made.effectiveR.target).toBeCloseTo(4, 12);
    expect("composite" in made.engine && made.engine.composite.theoreticalDensity).toBeCloseTo(1.6229867, 6);
  });

  it("returns null until every line has an actual mass", () => {
    const partial = weigh({}).map((l, i) => (i === 0 ? { ...l, actualGrams: null } : l));
    expect(actualComposition(input, result, partial)).toBeNull();
  });

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
});
