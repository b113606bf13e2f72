/**
 * Invariants of the formulation chemistry, checked with fast-check on random
 * formulations built from the reference materials:
 * - every amount is proportional to the batch size (all equations are linear in S);
 * - volume fractions φ_k = (w_k/ρ_k)/Σ(w_j/ρ_j) sum to 1;
 * - with no carried water, the water reached equals the target (C = 0 → W − C = W);
 * - bad input gives a typed error, never NaN, Infinity or a negative mass.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { computeFormulation } from "./compute";
import { isFormulationError } from "./errors";
import type { Basis, FormulationInput } from "./input-schema";
import type { FormulationResult } from "./result-types";
import { allNumbers, expectClose, ref } from "./test-support";

const PRECURSORS = ["teos", "tmos", "gptms", "mtes", "ti-isopropoxide", "zr-propoxide-70", "al-sec-butoxide", "triethyl-phosphate"];
const DRY_ORGANICS = ["pcl", "pdms-silanol", "peg-2000", "pmma"];

/** A composition: 1–3 precursors and 0–2 dry organic phases with random weight fractions summing to 1. */
const composition = fc
  .record({
    precursors: fc.uniqueArray(fc.constantFrom(...PRECURSORS), { minLength: 1, maxLength: 3 }),
    organics: fc.uniqueArray(fc.constantFrom(...DRY_ORGANICS), { minLength: 0, maxLength: 2 }),
    weights: fc.array(fc.double({ min: 0.05, max: 1, noNaN: true }), { minLength: 5, maxLength: 5 }),
  })
  .map(({ precursors, organics, weights }) => {
    const ids = [...precursors, ...organics];
    const raw = ids.map((_, i) => weights[i] ?? 1);
    const total = raw.reduce((a, b) => a + b, 0);
    const fractions = raw.map((w) => w / total);
    // put the rounding remainder on the first component so the sum is 1 to within 1e-15
    fractions[0] = 1 - fractions.slice(1).reduce((a, b) => a + b, 0);
    return ids.map((materialId, i) => ({ materialId, weightFraction: fractions[i] as number }));
  });

function makeInput(
  components: { materialId: string; weightFraction: number }[],
  basis: Basis,
  options: { R: number; ethanolPerAtom?: number; fill?: boolean; catalyst?: string },
): FormulationInput {
  const ids = new Set([...components.map((c) => c.materialId), "ethanol", "water-di", ...(options.catalyst ? [options.catalyst] : [])]);
  return {
    materials: [...ids].map(ref),
    basis,
    components,
    water: { materialId: "water-di", ratio: "R", value: options.R },
    solvent: options.fill
      ? { materialId: "ethanol", mode: "fill" }
      : { materialId: "ethanol", mode: "molPerNetworkAtom", value: options.ethanolPerAtom ?? 4 },
    ...(options.catalyst ? { catalyst: { materialId: options.catalyst, molPerNetworkAtom: 0.01 } } : {}),
    steps: [{ name: "Dry", temperatureC: 60, durationH: 1 }],
  };
}

function scaleBasis(basis: Basis, k: number): Basis {
  switch (basis.type) {
    case "solidMass":
      return { ...basis, grams: basis.grams * k };
    case "solidsContent":
      return { ...basis, solMassGrams: basis.solMassGrams * k };
    case "gelBody":
      return { ...basis, volumeMl: basis.volumeMl * k };
  }
}

const basis: fc.Arbitrary<{ basis: Basis; fill: boolean }> = fc.oneof(
  fc.double({ min: 0.01, max: 1e4, noNaN: true }).map((grams) => ({ basis: { type: "solidMass", grams } as Basis, fill: false })),
  fc
    .record({ solMassGrams: fc.double({ min: 1, max: 1e4, noNaN: true }), solidsFraction: fc.double({ min: 0.01, max: 0.08, noNaN: true }) })
    .map((b) => ({ basis: { type: "solidsContent", ...b } as Basis, fill: true })),
  fc
    .record({
      volumeMl: fc.double({ min: 1, max: 1e4, noNaN: true }),
      bulkDensity: fc.double({ min: 0.01, max: 0.06, noNaN: true }),
      linearShrinkage: fc.double({ min: 0, max: 0.3, noNaN: true }),
    })
    .map((b) => ({ basis: { type: "gelBody", ...b } as Basis, fill: true })),
);

function expectSane(result: FormulationResult): void {
  for (const value of allNumbers(result)) expect(Number.isFinite(value)).toBe(true);
  for (const l of result.lines) {
    expect(l.massGrams).toBeGreaterThanOrEqual(0);
    expect(l.volumeMl).toBeGreaterThanOrEqual(0);
  }
  expect(result.water.addMol).toBeGreaterThanOrEqual(0);
}

