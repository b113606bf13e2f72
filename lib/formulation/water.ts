import { Dec, HALF, quotient, toNumber, ZERO } from "./decimal";
import type { Notice } from "./result-types";

/**
 * Target water W, mol (chemistry: "Water"): R · Σa (R = mol H2O per mol
 * network-forming atom), h · Σg' (h = mol H2O per mol hydrolysable group
 * left after ligand exchange) or value · n_ref (per mol of one precursor).
 *
 * @param ratio - "R", "h" or "perPrecursor"
 * @param value - the ratio's value
 * @param mol - Σa, Σg' and n_ref, mol
 * @returns W in mol (decimal)
 * @example
 * ```ts
 * waterTarget("R", new Dec(4), { networkAtomMol: new Dec(0.1), groupMol: new Dec(0.4), referenceMol: new Dec(0.1) }).toNumber(); // 0.4 mol
 * ```
 */
export function waterTarget(ratio: "R" | "h" | "perPrecursor", value: Dec, mol: { networkAtomMol: Dec; groupMol: Dec; referenceMol: Dec }): Dec {
  return value.times(ratio === "R" ? mol.networkAtomMol : ratio === "h" ? mol.groupMol : mol.referenceMol);
}

/**
 * Water to add, mol: W − C, or 0 when the carried water C already reaches
 * the target (never negative).
 *
 * @example
 * ```ts
 * waterToAdd(new Dec(0.4), new Dec(0.05)).toNumber(); // 0.35
 * waterToAdd(new Dec(0.4), new Dec(0.5)).toNumber();  // 0
 * ```
 */
export function waterToAdd(targetMol: Dec, carriedMol: Dec): Dec {
  const add = targetMol.minus(carriedMol);
  return add.isNegative() ? ZERO : add;
}

/**
 * Relative tolerance of the water-ratio comparisons (dimensionless): R = 4
 * with two tetra-alkoxides is exactly the full-hydrolysis ratio even when
 * the two sums differ in the 20th digit. Common practice, no source.
 */
export const WATER_RATIO_TOLERANCE = 1e-9;

/**
 * True when `value` is below `reference` by more than the relative
 * tolerance WATER_RATIO_TOLERANCE: value < reference · (1 − tolerance) in
 * decimals. The JS numbers of both (correctly rounded, within 2⁻⁵³ of the
 * decimals) decide when they lie farther than 1e-14 of their size from the
 * bound, far beyond the float error of ~4e-16; only a value that close is
 * compared in decimals.
 *
 * @example
 * ```ts
 * clearlyBelow(new Dec("3.99999999999999999999"), new Dec(4)); // false
 * clearlyBelow(new Dec(3.99), new Dec(4)); // true
 * ```
 */
export function clearlyBelow(value: Dec, reference: Dec): boolean {
  const v = toNumber(value);
  const r = toNumber(reference);
  const difference = v - r * BELOW_FACTOR_NUMBER;
  const margin = 1e-14 * (Math.abs(v) + Math.abs(r));
  // numbers outside a double's normal range (non-finite, or so small they lose digits) leave the decision to the decimals
  if (Number.isFinite(difference) && Number.isFinite(margin) && margin > 1e-300 && Math.abs(difference) > margin) return difference < 0;
  return value.lessThan(reference.times(BELOW_FACTOR));
}

/** 1 − WATER_RATIO_TOLERANCE, made once. */
const BELOW_FACTOR = new Dec(1).minus(WATER_RATIO_TOLERANCE);
/** The same as a JS number. */
const BELOW_FACTOR_NUMBER = 1 - WATER_RATIO_TOLERANCE;

/** Formats a number for a notice (display only). */
function show(value: Dec): string {
  return String(Number(value.toPrecision(4)));
}

/**
 * Notices about the water balance (chemistry: "Water"): carried water above
 * the target (caution, with the ratio reached), effective water below the net
 * condensation need Σg/2 (caution: alkoxy groups remain), or below full
 * hydrolysis Σg (info).
 *
 * @param p - mol figures: target W, carried C, total (C + added), Σa and Σg
 * @returns notices, possibly empty
 * @example
 * ```ts
 * waterNotices({ targetMol: new Dec(0.1), carriedMol: new Dec(0.2), totalMol: new Dec(0.2), networkAtomMol: new Dec(0.1), hydrolysableGroupMol: new Dec(0.4) });
 * // [{ level: "caution", code: "carried_water_exceeds_target", … }, { level: "info", code: "below_full_hydrolysis", … }]
 * ```
 */
export function waterNotices(p: {
  targetMol: Dec;
  carriedMol: Dec;
  totalMol: Dec;
  networkAtomMol: Dec;
  hydrolysableGroupMol: Dec;
  /** False when the carried water does not count toward the target (then no "exceeds" caution). */
  countCarried?: boolean;
}): Notice[] {
  const notices: Notice[] = [];
  const effectiveR = (): Dec => quotient(p.totalMol, p.networkAtomMol);
  if ((p.countCarried ?? true) && clearlyBelow(p.targetMol, p.carriedMol)) {
    notices.push({
      level: "caution",
      code: "carried_water_exceeds_target",
      field: "water.value",
      message:
        `The other materials already bring ${show(p.carriedMol)} mol water, more than the target ${show(p.targetMol)} mol; ` +
        `no water is added and the ratio reached is R = ${show(effectiveR())}` +
        (p.hydrolysableGroupMol.isZero() ? "." : ` (h = ${show(quotient(p.totalMol, p.hydrolysableGroupMol))}).`),
    });
  }
  const netCondensation = p.hydrolysableGroupMol.times(HALF);
  if (p.hydrolysableGroupMol.isZero()) return notices;
  if (clearlyBelow(p.totalMol, netCondensation)) {
    notices.push({
      level: "caution",
      code: "below_net_condensation",
      field: "water.value",
      message:
        `Effective R = ${show(effectiveR())} is below the net-condensation ratio ${show(quotient(netCondensation, p.networkAtomMol))}: ` +
        "not enough water for complete condensation, alkoxy groups will remain in the gel.",
    });
  } else if (clearlyBelow(p.totalMol, p.hydrolysableGroupMol)) {
    notices.push({
      level: "info",
      code: "below_full_hydrolysis",
      field: "water.value",
      message:
        `Effective R = ${show(effectiveR())} is below the full-hydrolysis ratio ${show(quotient(p.hydrolysableGroupMol, p.networkAtomMol))}; ` +
        "hydrolysis relies on the water released by condensation.",
    });
  }
  return notices;
}
