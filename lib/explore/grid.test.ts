import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { isPlanError, planGrid, rangeValues, ternaryShares } from "./grid";
import type { Grid, Variable } from "./spec";
import { visorCoat } from "./test-fixtures";
import type { GridPlan, PlanError } from "./types";

const base = visorCoat(0.05);
const nameOf = (id: string): string => base.materials.find((m) => m.id === id)!.name;
const sweep = (...variables: Variable[]): Grid => ({ kind: "sweep", variables });
const titania = (from: number, to: number, step: number): Variable => ({ kind: "weightFraction", materialId: "ti-isopropoxide", from, to, step });

function plan(grid: Grid, input = base): GridPlan {
  const result = planGrid(grid, input);
  if (isPlanError(result)) throw new Error(`${result.field}: ${result.message}`);
  return result;
}
function refusal(grid: Grid, input = base): PlanError {
  const result = planGrid(grid, input);
  if (!isPlanError(result)) throw new Error(`planned ${result.count} points`);
  return result;
}

describe("planGrid", () => {
  it("counts a titania sweep 0–20 wt% in 1 wt% steps as 21 points, `to` included exactly", () => {
    const p = plan(sweep(titania(0, 0.2, 0.01)));
    expect(p.count).toBe(21);
    expect(p.axes).toHaveLength(1);
    expect(p.axes[0]!.values[0]).toBe(0);
    expect(p.axes[0]!.values[20]).toBe(0.2);
    expect(p.axes[0]!.values[5]).toBeCloseTo(0.05, 15);
    expect(p.axes[0]!.label).toBe(`${nameOf("ti-isopropoxide")}, weight fraction of the dry composite`);
    expect(p.axes[0]!.unit).toBe("wt%");
    expect(p.axes[0]!.percent).toBe(true);
    // the revision's own 5 wt% lies in the range: marked
    expect(p.base).toEqual([0.05]);
  });

  it("stops at the last step that does not pass `to`, and runs downwards when from > to", () => {
    expect(rangeValues(0, 1, 0.3)).toEqual([0, 0.3, 0.6, 0.8999999999999999]);
    expect(rangeValues(100, 80, 10)).toEqual([100, 90, 80]);
    // 0.1 + 0.1 + 0.1 = 0.30000000000000004 in float64: within 1e-9 of a step, so it is `to` itself
    expect(rangeValues(0, 0.3, 0.1)).toEqual([0, 0.1, 0.2, 0.3]);
    const p = plan(sweep({ kind: "stepTemperature", index: 3, from: 140, to: 80, step: 20 }));
    expect(p.axes[0]!.values).toEqual([140, 120, 100, 80]);
    expect(p.axes[0]!.label).toBe("Temperature of step 4, Thermal cure");
    expect(p.axes[0]!.unit).toBe("°C");
    expect(p.base).toEqual([120]);
  });

  it("orders two-variable points with the second variable fastest: p = i0 · n1 + i1", () => {
    const p = plan(sweep(titania(0, 0.1, 0.05), { kind: "waterRatio", from: 1, to: 4, step: 1 }));
    expect(p.count).toBe(12);
    expect(p.axes.map((a) => a.values.length)).toEqual([3, 4]);
    expect(p.axes[1]!.label).toBe("Water ratio R (mol water per mol network-forming atom)");
    expect(p.axes[1]!.unit).toBe("mol/mol");
    // the revision's R = 1.5 lies in 1–4: marked, though it is not a grid value
    expect(p.base).toEqual([0.05, 1.5]);
  });

  it("labels every kind of variable with the revision's names and units", () => {
    const modifier = plan(sweep({ kind: "modifierRatio", index: 0, from: 0.5, to: 2, step: 0.5 }));
    expect(modifier.axes[0]!.label).toContain("per mol metal of");
    expect(modifier.axes[0]!.label).toContain(base.materials.find((m) => m.id === "acac")!.name);
    expect(modifier.axes[0]!.unit).toBe("mol/mol");
    const solids = plan(sweep({ kind: "solidsContent", from: 0.1, to: 0.3, step: 0.05 }));
    expect(solids.axes[0]!.unit).toBe("wt%");
    expect(solids.base).toEqual([0.2]);
    const speed = plan(sweep({ kind: "withdrawalSpeed", from: 1, to: 5, step: 1 }));
    expect(speed.axes[0]!.unit).toBe("mm/s");
    const perTeos = plan(sweep({ kind: "waterRatio", from: 1, to: 4, step: 1 }), { ...base, water: { materialId: "water-di", ratio: "perPrecursor", referenceId: "teos", value: 2 } });
    expect(perTeos.axes[0]!.label).toBe(`Water ratio (mol water per mol ${base.materials.find((m) => m.id === "teos")!.name})`);
    const h = plan(sweep({ kind: "waterRatio", from: 1, to: 4, step: 1 }), { ...base, water: { ...base.water, ratio: "h" } });
    expect(h.axes[0]!.label).toContain("Water ratio h");
  });

  it("starts exactly at `from`, a −0 included (the property's counterexample of 2026-12-03)", () => {
    expect(Object.is(rangeValues(-0, 0.000999999999, 0.001)[0], -0)).toBe(true);
  });

  it("never passes `to`, steps by `step`, and counts what it lists (property)", () => {
    fc.assert(
      fc.property(fc.double({ min: -200, max: 4000, noNaN: true }), fc.double({ min: -200, max: 4000, noNaN: true }), fc.double({ min: 1e-3, max: 5000, noNaN: true }), (from, to, step) => {
        const result = planGrid(sweep({ kind: "stepTemperature", index: 3, from, to, step }), base);
        if (isPlanError(result)) {
          expect(result.field.startsWith("grid.variables.0")).toBe(true);
          return;
        }
        const values = result.axes[0]!.values;
        expect(result.count).toBe(values.length);
        expect(result.count).toBeLessThanOrEqual(20_000);
        expect(values[0]).toBe(from);
        const lo = Math.min(from, to);
        const hi = Math.max(from, to);
        for (const v of values) expect(v >= lo && v <= hi).toBe(true);
        for (let i = 1; i < values.length; i++) expect(Math.abs(Math.abs(values[i]! - values[i - 1]!) - step)).toBeLessThanOrEqual(1e-9 * Math.max(step, Math.abs(to)));
        // one more step would pass `to`
        expect(Math.abs(values[values.length - 1]! - from) + step).toBeGreaterThan(Math.abs(to - from) * (1 + 1e-12));
      }),
      { numRuns: 1000 },
    );
  });

  it("leaves out the revision's mark when its value lies outside the range", () => {
    expect(plan(sweep(titania(0.1, 0.2, 0.05))).base).toBeUndefined();
  });

  describe("ternary maps", () => {
    it("has 231 points at a step of 0.05 (21 a side), every triple summing to 1, in the documented order", () => {
      const p = plan({ kind: "ternary", materialIds: ["gptms", "teos", "ti-isopropoxide"], step: 0.05 });
      expect(p.count).toBe(231);
      expect(p.axes).toEqual([]);
      const t = p.ternary!;
      expect(t.shares).toHaveLength(3 * 231);
      expect(t.total).toBeCloseTo(1, 12);
      for (let i = 0; i < 231; i++) expect(t.shares[3 * i]! + t.shares[3 * i + 1]! + t.shares[3 * i + 2]!).toBeCloseTo(1, 12);
      // first point: all of the third component; second: one step of the second; last: all of the first
      expect([...t.shares.slice(0, 3)]).toEqual([0, 0, 1]);
      expect([...t.shares.slice(3, 6)]).toEqual([0, 0.05, 0.95]);
      expect([...t.shares.slice(-3)]).toEqual([1, 0, 0]);
      expect(p.base).toEqual([0.7, 0.25, 0.05].map((f) => f / t.total));
      expect(t.labels[0]).toBe(base.materials.find((m) => m.id === "gptms")!.name);
    });

    it("shares the three components' own total when other components stay fixed", () => {
      const p = plan({ kind: "ternary", materialIds: ["teos", "ti-isopropoxide", "gptms"], step: 0.5 });
      expect(p.count).toBe(6);
      expect(ternaryShares(2)).toEqual(new Float64Array([0, 0, 1, 0, 0.5, 0.5, 0, 1, 0, 0.5, 0, 0.5, 0.5, 0.5, 0, 1, 0, 0]));
      const four = { ...base, components: [...base.components.map((c) => ({ ...c, weightFraction: c.weightFraction * 0.9 })), { materialId: "pdms-silanol", weightFraction: 0.1 }] };
      const partial = plan({ kind: "ternary", materialIds: ["gptms", "teos", "ti-isopropoxide"], step: 0.25 }, four);
      expect(partial.count).toBe(15);
      expect(partial.ternary!.total).toBeCloseTo(0.9, 12);
    });
  });

  describe("refusals, each naming its field", () => {
    it("refuses an empty range", () => {
      const r = refusal(sweep(titania(0.1, 0.1, 0.01)));
      expect(r.field).toBe("grid.variables.0.to");
      expect(r.message).toContain("empty");
    });

    it("refuses a step of 0 or below (schema)", () => {
      expect(refusal(sweep(titania(0, 0.2, 0))).field).toBe("grid.variables.0.step");
      expect(refusal(sweep(titania(0, 0.2, -0.01))).message).toBe("step must be greater than 0");
    });

    it("refuses a step larger than the range", () => {
      const r = refusal(sweep({ kind: "waterRatio", from: 1, to: 2, step: 5 }));
      expect(r.field).toBe("grid.variables.0.step");
      expect(r.message).toContain("larger than the range");
    });

    it("refuses 10⁷ points before computing any, stating the cap", () => {
      const r = refusal(sweep({ kind: "modifierRatio", index: 0, from: 0, to: 9999, step: 1 }, { kind: "waterRatio", from: 0, to: 999, step: 1 }));
      expect(r.field).toBe("grid.variables");
      expect(r.message).toBe("this grid would compute 10,000,000 points; at most 20,000 — widen the step or narrow the range");
      const one = refusal(sweep({ kind: "waterRatio", from: 0, to: 100, step: 0.001 }));
      expect(one.field).toBe("grid.variables.0.step");
      expect(one.message).toContain("100,001 points");
      // exactly at the cap is allowed: 200 × 100
      expect(plan(sweep({ kind: "waterRatio", from: 0.01, to: 2, step: 0.01 }, { kind: "stepTemperature", index: 3, from: 1, to: 100, step: 1 })).count).toBe(20_000);
      expect(refusal({ kind: "ternary", materialIds: ["gptms", "teos", "ti-isopropoxide"], step: 0.005 }).field).toBe("grid.step");
      expect(refusal(sweep(titania(0, 1, 1e-300))).message).toBe("this grid would compute more than 1,000,000,000,000 points; at most 20,000 — widen the step or narrow the range");
    });

    it("refuses a weight fraction outside 0–1", () => {
      expect(refusal(sweep(titania(0, 1.2, 0.1))).field).toBe("grid.variables.0.to");
      expect(refusal(sweep(titania(-0.1, 0.2, 0.1))).field).toBe("grid.variables.0.from");
    });

    it("refuses a material that is not a component", () => {
      const r = refusal(sweep({ kind: "weightFraction", materialId: "ethanol", from: 0, to: 0.2, step: 0.1 }));
      expect(r.field).toBe("grid.variables.0.materialId");
      expect(r.message).toContain("not a component");
      expect(refusal({ kind: "ternary", materialIds: ["gptms", "teos", "acac"], step: 0.1 }).field).toBe("grid.materialIds.2");
    });

    it("refuses the solids content without a solids-content basis, and outside 0–1", () => {
      const r = refusal(sweep({ kind: "solidsContent", from: 0.1, to: 0.3, step: 0.1 }), { ...base, basis: { type: "solidMass", grams: 10 }, solvent: undefined });
      expect(r.field).toBe("grid.variables.0.kind");
      expect(r.message).toContain("solids-content basis");
      expect(refusal(sweep({ kind: "solidsContent", from: 0, to: 0.3, step: 0.1 })).field).toBe("grid.variables.0.from");
    });

    it("refuses a modifier or step that does not exist", () => {
      const m = refusal(sweep({ kind: "modifierRatio", index: 1, from: 0.5, to: 1, step: 0.5 }));
      expect(m.field).toBe("grid.variables.0.index");
      expect(m.message).toBe("this revision has 1 modifier; modifier 2 does not exist");
      const s = refusal(sweep({ kind: "stepTemperature", index: 4, from: 80, to: 120, step: 10 }));
      expect(s.field).toBe("grid.variables.0.index");
      expect(s.message).toContain("step 5 does not exist");
    });

    it("refuses the withdrawal speed without a dip coat", () => {
      const r = refusal(sweep({ kind: "withdrawalSpeed", from: 1, to: 3, step: 1 }), { ...base, coating: undefined });
      expect(r.field).toBe("grid.variables.0.kind");
      expect(r.message).toContain("dip coat");
    });

    it("refuses the same variable twice", () => {
      expect(refusal(sweep(titania(0, 0.1, 0.05), titania(0, 0.2, 0.1))).field).toBe("grid.variables.1");
      expect(refusal(sweep({ kind: "waterRatio", from: 1, to: 2, step: 1 }, { kind: "waterRatio", from: 1, to: 3, step: 1 })).field).toBe("grid.variables.1");
      // two different steps' temperatures are two variables
      expect(plan(sweep({ kind: "stepTemperature", index: 2, from: 40, to: 60, step: 10 }, { kind: "stepTemperature", index: 3, from: 100, to: 120, step: 10 })).count).toBe(9);
    });

    it("refuses a ternary with a repeated component or a total of 0", () => {
      expect(refusal({ kind: "ternary", materialIds: ["gptms", "teos", "gptms"], step: 0.1 }).field).toBe("grid.materialIds.2");
      const components = [
        { materialId: "gptms", weightFraction: 0 },
        { materialId: "teos", weightFraction: 0 },
        { materialId: "ti-isopropoxide", weightFraction: 0 },
        { materialId: "pdms-silanol", weightFraction: 1 },
      ];
      const zero = refusal({ kind: "ternary", materialIds: ["teos", "ti-isopropoxide", "gptms"], step: 0.1 }, { ...base, components });
      expect(zero.field).toBe("grid.materialIds");
      expect(zero.message).toContain("sum to 0");
    });

    it("refuses a ternary step that does not divide the total into whole steps", () => {
      expect(refusal({ kind: "ternary", materialIds: ["gptms", "teos", "ti-isopropoxide"], step: 0.3 }).field).toBe("grid.step");
    });

    it("refuses values outside the engine's input limits", () => {
      expect(refusal(sweep({ kind: "stepTemperature", index: 3, from: -300, to: 100, step: 50 })).field).toBe("grid.variables.0.from");
      expect(refusal(sweep({ kind: "withdrawalSpeed", from: 0, to: 3, step: 1 })).field).toBe("grid.variables.0.from");
    });
  });
});
