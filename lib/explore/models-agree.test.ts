import { describe, expect, it } from "vitest";
import { decimalModel } from "../formulation/numeric/figures";
import { numericModel } from "../formulation/numeric/model";
import { outputCatalogue } from "./outputs";
import { planAndRun } from "./run";
import type { Grid, Search } from "./spec";
import { visorCoat } from "./test-fixtures";
import type { ExplorationRun } from "./types";

// Priced with the demo's invented prices (db/demo.ts, demo data) so that the cost figures are compared too.
const PRICES: Record<string, number> = { teos: 42, gptms: 165, "ti-isopropoxide": 120, acac: 58, ethanol: 6.5, "water-di": 0.8, "hcl-37": 14 };
const unpriced = visorCoat(0.05);
const base = { ...unpriced, materials: unpriced.materials.map((m) => (PRICES[m.id] === undefined ? m : { ...m, pricePerKg: PRICES[m.id] })) };
const outputs = outputCatalogue(base).map((o) => o.key);
const search: Search = { constraints: [{ output: "organicContent", min: 0.5 }], thermal: "caution", objective: { goal: "closest", output: "refractiveIndex", value: 1.586 } };

function both(grid: Grid): [ExplorationRun, ExplorationRun] {
  const runs = [decimalModel(base.materials), numericModel(base.materials)].map((model) => {
    const run = planAndRun({ base, grid, outputs, search, model });
    if ("message" in run) throw new Error(run.message);
    return run;
  });
  return [runs[0]!, runs[1]!];
}

/** |a − b| ≤ 1e-9 · max(|a|, |b|, 1e-12), NaN only with NaN (the bound for the numeric path). */
function agree(a: number, b: number): boolean {
  if (Number.isNaN(a) || Number.isNaN(b)) return Number.isNaN(a) && Number.isNaN(b);
  return Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b), 1e-12);
}

describe("the numeric path and the decimal engine on an exploration grid", () => {
  const grids: [string, Grid][] = [
    ["titania × cure temperature map", { kind: "sweep", variables: [{ kind: "weightFraction", materialId: "ti-isopropoxide", from: 0, to: 0.2, step: 0.05 }, { kind: "stepTemperature", index: 3, from: 90, to: 150, step: 20 }] }],
    ["water ratio × modifier ratio map", { kind: "sweep", variables: [{ kind: "waterRatio", from: 0.5, to: 4, step: 0.5 }, { kind: "modifierRatio", index: 0, from: 0.5, to: 2, step: 0.5 }] }],
    ["ternary map", { kind: "ternary", materialIds: ["gptms", "teos", "ti-isopropoxide"], step: 0.125 }],
    ["solids content × withdrawal speed map", { kind: "sweep", variables: [{ kind: "solidsContent", from: 0.05, to: 0.35, step: 0.1 }, { kind: "withdrawalSpeed", from: 0.5, to: 4.5, step: 1 }] }],
  ];
  for (const [name, grid] of grids) {
    it(`agree within 1e-9 on every figure, verdict, refusal and candidate: ${name}`, () => {
      const [reference, fast] = both(grid);
      expect([...fast.status]).toEqual([...reference.status]);
      expect(fast.refusals).toEqual(reference.refusals);
      const mismatches: string[] = [];
      reference.outputs.forEach((key, o) => {
        for (let p = 0; p < reference.plan.count; p++) {
          const a = reference.values[o]![p]!;
          const b = fast.values[o]![p]!;
          if (!agree(a, b)) mismatches.push(`${key} at point ${p}: decimal ${a}, numeric ${b}`);
        }
      });
      expect(mismatches).toEqual([]);
      // the coat's figures are there to compare, not NaN on both sides
      for (const key of ["refractiveIndex", "dryThicknessNm", "vocGramsPerLitre", "costPerM2"]) expect(reference.values[reference.outputs.indexOf(key)]!.some(Number.isFinite)).toBe(true);
      expect(fast.candidates?.map((c) => c.point)).toEqual(reference.candidates?.map((c) => c.point));
    });
  }
});
