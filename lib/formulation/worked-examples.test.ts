/**
 * Worked examples: each expected value is worked out independently of the
 * engine — by hand (arithmetic in the comments, rounded) and again with plain
 * JS numbers following the published equations — never copied from engine
 * output. Equations: the formulation chemistry (residue → moles → mass as
 * supplied; water target R·Σa or h·Σg; rule of mixtures), with the net
 * reaction Si(OR)4 + 2 H2O → SiO2 + 4 ROH from Brinker & Scherer, Sol-Gel
 * Science (1990), ch. 3. Material values are those of data/materials.ts,
 * restated in each comment.
 */
import { describe, expect, it } from "vitest";
import { computeFormulation } from "./compute";
import type { FormulationInput } from "./input-schema";
import { expectClose, line, ref } from "./test-support";

const WATER = 18.015; // g/mol, 2 × 1.008 + 15.999 (IUPAC/CIAAW 2021 abridged)

describe("computeFormulation worked examples", () => {
  it("returns the recipe for TEOS + titanium isopropoxide + PCL (dry solid mass basis, molar solvent)", () => {
    // 10 g dry composite: 60 wt% SiO2 from TEOS, 10 wt% TiO2 from Ti(OiPr)4, 30 wt% PCL.
    // TEOS M 208.329, ρ 0.933; SiO2 60.083, 2.20 | Ti(OiPr)4 M 284.219, ρ 0.96; TiO2 79.865, 2.70 (amorphous titania of a low-temperature hybrid)
    // PCL ρ 1.145 | ethanol M 46.069, ρ 0.7893 | water M 18.015, ρ 0.9982
    //
    // n(TEOS) = 6 g / 60.083 = 0.0998619 mol → 0.0998619 × 208.329 = 20.8041 g → / 0.933 = 22.2981 mL
    // n(Ti)   = 1 g / 79.865 = 0.0125211 mol → 0.0125211 × 284.219 = 3.55874 g → / 0.96 = 3.70702 mL
    // PCL: 3 g → 3 / 1.145 = 2.62009 mL
    // Σa = 0.112383 mol; Σg = 4 Σa = 0.449532 mol
    // water R = 2: W = 0.224766 mol → 4.04916 g → 4.05646 mL (no carried water)
    // ethanol 4 mol/mol: 0.449532 mol → 20.7095 g → 26.2378 mL
    // sol 52.1215 g, 58.9195 mL; solids 10 / 52.1215 = 0.191859
    // Σ w/ρ = 0.6/2.2 + 0.1/2.7 + 0.3/1.145 = 0.571773 → ρth = 1.74895 g/cm³
    // φ = 0.476985 (SiO2), 0.0647758 (TiO2), 0.458239 (PCL)
    // ethanol released 4 × 0.0998619 = 0.399447 mol (18.4021 g); 2-propanol 0.0500845 mol (3.00988 g)
    const input: FormulationInput = {
      materials: [ref("teos"), ref("ti-isopropoxide"), ref("pcl"), ref("ethanol"), ref("water-di")],
      basis: { type: "solidMass", grams: 10 },
      components: [
        { materialId: "teos", weightFraction: 0.6 },
        { materialId: "ti-isopropoxide", weightFraction: 0.1 },
        { materialId: "pcl", weightFraction: 0.3 },
      ],
      water: { materialId: "water-di", ratio: "R", value: 2 },
      solvent: { materialId: "ethanol", mode: "molPerNetworkAtom", value: 4 },
      steps: [{ name: "Dry", temperatureC: 40, durationH: 12 }],
    };
    const result = computeFormulation(input);

    // hand values (rounded)
    expect(line(result, "teos").massGrams).toBeCloseTo(20.8041, 3);
    expect(line(result, "teos").volumeMl).toBeCloseTo(22.2981, 3);
    expect(line(result, "ti-isopropoxide").massGrams).toBeCloseTo(3.55874, 4);
    expect(line(result, "pcl").volumeMl).toBeCloseTo(2.62009, 4);
    expect(result.water.addGrams).toBeCloseTo(4.04916, 4);
    expect(line(result, "ethanol").massGrams).toBeCloseTo(20.7095, 3);
    expect(result.sol.massGrams).toBeCloseTo(52.1215, 3);
    expect(result.sol.solidsFraction).toBeCloseTo(0.191859, 5);
    expect(result.composite.theoreticalDensity).toBeCloseTo(1.74895, 4);

    // plain-number recomputation at full precision
    const nSi = 6 / 60.083;
    const nTi = 1 / 79.865;
    const a = nSi + nTi;
    const teos = nSi * 208.329;
    const ti = nTi * 284.219;
    const water = 2 * a * WATER;
    const ethanol = 4 * a * 46.069;
    expectClose(line(result, "teos").moles, nSi);
    expectClose(line(result, "teos").massGrams, teos);
    expectClose(line(result, "teos").residueGrams, 6);
    expectClose(line(result, "teos").hydrolysableGroupMol, 4 * nSi);
    expectClose(line(result, "ti-isopropoxide").massGrams, ti);
    expectClose(line(result, "ti-isopropoxide").volumeMl, ti / 0.96);
    expectClose(line(result, "pcl").massGrams, 3);
    expectClose(result.water.targetMol, 2 * a);
    expectClose(result.water.addGrams, water);
    expectClose(result.water.addMl, water / 0.9982);
    expectClose(result.water.hydrolysisMol, 4 * a);
    expectClose(result.water.condensationMol, 2 * a);
    expectClose(result.water.effectiveR, 2);
    expectClose(result.water.effectiveH, 0.5);
    expectClose(line(result, "ethanol").massGrams, ethanol);
    const solMass = teos + ti + 3 + water + ethanol;
    const solVolume = teos / 0.933 + ti / 0.96 + 3 / 1.145 + water / 0.9982 + ethanol / 0.7893;
    expectClose(result.sol.massGrams, solMass);
    expectClose(result.sol.volumeMl, solVolume);
    expectClose(result.sol.residueGramsPerL, 10 / (solVolume / 1000));
    expectClose(result.sol.networkAtomMolarity, a / (solVolume / 1000));
    const specific = 0.6 / 2.2 + 0.1 / 2.7 + 0.3 / 1.145;
    expectClose(result.composite.theoreticalDensity, 1 / specific);
    expectClose(result.composite.phases[0]?.volumeFraction, 0.6 / 2.2 / specific);
    expectClose(result.composite.phases[1]?.volumeFraction, 0.1 / 2.7 / specific);
    expectClose(result.composite.phases[2]?.volumeFraction, 0.3 / 1.145 / specific);
    expectClose(result.composite.denseShrinkage.volumetric, 1 - (10 * specific) / solVolume);
    expectClose(result.composite.denseShrinkage.linear, 1 - Math.cbrt((10 * specific) / solVolume), 1e-12);
    expect(result.alcohol).toHaveLength(2);
    expectClose(result.alcohol.find((x) => x.name === "ethanol")?.grams, 4 * nSi * 46.069);
    expectClose(result.alcohol.find((x) => x.name === "2-propanol")?.mol, 4 * nTi);

    // order of addition: precursors, organics, solvent, water
    expect(result.lines.map((l) => l.materialId)).toEqual(["teos", "ti-isopropoxide", "pcl", "ethanol", "water-di"]);
    // h = 0.5 is exactly the net-condensation need (Brinker & Scherer), below full hydrolysis (h = 1)
    const codes = result.notices.map((n) => n.code);
    expect(codes).not.toContain("below_net_condensation");
    expect(codes).toContain("below_full_hydrolysis");
    expect(result.composite.porosity).toBeUndefined();
  });

  it("counts the water carried by a hydrochloric acid stock", () => {
    // 6.0083 g SiO2 → n(TEOS) = 6.0083 / 60.083 = 0.1 mol (20.8329 g TEOS)
    // R = 4 → W = 0.4 mol (Brinker & Scherer: 4 mol water per Si hydrolyses TEOS fully)
    // HCl 37 wt% at 0.1 mol/mol Si: 0.01 mol × 36.458 = 0.36458 g active → / 0.37 = 0.98535135 g stock
    // water carried 0.98535135 × 0.63 = 0.62077135 g → / 18.015 = 0.034458582 mol
    // water to add 0.4 − 0.034458582 = 0.36554142 mol → 6.5852286 g
    const result = computeFormulation({
      materials: [ref("teos"), ref("water-di"), ref("hcl-37")],
      basis: { type: "solidMass", grams: 6.0083 },
      components: [{ materialId: "teos", weightFraction: 1 }],
      water: { materialId: "water-di", ratio: "R", value: 4 },
      catalyst: { materialId: "hcl-37", molPerNetworkAtom: 0.1 },
      steps: [],
    });
    expect(line(result, "teos").massGrams).toBeCloseTo(20.8329, 4);
    expect(line(result, "hcl-37").massGrams).toBeCloseTo(0.98535135, 7);
    expect(line(result, "hcl-37").carriedWaterMol).toBeCloseTo(0.034458582, 8);
    expect(result.water.carriedMol).toBeCloseTo(0.034458582, 8);
    expect(result.water.addMol).toBeCloseTo(0.36554142, 7);
    expect(result.water.addGrams).toBeCloseTo(6.5852286, 6);
    expectClose(result.water.effectiveR, 4);
    expectClose(result.water.effectiveH, 1);
    expectClose(line(result, "hcl-37").moles, 0.01);
    expectClose(line(result, "hcl-37").volumeMl, (0.01 * 36.458) / 0.37 / 1.18);
    expect(result.lines.map((l) => l.role)).toEqual(["precursor", "water", "catalyst"]);
    expect(result.notices.map((n) => n.code)).toContain("corrosive");
  });

  it("counts the water carried by an aqueous polymer solution and reports the ratio reached", () => {
    // 10 g: 80 wt% SiO2 from TEOS, 20 wt% PVA supplied as 10 wt% solution in water
    // n(TEOS) = 8 / 60.083 = 0.133149 mol; target R = 4 → W = 0.532597 mol
    // PVA: 2 g dry → 2 / 0.1 = 20 g solution carrying 18 g water = 18 / 18.015 = 0.999167 mol
    // carried > target → add nothing; R reached = 0.999167 / 0.133149 = 7.50412
    // dry phase density of PVA 1.27 (not the solution's 1.02): ρth = 1 / (0.8/2.2 + 0.2/1.27) = 1.91896
    const result = computeFormulation({
      materials: [ref("teos"), ref("pva-10-aq"), ref("water-di")],
      basis: { type: "solidMass", grams: 10 },
      components: [
        { materialId: "teos", weightFraction: 0.8 },
        { materialId: "pva-10-aq", weightFraction: 0.2 },
      ],
      water: { materialId: "water-di", ratio: "R", value: 4 },
      steps: [{ name: "Dry", temperatureC: 60, durationH: 24 }],
    });
    expectClose(line(result, "pva-10-aq").massGrams, 20);
    expectClose(line(result, "pva-10-aq").residueGrams, 2);
    expectClose(line(result, "pva-10-aq").carriedWaterMol, 18 / WATER);
    expect(result.water.carriedMol).toBeCloseTo(0.999167, 6);
    expect(result.water.targetMol).toBeCloseTo(0.532597, 6);
    expect(result.water.addMol).toBe(0);
    expect(result.water.addGrams).toBe(0);
    expect(result.lines.some((l) => l.role === "water")).toBe(false);
    expect(result.water.effectiveR).toBeCloseTo(7.50412, 5);
    expectClose(result.water.effectiveR, 18 / WATER / (8 / 60.083));
    expect(result.composite.theoreticalDensity).toBeCloseTo(1.91896, 5);
    expectClose(result.composite.phases[1]?.density, 1.27);
    const notice = result.notices.find((n) => n.code === "carried_water_exceeds_target");
    expect(notice?.level).toBe("caution");
    expect(notice?.message).toContain("7.504");
  });

  it("counts water of crystallisation from a hydrate and warns that its conversion is never reached", () => {
    // 10 g: 70 wt% SiO2 from TEOS, 30 wt% CaO from Ca(NO3)2·4H2O (M 236.146, CaO 56.077)
    // n(TEOS) = 7 / 60.083 = 0.116506 mol; n(Ca) = 3 / 56.077 = 0.0534979 mol → × 236.146 = 12.6333 g
    // water of crystallisation 4 × 0.0534979 = 0.213991 mol
    // Σa = 0.116506 (Ca is a network modifier); Σg = 4 × 0.116506 = 0.466022
    // R = 4: W = 0.466022 → add 0.466022 − 0.213991 = 0.252031 mol = 4.54033 g
    // highest step 120 °C < 600 °C nitrate decomposition: caution, residue not CaO yet
    const result = computeFormulation({
      materials: [ref("teos"), ref("ca-nitrate-4h2o"), ref("water-di"), ref("ethanol")],
      basis: { type: "solidMass", grams: 10 },
      components: [
        { materialId: "teos", weightFraction: 0.7 },
        { materialId: "ca-nitrate-4h2o", weightFraction: 0.3 },
      ],
      water: { materialId: "water-di", ratio: "R", value: 4 },
      solvent: { materialId: "ethanol", mode: "molPerNetworkAtom", value: 2 },
      steps: [
        { name: "Age", temperatureC: 60, durationH: 72 },
        { name: "Dry", temperatureC: 120, durationH: 24 },
      ],
    });
    expect(line(result, "ca-nitrate-4h2o").massGrams).toBeCloseTo(12.6333, 4);
    expect(line(result, "ca-nitrate-4h2o").carriedWaterMol).toBeCloseTo(0.213991, 6);
    expectClose(line(result, "ca-nitrate-4h2o").carriedWaterMol, (4 * 3) / 56.077);
    expectClose(line(result, "ca-nitrate-4h2o").networkAtomMol, 0, 0);
    expect(result.water.addMol).toBeCloseTo(0.252031, 6);
    expect(result.water.addGrams).toBeCloseTo(4.54033, 5);
    expectClose(result.water.addMol, (4 * 7) / 60.083 - (4 * 3) / 56.077);
    expectClose(result.water.effectiveR, 4);

    expect(result.thermal.status).toBe("caution");
    const conversion = result.thermal.checks.find((c) => c.limit === "conversion");
    expect(conversion).toMatchObject({ materialId: "ca-nitrate-4h2o", stepName: "Dry", temperatureC: 120, limitC: 600, status: "caution" });
    expect(result.notices.find((n) => n.code === "conversion_not_reached")?.message).toContain("CaO");

    // the same batch annealed at 600 °C reaches the conversion: clear
    const annealed = computeFormulation({
      materials: [ref("teos"), ref("ca-nitrate-4h2o"), ref("water-di")],
      basis: { type: "solidMass", grams: 10 },
      components: [
        { materialId: "teos", weightFraction: 0.7 },
        { materialId: "ca-nitrate-4h2o", weightFraction: 0.3 },
      ],
      water: { materialId: "water-di", ratio: "R", value: 4 },
      steps: [{ name: "Anneal", temperatureC: 600, durationH: 2 }],
    });
    expect(annealed.thermal.status).toBe("clear");
    expect(annealed.thermal.checks).toEqual([
      { materialId: "ca-nitrate-4h2o", stepName: "Anneal", temperatureC: 600, limit: "conversion", limitC: 600, marginC: 20, status: "clear", stage: "curing", atmosphere: "air" },
    ]);
  });

  it("fills the sol with solvent up to the sol mass of a solids-content basis", () => {
    // sol 100 g at solids content 0.1 → S = 10 g SiO2 → n(TEOS) = 10 / 60.083 = 0.166436 mol → 34.6735 g
    // HCl 37 wt% at 0.01 mol/mol: 0.00166436 mol × 36.458 / 0.37 = 0.163997 g, carrying 0.163997 × 0.63 / 18.015 = 0.00573508 mol water
    // R = 4: W = 0.665746 mol; add 0.665746 − 0.00573508 = 0.660011 mol = 11.8901 g
    // ethanol fill = 100 − 34.6735 − 0.163997 − 11.8901 = 53.2724 g
    const result = computeFormulation({
      materials: [ref("teos"), ref("ethanol"), ref("water-di"), ref("hcl-37")],
      basis: { type: "solidsContent", solMassGrams: 100, solidsFraction: 0.1 },
      components: [{ materialId: "teos", weightFraction: 1 }],
      water: { materialId: "water-di", ratio: "R", value: 4 },
      solvent: { materialId: "ethanol", mode: "fill" },
      catalyst: { materialId: "hcl-37", molPerNetworkAtom: 0.01 },
      steps: [],
    });
    const nSi = 10 / 60.083;
    const teos = nSi * 208.329;
    const hcl = (0.01 * nSi * 36.458) / 0.37;
    const add = 4 * nSi - (hcl * 0.63) / WATER;
    expect(line(result, "teos").massGrams).toBeCloseTo(34.6735, 4);
    expect(result.water.addGrams).toBeCloseTo(11.8901, 4);
    expect(line(result, "ethanol").massGrams).toBeCloseTo(53.2724, 3);
    expectClose(line(result, "ethanol").massGrams, 100 - teos - hcl - add * WATER, 1e-11);
    expectClose(line(result, "ethanol").moles, (100 - teos - hcl - add * WATER) / 46.069, 1e-11);
    expectClose(result.sol.massGrams, 100);
    expectClose(result.sol.solidsFraction, 0.1);
    expect(result.notices.map((n) => n.code)).not.toContain("sol_mass_differs_from_basis");
  });

  it("sizes a gel body from mould volume, bulk density and shrinkage and fills the mould", () => {
    // S = ρb · V · (1 − s)³ = 0.5 × 50 × 0.75³ = 25 × 0.421875 = 10.546875 g
    // 70 wt% SiO2 from TEOS, 30 wt% silanol PDMS (ρ 0.97); ethanol fills the sol to 50 mL
    // ρth = 1 / (0.7/2.2 + 0.3/0.97) = 1.59373 g/cm³; porosity = 1 − 0.5 / 1.59373 = 0.686270
    // dry gel volume S/ρb = 21.09375 mL of 50 mL: volumetric 0.578125, linear 1 − 0.421875^(1/3) = 0.25
    const result = computeFormulation({
      materials: [ref("teos"), ref("pdms-silanol"), ref("ethanol"), ref("water-di"), ref("hcl-37")],
      basis: { type: "gelBody", volumeMl: 50, bulkDensity: 0.5, linearShrinkage: 0.25 },
      components: [
        { materialId: "teos", weightFraction: 0.7 },
        { materialId: "pdms-silanol", weightFraction: 0.3 },
      ],
      water: { materialId: "water-di", ratio: "R", value: 4 },
      solvent: { materialId: "ethanol", mode: "fill" },
      catalyst: { materialId: "hcl-37", molPerNetworkAtom: 0.01 },
      steps: [{ name: "Dry", temperatureC: 60, durationH: 96 }],
    });
    expectClose(result.composite.massGrams, 10.546875);
    expectClose(result.sol.volumeMl, 50, 1e-12);
    expect(result.composite.theoreticalDensity).toBeCloseTo(1.59373, 5);
    expect(result.composite.porosity).toBeCloseTo(0.68627, 5);
    expectClose(result.composite.porosity as number, 1 - 0.5 * (0.7 / 2.2 + 0.3 / 0.97));
    expectClose(result.composite.dryGelShrinkage?.volumetric as number, 0.578125, 1e-12);
    expectClose(result.composite.dryGelShrinkage?.linear as number, 0.25, 1e-12);

    // ethanol volume = 50 mL − everything else (ideal mixing)
    const nSi = (0.7 * 10.546875) / 60.083;
    const others =
      (nSi * 208.329) / 0.933 +
      (0.3 * 10.546875) / 0.97 +
      (0.01 * nSi * 36.458) / 0.37 / 1.18 +
      ((4 * nSi - ((0.01 * nSi * 36.458) / 0.37) * 0.63 / WATER) * WATER) / 0.9982;
    expectClose(line(result, "ethanol").volumeMl, 50 - others, 1e-11);
    expect(result.notices.map((n) => n.code)).not.toContain("gel_body_does_not_fit");
  });

  it("reports the 1-propanol carried by the zirconium propoxide solution and refers water to h", () => {
    // 50 g: 75 wt% GPTMS residue (C6H11O3.5Si, 167.2355), 25 wt% ZrO2 (123.222) from a 70 wt% solution
    // n(GPTMS) = 37.5 / 167.2355 = 0.224235 mol; n(Zr) = 12.5 / 123.222 = 0.101443 mol
    // Zr solution = 0.101443 × 327.576 / 0.7 = 47.4718 g, of which 30 % = 14.2415 g 1-propanol
    // Σg = 3 × 0.224235 + 4 × 0.101443 = 1.07848 mol; h = 0.5 → W = 0.539238 mol
    // HNO3 65 wt% at 0.02 mol/mol: 0.00651356 mol × 63.012 / 0.65 = 0.631434 g, carrying 0.0122677 mol water
    // 1-propanol 6 mol/mol: 6 × 0.325678 = 1.95407 mol wanted; the solution carries 14.2415 / 60.096 = 0.236980 mol,
    // so 1.71709 mol = 103.190 g is added (chemistry.md, "Solvent": carried solvent counts toward the ratio)
    const result = computeFormulation({
      materials: [ref("gptms"), ref("zr-propoxide-70"), ref("1-propanol"), ref("water-di"), ref("hno3-65")],
      basis: { type: "solidMass", grams: 50 },
      components: [
        { materialId: "gptms", weightFraction: 0.75 },
        { materialId: "zr-propoxide-70", weightFraction: 0.25 },
      ],
      water: { materialId: "water-di", ratio: "h", value: 0.5 },
      solvent: { materialId: "1-propanol", mode: "molPerNetworkAtom", value: 6 },
      catalyst: { materialId: "hno3-65", molPerNetworkAtom: 0.02 },
      steps: [{ name: "Cure", temperatureC: 130, durationH: 1 }],
    });
    const nG = 37.5 / 167.2355;
    const nZr = 12.5 / 123.222;
    const zr = (nZr * 327.576) / 0.7;
    expect(line(result, "zr-propoxide-70").massGrams).toBeCloseTo(47.4718, 4);
    expect(line(result, "zr-propoxide-70").carriedSolventGrams).toBeCloseTo(14.2415, 4);
    expectClose(line(result, "zr-propoxide-70").carriedSolventGrams, 0.3 * zr, 1e-12);
    expect(result.water.targetMol).toBeCloseTo(0.539238, 6);
    expectClose(result.water.targetMol, 0.5 * (3 * nG + 4 * nZr));
    expectClose(result.water.effectiveH, 0.5);
    const hno3 = (0.02 * (nG + nZr) * 63.012) / 0.65;
    expect(line(result, "hno3-65").massGrams).toBeCloseTo(0.631434, 6);
    expectClose(result.water.carriedMol, (hno3 * 0.35) / WATER);
    expectClose(line(result, "1-propanol").massGrams, (6 * (nG + nZr) - (0.3 * zr) / 60.096) * 60.096, 1e-12);
    expect(line(result, "1-propanol").massGrams).toBeCloseTo(103.19, 2);
    expectClose(result.solvent?.molPerNetworkAtom, 6, 1e-12);
    expectClose(result.solvent?.carriedGrams, 0.3 * zr, 1e-12);
    expectClose(result.alcohol.find((x) => x.name === "methanol")?.mol, 3 * nG);
    expectClose(result.alcohol.find((x) => x.name === "1-propanol")?.mol, 4 * nZr);
    expect(result.notices.map((n) => n.code)).toEqual(expect.arrayContaining(["methanol_released", "corrosive", "alkoxide_handling"]));
  });

  describe("edge cases", () => {
    it("reports a gel-body target whose reagents overflow the mould when no fill is used", () => {
      // S = 1.0 × 10 × 1 = 10 g SiO2 → TEOS 10 × 208.329 / 60.083 = 34.6735 g = 37.16 mL > 10 mL mould
      const result = computeFormulation({
        materials: [ref("teos"), ref("ethanol"), ref("water-di")],
        basis: { type: "gelBody", volumeMl: 10, bulkDensity: 1.0 },
        components: [{ materialId: "teos", weightFraction: 1 }],
        water: { materialId: "water-di", ratio: "R", value: 4 },
        solvent: { materialId: "ethanol", mode: "molPerNetworkAtom", value: 4 },
        steps: [],
      });
      const notice = result.notices.find((n) => n.code === "gel_body_does_not_fit");
      expect(notice).toMatchObject({ level: "error", field: "basis.volumeMl" });
    });

    it("flags a solids-content basis the sol does not match without a fill", () => {
      const result = computeFormulation({
        materials: [ref("teos"), ref("ethanol"), ref("water-di")],
        basis: { type: "solidsContent", solMassGrams: 100, solidsFraction: 0.1 },
        components: [{ materialId: "teos", weightFraction: 1 }],
        water: { materialId: "water-di", ratio: "R", value: 4 },
        solvent: { materialId: "ethanol", mode: "molPerNetworkAtom", value: 4 },
        steps: [],
      });
      expect(result.notices.find((n) => n.code === "sol_mass_differs_from_basis")?.level).toBe("caution");
      expectClose(result.sol.solidsFraction, 10 / result.sol.massGrams);
    });

    it("follows an explicit order of addition", () => {
      const result = computeFormulation({
        materials: [ref("teos"), ref("ethanol"), ref("water-di"), ref("hcl-37")],
        basis: { type: "solidMass", grams: 5 },
        components: [{ materialId: "teos", weightFraction: 1 }],
        water: { materialId: "water-di", ratio: "R", value: 4 },
        solvent: { materialId: "ethanol", mode: "molPerNetworkAtom", value: 4 },
        catalyst: { materialId: "hcl-37", molPerNetworkAtom: 0.01 },
        steps: [],
        additionOrder: ["ethanol", "hcl-37", "water-di"],
      });
      expect(result.lines.map((l) => l.materialId)).toEqual(["ethanol", "hcl-37", "water-di", "teos"]);
    });
  });
});
