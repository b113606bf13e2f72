/**
 * The film a coating method gives, in plain float64: the numeric twin of
 * film.ts (chemistry: "What the coat will be"), figures only, no notices.
 */
import { LANDAU_LEVICH_PREFACTOR, ML_PER_L, STANDARD_GRAVITY_M_PER_S2 } from "../constants";
import type { CoatingSpec } from "../input-schema";

/** SI per mPa·s, per mm/s, per mN/m (exact). */
const MILLI = 1e-3;
/** µm per m (exact). */
const UM_PER_M = 1e6;
/** nm per µm (exact). */
const NM_PER_UM = 1000;
/** kg/m³ per g/cm³ (exact). */
const KG_PER_M3_PER_G_PER_CM3 = 1000;

/** The film figures (NaN where film.ts leaves a field out). */
export interface NumericFilm {
  /** µm */
  wetThicknessUm: number;
  /** nm */
  dryThicknessNm: number;
  /** m²/L, no losses */
  coverageM2PerL: number;
  /** ηU/γ, dimensionless; dip only, NaN otherwise */
  capillaryNumber: number;
}

/**
 * The film of a coating method:
 * - dip: Landau–Levich, h = 0.94 (ηU)^(2/3) / (γ^(1/6) (ρg)^(1/2)) in SI units
 *   (Landau & Levich, Acta Physicochim. URSS 17 (1942) 42), Ca = ηU/γ,
 *   dry = wet · φ_s / (1 − P);
 * - spin: dry = h_cal · (ω_cal / ω)^(1/2) (Meyerhofer, J. Appl. Phys. 49 (1978) 3993),
 *   wet = dry (1 − P) / φ_s;
 * - wetFilm: the wet thickness as stated, dry = wet · φ_s / (1 − P).
 * Coverage m²/L = 1000 / h_wet[µm].
 *
 * @param spec - the coating method and its settings
 * @param solidVolumeFraction - φ_s = (S / ρ_th) / V_sol
 * @param porosity - P of the dry coat (0 when no bulk density is known)
 * @param densityGPerCm3 - ρ of the sol = sol mass / sol volume, g/cm³
 * @returns the film figures
 * @example
 * ```ts
 * numericFilm({ method: "wetFilm", wetThicknessUm: 10 }, 0.05, 0, 0.9).dryThicknessNm; // 500 nm
 * ```
 */
export function numericFilm(spec: CoatingSpec, solidVolumeFraction: number, porosity: number, densityGPerCm3: number): NumericFilm {
  let wetUm: number;
  let dryNm: number;
  let capillaryNumber = Number.NaN;
  if (spec.method === "dip") {
    const etaU = spec.viscosityMPaS * MILLI * (spec.withdrawalMmPerS * MILLI); // Pa·s · m/s = N/m
    const gamma = spec.surfaceTensionMNPerM * MILLI; // N/m
    const rhoG = densityGPerCm3 * KG_PER_M3_PER_G_PER_CM3 * STANDARD_GRAVITY_M_PER_S2; // N/m³
    const numerator = Math.cbrt(etaU * etaU) * LANDAU_LEVICH_PREFACTOR;
    const denominator = Math.sqrt(Math.cbrt(gamma)) * Math.sqrt(rhoG);
    wetUm = (numerator / denominator) * UM_PER_M;
    dryNm = (wetUm * NM_PER_UM * solidVolumeFraction) / (1 - porosity);
    capillaryNumber = etaU / gamma;
  } else if (spec.method === "spin") {
    dryNm = spec.calibration.dryThicknessNm * Math.sqrt(spec.calibration.rpm / spec.rpm);
    wetUm = (dryNm * (1 - porosity)) / solidVolumeFraction / NM_PER_UM;
  } else {
    wetUm = spec.wetThicknessUm;
    dryNm = (wetUm * NM_PER_UM * solidVolumeFraction) / (1 - porosity);
  }
  return { wetThicknessUm: wetUm, dryThicknessNm: dryNm, coverageM2PerL: ML_PER_L / wetUm, capillaryNumber };
}
