/**
 * fast-check arbitraries for the tests of the numeric coat figures (not part
 * of the engine's API): random valid formulations over the reference
 * materials, extending those of properties-coat.test.ts and
 * properties.test.ts with every coating method (with and without a target
 * and an area), substrates with and without an index, phases with and
 * without one, priced and unpriced lines, epoxy and amine materials, VOC
 * verdicts of every kind and a measured porosity.
 */
import fc from "fast-check";
import type { CoatingSpec, FormulationInput } from "../input-schema";
import type { Material } from "../material-schema";
import { ref } from "../test-support";

const PRECURSORS = ["teos", "gptms", "aptes", "mtes", "ti-isopropoxide", "zr-propoxide-70", "colloidal-silica-30", "al-sec-butoxide"];
const ORGANICS = ["epoxy-dgeba", "polyetheramine-230", "peg-2000", "pcl", "pva-10-aq"];
const SOLVENTS = ["ethanol", "1-propanol", "1-methoxy-2-propanol", "1-butanol"];
const CATALYSTS = ["hcl-37", "acetic-acid-glacial", "ammonia-25"];
/** Refractive index 1.586, 1.52, 1.64; none (opaque) for aluminium and PEEK. */
const SUBSTRATES = ["polycarbonate", "soda-lime-glass", "pet", "aluminium-6061", "peek"];
/** Alkoxides an acac ligand can modify. */
const MODIFIABLE = ["ti-isopropoxide", "zr-propoxide-70", "al-sec-butoxide"];

/** Absent half the time (fast-check builds the nil value with probability 1 / freq). */
const optional = <T>(arb: fc.Arbitrary<T>): fc.Arbitrary<T | undefined> => fc.option(arb, { nil: undefined, freq: 2 });

/** A coating: dip, spin or wet film, each with or without a target dry thickness and an area. */
export const coatingArb: fc.Arbitrary<CoatingSpec> = fc
  .record({
    method: fc.oneof(
      fc.record({
        method: fc.constant("dip" as const),
        withdrawalMmPerS: fc.double({ min: 0.05, max: 50, noNaN: true }),
        viscosityMPaS: fc.double({ min: 0.5, max: 500, noNaN: true }),
        surfaceTensionMNPerM: fc.double({ min: 15, max: 72, noNaN: true }),
      }),
      fc.record({
        method: fc.constant("spin" as const),
        rpm: fc.integer({ min: 300, max: 12000 }),
        calibration: fc.record({ rpm: fc.integer({ min: 300, max: 12000 }), dryThicknessNm: fc.double({ min: 20, max: 3000, noNaN: true }) }),
      }),
      fc.record({ method: fc.constant("wetFilm" as const), wetThicknessUm: fc.double({ min: 0.5, max: 300, noNaN: true }) }),
    ),
    target: optional(fc.double({ min: 20, max: 2000, noNaN: true })),
    area: optional(fc.double({ min: 0.01, max: 20, noNaN: true })),
  })
  .map(({ method, target, area }) => ({
    ...method,
    ...(target === undefined ? {} : { targetDryThicknessNm: target }),
    ...(area === undefined ? {} : { areaM2: area }),
  }));

/** Material edits that change a coat figure's presence or a VOC verdict. */
const editsArb = fc.record({
  /**
   * 0: no prices; 1: every material priced; 2: some priced (cost absent unless all dispensed lines are);
   * 3: all but the components of zero weight (whose lines weigh nothing and need no price).
   */
  priceMode: fc.constantFrom(0, 1, 2, 3),
  prices: fc.array(fc.double({ min: 0.5, max: 500, noNaN: true }), { minLength: 20, maxLength: 20 }),
  priced: fc.array(fc.boolean(), { minLength: 20, maxLength: 20 }),
  /** Remove the refractive index of this material (by position among the phases' materials). */
  dropIndexOf: optional(fc.nat(9)),
  /** Solvent without a boiling point: assumed volatile. */
  solventWithoutBoilingPoint: fc.boolean(),
  /** Solvent with a boiling point above 250 °C: not a VOC (invented value). */
  solventAbove250: fc.boolean(),
  /** Zirconium propoxide solution naming no carried solvent: counted as VOC. */
  carriedSolventUnnamed: fc.boolean(),
  /** Solvent and acetic acid below 100 % (the balance water, as in 96 % ethanol): VOC counts the active part. */
  volatileAssay: optional(fc.double({ min: 0.8, max: 0.99, noNaN: true })),
  /** GPTMS and APTES below 100 %: the epoxy–amine balance counts the active part (invented grades). */
  curingAssay: optional(fc.double({ min: 0.9, max: 0.99, noNaN: true })),
  /** The epoxy resin supplied as a solution in the sol's solvent (invented grade): its dry phase, not its mass, cures. */
  epoxySolution: optional(fc.double({ min: 0.5, max: 0.95, noNaN: true })),
  order: fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 20, maxLength: 20 }),
});

