/**
 * Folded per-material factors against the step-by-step decimal arithmetic
 * they replace (the oracle is decimal.js itself): a precursor's amounts as
 * residue grams × a folded 20-digit factor stay within 1e-18 relative of
 * n = m_res / (k · M_res), mass = n · M / assay, mL = mass / ρ and so on;
 * the value-keyed memo returns a value only for the very same numbers.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { Dec, WATER_MOL_PER_GRAM } from "./decimal";
import { indexMaterials } from "./material-index";
import type { Material } from "./material-schema";
import { precursorAmounts } from "./precursor";
import { ref } from "./test-support";
import { ValueKeyedCache } from "./value-cache";

function within(actual: Dec, expected: Dec, rel: string): boolean {
  if (expected.isZero()) return actual.isZero();
  return actual.minus(expected).div(expected).abs().lessThanOrEqualTo(rel);
}

/** A precursor with arbitrary constants (TEOS's names and formula). */
const precursorMaterial: fc.Arbitrary<Material> = fc
  .record({
    k: fc.constantFrom(1, 2, 0.5, 3),
    residueMolarMass: fc.double({ min: 10, max: 1000, noNaN: true }),
    molarMass: fc.double({ min: 20, max: 2000, noNaN: true }),
    assay: fc.option(fc.double({ min: 0.05, max: 1, noNaN: true }), { nil: undefined }),
    density: fc.double({ min: 0.5, max: 5, noNaN: true }),
    atoms: fc.constantFrom(1, 2, 0.5, 3),
    groups: fc.option(fc.constantFrom(0, 1, 2, 3, 4, 4.5), { nil: undefined }),
    waterFraction: fc.option(fc.double({ min: 0, max: 0.9, noNaN: true }), { nil: undefined }),
    crystalWater: fc.option(fc.constantFrom(0, 1, 2, 6), { nil: undefined }),
    solventFraction: fc.option(fc.double({ min: 0, max: 0.9, noNaN: true }), { nil: undefined }),
  })
  .map((c) => {
    const teos = ref("teos");
    const precursor = teos.precursor!;
    return {
      ...teos,
      molarMass: c.molarMass,
      assay: c.assay,
      density: c.density,
      waterFraction: c.waterFraction,
      crystalWaterPerFormula: c.crystalWater,
      solventFraction: c.solventFraction,
      precursor: {
        ...precursor,
        residuePerMolecule: c.k,
        residueMolarMass: c.residueMolarMass,
        networkAtomsPerMolecule: c.atoms,
        hydrolysableGroupsPerMolecule: c.groups,
      },
    } as Material;
  });

describe("precursorAmounts (folded factors)", () => {
  it("stays within 1e-18 relative of the step-by-step decimal products", () => {
    fc.assert(
      fc.property(
        precursorMaterial,
        fc.double({ min: 1e-6, max: 1, noNaN: true }),
        fc.double({ min: 1e-3, max: 1e5, noNaN: true }),
        (material, w, s) => {
          const entry = indexMaterials([material]).get(material.id)!;
          const a = precursorAmounts(entry, new Dec(w), new Dec(s));
          const data = material.precursor!;
          const residue = new Dec(w).times(s);
          const moles = residue.div(new Dec(data.residuePerMolecule).times(data.residueMolarMass));
          const mass = moles.times(material.molarMass!).div(material.assay ?? 1);
          const water = mass
            .times(material.waterFraction ?? 0)
            .times(WATER_MOL_PER_GRAM)
            .plus(moles.times(material.crystalWaterPerFormula ?? 0));
          expect(a.residueGrams.equals(residue)).toBe(true);
          expect(within(a.moles, moles, "1e-18")).toBe(true);
          expect(within(a.massGrams, mass, "1e-18")).toBe(true);
          expect(within(a.volumeMl, mass.div(material.density!), "1e-18")).toBe(true);
          expect(within(a.networkAtomMol, moles.times(data.networkAtomsPerMolecule), "1e-18")).toBe(true);
          expect(within(a.hydrolysableGroupMol, moles.times(data.hydrolysableGroupsPerMolecule ?? 0), "1e-18")).toBe(true);
          expect(within(a.carriedWaterMol, water, "1e-18")).toBe(true);
          expect(within(a.carriedSolventGrams, mass.times(material.solventFraction ?? 0), "1e-18")).toBe(true);
          expect(a.alcoholMol.equals(data.leavingAlcohol ? a.hydrolysableGroupMol : 0)).toBe(true);
        },
      ),
      { numRuns: 1500 },
    );
  });

  it("follows a material whose constants change between calls (no memo by identity)", () => {
    const teos = ref("teos");
    const entry = indexMaterials([teos]).get("teos")!;
    const before = precursorAmounts(entry, new Dec(1), new Dec(10)).massGrams;
    const heavier = { ...teos, molarMass: teos.molarMass! * 2 };
    const after = precursorAmounts(indexMaterials([heavier]).get("teos")!, new Dec(1), new Dec(10)).massGrams;
    expect(within(after, before.times(2), "1e-18")).toBe(true);
  });

  it("refuses a precursor without a density as before", () => {
    const entry = indexMaterials([{ ...ref("teos"), density: undefined }]).get("teos")!;
    expect(() => precursorAmounts(entry, new Dec(1), new Dec(10))).toThrow(/no density/);
  });
});

describe("ValueKeyedCache", () => {
  it("builds once per list of numbers and never mixes two lists", () => {
    fc.assert(
      fc.property(fc.array(fc.array(fc.double({ noNaN: true }), { minLength: 1, maxLength: 4 }), { minLength: 1, maxLength: 30 }), (keys) => {
        const cache = new ValueKeyedCache<string>(1000);
        let builds = 0;
        const text = (key: readonly number[]): string => key.map((v) => (Object.is(v, -0) ? "-0" : String(v))).join(",");
        for (const key of keys) {
          expect(cache.get(key, () => ((builds += 1), text(key)))).toBe(text(key));
        }
        expect(builds).toBe(new Set(keys.map(text)).size);
      }),
      { numRuns: 500 },
    );
  });

  it("empties itself at its limit and keeps answering right", () => {
    const cache = new ValueKeyedCache<number>(3);
    for (let i = 0; i < 10; i += 1) expect(cache.get([i, i + 1], () => i * 10)).toBe(i * 10);
    expect(cache.get([9, 10], () => -1)).toBe(90);
    expect(cache.get([0, 1], () => 7)).toBe(7);
  });
});
