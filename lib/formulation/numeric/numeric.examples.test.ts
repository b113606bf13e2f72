/**
 * Worked examples of the numeric path, one per feature, each checked twice:
 * against the decimal engine (every figure within 1e-9) and against a hand
 * calculation from the stoichiometry of complete hydrolysis and condensation
 * (Brinker & Scherer, Sol-Gel Science, 1990, ch. 3: Si(OR)4 + 2 H2O → SiO2 +
 * 4 ROH; a residue of molar mass M_res per k formula units per molecule) and
 * the ideal-mixing rule of mixtures for volumes and densities (common
 * practice, no source). Material constants are the reference data's.
 */
import { describe, expect, it } from "vitest";
import type { FormulationInput } from "../input-schema";
import { expectClose, ref } from "../test-support";
import { figuresDifference } from "./compare";
import { decimalModel, type NumericFigures, type NumericOutcome } from "./figures";
import { numericModel } from "./model";

const WATER = 18.015;
const SIO2 = 60.083;

function outcome(input: FormulationInput): NumericOutcome {
  const numeric = numericModel(input.materials).evaluate(input);
  const decimal = decimalModel(input.materials).evaluate(input);
  if (!decimal.ok || !numeric.ok) expect(numeric).toEqual(decimal);
  else expect(figuresDifference(numeric.figures, decimal.figures).max).toBeLessThanOrEqual(1e-9);
  return numeric;
}

function figures(input: FormulationInput): NumericFigures {
  const result = outcome(input);
  if (!result.ok) throw new Error(`refused: ${result.code} on ${result.field}`);
  return result.figures;
}

/** 10 g of dry composite from TEOS alone, water R = 4, no solvent, no steps. */
function teosInput(extra: Partial<FormulationInput> = {}): FormulationInput {
  return {
    materials: [ref("teos"), ref("ethanol"), ref("water-di"), ref("hcl-37")],
    basis: { type: "solidMass", grams: 10 },
    components: [{ materialId: "teos", weightFraction: 1 }],
    water: { materialId: "water-di", ratio: "R", value: 4 },
    steps: [],
    ...extra,
  };
}

