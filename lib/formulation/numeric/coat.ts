/**
 * The coat figures of the numeric fast path (plain float64): film, optics,
 * VOC, epoxy–amine balance and cost, mirroring the decimal engine's
 * addCoatPredictions (lib/formulation/coat.ts) figure for figure, without
 * its notices. For plots and searches over many points only; the decimal
 * engine stays the source of every saved or printed figure.
 */
import type { NumericCoatContext, NumericCoatFigures } from "./context";
import { numericCost } from "./coat-cost";
import { numericCureRatio } from "./coat-cure";
import { numericFilm } from "./coat-film";
import { numericOptics } from "./coat-optics";
import { numericVoc } from "./coat-voc";
import type { NumericFailure } from "./figures";

/**
 * What the coat will be (chemistry: "What the coat will be"), as plain
 * numbers, NaN where the decimal engine leaves a field out:
 * - film (only with a coating): φ_s = (S / ρ_th) / V_sol, sol density = sol mass / sol volume;
 * - optics: Lorentz–Lorenz over the phases, porosity as air, mismatch to the substrate;
 * - VOC (always); a refusal with the engine's code and field where voc.ts throws;
 * - the epoxy–amine ratio; the cost (only when every dispensed line has a price).
 *
 * @param ctx - the figures of the computation (see NumericCoatContext)
 * @returns the coat figures, or the refusal the decimal engine would give
 * @example
 * ```ts
 * const coat = numericCoat(ctx);
 * if (!("ok" in coat)) coat.dryThicknessNm; // nm, NaN without a coating
 * ```
 */
export function numericCoat(ctx: NumericCoatContext): NumericCoatFigures | NumericFailure {
  const { input, byId, lines, solidMass, solVolume, porosity, theoreticalDensity } = ctx;

  const voc = numericVoc({ lines, byId, alcohols: ctx.alcohols, waterMol: ctx.totalWaterMol, waterMaterial: ctx.waterMaterial, solVolumeMl: solVolume });
  if ("ok" in voc) return voc;

  let wetThicknessUm = Number.NaN;
  let dryThicknessNm = Number.NaN;
  let coverageM2PerL = Number.NaN;
  let capillaryNumber = Number.NaN;
  if (input.coating) {
    const solidVolumeFraction = solidMass / theoreticalDensity / solVolume;
    const film = numericFilm(input.coating, solidVolumeFraction, porosity, ctx.solMass / solVolume);
    ({ wetThicknessUm, dryThicknessNm, coverageM2PerL, capillaryNumber } = film);
  }

  const optics = numericOptics(ctx.phases, byId, porosity, theoreticalDensity, input.substrateId);
  const cost = numericCost(lines, byId, solidMass, solVolume, coverageM2PerL);
  return {
    wetThicknessUm,
    dryThicknessNm,
    coverageM2PerL,
    capillaryNumber,
    refractiveIndex: optics.refractiveIndex,
    indexMismatch: optics.indexMismatch,
    vocMassGrams: voc.vocMassGrams,
    vocGramsPerLitre: voc.vocGramsPerLitre,
    vocGramsPerLitreLessWater: voc.vocGramsPerLitreLessWater,
    cureRatio: numericCureRatio(lines, byId),
    ...cost,
  };
}
