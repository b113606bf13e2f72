import { CAPILLARY_NUMBER_LIMIT, LANDAU_LEVICH_PREFACTOR, ML_PER_L, STANDARD_GRAVITY_M_PER_S2 } from "./constants";
import { cubeRoot, type Dec, dec, ONE, toNumber } from "./decimal";
import type { CoatingSpec } from "./input-schema";
import type { CoatingResult, Notice } from "./result-types";

/** SI per mPa·s, per mm/s, per mN/m (exact). */
const MILLI = 1e-3;
/** µm per m (exact). */
const UM_PER_M = 1e6;
/** nm per µm (exact). */
const NM_PER_UM = 1000;
/** kg/m³ per g/cm³ (exact). */
const KG_PER_M3_PER_G_PER_CM3 = 1000;

/** What the film predictions need to know about the sol and the dry coat. */
export interface FilmSol {
  /** φ_s = (S / ρ_th) / V_sol, dimensionless. */
  solidVolumeFraction: Dec;
  /** P, porosity of the dry coat (0 when no bulk density is known). */
  porosity: Dec;
  /** ρ = sol mass / sol volume, g/cm³. */
  densityGPerCm3: Dec;
}

/**
 * Wet film thickness of a dip coat by the Landau–Levich law, µm:
 * h = 0.94 (ηU)^(2/3) / (γ^(1/6) (ρg)^(1/2)) in SI units (Landau & Levich,
 * Acta Physicochim. URSS 17 (1942) 42), with the capillary number Ca = ηU/γ.
 *
 * @param viscosityMPaS - η, mPa·s
 * @param withdrawalMmPerS - U, mm/s
 * @param surfaceTensionMNPerM - γ, mN/m
 * @param densityGPerCm3 - ρ of the sol, g/cm³
 * @returns wet thickness in µm and Ca (dimensionless)
 * @example
 * ```ts
 * // η 2 mPa·s, U 1 mm/s, γ 22 mN/m, ρ 0.85 g/cm³ → h ≈ 2.01 µm, Ca ≈ 9.1e-5
 * landauLevich(dec(2), dec(1), dec(22), dec(0.85)).wetUm.toNumber();
 * ```
 */
export function landauLevich(viscosityMPaS: Dec, withdrawalMmPerS: Dec, surfaceTensionMNPerM: Dec, densityGPerCm3: Dec): { wetUm: Dec; capillaryNumber: Dec } {
  const etaU = viscosityMPaS.times(MILLI).times(withdrawalMmPerS.times(MILLI)); // Pa·s · m/s = N/m
  const gamma = surfaceTensionMNPerM.times(MILLI); // N/m
  const rhoG = densityGPerCm3.times(KG_PER_M3_PER_G_PER_CM3).times(STANDARD_GRAVITY_M_PER_S2); // N/m³
  // (ηU)^(2/3) = ∛((ηU)²); γ^(1/6) = √(∛γ)
  const numerator = cubeRoot(etaU.times(etaU)).times(LANDAU_LEVICH_PREFACTOR);
  const denominator = cubeRoot(gamma).sqrt().times(rhoG.sqrt());
  return { wetUm: numerator.div(denominator).times(UM_PER_M), capillaryNumber: etaU.div(gamma) };
}

/**
 * Dry film thickness from the wet one, nm, for a film constrained on its
 * substrate that shrinks in thickness only: h_dry = h_wet · φ_s / (1 − P)
 * (chemistry: "What the coat will be").
 *
 * @example
 * ```ts
 * dryFromWetNm(dec(2), dec(0.05), dec(0)).toNumber(); // 100 nm
 * ```
 */
export function dryFromWetNm(wetUm: Dec, solidVolumeFraction: Dec, porosity: Dec): Dec {
  return wetUm.times(NM_PER_UM).times(solidVolumeFraction).div(ONE.minus(porosity));
}

/**
 * Spin-coated dry thickness from one measured film, nm: h = h_cal · (ω_cal / ω)^(1/2)
 * (Meyerhofer, J. Appl. Phys. 49 (1978) 3993).
 *
 * @example
 * ```ts
 * spinDryNm(dec(4000), dec(2000), dec(200)).toNumber(); // 141.42… nm
 * ```
 */
export function spinDryNm(rpm: Dec, calibrationRpm: Dec, calibrationNm: Dec): Dec {
  return calibrationNm.times(calibrationRpm.div(rpm).sqrt());
}