/** A formulation to compute, and a porosity to reach by a measured bulk density (undefined: none). */
export interface CoatCase {
  input: FormulationInput;
  porosity: number | undefined;
}

function edit(material: Material, changes: Partial<Material>, removed: readonly (keyof Material)[] = []): Material {
  const out: Record<string, unknown> = { ...material, ...changes };
  for (const key of removed) delete out[key];
  return out as unknown as Material;
}

/** A random coat formulation (see the file's comment). */
export const coatCaseArb: fc.Arbitrary<CoatCase> = fc
  .record({
    precursors: fc.uniqueArray(fc.constantFrom(...PRECURSORS), { minLength: 1, maxLength: 3 }),
    organics: fc.uniqueArray(fc.constantFrom(...ORGANICS), { minLength: 0, maxLength: 2 }),
    // a component of zero weight leaves a line of 0 g (never the first, which takes the remainder)
    weights: fc.array(fc.oneof(fc.constant(0), fc.double({ min: 0.05, max: 1, noNaN: true })), { minLength: 5, maxLength: 5 }),
    modifierRatio: optional(fc.double({ min: 0.2, max: 1.5, noNaN: true })),
    R: fc.double({ min: 0.5, max: 20, noNaN: true }),
    countCarried: fc.boolean(),
    solvent: fc.constantFrom(...SOLVENTS),
    solventMode: fc.oneof(
      fc.record({ fill: fc.constant(false), perAtom: fc.double({ min: 0, max: 20, noNaN: true }), grams: fc.double({ min: 0.1, max: 1000, noNaN: true }) }),
      fc.record({ fill: fc.constant(true), solMassGrams: fc.double({ min: 10, max: 5000, noNaN: true }), solidsFraction: fc.double({ min: 0.01, max: 0.1, noNaN: true }) }),
      // a gel body: its bulk density gives the porosity (an aerogel-like coat, P near 1)
      fc.record({
        fill: fc.constant(true),
        volumeMl: fc.double({ min: 1, max: 1000, noNaN: true }),
        bulkDensity: fc.double({ min: 0.01, max: 0.3, noNaN: true }),
        linearShrinkage: fc.double({ min: 0, max: 0.3, noNaN: true }),
      }),
    ),
    catalyst: optional(fc.record({ id: fc.constantFrom(...CATALYSTS), ratio: fc.double({ min: 0.001, max: 0.2, noNaN: true }) })),
    coating: optional(coatingArb),
    substrate: optional(fc.constantFrom(...SUBSTRATES)),
    porosity: optional(fc.double({ min: 0.02, max: 0.6, noNaN: true })),
    edits: editsArb,
  })
  .map((r): CoatCase => {
    const componentIds = [...r.precursors, ...r.organics];
    const raw = componentIds.map((_, i) => (i === 0 ? Math.max(r.weights[0] ?? 1, 0.05) : (r.weights[i] ?? 1)));
    const total = raw.reduce((a, b) => a + b, 0);
    const fractions = raw.map((w) => w / total);
    fractions[0] = 1 - fractions.slice(1).reduce((a, b) => a + b, 0);
    const modified = r.precursors.find((id) => MODIFIABLE.includes(id));
    const withModifier = modified !== undefined && r.modifierRatio !== undefined;
    const ids = [
      ...componentIds,
      ...(withModifier ? ["acac"] : []),
      r.solvent,
      "water-di",
      ...(r.catalyst ? [r.catalyst.id] : []),
      ...(r.substrate ? [r.substrate] : []),
    ];
    const phaseIds = [...componentIds, ...(withModifier ? ["acac"] : [])];
    const dropIndex = r.edits.dropIndexOf === undefined ? undefined : phaseIds[r.edits.dropIndexOf % phaseIds.length];
    let materials = ids.map((id, i): Material => {
      let m = ref(id);
      if (id === dropIndex) m = m.kind === "precursor" && m.precursor ? edit(m, { precursor: { ...m.precursor, residueRefractiveIndex: undefined } }) : edit(m, {}, ["refractiveIndex"]);
      if (id === r.solvent && r.edits.solventWithoutBoilingPoint) m = edit(m, {}, ["boilingPointC"]);
      else if (id === r.solvent && r.edits.solventAbove250) m = edit(m, { boilingPointC: 260 });
      if (id === "zr-propoxide-70" && r.edits.carriedSolventUnnamed) m = edit(m, {}, ["solventId"]);
      const { volatileAssay, curingAssay } = r.edits;
      if ((id === r.solvent || id === "acetic-acid-glacial") && volatileAssay !== undefined) m = edit(m, { assay: volatileAssay, waterFraction: 1 - volatileAssay });
      if ((id === "gptms" || id === "aptes") && curingAssay !== undefined) m = edit(m, { assay: curingAssay });
      const { epoxySolution } = r.edits;
      if (id === "epoxy-dgeba" && epoxySolution !== undefined) {
        m = edit(m, { assay: epoxySolution, solventFraction: 1 - epoxySolution, solventId: r.solvent, phaseDensity: m.density });
      }
      const unweighed = componentIds.includes(id) && fractions[componentIds.indexOf(id)] === 0;
      const mode = r.edits.priceMode;
      const priced = mode === 1 || (mode === 2 && r.edits.priced[i]) || (mode === 3 && !unweighed);
      return priced ? edit(m, { pricePerKg: r.edits.prices[i] as number }) : m;
    });
    // the materials list in a random order (error paths name a material by its position)
    const order = new Map(materials.map((m, i) => [m.id, r.edits.order[i] ?? 0]));
    materials = [...materials].sort((a, b) => (order.get(a.id) ?? 0) - (order.get(b.id) ?? 0));
    const mode = r.solventMode;
    const input: FormulationInput = {
      materials,
      basis: !mode.fill
        ? { type: "solidMass", grams: mode.grams }
        : "volumeMl" in mode
          ? { type: "gelBody", volumeMl: mode.volumeMl, bulkDensity: mode.bulkDensity, linearShrinkage: mode.linearShrinkage }
          : { type: "solidsContent", solMassGrams: mode.solMassGrams, solidsFraction: mode.solidsFraction },
      components: componentIds.map((materialId, i) => ({ materialId, weightFraction: fractions[i] as number })),
      ...(withModifier ? { modifiers: [{ materialId: "acac", precursorId: modified, molPerMetal: r.modifierRatio as number }] } : {}),
      water: { materialId: "water-di", ratio: "R", value: r.R, countCarried: r.countCarried },
      solvent: mode.fill ? { materialId: r.solvent, mode: "fill" } : { materialId: r.solvent, mode: "molPerNetworkAtom", value: mode.perAtom },
      ...(r.catalyst ? { catalyst: { materialId: r.catalyst.id, molPerNetworkAtom: r.catalyst.ratio } } : {}),
      ...(r.coating ? { coating: r.coating } : {}),
      ...(r.substrate ? { substrateId: r.substrate } : {}),
      steps: [{ name: "Dry", temperatureC: 60, durationH: 1, stage: "drying" }],
    };
    return { input, porosity: r.porosity };
  });

