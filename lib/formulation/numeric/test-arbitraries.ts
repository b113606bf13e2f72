/**
 * Random formulation inputs for the tests of the numeric path (fast-check),
 * built from the reference materials: colloidal and oligomeric precursors,
 * precursor solutions carrying their own solvent, a salt with crystal water,
 * organic phases (one in water), modifiers, every basis, every water ratio,
 * solvent by ratio and by fill, catalysts, coating methods, substrates and
 * steps of every stage and atmosphere; now and then a material loses a
 * property so that the engine refuses. Test support only: imports
 * fast-check and the reference data.
 */
import fc from "fast-check";
import { referenceMaterial } from "../../../data/materials";
import type { Basis, CoatingSpec, FormulationInput, ProcessStep } from "../input-schema";
import type { Material } from "../material-schema";

export const PRECURSORS = [
  "teos",
  "tmos",
  "gptms",
  "mtes",
  "mtms",
  "ti-isopropoxide",
  "ti-butoxide",
  "zr-propoxide-70",
  "al-sec-butoxide",
  "triethyl-phosphate",
  "ca-nitrate-4h2o",
  "colloidal-silica-30",
  "ethyl-silicate-40",
];
export const METAL_ALKOXIDES = ["ti-isopropoxide", "ti-butoxide", "zr-propoxide-70", "al-sec-butoxide"];
export const ORGANICS = ["pcl", "peg-2000", "pva-10-aq", "pdms-silanol", "pmma", "gelatin", "epoxy-dgeba", "polyetheramine-230"];
export const MODIFIERS = ["acac", "ethyl-acetoacetate", "methacrylic-acid"];
export const SOLVENTS = ["ethanol", "1-propanol", "2-propanol", "1-methoxy-2-propanol"];
export const CATALYSTS = ["hcl-37", "hno3-65", "acetic-acid-glacial", "ammonia-25"];
export const SUBSTRATES = ["polycarbonate", "pmma-sheet", "peek", "pet", "pla", "uhmwpe", "aluminium-6061", "soda-lime-glass"];

/**
 * A double in [min, max] with values below 1e-200 taken as 0: fast-check likes the smallest subnormals
 * (5e-324), which the decimal engine keeps and float64 products underflow (a bonded-ligand phase of
 * 1e-323 g, say). No formulation has such amounts.
 */
function double(min: number, max: number): fc.Arbitrary<number> {
  return fc.double({ min, max, noNaN: true }).map((value) => (Math.abs(value) < 1e-200 ? 0 : value));
}

const basis: fc.Arbitrary<Basis> = fc.oneof(
  double(0.01, 1e4).map((grams): Basis => ({ type: "solidMass", grams })),
  fc
    .record({ solMassGrams: double(1, 1e4), solidsFraction: double(0.005, 0.3) })
    .map((b): Basis => ({ type: "solidsContent", ...b })),
  fc
    .record({
      volumeMl: double(1, 1e4),
      bulkDensity: double(0.005, 0.3),
      linearShrinkage: fc.option(double(0, 0.5), { nil: undefined }),
    })
    .map(({ linearShrinkage, ...b }): Basis => ({ type: "gelBody", ...b, ...(linearShrinkage === undefined ? {} : { linearShrinkage }) })),
);

const step: fc.Arbitrary<ProcessStep> = fc
  .record({
    temperatureC: fc.oneof(fc.integer({ min: 15, max: 700 }), double(15, 700)),
    durationH: double(0.1, 48),
    stage: fc.option(fc.constantFrom("sol" as const, "drying" as const, "curing" as const), { nil: undefined }),
    atmosphere: fc.option(fc.constantFrom("air" as const, "inert" as const), { nil: undefined }),
  })
  .map(({ stage, atmosphere, ...s }, ) => ({ name: "Step", ...s, ...(stage ? { stage } : {}), ...(atmosphere ? { atmosphere } : {}) }));

const coating: fc.Arbitrary<CoatingSpec> = fc.oneof(
  fc.record({
    method: fc.constant("dip" as const),
    withdrawalMmPerS: double(0.1, 10),
    viscosityMPaS: double(1, 50),
    surfaceTensionMNPerM: double(20, 72),
  }),
  fc.record({
    method: fc.constant("spin" as const),
    rpm: fc.integer({ min: 500, max: 8000 }),
    calibration: fc.record({ rpm: fc.integer({ min: 500, max: 8000 }), dryThicknessNm: double(20, 2000) }),
    areaM2: double(0.01, 10),
  }),
  fc.record({ method: fc.constant("wetFilm" as const), wetThicknessUm: double(1, 200) }),
);

/** `value` in `weight` of `outOf` draws, undefined in the others. */
function rarely<T>(value: fc.Arbitrary<T>, weight: number, outOf: number): fc.Arbitrary<T | undefined> {
  return fc.oneof({ arbitrary: value, weight }, { arbitrary: fc.constant(undefined), weight: outOf - weight });
}

/**
 * Every material the inputs may use, without sources: one list for many inputs, so that one model
 * can evaluate them all in turn (as the explorer does).
 *
 * @example
 * ```ts
 * const model = numericModel(allMaterials());
 * ```
 */
export function allMaterials(): Material[] {
  return [...PRECURSORS, ...ORGANICS, ...MODIFIERS, ...SOLVENTS, ...CATALYSTS, ...SUBSTRATES, "water-di"].map((id) => {
    const material: Material = { ...referenceMaterial(id) };
    delete material.sources;
    return material;
  });
}

