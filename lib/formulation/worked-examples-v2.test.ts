/**
 * Worked examples of engine v2, each computed by hand in the comments with
 * the equations of chemistry.md (sections Water, Solvent, Modifiers,
 * Colloidal and oligomeric precursors, Thermal compatibility) and checked
 * again below with plain JS numbers. Molar masses: IUPAC/CIAAW 2021
 * abridged; material data: data/materials.ts, whose sources are named there.
 */
import { describe, expect, it } from "vitest";
import { computeFormulation } from "./compute";
import type { FormulationInput } from "./input-schema";
import { expectClose, line, ref } from "./test-support";

const WATER = 18.015; // g/mol

describe("engine v2 worked examples", () => {
  it("chelates titanium isopropoxide 1:1 with acetylacetone beside GPTMS and TEOS", () => {
    // Source: the usual Ti(OiPr)4 : acac = 1 : 1 chelation before water (Livage, Henry & Sanchez,
    // Prog. Solid State Chem. 18 (1988) 259; Sanchez et al., J. Non-Cryst. Solids 100 (1988) 65).
    // 10 g dry composite, ligand-free targets 60 % GPTMS residue (167.2355), 30 % SiO2 (60.083), 10 % TiO2 (79.865).
    // Bonded acac M_b = 91.11 g/mol: c = x · a/(k M_res) · w_Ti · M_b = 1 × 0.1 × 91.11 / 79.865 = 0.114080
    // S_free = 10 / 1.114080 = 8.97602 g
    // n(GPTMS) = 0.6 × 8.97602 / 167.2355 = 0.0322037; n(TEOS) = 0.3 × 8.97602 / 60.083 = 0.0448181;
    // n(Ti) = 0.1 × 8.97602 / 79.865 = 0.0112390 → acac n_L = 0.0112390 mol = 1.12521 g = 1.15407 mL (ρ 0.975)
    // bonded ligand 0.0112390 × 91.11 = 1.02398 g = 10 − 8.97602 ✓
    // Σa = 0.0882608; Σg = 3 × 0.0322037 + 4 × 0.0448181 + 4 × 0.0112390 = 0.320840; Σg' = Σg − n_L = 0.309601
    // R = 2 → W = 0.176522 mol; effective h = 0.176522 / 0.309601 = 0.570159
    // composite weight fractions: 0.538561, 0.269280, 0.0897602 and the ligand 0.102398 (sum 1)
    const input: FormulationInput = {
      materials: [ref("gptms"), ref("teos"), ref("ti-isopropoxide"), ref("acac"), ref("ethanol"), ref("water-di")],
      basis: { type: "solidMass", grams: 10 },
      components: [
        { materialId: "gptms", weightFraction: 0.6 },
        { materialId: "teos", weightFraction: 0.3 },
        { materialId: "ti-isopropoxide", weightFraction: 0.1 },
      ],
      modifiers: [{ materialId: "acac", precursorId: "ti-isopropoxide", molPerMetal: 1 }],
      water: { materialId: "water-di", ratio: "R", value: 2 },
      solvent: { materialId: "ethanol", mode: "molPerNetworkAtom", value: 4 },
      steps: [{ name: "Cure", temperatureC: 120, durationH: 2, stage: "curing" }],
    };
    const result = computeFormulation(input);
    expect(line(result, "acac").massGrams).toBeCloseTo(1.12521, 4);
    expect(line(result, "acac").role).toBe("modifier");
    expect(result.water.hydrolysisMol).toBeCloseTo(0.309601, 5);
    expect(result.water.effectiveH).toBeCloseTo(0.570159, 5);

    const c = (0.1 * 91.11) / 79.865;
    const free = 10 / (1 + c);
    const nG = (0.6 * free) / 167.2355;
    const nT = (0.3 * free) / 60.083;
    const nTi = (0.1 * free) / 79.865;
    expectClose(line(result, "gptms").moles, nG, 1e-12);
    expectClose(line(result, "ti-isopropoxide").massGrams, nTi * 284.219, 1e-12);
    expectClose(line(result, "acac").moles, nTi, 1e-12);
    expectClose(line(result, "acac").volumeMl, (nTi * 100.117) / 0.975, 1e-12);
    expectClose(result.water.groupsReplacedMol, nTi, 1e-12);
    expectClose(result.water.targetMol, 2 * (nG + nT + nTi), 1e-12);
    const acacPhase = result.composite.phases.find((p) => p.materialId === "acac");
    expectClose(acacPhase?.weightFraction, (nTi * 91.11) / 10, 1e-12);
    expect(acacPhase?.residueFormula).toBe("C5H7O1.5");
    expectClose(result.composite.phases.reduce((s, p) => s + p.weightFraction, 0), 1, 1e-12);
    expectClose(result.composite.phases.reduce((s, p) => s + p.volumeFraction, 0), 1, 1e-12);
    // the alcohol released is unchanged by the exchange: 3 n(GPTMS) methanol, 4 n(TEOS) ethanol, 4 n(Ti) 2-propanol
    expectClose(result.alcohol.find((a) => a.name === "2-propanol")?.mol, 4 * nTi, 1e-12);
    const codes = result.notices.map((n) => n.code);
    expect(codes).toContain("ligand_free_targets");
    expect(codes).not.toContain("fast_hydrolysis_unmodified");
    // order of addition: the modifier goes to the alkoxides before any water
    const order = result.lines.map((l) => l.materialId);
    expect(order.indexOf("acac")).toBeLessThan(order.indexOf("water-di"));

    // without the modifier the titanium alkoxide gets the fast-hydrolysis caution (effective R 2 > 1)
    const bare = computeFormulation({ ...input, modifiers: [] });
    expect(bare.notices.map((n) => n.code)).toContain("fast_hydrolysis_unmodified");
    // a cure at 400 °C burns the ligand out (removal 350 °C): S_free = S
    const burnt = computeFormulation({ ...input, steps: [{ name: "Anneal", temperatureC: 400, durationH: 1 }] });
    expect(burnt.composite.phases.find((p) => p.materialId === "acac")).toBeUndefined();
    expectClose(line(burnt, "gptms").residueGrams, 6, 1e-12);
    expect(burnt.notices.map((n) => n.code)).toContain("ligand_removed");
  });

  it("refuses more ligand than the alkoxide has alkoxy groups", () => {
    // Ti(OR)4 has 4 groups per Ti; acac at 5 mol/mol would replace 5
    expect(() =>
      computeFormulation({
        materials: [ref("ti-isopropoxide"), ref("acac"), ref("water-di")],
        basis: { type: "solidMass", grams: 1 },
        components: [{ materialId: "ti-isopropoxide", weightFraction: 1 }],
        modifiers: [{ materialId: "acac", precursorId: "ti-isopropoxide", molPerMetal: 5 }],
        water: { materialId: "water-di", ratio: "R", value: 1 },
        steps: [],
      }),
    ).toThrow(/replace 5 alkoxy groups per metal atom, but it has only 4/);
  });

  it("computes colloidal silica with methyltrimethoxysilane at an R target (an aqueous hard coat)", () => {
    // Source: the silica-filled methylsilsesquioxane hard coat, colloidal silica dispersed in a partial
    // condensate of CH3Si(OH)3 (Clark, US 3,986,997, 1976; from memory).
    // 20 g dry: 10 g SiO2 from a 30 % sol → n = 10 / 60.083 = 0.166436 mol, 33.3333 g of sol carrying
    // 23.3333 g = 1.29522 mol water; 10 g CH3SiO1.5 (67.1185) → n(MTMS) = 0.148990 mol → × 136.222 = 20.2958 g
    // Σa = 0.315426 mol; R = 3 → W = 0.946279 mol < carried 1.29522: no water added (caution), effective R = 4.10626
    // Σg = 3 × 0.148990 = 0.446971 (the sol brings no alkoxy groups) → effective h = 2.89778
    const result = computeFormulation({
      materials: [ref("colloidal-silica-30"), ref("mtms"), ref("water-di"), ref("acetic-acid-glacial")],
      basis: { type: "solidMass", grams: 20 },
      components: [
        { materialId: "colloidal-silica-30", weightFraction: 0.5 },
        { materialId: "mtms", weightFraction: 0.5 },
      ],
      water: { materialId: "water-di", ratio: "R", value: 3 },
      catalyst: { materialId: "acetic-acid-glacial", molPerNetworkAtom: 0.05 },
      steps: [{ name: "Cure", temperatureC: 120, durationH: 4 }],
    });
    const mtms = ref("mtms");
    const nCs = 10 / 60.083;
    const nM = 10 / mtms.precursor!.residueMolarMass;
    expectClose(line(result, "colloidal-silica-30").massGrams, 10 / 0.3, 1e-12);
    expectClose(line(result, "mtms").massGrams, nM * mtms.molarMass!, 1e-12);
    expectClose(result.water.carriedMol, (10 / 0.3) * 0.7 / WATER, 1e-12);
    expect(result.water.addMol).toBe(0);
    expectClose(result.water.effectiveR, ((10 / 0.3) * 0.7) / WATER / (nCs + nM), 1e-12);
    expectClose(result.water.effectiveH, ((10 / 0.3) * 0.7) / WATER / (3 * nM), 1e-12);
    expect(result.water.effectiveR).toBeCloseTo(4.106, 2);
    expect(result.notices.map((n) => n.code)).toContain("carried_water_exceeds_target");
    expect(result.notices.map((n) => n.code)).not.toContain("below_full_hydrolysis");
  });

  it("makes a 58S-type bioactive glass with water per TEOS = 12, carried water not counted", () => {
    // Source: 58S = 58 SiO2 – 33 CaO – 9 P2O5 wt% (Li, Clark & Hench, J. Appl. Biomater. 2 (1991) 231) made with
    // H2O : TEOS = 12 (Saravanapavan & Hench, J. Non-Cryst. Solids 318 (2003) 1; from memory).
    // 10 g: n(TEOS) = 5.8 / 60.083 = 0.0965331; n(Ca) = 3.3 / 56.077 = 0.0588477 → 13.8966 g Ca(NO3)2·4H2O;
    // n(TEP) = 0.9 / (0.5 × 141.943) = 0.0126811 → 2.30995 g
    // water to add = 12 × 0.0965331 = 1.15840 mol = 20.8685 g (the tetrahydrate's 4 × 0.0588477 = 0.235391 mol not counted)
    // effective R = (1.15840 + 0.235391) / (0.0965331 + 0.0126811) = 12.7620 (all water present, per network atom)
    const result = computeFormulation({
      materials: [ref("teos"), ref("ca-nitrate-4h2o"), ref("triethyl-phosphate"), ref("water-di"), ref("hno3-65")],
      basis: { type: "solidMass", grams: 10 },
      components: [
        { materialId: "teos", weightFraction: 0.58 },
        { materialId: "ca-nitrate-4h2o", weightFraction: 0.33 },
        { materialId: "triethyl-phosphate", weightFraction: 0.09 },
      ],
      water: { materialId: "water-di", ratio: "perPrecursor", referenceId: "teos", value: 12, countCarried: false },
      steps: [
        { name: "Ageing", temperatureC: 60, durationH: 72, stage: "sol" },
        { name: "Drying", temperatureC: 130, durationH: 48, stage: "drying" },
        { name: "Stabilisation", temperatureC: 700, durationH: 2, stage: "curing" },
      ],
    });
    const nT = 5.8 / 60.083;
    const nCa = 3.3 / 56.077;
    const nP = 0.9 / (0.5 * 141.943);
    expect(result.water.addGrams).toBeCloseTo(20.8685, 3);
    expectClose(result.water.addMol, 12 * nT, 1e-12);
    expectClose(result.water.carriedMol, 4 * nCa, 1e-12);
    expectClose(result.water.effectiveR, (12 * nT + 4 * nCa) / (nT + nP), 1e-12);
    expect(result.thermal.status).toBe("clear"); // 700 °C reaches the 600 °C nitrate conversion
    // triethyl phosphate is not one of the moisture-sensitive, flammable alkoxides: only TEOS is named
    const handling = result.notices.find((n) => n.code === "alkoxide_handling");
    expect(handling?.message).toContain("Tetraethoxysilane");
    expect(handling?.message).not.toMatch(/phosphate/i);
  });

  it("counts the 1-propanol of a zirconium propoxide solution toward a propanol molar ratio", () => {
    // 10 g ZrO2 (123.222): n(Zr) = 0.0811543 mol; 70 % solution = 0.0811543 × 327.576 / 0.7 = 37.9774 g,
    // carrying 30 % = 11.3932 g 1-propanol = 0.189584 mol (60.096) = 2.33609 mol per mol Zr.
    // Ratio 2: the carried propanol alone exceeds it, none is added (caution), the real ratio 2.336 is reported.
    // Ratio 4: added = 4 × 0.0811543 − 0.189584 = 0.135033 mol = 8.11497 g.
    const input = (value: number): FormulationInput => ({
      materials: [ref("zr-propoxide-70"), ref("1-propanol"), ref("water-di")],
      basis: { type: "solidMass", grams: 10 },
      components: [{ materialId: "zr-propoxide-70", weightFraction: 1 }],
      water: { materialId: "water-di", ratio: "R", value: 1 },
      solvent: { materialId: "1-propanol", mode: "molPerNetworkAtom", value },
      steps: [{ name: "Cure", temperatureC: 150, durationH: 1 }],
    });
    const two = computeFormulation(input(2));
    expect(two.lines.find((l) => l.materialId === "1-propanol")).toBeUndefined();
    expect(two.notices.map((n) => n.code)).toContain("carried_solvent_exceeds_ratio");
    expect(two.solvent?.molPerNetworkAtom).toBeCloseTo(2.33609, 4);
    const four = computeFormulation(input(4));
    expect(line(four, "1-propanol").massGrams).toBeCloseTo(8.11497, 4);
    expectClose(four.solvent?.molPerNetworkAtom, 4, 1e-12);
    expect(four.solvent?.carriedGrams).toBeCloseTo(11.3932, 3);
  });

  it("gives a polycarbonate cure at 128 °C for 0.5 h a caution with the hours above the rating, and fails one at 135 °C", () => {
    // PC: heat deflection 132 °C at 1.8 MPa (ISO 75-2 method A, typical grade, from memory), rating 125 °C.
    // 128 °C: below 132 (no fail), within 20 °C of it and above 125 → caution, 0.5 h above the rating.
    // 135 °C ≥ 132 → fail.
    const coat = (temperatureC: number, durationH: number): FormulationInput => ({
      materials: [ref("gptms"), ref("teos"), ref("ethanol"), ref("water-di"), ref("polycarbonate")],
      basis: { type: "solidsContent", solMassGrams: 100, solidsFraction: 0.2 },
      components: [
        { materialId: "gptms", weightFraction: 0.7 },
        { materialId: "teos", weightFraction: 0.3 },
      ],
      water: { materialId: "water-di", ratio: "R", value: 1.5 },
      solvent: { materialId: "ethanol", mode: "fill" },
      substrateId: "polycarbonate",
      steps: [
        { name: "Hydrolysis", temperatureC: 25, durationH: 2, stage: "sol" },
        { name: "Cure", temperatureC, durationH, stage: "curing" },
      ],
    });
    const warm = computeFormulation(coat(128, 0.5));
    expect(warm.thermal.status).toBe("caution");
    expect(warm.notices.find((n) => n.code === "above_service_rating")?.message).toMatch(/0\.5 h at or above its continuous-use rating of 125 °C/);
    const hot = computeFormulation(coat(135, 0.5));
    expect(hot.thermal.status).toBe("fail");
    expect(hot.thermal.checks.find((c) => c.stepName === "Cure")).toMatchObject({ limit: "heatDeflection", limitC: 132, status: "fail" });
  });

  it("leaves PEG at 60 °C in the sol stage clear, and cautions on its melting point when drying", () => {
    // PEG 2000 melts at 52 °C (data/materials.ts); a dissolved polymer in the sol does not "melt" (chemistry.md).
    const peg = (stage: "sol" | "drying"): FormulationInput => ({
      materials: [ref("teos"), ref("peg-2000"), ref("ethanol"), ref("water-di")],
      basis: { type: "solidMass", grams: 10 },
      components: [
        { materialId: "teos", weightFraction: 0.8 },
        { materialId: "peg-2000", weightFraction: 0.2 },
      ],
      water: { materialId: "water-di", ratio: "R", value: 4 },
      solvent: { materialId: "ethanol", mode: "molPerNetworkAtom", value: 4 },
      steps: [{ name: "Ageing", temperatureC: 60, durationH: 24, stage }],
    });
    expect(computeFormulation(peg("sol")).thermal.status).toBe("clear");
    expect(computeFormulation(peg("drying")).thermal.checks[0]).toMatchObject({ status: "caution", limit: "melting", limitC: 52 });
  });
});
