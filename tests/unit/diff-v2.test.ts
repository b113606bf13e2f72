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

  it("shows the coat's settings, and no change between two drafts without a coat", () => {
    expect(paths(base, { ...base })).toEqual([]);
    const dip = { ...base, coating: { method: "dip" as const, withdrawalMmPerS: 2, viscosityMPaS: 3, surfaceTensionMNPerM: 24 } };
    expect(paths(base, dip)).toEqual(["coating.method", "coating.surfaceTensionMNPerM", "coating.viscosityMPaS", "coating.withdrawalMmPerS"]);
    const faster = { ...dip, coating: { ...dip.coating, withdrawalMmPerS: 3, targetDryThicknessNm: 400 } };
    const d = diffRevisions({ input: dip, result: null }, { input: faster, result: null }).input;
    expect(d).toEqual([
      { path: "coating.targetDryThicknessNm", before: null, after: 400 },
      { path: "coating.withdrawalMmPerS", before: 2, after: 3 },
    ]);
  });

  it("shows the coat's predicted figures among the key results", () => {
    const result = (dryThicknessNm: number, voc: number) =>
      ({
        lines: [],
        water: { addGrams: 1, effectiveR: 4 },
        sol: { solidsFraction: 0.1 },
        composite: { theoreticalDensity: 2 },
        thermal: { status: "ok" },
        coating: { method: "dip", solidVolumeFraction: 0.05, wetThicknessUm: 10, dryThicknessNm, coverageM2PerL: 100 },
        voc: { massGrams: 50, gramsPerLitre: voc, gramsPerLitreLessWater: voc * 1.1, waterMl: 5 },
      }) as unknown as import("@/lib/formulation").FormulationResult;
    const r = diffRevisions({ input: base, result: result(500, 600) }, { input: base, result: result(520, 600) }).results;
    expect(r).toEqual([{ path: "coat.dryThicknessNm", before: 500, after: 520 }]);
  });
});