/** Drops a property from one material now and then, so that the engine refuses (missing density, molar mass …). */
const damage = rarely(
  fc.record({ slot: fc.nat(), property: fc.constantFrom("density" as const, "molarMass" as const, "phaseDensity" as const, "precursor" as const) }),
  1,
  12,
);

/**
 * A random formulation input over the reference materials. Most are valid;
 * run it through the input schema before use.
 *
 * @example
 * ```ts
 * fc.assert(fc.property(formulationInputs, (input) => { ... }));
 * ```
 */
export const formulationInputs: fc.Arbitrary<FormulationInput> = fc
  .record({
    precursors: fc.uniqueArray(fc.constantFrom(...PRECURSORS), { minLength: 1, maxLength: 3 }),
    organics: fc.uniqueArray(fc.constantFrom(...ORGANICS), { minLength: 0, maxLength: 2 }),
    weights: fc.array(double(0.02, 1), { minLength: 5, maxLength: 5 }),
    scaled: fc.boolean(),
    // 0–2 modifier lines on the first metal alkoxide: two of one ligand share its bonded phase.
    modifiers: fc.array(fc.record({ id: fc.constantFrom(...MODIFIERS), x: double(0, 2.5) }), { minLength: 0, maxLength: 2 }),
    basis,
    water: fc.record({
      ratio: fc.constantFrom("R" as const, "h" as const, "perPrecursor" as const),
      value: double(0, 30),
      countCarried: fc.option(fc.boolean(), { nil: undefined }),
    }),
    solvent: fc.option(fc.record({ id: fc.constantFrom(...SOLVENTS), fill: fc.boolean(), value: double(0, 40) }), {
      nil: undefined,
      freq: 5,
    }),
    catalyst: fc.option(fc.record({ id: fc.constantFrom(...CATALYSTS), ratio: double(0, 0.5) }), { nil: undefined }),
    substrate: fc.option(fc.constantFrom(...SUBSTRATES), { nil: undefined }),
    steps: fc.array(step, { minLength: 0, maxLength: 3 }),
    marginC: fc.option(double(0, 100), { nil: undefined }),
    bulk: rarely(double(0.05, 4), 1, 3),
    coating: fc.option(coating, { nil: undefined }),
    prices: rarely(fc.array(double(0.5, 500), { minLength: 1, maxLength: 4 }), 1, 3),
    damage,
  })
  .map((r): FormulationInput => {
    const ids = [...r.precursors, ...r.organics];
    const raw = ids.map((_, i) => r.weights[i] ?? 1);
    const total = raw.reduce((a, b) => a + b, 0);
    // "scaled": fractions that sum to 1 within 0.5 %, which the engine scales to 1.
    const fractions = raw.map((w) => (r.scaled ? (w / total) * 1.003 : w / total));
    if (!r.scaled) fractions[0] = 1 - fractions.slice(1).reduce((a, b) => a + b, 0);
    const metal = r.precursors.find((id) => METAL_ALKOXIDES.includes(id));
    const wanted = new Set<string>([...ids, "water-di"]);
    if (metal) for (const modifier of r.modifiers) wanted.add(modifier.id);
    if (r.solvent) wanted.add(r.solvent.id);
    if (r.catalyst) wanted.add(r.catalyst.id);
    if (r.substrate) wanted.add(r.substrate);
    // The sources' texts never enter the arithmetic; without them validation is quicker.
    const materials: Material[] = [...wanted].map((id, i) => {
      const material: Material = { ...referenceMaterial(id) };
      delete material.sources;
      return r.prices ? { ...material, pricePerKg: r.prices[i % r.prices.length]! } : material;
    });
    if (r.damage) {
      const index = r.damage.slot % materials.length;
      const damaged: Material = { ...materials[index]! };
      delete damaged[r.damage.property];
      materials[index] = damaged;
    }
    const fill = r.solvent?.fill === true && r.basis.type !== "solidMass";
    return {
      materials,
      basis: r.basis,
      components: ids.map((materialId, i) => ({ materialId, weightFraction: fractions[i]! })),
      water: {
        materialId: "water-di",
        ratio: r.water.ratio,
        value: r.water.value,
        ...(r.water.ratio === "perPrecursor" ? { referenceId: r.precursors[0]! } : {}),
        ...(r.water.countCarried === undefined ? {} : { countCarried: r.water.countCarried }),
      },
      ...(r.solvent ? { solvent: fill ? { materialId: r.solvent.id, mode: "fill" as const } : { materialId: r.solvent.id, mode: "molPerNetworkAtom" as const, value: r.solvent.value } } : {}),
      ...(r.catalyst ? { catalyst: { materialId: r.catalyst.id, molPerNetworkAtom: r.catalyst.ratio } } : {}),
      ...(metal && r.modifiers.length > 0 ? { modifiers: r.modifiers.map((m) => ({ materialId: m.id, precursorId: metal, molPerMetal: m.x })) } : {}),
      ...(r.substrate ? { substrateId: r.substrate } : {}),
      steps: r.steps,
      ...(r.marginC === undefined ? {} : { marginC: r.marginC }),
      ...(r.bulk === undefined ? {} : { measuredBulkDensity: r.bulk }),
      ...(r.coating ? { coating: r.coating } : {}),
    };
  });
