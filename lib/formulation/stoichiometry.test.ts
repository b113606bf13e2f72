import { describe, expect, it } from "vitest";
import { computeFormulation } from "./compute";
import { residueYield } from "./precursor";
import { expectClose, ref } from "./test-support";

describe("residueYield", () => {
  it("returns 28.8 wt% SiO2 for TEOS", () => {
    // Common practice, no source: TEOS (208.33 g/mol) yields 60.08 / 208.33 = 0.2884 → 28.8 wt% SiO2
    expect(residueYield(ref("teos"))).toBeCloseTo(0.288, 3);
    expectClose(residueYield(ref("teos")), 60.083 / 208.329);
  });

  it("returns the yields of TMOS, titanium isopropoxide and aluminium sec-butoxide", () => {
    // TMOS: 60.083 / 152.221 = 0.3947 (39.5 wt% SiO2, common practice, no source)
    expect(residueYield(ref("tmos"))).toBeCloseTo(0.3947, 4);
    // Ti(OiPr)4: 79.865 / 284.219 = 0.2810 (28.1 wt% TiO2, from memory)
    expect(residueYield(ref("ti-isopropoxide"))).toBeCloseTo(0.281, 3);
    // Al(OsBu)3 → ½ Al2O3: 0.5 × 101.961 / 246.327 = 0.2070 (by hand)
    expect(residueYield(ref("al-sec-butoxide"))).toBeCloseTo(0.207, 3);
  });
});

describe("water stoichiometry of a tetra-alkoxysilane", () => {
  // Brinker & Scherer, Sol-Gel Science (1990), ch. 3: Si(OR)4 + 4 H2O → Si(OH)4 + 4 ROH (hydrolysis),
  // net Si(OR)4 + 2 H2O → SiO2 + 4 ROH: full hydrolysis needs R = 4, complete condensation a net R = 2.
  const teosOnly = (R: number): ReturnType<typeof computeFormulation> =>
    computeFormulation({
      materials: [ref("teos"), ref("water-di")],
      basis: { type: "solidMass", grams: 60.083 }, // 1 mol SiO2 → 1 mol TEOS
      components: [{ materialId: "teos", weightFraction: 1 }],
      water: { materialId: "water-di", ratio: "R", value: R },
      steps: [],
    });

  it("returns 4 mol water for full hydrolysis and 2 mol net for condensation per mol Si", () => {
    const result = teosOnly(4);
    expectClose(result.water.hydrolysisMol, 4);
    expectClose(result.water.condensationMol, 2);
    expectClose(result.water.addMol, 4);
    expectClose(result.alcohol[0]?.mol as number, 4); // 4 ROH per Si(OR)4
    expect(result.alcohol[0]?.name).toBe("ethanol");
    expect(result.notices.map((n) => n.code)).not.toContain("below_full_hydrolysis");
  });

  it("notes R below 4 and warns below the net-condensation ratio 2", () => {
    expect(teosOnly(3).notices.map((n) => n.code)).toContain("below_full_hydrolysis");
    expect(teosOnly(2).notices.map((n) => n.code)).not.toContain("below_net_condensation");
    const low = teosOnly(1.5);
    expect(low.notices.find((n) => n.code === "below_net_condensation")?.level).toBe("caution");
    expect(low.notices.find((n) => n.code === "below_net_condensation")?.message).toContain("1.5");
  });

  it("treats h = 1 as R = 4 for TEOS", () => {
    const byH = computeFormulation({
      materials: [ref("teos"), ref("water-di")],
      basis: { type: "solidMass", grams: 60.083 },
      components: [{ materialId: "teos", weightFraction: 1 }],
      water: { materialId: "water-di", ratio: "h", value: 1 },
      steps: [],
    });
    expectClose(byH.water.effectiveR, 4);
    expectClose(byH.water.targetMol, 4);
  });
});