describe("computeFormulation invariants", () => {
  it("returns masses proportional to the basis", () => {
    fc.assert(
      fc.property(composition, basis, fc.double({ min: 0.1, max: 100, noNaN: true }), fc.double({ min: 0.5, max: 6, noNaN: true }), (components, b, k, R) => {
        const one = computeFormulation(makeInput(components, b.basis, { R, fill: b.fill, catalyst: "hcl-37" }));
        const scaled = computeFormulation(makeInput(components, scaleBasis(b.basis, k), { R, fill: b.fill, catalyst: "hcl-37" }));
        expect(scaled.lines.map((l) => l.materialId)).toEqual(one.lines.map((l) => l.materialId));
        one.lines.forEach((l, i) => {
          expectClose(scaled.lines[i]?.massGrams, l.massGrams * k, 1e-9, l.materialId);
          expectClose(scaled.lines[i]?.volumeMl, l.volumeMl * k, 1e-9, l.materialId);
        });
        expectClose(scaled.composite.massGrams, one.composite.massGrams * k, 1e-9);
        expectClose(scaled.water.addGrams, one.water.addGrams * k, 1e-9);
        expectClose(scaled.water.effectiveR, one.water.effectiveR, 1e-9);
        expectClose(scaled.sol.solidsFraction, one.sol.solidsFraction, 1e-9);
        expectSane(one);
        expectSane(scaled);
      }),
      { numRuns: 150 },
    );
  });

  it("returns volume fractions that sum to 1", () => {
    fc.assert(
      fc.property(composition, (components) => {
        const result = computeFormulation(makeInput(components, { type: "solidMass", grams: 10 }, { R: 4 }));
        const total = result.composite.phases.reduce((sum, phase) => sum + phase.volumeFraction, 0);
        expect(Math.abs(total - 1)).toBeLessThan(1e-12);
        for (const phase of result.composite.phases) expect(phase.volumeFraction).toBeGreaterThanOrEqual(0);
      }),
      { numRuns: 200 },
    );
  });

  it("returns an effective R equal to the target when nothing carries water", () => {
    fc.assert(
      fc.property(composition, fc.double({ min: 0, max: 20, noNaN: true }), fc.double({ min: 0, max: 10, noNaN: true }), (components, R, ethanol) => {
        const result = computeFormulation(
          makeInput(components, { type: "solidMass", grams: 25 }, { R, ethanolPerAtom: ethanol, catalyst: "acetic-acid-glacial" }),
        );
        expect(result.water.carriedMol).toBe(0);
        if (result.water.targetMol * 18.015 < 1e-9) {
          // Below 1e-9 g the water line is left out (MIN_LINE_GRAMS): nothing is added.
          expect(result.water.addMol).toBe(0);
        } else {
          expectClose(result.water.effectiveR, R, 1e-12);
          expectClose(result.water.addMol, result.water.targetMol, 1e-12);
        }
      }),
      { numRuns: 200 },
    );
  });

  describe("edge cases", () => {
    const valid = makeInput(
      [
        { materialId: "teos", weightFraction: 0.6 },
        { materialId: "zr-propoxide-70", weightFraction: 0.1 },
        { materialId: "pcl", weightFraction: 0.3 },
      ],
      { type: "solidsContent", solMassGrams: 100, solidsFraction: 0.05 },
      { R: 4, fill: true, catalyst: "hcl-37" },
    );
    const PATHS: (string | number)[][] = [
      ["basis"], ["basis", "solMassGrams"], ["basis", "solidsFraction"], ["basis", "type"],
      ["components"], ["components", 0, "weightFraction"], ["components", 1, "materialId"],
      ["water", "value"], ["water", "ratio"], ["solvent"], ["solvent", "mode"], ["catalyst", "molPerNetworkAtom"],
      ["materials", 0, "density"], ["materials", 0, "molarMass"], ["materials", 0, "assay"], ["materials", 1, "solventFraction"],
      ["materials", 0, "precursor", "residueMolarMass"], ["materials", 0, "precursor", "residuePerMolecule"],
      ["materials", 0, "precursor", "hydrolysableGroupsPerMolecule"], ["materials", 2, "phaseDensity"], ["materials", 3, "waterFraction"],
      ["steps", 0, "temperatureC"], ["marginC"], ["measuredBulkDensity"], ["substrateId"],
    ];
    const badValue = fc.oneof(
      fc.double(),
      fc.constantFrom(Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY, -1, 0, 1e308, -0, 2),
      fc.string(),
      fc.constantFrom(undefined, null, [], {}, true),
    );

    function mutate(input: FormulationInput, path: (string | number)[], value: unknown): unknown {
      const copy = structuredClone(input) as unknown as Record<string | number, unknown>;
      let node = copy;
      for (const key of path.slice(0, -1)) {
        const next = node[key];
        if (next === null || typeof next !== "object") return copy;
        node = next as Record<string | number, unknown>;
      }
      node[path[path.length - 1] as string | number] = value;
      return copy;
    }

    it("returns a typed error or sane figures, never NaN, for random bad values", () => {
      fc.assert(
        fc.property(fc.constantFrom(...PATHS), badValue, (path, value) => {
          const input = mutate(valid, path, value);
          try {
            expectSane(computeFormulation(input as FormulationInput));
          } catch (error) {
            if (!isFormulationError(error)) throw error;
            expect(error.field).toBeTypeOf("string");
            expect(error.issues.length).toBeGreaterThan(0);
          }
        }),
        { numRuns: Number(process.env.FC_RUNS ?? 400) },
      );
    });

    it("returns a typed error or finite figures for random materials across the whole allowed range", () => {
      const inRange = (min: number, max: number): fc.Arbitrary<number> =>
        fc.oneof(fc.constantFrom(min, max), fc.double({ min, max, noNaN: true }));
      const precursor = fc.record({
        molarMass: inRange(1, 1e7),
        density: inRange(0.001, 30),
        assay: inRange(0.001, 1),
        residueMolarMass: inRange(1, 1e7),
        residuePerMolecule: inRange(0.01, 100),
        residueDensity: inRange(0.001, 30),
        networkAtomsPerMolecule: inRange(0, 100),
        hydrolysableGroupsPerMolecule: inRange(0, 100),
        crystalWaterPerFormula: inRange(0, 100),
      });
      const wild = fc.record({
        precursor,
        organicDensity: inRange(0.001, 30),
        organicAssay: inRange(0.001, 1),
        weight: inRange(0, 1),
        amount: inRange(1e-6, 1e9),
        bulkDensity: inRange(0.001, 30),
        R: inRange(0, 1e4),
        solvent: inRange(0, 1e4),
        catalyst: inRange(0, 1e4),
        type: fc.constantFrom("solidMass", "solidsContent", "gelBody"),
      });
      fc.assert(
        fc.property(wild, (w) => {
          const p = w.precursor;
          const input: FormulationInput = {
            materials: [
              {
                id: "p", name: "P", kind: "precursor", molarMass: p.molarMass, density: p.density, assay: p.assay,
                waterFraction: (1 - p.assay) / 2, crystalWaterPerFormula: p.crystalWaterPerFormula,
                precursor: {
                  residueFormula: "SiO2", residueMolarMass: p.residueMolarMass, residuePerMolecule: p.residuePerMolecule,
                  residueDensity: p.residueDensity, networkAtomsPerMolecule: p.networkAtomsPerMolecule,
                  hydrolysableGroupsPerMolecule: p.hydrolysableGroupsPerMolecule, leavingAlcohol: { name: "ethanol", molarMass: 46.069 },
                },
              },
              { id: "o", name: "O", kind: "organic", density: w.organicDensity, assay: w.organicAssay, phaseDensity: w.organicDensity, waterFraction: 1 - w.organicAssay },
              ref("ethanol"), ref("water-di"), ref("hcl-37"),
            ],
            basis:
              w.type === "solidMass"
                ? { type: "solidMass", grams: w.amount }
                : w.type === "solidsContent"
                  ? { type: "solidsContent", solMassGrams: w.amount, solidsFraction: 0.05 }
                  : { type: "gelBody", volumeMl: w.amount, bulkDensity: w.bulkDensity, linearShrinkage: 0.1 },
            components: [
              { materialId: "p", weightFraction: 1 - w.weight },
              { materialId: "o", weightFraction: w.weight },
            ],
            water: { materialId: "water-di", ratio: "R", value: w.R },
            solvent: w.type === "solidMass" ? { materialId: "ethanol", mode: "molPerNetworkAtom", value: w.solvent } : { materialId: "ethanol", mode: "fill" },
            catalyst: { materialId: "hcl-37", molPerNetworkAtom: w.catalyst },
            steps: [{ name: "Dry", temperatureC: 60, durationH: 1 }],
            measuredBulkDensity: 0.001,
          };
          try {
            expectSane(computeFormulation(input));
          } catch (error) {
            if (!isFormulationError(error)) throw error;
          }
        }),
        { numRuns: Number(process.env.FC_RUNS ?? 300) },
      );
    });

    it("returns a typed error for arbitrary values", () => {
      fc.assert(
        fc.property(fc.anything(), (raw) => {
          expect(() => computeFormulation(raw as FormulationInput)).toThrow(expect.objectContaining({ name: "FormulationError" }));
        }),
        { numRuns: 200 },
      );
    });
  });
});
