/**
 * The plot's curve: dry thickness against withdrawal speed (dip) or spin
 * speed (spin) at the sol as computed, from the one point the engine gives.
 * At a fixed sol, Landau–Levich gives h ∝ U^(2/3) (Landau & Levich 1942;
 * Brinker et al., Thin Solid Films 201 (1991) 97) and spin coating h ∝ ω^(−1/2)
 * (Meyerhofer, J. Appl. Phys. 49 (1978) 3993), so every other point is a
 * scaling of the computed one: no new engine call per point. Plain numbers:
 * these are for drawing, the figures shown come from the engine.
 */
import type { CoatingResult, CoatingSpec } from "@/lib/formulation";

export interface CoatCurve {
  /** "dip": x in mm/s; "spin": x in rpm. */
  axis: "dip" | "spin";
  /** Words and unit of the x axis. */
  xLabel: string;
  xUnit: string;
  points: { x: number; dryNm: number }[];
  /** The chosen speed and its dry thickness. */
  chosen: { x: number; dryNm: number };
  /** The target and the speed that gives it, when a target is set. */
  target?: { x: number; dryNm: number };
  /** Dip: the speed above which Ca > 0.01 (Landau–Levich less reliable); absent when off the plot. */
  caLimitX?: number;
}

/** Landau–Levich exponent of the withdrawal speed. */
const DIP_EXPONENT = 2 / 3;
/** Spin-speed exponent of the final thickness. */
const SPIN_EXPONENT = -1 / 2;
/** Ca above which the plot marks Landau–Levich as less reliable (chemistry.md: caution above 0.01). */
const CA_LIMIT = 0.01;
/** Points drawn along the curve. */
const POINTS = 48;

/** Dry thickness at speed x, from one point (x0, h0) and the exponent. */
export function scaledThickness(x: number, x0: number, h0: number, exponent: number): number {
  return h0 * Math.pow(x / x0, exponent);
}

/**
 * The curve for a dip or spin coat, or null for a wet film (thickness does
 * not depend on a speed) or a result without a coat.
 *
 * @example
 * ```ts
 * coatCurve({ method: "dip", withdrawalMmPerS: 1, viscosityMPaS: 3, surfaceTensionMNPerM: 23 }, { method: "dip", dryThicknessNm: 500, … });
 * // points from 0.25 to 2.5 mm/s, 500 nm at 1 mm/s
 * ```
 */
export function coatCurve(spec: CoatingSpec | undefined, film: CoatingResult | undefined): CoatCurve | null {
  if (!spec || !film || spec.method === "wetFilm" || !(film.dryThicknessNm > 0)) return null;
  const dip = spec.method === "dip";
  const x0 = dip ? spec.withdrawalMmPerS : spec.rpm;
  const exponent = dip ? DIP_EXPONENT : SPIN_EXPONENT;
  const targetX = dip ? film.withdrawalMmPerSForTarget : film.rpmForTarget;
  const targetNm = spec.targetDryThicknessNm;
  const xs = [x0, ...(targetX !== undefined && targetX > 0 ? [targetX] : [])];
  if (!dip) xs.push(spec.calibration.rpm);
  const lo = Math.min(...xs) / (dip ? 4 : 2);
  const hi = Math.max(...xs) * (dip ? 2.5 : 1.5);
  const points = Array.from({ length: POINTS + 1 }, (_, i) => {
    const x = lo + ((hi - lo) * i) / POINTS;
    return { x, dryNm: scaledThickness(x, x0, film.dryThicknessNm, exponent) };
  });
  const curve: CoatCurve = {
    axis: dip ? "dip" : "spin",
    xLabel: dip ? "Withdrawal speed" : "Spin speed",
    xUnit: dip ? "mm/s" : "rpm",
    points,
    chosen: { x: x0, dryNm: film.dryThicknessNm },
  };
  if (targetX !== undefined && targetX > 0 && targetNm !== undefined) curve.target = { x: targetX, dryNm: targetNm };
  if (dip && film.capillaryNumber !== undefined && film.capillaryNumber > 0) {
    // Ca = ηU/γ is proportional to U: the speed where it reaches the limit.
    const limit = x0 * (CA_LIMIT / film.capillaryNumber);
    if (limit <= hi) curve.caLimitX = limit;
  }
  return curve;
}
