import { describe, expect, it } from "vitest";
import { diffRevisions } from "@/lib/diff";
import { referenceMaterial } from "@/data/materials";
import type { FormulationInput } from "@/lib/formulation";

// Which input fields a revision diff shows; no chemistry is checked here.
const base: FormulationInput = {
  materials: ["ti-isopropoxide", "teos", "acac", "water-di"].map(referenceMaterial),
  basis: { type: "solidMass", grams: 10 },
  components: [
    { materialId: "ti-isopropoxide", weightFraction: 0.3 },
    { materialId: "teos", weightFraction: 0.7 },
  ],
  water: { materialId: "water-di", ratio: "R", value: 4 },
  steps: [{ name: "Cure", temperatureC: 120, durationH: 1 }],
};

const paths = (a: FormulationInput, b: FormulationInput) => diffRevisions({ input: a, result: null }, { input: b, result: null }).input.map((d) => d.path);

describe("revision diff, engine v2 fields", () => {
  it("shows an added modifier by name and precursor, with its ratio", () => {
    const after = { ...base, modifiers: [{ materialId: "acac", precursorId: "ti-isopropoxide", molPerMetal: 1 }] };
    const d = diffRevisions({ input: base, result: null }, { input: after, result: null }).input;
    const entry = d.find((e) => e.path.startsWith("modifiers."));
    expect(entry?.path).toBe(`modifiers.${referenceMaterial("acac").name} on ${referenceMaterial("ti-isopropoxide").name}`);
    expect(entry?.after).toBe(1);
  });

  it("shows the water convention, its precursor and the carried-water switch", () => {
    const after = { ...base, water: { materialId: "water-di", ratio: "perPrecursor" as const, referenceId: "teos", value: 12, countCarried: false } };
    expect(paths(base, after)).toEqual(expect.arrayContaining(["water.ratio", "water.referenceId", "water.countCarried", "water.value"]));
  });

  it("shows a step's stage and atmosphere, and no change when an old draft's defaults are written out", () => {
    const stated = { ...base, steps: [{ name: "Cure", temperatureC: 120, durationH: 1, stage: "curing" as const, atmosphere: "air" as const }] };
    expect(paths(base, stated)).toEqual([]);
    const explicitWater = { ...base, water: { ...base.water, countCarried: true } };
    expect(paths(base, explicitWater)).toEqual([]);
    const sol = { ...base, steps: [{ name: "Cure", temperatureC: 120, durationH: 1, stage: "sol" as const, atmosphere: "inert" as const }] };
    expect(paths(base, sol)).toEqual(["steps[0].atmosphere", "steps[0].stage"]);
  });
});
