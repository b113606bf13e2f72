/**
 * The numeric kernel: one point's figures from its varied numbers and a
 * KernelPlan (kernel-plan.ts), the same equations as composition.ts,
 * liquids.ts, fill.ts and the coat figures, over plain numbers only. A point
 * whose structure differs from the plan's (no network atoms, a fill that
 * would refuse, a bulk density above the theoretical one, no water-free
 * volume …) returns KERNEL_GENERAL and is computed by the general branch,
 * which gives the engine's refusal or figures.
 */
import { MIN_LINE_GRAMS, ML_PER_L } from "../constants";
import { numericFilm } from "./coat-film";
import { SCALAR_FIGURES, type ScalarFigure } from "./compare";
import * as layout from "./kernel-layout";
import type { KernelPlan } from "./kernel-plan";
import { addLine as addSums, thermal as thermalOf, type KernelState } from "./kernel-state";

// Local copies, read once: where modules are compiled one by one (tsx, vitest), an imported binding is
// read through a getter at every use, which a loop over components cannot afford.
const { C_AMINE, C_ATOMS, C_COST, C_EPOXY, C_GROUPS, C_MASS, C_MOLES, C_OPTICS, C_ORGANIC, C_ORGANIC_SPECIFIC, C_SHARE, C_SOLVENT } = layout;
const { C_SPECIFIC, C_VOC, C_VOLUME, C_WATER, KNOB_SOLIDS, KNOB_SPEED, KNOB_STEP, KNOB_WATER, KNOB_WEIGHT, STRIDE } = layout;
const MIN_GRAMS = MIN_LINE_GRAMS;
const PER_L = ML_PER_L;
const film = numericFilm;
const addLine = addSums;
const thermal = thermalOf;

/** The point needs the general branch. */
export const KERNEL_GENERAL = -2;

const at = (key: ScalarFigure): number => SCALAR_FIGURES.indexOf(key);
const F = {
  solMass: at("solMassGrams"),
  solVolume: at("solVolumeMl"),
  solids: at("solidsFraction"),
  residuePerL: at("residueGramsPerL"),
  composite: at("compositeMassGrams"),
  density: at("theoreticalDensity"),
  porosity: at("porosity"),
  linear: at("denseLinearShrinkage"),
  volumetric: at("denseVolumetricShrinkage"),
  organicW: at("organicWeightFraction"),
  organicV: at("organicVolumeFraction"),
  organicContent: at("organicContent"),
  R: at("effectiveR"),
  H: at("effectiveH"),
  waterAdd: at("waterAddGrams"),
  solventAdded: at("solventAddedGrams"),
  solventPerAtom: at("solventMolPerNetworkAtom"),
  maxAllowed: at("maxAllowedC"),
  wet: at("wetThicknessUm"),
  dry: at("dryThicknessNm"),
  coverage: at("coverageM2PerL"),
  capillary: at("capillaryNumber"),
  index: at("refractiveIndex"),
  mismatch: at("indexMismatch"),
  voc: at("vocMassGrams"),
  vocPerL: at("vocGramsPerLitre"),
  vocLessWater: at("vocGramsPerLitreLessWater"),
  cure: at("cureRatio"),
  costTotal: at("costTotal"),
  costPerKg: at("costPerKgDry"),
  costPerL: at("costPerLitreSol"),
  costPerM2: at("costPerM2"),
};

/**
 * One point: sets the knobs to `values`, computes every scalar figure into `out` (SCALAR_FIGURES order).
 *
 * @returns the thermal status (0 clear, 1 caution, 2 fail), or KERNEL_GENERAL
 * @example
 * ```ts
 * const status = kernelPoint(plan, kernelState(plan), Float64Array.of(0.3, 4), out);
 * ```
 */