/**
 * An aqueous sol whose water may take more than the whole sol at the water
 * density given (colloidal silica carries 70 % water), or whose water has no
 * density at all: the points where the VOC figure refuses the input.
 */
export const aqueousCaseArb: fc.Arbitrary<FormulationInput> = fc
  .record({
    // all colloidal silica, or some TEOS beside it (never a fraction below the schema's 1e-6)
    colloidal: fc.oneof(fc.constant(1), fc.double({ min: 0.3, max: 0.99, noNaN: true })),
    R: fc.double({ min: 0.5, max: 40, noNaN: true }),
    waterDensity: optional(fc.double({ min: 0.3, max: 1.2, noNaN: true })),
    ethanol: fc.double({ min: 0, max: 3, noNaN: true }),
    coating: optional(coatingArb),
    // the materials list in a random order: the refusal names the water by its position
    order: fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 4, maxLength: 4 }),
  })
  .map((r) => {
    const water = r.waterDensity === undefined ? edit(ref("water-di"), {}, ["density"]) : edit(ref("water-di"), { density: r.waterDensity });
    return {
      materials: [ref("colloidal-silica-30"), ref("teos"), ref("ethanol"), water]
        .map((material, i) => ({ material, key: r.order[i] ?? 0 }))
        .sort((a, b) => a.key - b.key)
        .map((entry) => entry.material),
      basis: { type: "solidMass", grams: 10 },
      components: [
        { materialId: "colloidal-silica-30", weightFraction: r.colloidal },
        { materialId: "teos", weightFraction: 1 - r.colloidal },
      ],
      water: { materialId: "water-di", ratio: "R", value: r.R },
      solvent: { materialId: "ethanol", mode: "molPerNetworkAtom", value: r.ethanol },
      ...(r.coating ? { coating: r.coating } : {}),
      steps: [{ name: "Dry", temperatureC: 60, durationH: 1 }],
    };
  });
