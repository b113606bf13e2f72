import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { referenceMaterials } from "../../data/materials";
import { formulationInputSchema, type FormulationInput } from "../formulation/input-schema";
import { isPointRefusal, pointInput } from "./apply";
import { isPlanError, planGrid } from "./grid";
import type { Grid } from "./spec";
import { visorCoat } from "./test-fixtures";
import type { GridPlan } from "./types";

const base = visorCoat(0.05);

function plan(grid: Grid, input: FormulationInput = base): GridPlan {
  const result = planGrid(grid, input);
  if (isPlanError(result)) throw new Error(`${result.field}: ${result.message}`);
  return result;
}
function at(p: GridPlan, point: number, input: FormulationInput = base): FormulationInput {
  const result = pointInput(input, p, point);
  if (isPointRefusal(result)) throw new Error(`${result.code} at ${result.field}`);
  return result;
}
const fractions = (input: FormulationInput): Record<string, number> => Object.fromEntries(input.components.map((c) => [c.materialId, c.weightFraction]));
const sum = (input: FormulationInput): number => input.components.reduce((s, c) => s + c.weightFraction, 0);

describe("pointInput", () => {
  it("sets a varied weight fraction; the others keep their proportions and share the rest", () => {
    const p = plan({ kind: "sweep", variables: [{ kind: "weightFraction", materialId: "ti-isopropoxide", from: 0, to: 0.2, step: 0.05 }] });
    const input = at(p, 4); // titania 0.2
    const f = fractions(input);
    expect(f["ti-isopropoxide"]).toBe(0.2);
    // GPTMS : TEOS stays 0.7 : 0.25 and they share 0.8: 0.8 × 0.7/0.95, 0.8 × 0.25/0.95
    expect(f.gptms).toBeCloseTo((0.8 * 0.7) / 0.95, 14);
    expect(f.teos).toBeCloseTo((0.8 * 0.25) / 0.95, 14);
    expect(f.gptms! / f.teos!).toBeCloseTo(0.7 / 0.25, 12);
    expect(sum(input)).toBeCloseTo(1, 14);
    expect(formulationInputSchema.safeParse(input).success).toBe(true);
  });

  it("copies only what the point changes and never changes the revision's input", () => {
    const frozen = structuredClone(base);
    const p = plan({ kind: "sweep", variables: [{ kind: "waterRatio", from: 1, to: 4, step: 1 }, { kind: "stepTemperature", index: 3, from: 80, to: 120, step: 20 }] });
    const input = at(p, 5); // R index 1 (= 2), temperature index 2 (= 120)
    expect(input.water.value).toBe(2);
    expect(input.steps[3]!.temperatureC).toBe(120);
    expect(input.materials).toBe(base.materials);
    expect(input.components).toBe(base.components);
    expect(input.modifiers).toBe(base.modifiers);
    expect(input.steps[0]).toBe(base.steps[0]);
    expect(input.steps).not.toBe(base.steps);
    expect(base).toEqual(frozen);
  });

  it("applies each other kind of variable", () => {
    const modifier = at(plan({ kind: "sweep", variables: [{ kind: "modifierRatio", index: 0, from: 0.5, to: 2, step: 0.5 }] }), 3);
    expect(modifier.modifiers![0]!.molPerMetal).toBe(2);
    const solids = at(plan({ kind: "sweep", variables: [{ kind: "solidsContent", from: 0.1, to: 0.3, step: 0.1 }] }), 2);
    expect(solids.basis).toEqual({ type: "solidsContent", solMassGrams: 500, solidsFraction: 0.3 });
    const speed = at(plan({ kind: "sweep", variables: [{ kind: "withdrawalSpeed", from: 1, to: 5, step: 2 }] }), 1);
    expect(speed.coating).toMatchObject({ method: "dip", withdrawalMmPerS: 3, viscosityMPaS: 3 });
  });

  it("sets a ternary point's three components to share × total and leaves the others", () => {
    const four = { ...base, materials: [...base.materials, referenceMaterials.find((m) => m.id === "pdms-silanol")!] };
    four.components = [...base.components.map((c) => ({ ...c, weightFraction: c.weightFraction * 0.9 })), { materialId: "pdms-silanol", weightFraction: 0.1 }];
    const p = plan({ kind: "ternary", materialIds: ["gptms", "teos", "ti-isopropoxide"], step: 0.25 }, four);
    // point 1 in the documented order: shares (0, 0.25, 0.75)
    const input = at(p, 1, four);
    const f = fractions(input);
    expect(f.gptms).toBe(0);
    expect(f.teos).toBeCloseTo(0.25 * 0.9, 14);
    expect(f["ti-isopropoxide"]).toBeCloseTo(0.75 * 0.9, 14);
    expect(f["pdms-silanol"]).toBe(0.1);
    expect(formulationInputSchema.safeParse(input).success).toBe(true);
  });

  it("keeps two varied fractions and scales the rest", () => {
    const p = plan({
      kind: "sweep",
      variables: [
        { kind: "weightFraction", materialId: "ti-isopropoxide", from: 0, to: 0.2, step: 0.1 },
        { kind: "weightFraction", materialId: "teos", from: 0.1, to: 0.3, step: 0.1 },
      ],
    });
    const f = fractions(at(p, 8)); // 0.2 and 0.3: GPTMS takes 0.5
    expect(f.gptms).toBeCloseTo(0.5, 14);
  });

  describe("edge cases", () => {
    it("refuses varied fractions above 1 in total, and a rest nobody can take", () => {
      const two = plan({
        kind: "sweep",
        variables: [
          { kind: "weightFraction", materialId: "gptms", from: 0.6, to: 0.8, step: 0.2 },
          { kind: "weightFraction", materialId: "teos", from: 0.3, to: 0.5, step: 0.2 },
        ],
      });
      expect(pointInput(base, two, 3)).toEqual({ code: "fractions_over_one", field: "components" });
      const only = { ...base, components: [{ materialId: "gptms", weightFraction: 1 }], modifiers: undefined };
      const p = plan({ kind: "sweep", variables: [{ kind: "weightFraction", materialId: "gptms", from: 0.5, to: 1, step: 0.5 }] }, only);
      expect(pointInput(only, p, 0)).toEqual({ code: "nothing_takes_the_rest", field: "components" });
      expect(isPointRefusal(pointInput(only, p, 1))).toBe(false);
      expect(pointInput(base, p, 7)).toEqual({ code: "no_such_point", field: "point" });
    });

    it("rounds fractions in (0, 1e-6) to 0, which the schema allows, and keeps the others valid", () => {
      // titania swept to 1 − 5e-7: the others share 5e-7 and each would be below 1e-6
      const p = plan({ kind: "sweep", variables: [{ kind: "weightFraction", materialId: "ti-isopropoxide", from: 0.9999995, to: 0.4999995, step: 0.5 }] });
      const f = fractions(at(p, 0));
      expect(f.gptms).toBe(0);
      expect(f.teos).toBe(0);
      // a titania fraction of 5e-7 becomes 0 too
      const tiny = fractions(at(plan({ kind: "sweep", variables: [{ kind: "weightFraction", materialId: "ti-isopropoxide", from: 5e-7, to: 0.1, step: 0.05 }] }), 0));
      expect(tiny["ti-isopropoxide"]).toBe(0);
      expect(formulationInputSchema.safeParse(at(p, 0)).success).toBe(true);
    });

    it("gives a schema-valid input summing to 1 for any point of random weight-fraction sweeps (property)", () => {
      const ids = ["gptms", "teos", "ti-isopropoxide"];
      fc.assert(
        fc.property(
          fc.constantFrom(...ids),
          fc.double({ min: 0, max: 1, noNaN: true }),
          fc.double({ min: 0, max: 1, noNaN: true }),
          fc.integer({ min: 1, max: 50 }),
          fc.nat(),
          (id, a, b, n, pick) => {
            if (a === b) return;
            const step = Math.abs(b - a) / n;
            const p = planGrid({ kind: "sweep", variables: [{ kind: "weightFraction", materialId: id, from: a, to: b, step }] }, base);
            if (isPlanError(p)) return; // e.g. a step under the schema's resolution
            const input = pointInput(base, p, pick % p.count);
            if (isPointRefusal(input)) throw new Error(input.code);
            expect(Math.abs(sum(input) - 1)).toBeLessThan(1e-5);
            const parsed = formulationInputSchema.safeParse(input);
            expect(parsed.success, JSON.stringify(parsed.error?.issues)).toBe(true);
          },
        ),
        { numRuns: 500 },
      );
    });
  });
});
