import type { LineDeviation } from "@/lib/client/batches";
import { fmtMass, fmtPercent } from "@/lib/format";

/**
 * Deviation of an actual mass from target, for the live display while typing:
 * |actual − target| beyond max(tolerance × target, balance resolution) is
 * outside. The server's figure (lib/batches/deviation.ts, in decimal
 * arithmetic) replaces this one once the line is saved.
 */
export function liveDeviation(targetGrams: number, actualGrams: number, toleranceFraction: number, resolutionGrams: number): LineDeviation {
  const diff = actualGrams - targetGrams;
  const tolerance = Math.max(Math.abs(targetGrams * toleranceFraction), resolutionGrams);
  // A relative margin of 1e-9 keeps float noise from flagging a mass exactly at the limit.
  return {
    absoluteGrams: diff,
    relative: targetGrams === 0 ? null : diff / targetGrams,
    toleranceGrams: tolerance,
    outside: Math.abs(diff) > tolerance * (1 + 1e-9),
  };
}

/** "+4.95 g (+5.0 %)"; a deviation that rounds to nothing at the balance resolution reads "±0.00 g (0.0 %)". */
export function deviationWords(d: LineDeviation, resolution: number): string {
  const rounded = Math.round(d.absoluteGrams / resolution);
  const sign = rounded > 0 ? "+" : rounded < 0 ? "−" : "±";
  const mass = fmtMass(Math.abs(d.absoluteGrams), resolution);
  if (d.relative === null) return `${sign}${mass}`;
  const pct = fmtPercent(Math.abs(d.relative), 1);
  const pctSign = pct.startsWith("0.0") ? "" : d.relative > 0 ? "+" : "−";
  return `${sign}${mass} (${pctSign}${pct})`;
}

/** "±1 %" for a tolerance of 0.01; one decimal below 1 % ("±0.5 %"). */
export function toleranceWords(toleranceFraction: number): string {
  return `±${fmtPercent(toleranceFraction, toleranceFraction * 100 < 1 ? 1 : 0)}`;
}