function capillaryNotice(ca: Dec, field: string, what: string): Notice[] {
  if (!ca.greaterThan(CAPILLARY_NUMBER_LIMIT)) return [];
  return [
    {
      level: "caution",
      code: "dip_thickness_law_out_of_range",
      field,
      message:
        `${what} the capillary number ηU/γ is ${Number(ca.toPrecision(3))}, above ${CAPILLARY_NUMBER_LIMIT}: the Landau–Levich thickness ` +
        `holds only for a capillary number far below 1, so the predicted thickness is a rough guide here. Measure a film.`,
    },
  ];
}

/**
 * The film a coating method gives (chemistry: "What the coat will be"):
 * - dip: wet thickness by Landau–Levich, dry = wet · φ_s / (1 − P); for a
 *   target dry thickness h_t the speed U_t = U · (h_t / h_dry)^(3/2); a
 *   caution when Ca = ηU/γ > 0.01 (at the chosen or the target speed);
 * - spin: dry thickness from the calibration film, ∝ rpm^(−1/2); the wet
 *   thickness back-computed, h_wet = h_dry (1 − P) / φ_s; target
 *   ω_t = ω_cal · (h_cal / h_t)²;
 * - wetFilm: the wet thickness as stated.
 * Coverage (no losses) m²/L = 1000 / h_wet[µm]; sol for an area,
 * mL = area[m²] · h_wet[µm].
 *
 * @param spec - the coating method and its settings
 * @param sol - φ_s, P and the sol density
 * @returns the coating figures (plain numbers) and its notices
 * @example
 * ```ts
 * filmPrediction({ method: "wetFilm", wetThicknessUm: 10 }, { solidVolumeFraction: dec(0.05), porosity: ZERO, densityGPerCm3: dec(0.9) })
 *   .coating.dryThicknessNm; // 500 nm
 * ```
 */
export function filmPrediction(spec: CoatingSpec, sol: FilmSol): { coating: CoatingResult; notices: Notice[] } {
  const phi = sol.solidVolumeFraction;
  const notices: Notice[] = [];
  let wetUm: Dec;
  let dryNm: Dec;
  const extra: Partial<CoatingResult> = {};
  const target = spec.targetDryThicknessNm === undefined ? undefined : dec(spec.targetDryThicknessNm);
  if (spec.method === "dip") {
    const speed = dec(spec.withdrawalMmPerS);
    const ll = landauLevich(dec(spec.viscosityMPaS), speed, dec(spec.surfaceTensionMNPerM), sol.densityGPerCm3);
    wetUm = ll.wetUm;
    dryNm = dryFromWetNm(wetUm, phi, sol.porosity);
    extra.capillaryNumber = toNumber(ll.capillaryNumber);
    notices.push(...capillaryNotice(ll.capillaryNumber, "coating.withdrawalMmPerS", "At this withdrawal speed"));
    if (target) {
      const x = target.div(dryNm);
      const targetSpeed = speed.times(x).times(x.sqrt());
      extra.withdrawalMmPerSForTarget = toNumber(targetSpeed);
      notices.push(...capillaryNotice(ll.capillaryNumber.times(x).times(x.sqrt()), "coating.targetDryThicknessNm", "At the speed for the target thickness"));
    }
  } else if (spec.method === "spin") {
    const calibrationRpm = dec(spec.calibration.rpm);
    const calibrationNm = dec(spec.calibration.dryThicknessNm);
    dryNm = spinDryNm(dec(spec.rpm), calibrationRpm, calibrationNm);
    wetUm = dryNm.times(ONE.minus(sol.porosity)).div(phi).div(NM_PER_UM);
    if (target) {
      const ratio = calibrationNm.div(target);
      extra.rpmForTarget = toNumber(calibrationRpm.times(ratio).times(ratio));
    }
  } else {
    wetUm = dec(spec.wetThicknessUm);
    dryNm = dryFromWetNm(wetUm, phi, sol.porosity);
  }
  const coating: CoatingResult = {
    method: spec.method,
    solidVolumeFraction: toNumber(phi),
    wetThicknessUm: toNumber(wetUm),
    dryThicknessNm: toNumber(dryNm),
    coverageM2PerL: toNumber(dec(ML_PER_L).div(wetUm)),
  };
  if (spec.areaM2 !== undefined) coating.solMlForArea = toNumber(dec(spec.areaM2).times(wetUm));
  Object.assign(coating, extra);
  notices.push({
    level: "info",
    code: "coat_figures_ideal",
    field: "coating",
    message:
      "Film figures assume the dense dry solid of the ideal composite, all shrinkage in the thickness and no losses of sol; " +
      "a measured film thickness is the better guide, and the sol's viscosity and surface tension change as it ages.",
  });
  return { coating, notices };
}
