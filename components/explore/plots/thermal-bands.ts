/**
 * Thermal verdict of a one-variable sweep as bands along x: consecutive points
 * with the same status merge into one band whose edges lie halfway to the
 * neighbouring points (and at the first and last point at the ends). Plain
 * TypeScript, no framework.
 */
import { POINT_STATUSES, type PointStatus } from "@/lib/explore/types";

/** One band: points first…last (in the axis's order) share `status`; x from ≤ to. */
export interface ThermalBand {
  status: PointStatus;
  from: number;
  to: number;
  first: number;
  last: number;
}

/**
 * Bands of equal status along xs (the shown x of each point, in the axis's
 * order, rising or falling); only the statuses in `keep` are returned.
 * @example thermalBands([0, 1, 2, 3], Uint8Array.of(0, 2, 2, 0), ["fail"]) // [{ status: "fail", from: 0.5, to: 2.5, first: 1, last: 2 }]
 */
export function thermalBands(xs: readonly number[], status: ArrayLike<number>, keep: readonly PointStatus[] = ["caution", "fail"]): ThermalBand[] {
  const bands: ThermalBand[] = [];
  const n = Math.min(xs.length, status.length);
  const edgeBefore = (i: number) => (i === 0 ? xs[0]! : (xs[i - 1]! + xs[i]!) / 2);
  const edgeAfter = (i: number) => (i === n - 1 ? xs[n - 1]! : (xs[i]! + xs[i + 1]!) / 2);
  let start = 0;
  for (let i = 1; i <= n; i++) {
    if (i < n && status[i] === status[start]) continue;
    const s = POINT_STATUSES[status[start]!] ?? "clear";
    if (keep.includes(s)) {
      const a = edgeBefore(start);
      const b = edgeAfter(i - 1);
      bands.push({ status: s, from: Math.min(a, b), to: Math.max(a, b), first: start, last: i - 1 });
    }
    start = i;
  }
  return bands;
}
