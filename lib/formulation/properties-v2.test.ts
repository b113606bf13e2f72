/**
 * Invariants of engine v2, checked with fast-check on random formulations
 * with modifiers, colloidal precursors and every basis (chemistry.md,
 * "Modifiers" and "Colloidal and oligomeric precursors"):
 * - Σg' = Σg − q · Σ n_L ≥ 0, and the exchange does not change the alcohol released;
 * - the composite's weight and volume fractions sum to 1, bonded ligands included;
 * - every amount scales with the basis (all equations are linear in S).
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { computeFormulation } from "./compute";
import type { Basis, FormulationInput } from "./input-schema";
import { allNumbers, expectClose, ref } from "./test-support";

const METAL_ALKOXIDES = ["ti-isopropoxide", "ti-butoxide", "zr-propoxide-70", "al-sec-butoxide"];
const SILICON = ["teos", "gptms", "mtms", "colloidal-silica-30", "ethyl-silicate-40"];
const MODIFIERS = ["acac", "ethyl-acetoacetate", "methacrylic-acid"];
const ORGANICS = ["pcl", "peg-2000", "pva-10-aq"];

const recipe = fc
  .record({
    metal: fc.constantFrom(...METAL_ALKOXIDES),
    silicon: fc.uniqueArray(fc.constantFrom(...SILICON), { minLength: 1, maxLength: 2 }),
    organic: fc.option(fc.constantFrom(...ORGANICS), { nil: undefined }),
    weights: fc.array(fc.double({ min: 0.05, max: 1, noNaN: true }), { minLength: 4, maxLength: 4 }),
    modifier: fc.constantFrom(...MODIFIERS),
    // at most 3 mol per metal: Al(OR)3 has 3 groups, Ti and Zr 4, q = 1
    x: fc.double({ min: 0, max: 3, noNaN: true }),
    R: fc.double({ min: 0.5, max: 20, noNaN: true }),
    hot: fc.boolean(),
  })
  .map((r) => {
    const ids = [r.metal, ...r.silicon, ...(r.organic ? [r.organic] : [])];
    const raw = ids.map((_, i) => r.weights[i] ?? 1);
    const total = raw.reduce((a, b) => a + b, 0);
    const fractions = raw.map((w) => w / total);
    fractions[0] = 1 - fractions.slice(1).reduce((a, b) => a + b, 0);
    return { ...r, components: ids.map((materialId, i) => ({ materialId, weightFraction: fractions[i] as number })) };
  });

const bases: fc.Arbitrary<{ basis: Basis; fill: boolean }> = fc.oneof(
  fc.double({ min: 0.01, max: 1e4, noNaN: true }).map((grams) => ({ basis: { type: "solidMass", grams } as Basis, fill: false })),
  fc
    .record({ solMassGrams: fc.double({ min: 1, max: 1e4, noNaN: true }), solidsFraction: fc.double({ min: 0.005, max: 0.03, noNaN: true }) })
    .map((b) => ({ basis: { type: "solidsContent", ...b } as Basis, fill: true })),
  fc
    .record({ volumeMl: fc.double({ min: 1, max: 1e4, noNaN: true }), bulkDensity: fc.double({ min: 0.005, max: 0.02, noNaN: true }) })
    .map((b) => ({ basis: { type: "gelBody", ...b } as Basis, fill: true })),
);

/** One random recipe. */
type Recipe = typeof recipe extends fc.Arbitrary<infer T> ? T : never;

function inputOf(r: Recipe, basis: Basis, fill: boolean, withModifier = true): FormulationInput {
  const ids = new Set([...r.components.map((c) => c.materialId), r.modifier, "ethanol", "water-di"]);
  return {
    materials: [...ids].map(ref),
    basis,
    components: r.components,
    ...(withModifier && r.x > 0 ? { modifiers: [{ materialId: r.modifier, precursorId: r.metal, molPerMetal: r.x }] } : {}),
    water: { materialId: "water-di", ratio: "R", value: r.R },
    solvent: fill ? { materialId: "ethanol", mode: "fill" } : { materialId: "ethanol", mode: "molPerNetworkAtom", value: 4 },
    steps: [{ name: "Cure", temperatureC: r.hot ? 450 : 120, durationH: 1 }],
  };
}

const scale = (basis: Basis, k: number): Basis =>
  basis.type === "solidMass" ? { ...basis, grams: basis.grams * k } : basis.type === "solidsContent" ? { ...basis, solMassGrams: basis.solMassGrams * k } : { ...basis, volumeMl: basis.volumeMl * k };

describe("engine v2 invariants", () => {
  it("keeps Σg' ≥ 0 and the alcohol released unchanged by ligand exchange", () => {
    fc.assert(
      fc.property(recipe, (r) => {
        const basis: Basis = { type: "solidMass", grams: 10 };
        const modified = computeFormulation(inputOf(r, basis, false));
        expect(modified.water.hydrolysisMol).toBeGreaterThanOrEqual(0);
        if (r.x > 0) expectClose(modified.water.groupsReplacedMol, modified.modifiers![0]!.ligandMol, 1e-12);
        // the same metal amounts without the modifier: scale S so that S_free matches
        const free = modified.composite.massGrams - (modified.modifiers?.reduce((s, m) => s + m.bondedGrams, 0) ?? 0);
        const bare = computeFormulation(inputOf(r, { type: "solidMass", grams: free }, false, false));
        const total = (res: typeof bare): number => res.alcohol.reduce((s, a) => s + a.mol, 0);
        expectClose(total(modified), total(bare), 1e-9);
        expectClose(modified.water.hydrolysisMol + (modified.water.groupsReplacedMol ?? 0), bare.water.hydrolysisMol, 1e-9);
      }),
      { numRuns: 300 },
    );
  });

  it("returns weight and volume fractions that sum to 1, bonded ligands included", () => {
    fc.assert(
      fc.property(recipe, bases, (r, b) => {
        const result = computeFormulation(inputOf(r, b.basis, b.fill));
        const w = result.composite.phases.reduce((s, p) => s + p.weightFraction, 0);
        const v = result.composite.phases.reduce((s, p) => s + p.volumeFraction, 0);
        expect(Math.abs(w - 1)).toBeLessThan(1e-12);
        expect(Math.abs(v - 1)).toBeLessThan(1e-12);
        const ligand = result.composite.phases.find((p) => p.materialId === r.modifier);
        expect(ligand !== undefined).toBe(r.x > 0 && !r.hot);
      }),
      { numRuns: 300 },
    );
  });

  it("returns results that scale with the basis", () => {
    fc.assert(
      fc.property(recipe, bases, fc.double({ min: 0.1, max: 50, noNaN: true }), (r, b, k) => {
        const one = computeFormulation(inputOf(r, b.basis, b.fill));
        const big = computeFormulation(inputOf(r, scale(b.basis, k), b.fill));
        expect(big.lines.map((l) => l.materialId)).toEqual(one.lines.map((l) => l.materialId));
        one.lines.forEach((l, i) => expectClose(big.lines[i]?.massGrams, l.massGrams * k, 1e-9, l.materialId));
        expectClose(big.composite.massGrams, one.composite.massGrams * k, 1e-9);
        expectClose(big.water.effectiveR, one.water.effectiveR, 1e-9);
        for (const value of allNumbers(big)) expect(Number.isFinite(value)).toBe(true);
      }),
      { numRuns: 200 },
    );
  });
});
