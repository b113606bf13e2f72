/**
 * The "every figure" yardstick of bench-explore.ts (see bench-explore-bare.ts):
 * all 32 scalar figures of the numeric path for every point of the
 * benchmark's map, hand-inlined for its one formulation.
 */
import { SCALAR_FIGURES } from "../lib/formulation/numeric/compare";
import type { BareGrid } from "./bench-explore-bare";

const MIN_GRAMS = 1e-9;
/** Figures per point. */
export const FULL = SCALAR_FIGURES.length;
const F = Object.fromEntries(SCALAR_FIGURES.map((key, k) => [key, k])) as Record<(typeof SCALAR_FIGURES)[number], number>;

/**
 * Every scalar figure of every point into `out` (FULL per point, SCALAR_FIGURES order), with the
 * checks those figures need; returns the number of points whose checks failed (their figures NaN).
 *
 * @example
 * ```ts
 * fullArithmetic(grid, new Float64Array(count * FULL)); // 0
 * ```
 */
export function fullArithmetic(g: BareGrid, out: Float64Array): number {
  const { t, fractions, ratios } = g;
  const { catalystGramsPerMol, catalystPerDensity, catalystPrice, catalystRatio, catalystVocPerGram, catalystWaterPerGram, maxAllowedC, n, perPhaseDensity, solventMolPerGram, solventPerDensity, solventPrice, solventVocPerGram, solventWaterPerGram, substrateIndex, waterDensity, waterMolarMass, waterPerDensity, waterPrice, weight } = t;
  const { amine: cAmine, atoms: cAtoms, cost: cCost, epoxy: cEpoxy, groups: cGroups, mass: cMass, optics: cOptics, organic: cOrganic, share: cShare, voc: cVoc, volume: cVolume, water: cWater } = t.full;
  const solMassGrams = g.solMassGrams;
  const solidMass = g.solidsFraction * g.solMassGrams;
  const Mw = waterMolarMass;
  const fillCoefficient = 1 - solventWaterPerGram * Mw;
  const [solMassAt, solVolumeAt, solidsAt, residueAt, compositeAt, densityAt, porosityAt, linearAt, volumetricAt] = [
    F.solMassGrams, F.solVolumeMl, F.solidsFraction, F.residueGramsPerL, F.compositeMassGrams, F.theoreticalDensity, F.porosity,
    F.denseLinearShrinkage, F.denseVolumetricShrinkage,
  ];
  const [organicWAt, organicVAt, contentAt, rAt, hAt, waterAddAt, solventAddedAt, solventPerAtomAt, maxAllowedAt] = [
    F.organicWeightFraction, F.organicVolumeFraction, F.organicContent, F.effectiveR, F.effectiveH, F.waterAddGrams,
    F.solventAddedGrams, F.solventMolPerNetworkAtom, F.maxAllowedC,
  ];
  const [wetAt, dryAt, coverageAt, capillaryAt, indexAt, mismatchAt, vocAt, vocPerLAt, vocLessWaterAt] = [
    F.wetThicknessUm, F.dryThicknessNm, F.coverageM2PerL, F.capillaryNumber, F.refractiveIndex, F.indexMismatch,
    F.vocMassGrams, F.vocGramsPerLitre, F.vocGramsPerLitreLessWater,
  ];
  const [cureAt, costTotalAt, costPerKgAt, costPerLAt, costPerM2At] = [F.cureRatio, F.costTotal, F.costPerKgDry, F.costPerLitreSol, F.costPerM2];
  let othersTotal = 0;
  for (let i = 1; i < n; i++) othersTotal += weight[i]!;
  let failed = 0;
  let p = 0;
  for (let a = 0; a < fractions.length; a++) {
    const w0 = fractions[a]!;
    const scale = (1 - w0) / othersTotal;
    for (let b = 0; b < ratios.length; b++, p++) {
      const o = p * FULL;
      let mass = 0;
      let volume = 0;
      let atoms = 0;
      let groups = 0;
      let water = 0;
      let voc = 0;
      let epoxy = 0;
      let amine = 0;
      let cost = 0;
      let specific = 0;
      let organicW = 0;
      let organicSpecific = 0;
      let content = 0;
      let optics = 0;
      let known = 0;
      for (let i = 0; i < n; i++) {
        const w = i === 0 ? w0 : weight[i]! * scale;
        const residue = w * solidMass;
        mass += residue * cMass[i]!;
        volume += residue * cVolume[i]!;
        atoms += residue * cAtoms[i]!;
        groups += residue * cGroups[i]!;
        water += residue * cWater[i]!;
        voc += residue * cVoc[i]!;
        epoxy += residue * cEpoxy[i]!;
        amine += residue * cAmine[i]!;
        cost += residue * cCost[i]!;
        const perDensity = perPhaseDensity[i]!;
        specific += w * perDensity;
        organicW += w * cOrganic[i]!;
        organicSpecific += w * cOrganic[i]! * perDensity;
        content += w * cShare[i]!;
        if (w !== 0) {
          optics += w * cOptics[i]!;
          known += 1;
        }
      }
      if (!(atoms > 0)) {
        out.fill(Number.NaN, o, o + FULL);
        failed += 1;
        continue;
      }
      const catalystGrams = catalystRatio * atoms * catalystGramsPerMol;
      mass += catalystGrams;
      volume += catalystGrams * catalystPerDensity;
      water += catalystGrams * catalystWaterPerGram;
      voc += catalystGrams * catalystVocPerGram;
      cost += catalystGrams * catalystPrice;
      // fill with the solvent to the sol mass, the water still needed beside it
      const need = Math.max(ratios[b]! * atoms - water, 0);
      const available = solMassGrams - mass;
      let grams = available;
      let addMol = 0;
      if (need > 0) {
        grams = (available - need * Mw) / fillCoefficient;
        addMol = need - grams * solventWaterPerGram;
        if (addMol < 0) {
          grams = available;
          addMol = 0;
        }
      }
      if (Math.abs(grams) < MIN_GRAMS) grams = 0;
      if (grams < 0) {
        out.fill(Number.NaN, o, o + FULL);
        failed += 1;
        continue;
      }
      mass += grams;
      volume += grams * solventPerDensity;
      water += grams * solventWaterPerGram;
      voc += grams * solventVocPerGram;
      cost += grams * solventPrice;
      if (addMol * Mw < MIN_GRAMS) addMol = 0;
      const addGrams = addMol * Mw;
      mass += addGrams;
      volume += addGrams * waterPerDensity;
      cost += addGrams > 0 ? addGrams * waterPrice : 0;
      const totalWater = water + addMol;
      const lessWaterMl = volume - (totalWater * Mw) / waterDensity;
      if (!(lessWaterMl > 0)) {
        out.fill(Number.NaN, o, o + FULL);
        failed += 1;
        continue;
      }
      const density = 1 / specific;
      const ratio = solidMass / density / volume;
      const index = known > 0 ? Math.sqrt((1 + 2 * optics * density) / (1 - optics * density)) : Number.NaN;
      const total = cost / 1000;
      const perLitre = (total * 1000) / volume;
      out[o + solMassAt] = mass;
      out[o + solVolumeAt] = volume;
      out[o + solidsAt] = solidMass / mass;
      out[o + residueAt] = (solidMass * 1000) / volume;
      out[o + compositeAt] = solidMass;
      out[o + densityAt] = density;
      out[o + porosityAt] = Number.NaN;
      out[o + linearAt] = 1 - Math.cbrt(ratio);
      out[o + volumetricAt] = 1 - ratio;
      out[o + organicWAt] = organicW;
      out[o + organicVAt] = organicSpecific * density;
      out[o + contentAt] = content;
      out[o + rAt] = totalWater / atoms;
      out[o + hAt] = totalWater / groups;
      out[o + waterAddAt] = addGrams;
      out[o + solventAddedAt] = grams;
      out[o + solventPerAtomAt] = grams > 0 ? (grams * solventMolPerGram) / atoms : Number.NaN;
      out[o + maxAllowedAt] = maxAllowedC;
      out[o + wetAt] = Number.NaN;
      out[o + dryAt] = Number.NaN;
      out[o + coverageAt] = Number.NaN;
      out[o + capillaryAt] = Number.NaN;
      out[o + indexAt] = index;
      out[o + mismatchAt] = index - substrateIndex;
      out[o + vocAt] = voc;
      out[o + vocPerLAt] = (voc * 1000) / volume;
      out[o + vocLessWaterAt] = (voc * 1000) / lessWaterMl;
      out[o + cureAt] = epoxy > 0 ? amine / epoxy : Number.NaN;
      out[o + costTotalAt] = total;
      out[o + costPerKgAt] = (total * 1000) / solidMass;
      out[o + costPerLAt] = perLitre;
      out[o + costPerM2At] = Number.NaN;
    }
  }
  return failed;
}
