/**
 * The composition a batch actually made, worked by hand in the comments
 * (densities: CRC Handbook for SiO2, the supplier's value for PDMS, as in data/materials.ts).
 */
import { describe, expect, it } from "vitest";
import { referenceMaterials } from "@/data/materials";
import { computeFormulation, type FormulationInput } from "@/lib/formulation";
import { actualComposition } from "./composition";
import { batchLinesFrom } from "./lines";

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
    expect(made.effectiveH?.actual).toBeCloseTo(0.9090909091, 9);
    expect(made.effectiveR.target).toBeCloseTo(4, 12);
    expect("composite" in made.engine && made.engine.composite.theoreticalDensity).toBeCloseTo(1.6229867, 6);
  });

  it("returns null until every line has an actual mass", () => {
    const partial = weigh({}).map((l, i) => (i === 0 ? { ...l, actualGrams: null } : l));
    expect(actualComposition(input, result, partial)).toBeNull();
  });
});