describe("numeric path: worked examples", () => {
  it("weighs TEOS, ethanol by ratio, HCl 37 % and the water it still needs for 10 g of silica", () => {
    const f = figures(
      teosInput({ solvent: { materialId: "ethanol", mode: "molPerNetworkAtom", value: 4 }, catalyst: { materialId: "hcl-37", molPerNetworkAtom: 0.01 } }),
    );
    const n = 10 / SIO2;
    const acid = (0.01 * n * 36.458) / 0.37;
    const carried = (acid * 0.63) / WATER;
    const water = (4 * n - carried) * WATER;
    expectClose(f.waterAddGrams, water, 1e-12);
    expectClose(f.solMassGrams, n * 208.329 + 4 * n * 46.069 + acid + water, 1e-12);
    expectClose(f.solVolumeMl, (n * 208.329) / 0.933 + (4 * n * 46.069) / 0.7893 + acid / 1.18 + water / 0.9982, 1e-12);
    expectClose(f.effectiveR, 4, 1e-12);
    expectClose(f.effectiveH, 1, 1e-12);
    expectClose(f.solventMolPerNetworkAtom, 4, 1e-12);
  });

  it("counts the water of colloidal silica (30 % in water): none added when it exceeds the target", () => {
    const f = figures({ ...teosInput(), materials: [ref("colloidal-silica-30"), ref("water-di")], components: [{ materialId: "colloidal-silica-30", weightFraction: 1 }] });
    const n = 10 / SIO2;
    expect(f.waterAddGrams).toBe(0);
    expectClose(f.solMassGrams, 10 / 0.3, 1e-12);
    expectClose(f.effectiveR, ((10 / 0.3) * 0.7) / WATER / n, 1e-12);
    expect(f.effectiveH).toBeNaN(); // no alkoxy groups
  });

  it("sets the water of an oligomeric silicate (2.4 ethoxy groups per Si) by h", () => {
    const f = figures({
      ...teosInput(),
      materials: [ref("ethyl-silicate-40"), ref("water-di")],
      components: [{ materialId: "ethyl-silicate-40", weightFraction: 1 }],
      water: { materialId: "water-di", ratio: "h", value: 1 },
    });
    expectClose(f.effectiveR, 2.4, 1e-12);
    expectClose(f.waterAddGrams, 2.4 * (10 / SIO2) * WATER, 1e-12);
  });

  it("counts the 1-propanol a 70 % zirconium propoxide solution carries toward the solvent ratio", () => {
    const at = (value: number): NumericFigures =>
      figures({
        ...teosInput(),
        materials: [ref("zr-propoxide-70"), ref("1-propanol"), ref("water-di")],
        components: [{ materialId: "zr-propoxide-70", weightFraction: 1 }],
        solvent: { materialId: "1-propanol", mode: "molPerNetworkAtom", value },
      });
    const n = 10 / 123.222;
    const carriedMol = (((n * 327.576) / 0.7) * 0.3) / 60.096; // 2.34 mol per mol Zr
    expectClose(at(6).solventAddedGrams, (6 * n - carriedMol) * 60.096, 1e-12);
    expectClose(at(6).solventMolPerNetworkAtom, 6, 1e-12);
    expect(at(2).solventAddedGrams).toBe(0); // the solution already brings more than 2 mol per mol Zr
    expectClose(at(2).solventMolPerNetworkAtom, carriedMol / n, 1e-12);
  });

  it("counts the crystal water of calcium nitrate tetrahydrate, or not, for water per mol TEOS", () => {
    const base = {
      ...teosInput(),
      materials: [ref("teos"), ref("ca-nitrate-4h2o"), ref("water-di")],
      components: [
        { materialId: "teos", weightFraction: 0.7 },
        { materialId: "ca-nitrate-4h2o", weightFraction: 0.3 },
      ],
    };
    const nSi = 7 / SIO2;
    const nCa = 3 / 56.077;
    const counted = figures({ ...base, water: { materialId: "water-di", ratio: "perPrecursor", referenceId: "teos", value: 4 } });
    expectClose(counted.waterAddGrams, (4 * nSi - 4 * nCa) * WATER, 1e-12);
    const apart = figures({ ...base, water: { materialId: "water-di", ratio: "perPrecursor", referenceId: "teos", value: 4, countCarried: false } });
    expectClose(apart.waterAddGrams, 4 * nSi * WATER, 1e-12);
    expectClose(apart.effectiveR, (4 * nSi + 4 * nCa) / nSi, 1e-12); // Ca is no network-forming atom
  });

  it("takes the dry phase of PVA 10 % in water at its own density and its water as carried", () => {
    const f = figures({
      ...teosInput(),
      materials: [ref("teos"), ref("pva-10-aq"), ref("water-di")],
      components: [
        { materialId: "teos", weightFraction: 0.8 },
        { materialId: "pva-10-aq", weightFraction: 0.2 },
      ],
      water: { materialId: "water-di", ratio: "R", value: 4, countCarried: false },
    });
    const density = 1 / (0.8 / 2.2 + 0.2 / 1.27);
    expectClose(f.theoreticalDensity, density, 1e-12);
    expectClose(f.organicVolumeFraction, (0.2 / 1.27) * density, 1e-12);
    expectClose(f.organicWeightFraction, 0.2, 1e-12);
    const n = 8 / SIO2;
    expectClose(f.effectiveR, (4 * n + (20 * 0.9) / WATER) / n, 1e-12);
  });

  it("adds acetylacetone's bonded ligand as a phase, and drops it when a step burns it out", () => {
    const input: FormulationInput = {
      ...teosInput(),
      materials: [ref("teos"), ref("ti-isopropoxide"), ref("acac"), ref("water-di")],
      components: [
        { materialId: "teos", weightFraction: 0.8 },
        { materialId: "ti-isopropoxide", weightFraction: 0.2 },
      ],
      modifiers: [{ materialId: "acac", precursorId: "ti-isopropoxide", molPerMetal: 1 }],
      water: { materialId: "water-di", ratio: "h", value: 1 },
    };
    const c = (0.2 / 79.865) * 91.11; // bonded ligand per g of ligand-free composite
    const bonded = figures({ ...input, steps: [{ name: "Dry", temperatureC: 120, durationH: 1 }] });
    expect(bonded.phases.map((p) => p.materialId)).toEqual(["teos", "ti-isopropoxide", "acac"]);
    expectClose(bonded.phases[2]!.weightFraction, c / (1 + c), 1e-12);
    const free = 10 / (1 + c);
    const groups = 4 * ((0.8 * free) / SIO2) + 3 * ((0.2 * free) / 79.865); // one of four Ti groups replaced
    expectClose(bonded.waterAddGrams, groups * WATER, 1e-12);
    const burnt = figures({ ...input, steps: [{ name: "Anneal", temperatureC: 400, durationH: 1 }] });
    expect(burnt.phases.map((p) => p.materialId)).toEqual(["teos", "ti-isopropoxide"]);
    expectClose(burnt.phases[1]!.weightFraction, 0.2, 1e-12);
  });

  it("fills ethanol to a 100 g sol at 10 % solids", () => {
    const f = figures(teosInput({ basis: { type: "solidsContent", solMassGrams: 100, solidsFraction: 0.1 }, solvent: { materialId: "ethanol", mode: "fill" } }));
    const n = 10 / SIO2;
    expectClose(f.solMassGrams, 100, 1e-12);
    expectClose(f.solidsFraction, 0.1, 1e-12);
    expectClose(f.solventAddedGrams, 100 - n * 208.329 - 4 * n * WATER, 1e-12);
  });

  it("sizes a gel body from its mould, bulk density and shrinkage, with its porosity", () => {
    const f = figures(
      teosInput({ basis: { type: "gelBody", volumeMl: 50, bulkDensity: 0.2, linearShrinkage: 0.1 }, solvent: { materialId: "ethanol", mode: "fill" } }),
    );
    expectClose(f.compositeMassGrams, 0.2 * 50 * 0.9 ** 3, 1e-12);
    expectClose(f.solVolumeMl, 50, 1e-12);
    expectClose(f.porosity, 1 - 0.2 / 2.2, 1e-12);
    expectClose(f.residueGramsPerL, (0.2 * 50 * 0.9 ** 3 * 1000) / 50, 1e-12);
  });

  it("gives the dense shrinkage from the sol volume, and porosity from a measured bulk density", () => {
    const f = figures(teosInput({ measuredBulkDensity: 1.1 }));
    const n = 10 / SIO2;
    const ratio = 10 / 2.2 / ((n * 208.329) / 0.933 + (4 * n * WATER) / 0.9982);
    expectClose(f.denseVolumetricShrinkage, 1 - ratio, 1e-12);
    expectClose(f.denseLinearShrinkage, 1 - Math.cbrt(ratio), 1e-12);
    expectClose(f.porosity, 0.5, 1e-12);
    expect(outcome(teosInput({ measuredBulkDensity: 2.5 }))).toEqual({ ok: false, code: "bulk_density_above_theoretical", field: "measuredBulkDensity" });
  });

  it("counts the R group of GPTMS's (C6H11O2)SiO1.5 residue as organic content", () => {
    const f = figures({ ...teosInput(), materials: [ref("gptms"), ref("water-di")], components: [{ materialId: "gptms", weightFraction: 1 }] });
    // C6H11O2: 6 · 12.011 + 11 · 1.008 + 2 · 15.999 = 115.152 g/mol of 167.2355
    expectClose(f.organicContent, 115.152 / 167.2355, 1e-3);
    expect(f.organicWeightFraction).toBe(0);
  });

  it("judges a polycarbonate substrate against its heat deflection temperature, service rating and the margin", () => {
    const on = (temperatureC: number, marginC?: number): NumericFigures =>
      figures(teosInput({ materials: [...teosInput().materials, ref("polycarbonate")], substrateId: "polycarbonate", steps: [{ name: "Cure", temperatureC, durationH: 1 }], ...(marginC === undefined ? {} : { marginC }) }));
    expect(on(100).thermalStatus).toBe("clear");
    expect(on(100).maxAllowedC).toBe(132 - 20);
    expect(on(115).thermalStatus).toBe("caution"); // within 20 °C of the 132 °C heat deflection temperature
    expect(on(126, 0).thermalStatus).toBe("caution"); // above the 125 °C continuous-use rating
    expect(on(132, 0).thermalStatus).toBe("fail");
  });

  it("uses PEG's onset in inert gas when every step is inert, and its melting point outside the sol stage", () => {
    const peg = (steps: FormulationInput["steps"]): NumericFigures =>
      figures({
        ...teosInput(),
        materials: [ref("teos"), ref("peg-2000"), ref("water-di")],
        components: [
          { materialId: "teos", weightFraction: 0.9 },
          { materialId: "peg-2000", weightFraction: 0.1 },
        ],
        steps,
      });
    expect(peg([{ name: "Age", temperatureC: 70, durationH: 1, stage: "sol" }]).thermalStatus).toBe("clear");
    expect(peg([{ name: "Dry", temperatureC: 70, durationH: 1, stage: "drying" }]).thermalStatus).toBe("caution"); // past the 52 °C melting point
    expect(peg([{ name: "Anneal", temperatureC: 250, durationH: 1, atmosphere: "inert" }]).maxAllowedC).toBe(340 - 20);
    expect(peg([{ name: "Anneal", temperatureC: 250, durationH: 1, atmosphere: "inert" }]).thermalStatus).toBe("caution"); // melting point
    expect(peg([{ name: "Anneal", temperatureC: 250, durationH: 1 }]).thermalStatus).toBe("fail"); // 180 °C onset in air
    expect(peg([{ name: "Anneal", temperatureC: 250, durationH: 1 }]).maxAllowedC).toBe(180 - 20);
  });

  it("cautions when no step reaches calcium nitrate's 600 °C conversion", () => {
    const input = (temperatureC: number): FormulationInput => ({
      ...teosInput(),
      materials: [ref("teos"), ref("ca-nitrate-4h2o"), ref("water-di")],
      components: [
        { materialId: "teos", weightFraction: 0.8 },
        { materialId: "ca-nitrate-4h2o", weightFraction: 0.2 },
      ],
      steps: [{ name: "Calcine", temperatureC, durationH: 2 }],
    });
    expect(figures(input(500)).thermalStatus).toBe("caution");
    expect(figures(input(650)).thermalStatus).toBe("clear");
  });

  it("refuses like the engine: a missing density, too much modifier, a sol too small for its reagents, h without alkoxy groups, an unreadable residue formula", () => {
    const noDensity = { ...ref("teos") };
    delete noDensity.density;
    expect(outcome(teosInput({ materials: [noDensity, ref("water-di")] }))).toEqual({ ok: false, code: "missing_density", field: "materials.0.density" });
    expect(
      outcome({
        ...teosInput(),
        materials: [ref("ti-isopropoxide"), ref("acac"), ref("water-di")],
        components: [{ materialId: "ti-isopropoxide", weightFraction: 1 }],
        modifiers: [{ materialId: "acac", precursorId: "ti-isopropoxide", molPerMetal: 5 }],
      }),
    ).toEqual({ ok: false, code: "too_much_modifier", field: "modifiers.0.molPerMetal" });
    expect(outcome(teosInput({ basis: { type: "solidsContent", solMassGrams: 100, solidsFraction: 0.4 }, solvent: { materialId: "ethanol", mode: "fill" } }))).toEqual({
      ok: false,
      code: "solids_content_too_high",
      field: "basis.solidsFraction",
    });
    expect(
      outcome({ ...teosInput(), materials: [ref("colloidal-silica-30"), ref("water-di")], components: [{ materialId: "colloidal-silica-30", weightFraction: 1 }], water: { materialId: "water-di", ratio: "h", value: 1 } }),
    ).toEqual({ ok: false, code: "no_hydrolysable_groups", field: "water.ratio" });
    const unreadable = { ...ref("gptms"), precursor: { ...ref("gptms").precursor!, residueFormula: "(C6H11Q2)SiO1.5" } };
    expect(outcome({ ...teosInput(), materials: [ref("teos"), unreadable, ref("water-di")] })).toEqual({ ok: false, code: "invalid_formula", field: "formula" });
  });
});