export function kernelPoint(plan: KernelPlan, state: KernelState, values: ArrayLike<number>, out: number[]): number {
  const weights = plan.weights;
  const lead = plan.leadingWeights;
  for (let k = 0; k < lead; k++) weights[k] = values[k]!;
  for (let k = lead; k < values.length; k++) {
    const code = plan.knobCode[k];
    const value = values[k]!;
    if (code === KNOB_WEIGHT) weights[plan.knobIndex[k]!] = value;
    else if (code === KNOB_WATER) plan.waterValue = value;
    else if (code === KNOB_SOLIDS) plan.solidsFraction = value;
    else if (code === KNOB_STEP) plan.steps[plan.knobIndex[k]!]!.temperatureC = value;
    else if (code === KNOB_SPEED && plan.coating?.method === "dip") plan.coating.withdrawalMmPerS = value;
  }
  const solidMass = plan.basisType === "solidsContent" ? plan.solidsFraction * plan.solMassGrams : plan.fixedSolidMass;
  const n = plan.n;
  let floatSum = 0;
  for (let i = 0; i < n; i++) floatSum += weights[i]!;
  const exact = Math.abs(floatSum - 1) <= 1e-12;

  const w = state.w;
  const s = state.sums;
  let mass = 0;
  let volume = 0;
  let water = 0;
  let solvent = 0;
  let voc = 0;
  let cost = 0;
  let priced = 0;
  let epoxy = 0;
  let amine = 0;
  let atoms = 0;
  let groups = 0;
  let specific = 0;
  let organicW = 0;
  let organicSpecific = 0;
  let content = 0;
  let optics = 0;
  let known = 0;
  const c = plan.coef;
  for (let i = 0, o = 0; i < n; i++, o += STRIDE) {
    const wi = exact ? weights[i]! : weights[i]! / floatSum;
    w[i] = wi;
    const residue = wi * solidMass;
    const grams = residue * c[o + C_MASS]!;
    mass += grams;
    volume += residue * c[o + C_VOLUME]!;
    atoms += residue * c[o + C_ATOMS]!;
    groups += residue * c[o + C_GROUPS]!;
    water += residue * c[o + C_WATER]!;
    solvent += residue * c[o + C_SOLVENT]!;
    voc += residue * c[o + C_VOC]!;
    epoxy += residue * c[o + C_EPOXY]!;
    amine += residue * c[o + C_AMINE]!;
    specific += wi * c[o + C_SPECIFIC]!;
    organicW += wi * c[o + C_ORGANIC]!;
    organicSpecific += wi * c[o + C_ORGANIC_SPECIFIC]!;
    content += wi * c[o + C_SHARE]!;
    if (grams > 0) {
      // a NaN price makes the cost NaN: absent, as when cost.ts finds a line without a price
      priced += 1;
      cost += residue * c[o + C_COST]!;
    }
    if (wi !== 0) {
      optics += wi * c[o + C_OPTICS]!;
      known += 1;
    }
  }
  s.mass = mass;
  s.volume = volume;
  s.water = water;
  s.solvent = solvent;
  s.voc = voc;
  s.cost = cost;
  s.priced = priced;
  s.epoxy = epoxy;
  s.amine = amine;
  if (!(atoms > 0)) return KERNEL_GENERAL;
  if (plan.waterRatio === 1 && !(groups > 0)) return KERNEL_GENERAL;

  if (plan.catalyst) {
    const grams = plan.catalystRatio * atoms * plan.catalystGramsPerMol;
    addLine(s, plan.catalyst, grams, grams * plan.catalyst.perDensity);
  }
  let solventAdded = Number.NaN;
  let solventPerAtom = Number.NaN;
  if (plan.solventMode === 1) {
    const carriedMol = s.solvent === 0 ? 0 : s.solvent / plan.solventMolarMass;
    const addMol = plan.solventValue * atoms - carriedMol;
    solventAdded = 0;
    let addedMol = 0;
    if (addMol > 0) {
      addedMol = addMol;
      const grams = addMol * plan.solventGramsPerMol;
      solventAdded = grams;
      if (grams >= MIN_GRAMS) addLine(s, plan.solventLine!, grams, grams * plan.solventLine!.perDensity);
    }
    const ratio = (addedMol + carriedMol) / atoms;
    if (Number.isFinite(ratio)) solventPerAtom = ratio;
  }
  const reference = plan.waterReference;
  const basisMol = plan.waterRatio === 0 ? atoms : plan.waterRatio === 1 ? groups : reference >= 0 ? w[reference]! * solidMass * plan.coef[reference * STRIDE + C_MOLES]! : 0;
  const targetMol = plan.waterValue * basisMol;
  const waterMolarMass = plan.waterMolarMass;
  let addMol: number;
  if (plan.solventMode === 2) {
    const fill = plan.fillLine!;
    const needMol = plan.countCarried ? targetMol - s.water : targetMol;
    const need = needMol > 0 ? needMol : 0;
    const solventCost = plan.fillVolume ? fill.perDensity : 1;
    const waterCost = need === 0 ? 0 : plan.fillVolume ? waterMolarMass / plan.waterDensity : waterMolarMass;
    const available = plan.fillAmount - (plan.fillVolume ? s.volume : s.mass);
    let grams: number;
    addMol = 0;
    if (need === 0) grams = available / solventCost;
    else {
      const coefficient = solventCost - fill.waterMolPerGram * waterCost;
      if (!(coefficient > 0)) return KERNEL_GENERAL;
      grams = (available - need * waterCost) / coefficient;
      addMol = need - grams * fill.waterMolPerGram;
      if (addMol < 0) {
        grams = available / solventCost;
        addMol = 0;
      }
    }
    if (Math.abs(grams) < MIN_GRAMS) grams = 0;
    if (grams < 0) return KERNEL_GENERAL;
    let addedMol = Number.NaN;
    if (grams > 0) {
      addedMol = (grams * plan.solventAssay) / plan.solventMolarMass;
      addLine(s, fill, grams, grams * fill.perDensity);
    }
    solventAdded = grams > 0 ? grams : 0;
    const ratio = (addedMol + s.solvent / plan.solventMolarMass) / atoms;
    if (Number.isFinite(ratio)) solventPerAtom = ratio;
  } else {
    addMol = plan.countCarried ? Math.max(targetMol - s.water, 0) : targetMol;
  }
  let addGrams = 0;
  if (addMol * waterMolarMass < MIN_GRAMS) addMol = 0;
  if (addMol > 0) {
    addGrams = addMol * waterMolarMass;
    const water = plan.waterLine;
    // its carried water is not counted again: the line's own water is addMol
    const carried = s.water;
    addLine(s, water, addGrams, addGrams * water.perDensity);
    s.water = carried;
  }
  const solMass = s.mass;
  const solVolume = s.volume;
  const totalWater = s.water + addMol;

  const density = 1 / specific;
  const ratio = solidMass / density / solVolume;
  let porosity = Number.NaN;
  if (!Number.isNaN(plan.bulkDensity)) {
    if (plan.bulkDensity > density) return KERNEL_GENERAL;
    porosity = 1 - plan.bulkDensity / density;
  }
  const pores = Number.isNaN(porosity) ? 0 : porosity;

  // VOC: the water's volume comes off for "less water".
  const waterMl = totalWater !== 0 ? (totalWater * waterMolarMass) / plan.waterDensity : 0;
  const lessWaterMl = solVolume - waterMl;
  if (!(lessWaterMl > 0)) return KERNEL_GENERAL;
  thermal(plan, state, w);

  let wet = Number.NaN;
  let dry = Number.NaN;
  let coverage = Number.NaN;
  let capillary = Number.NaN;
  if (plan.coating) {
    const coat = film(plan.coating, ratio, pores, solMass / solVolume);
    wet = coat.wetThicknessUm;
    dry = coat.dryThicknessNm;
    coverage = coat.coverageM2PerL;
    capillary = coat.capillaryNumber;
  }
  let index = Number.NaN;
  if (known > 0 && !Number.isNaN(optics)) {
    const sum = optics * density;
    const term = pores === 0 ? sum : sum * (1 - pores);
    index = Math.sqrt((1 + term * 2) / (1 - term));
  }

  out[F.solMass] = solMass;
  out[F.solVolume] = solVolume;
  out[F.solids] = solidMass / solMass;
  out[F.residuePerL] = (solidMass * PER_L) / solVolume;
  out[F.composite] = solidMass;
  out[F.density] = density;
  out[F.porosity] = porosity;
  out[F.linear] = 1 - Math.cbrt(ratio);
  out[F.volumetric] = 1 - ratio;
  out[F.organicW] = organicW;
  out[F.organicV] = organicSpecific * density;
  out[F.organicContent] = content;
  out[F.R] = totalWater / atoms;
  out[F.H] = groups === 0 ? Number.NaN : totalWater / groups;
  out[F.waterAdd] = addGrams;
  out[F.solventAdded] = solventAdded;
  out[F.solventPerAtom] = solventPerAtom;
  out[F.maxAllowed] = state.maxAllowedC;
  out[F.wet] = wet;
  out[F.dry] = dry;
  out[F.coverage] = coverage;
  out[F.capillary] = capillary;
  out[F.index] = index;
  out[F.mismatch] = index - plan.substrateIndex;
  out[F.voc] = s.voc;
  out[F.vocPerL] = (s.voc * PER_L) / solVolume;
  out[F.vocLessWater] = (s.voc * PER_L) / lessWaterMl;
  out[F.cure] = s.epoxy > 0 ? s.amine / s.epoxy : Number.NaN;
  const hasCost = s.priced > 0 && !Number.isNaN(s.cost);
  const total = hasCost ? s.cost / 1000 : Number.NaN;
  const perLitre = (total * PER_L) / solVolume;
  out[F.costTotal] = total;
  out[F.costPerKg] = (total * 1000) / solidMass;
  out[F.costPerL] = perLitre;
  out[F.costPerM2] = Number.isNaN(coverage) ? Number.NaN : perLitre / coverage;
  return state.status;
}
