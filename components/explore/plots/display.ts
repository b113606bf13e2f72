/**
 * How the plots show a run's numbers: weight fractions and percent figures ×100,
 * units beside every value, the thermal verdict in words. Plain TypeScript.
 */
import { sig } from "@/lib/format";
import { POINT_STATUSES, type Axis, type ExplorationRun, type OutputInfo, type PointStatus } from "@/lib/explore/types";

const NBSP = "\u00a0";

/**
 * Factor from an axis's stored values to the shown ones: the axis's own
 * `percent` flag when it has one, else weight fractions and the solids content
 * (stored 0–1) are shown in %, the rest as stored.
 * @example axisFactor({ variable: { kind: "weightFraction", … }, … }) // 100
 */
export function axisFactor(axis: Axis): number {
  // The grid may say so itself (an optional `percent` on the axis); else by the variable's kind.
  const percent = (axis as Axis & { percent?: boolean }).percent;
  if (percent !== undefined) return percent ? 100 : 1;
  return axis.variable.kind === "weightFraction" || axis.variable.kind === "solidsContent" ? 100 : 1;
}

/** Factor from a figure's stored values to the shown ones (×100 for a percent figure). */
export function outputFactor(info: OutputInfo): number {
  return info.percent ? 100 : 1;
}

/** "label (unit)", or the label alone for a plain number. */
export function withUnit(label: string, unit: string): string {
  return unit ? `${label} (${unit})` : label;
}

/**
 * A shown value with its unit to `digits` significant figures: "12.5 wt%";
 * "–" for NaN.
 * @example valueText(1.5862, "", 4) // "1.586"
 */
export function valueText(value: number, unit: string, digits = 4): string {
  if (!Number.isFinite(value)) return "–";
  const text = sig(value, digits).replace("-", "−");
  return unit ? `${text}${NBSP}${unit}` : text;
}

/**
 * A place on an axis with its unit, trailing zeros dropped: "20 wt%", "12.5 °C".
 * @example placeText(20, "wt%") // "20 wt%"
 */
export function placeText(value: number, unit: string, digits = 4): string {
  if (!Number.isFinite(value)) return "–";
  const raw = sig(value, digits);
  const text = (raw.includes(".") ? raw.replace(/0+$/, "").replace(/\.$/, "") : raw).replace("-", "−");
  return unit ? `${text}${NBSP}${unit}` : text;
}

/**
 * A label inside a sentence: first letter lower-cased unless it starts an
 * abbreviation ("Refractive index" → "refractive index", "VOC" stays).
 * @example inSentence("Refractive index") // "refractive index"
 */
export function inSentence(label: string): string {
  return /^[A-Z][a-z]/.test(label) ? label.charAt(0).toLowerCase() + label.slice(1) : label;
}

/** Words for each point status, as the plots and the table print them. */
export const STATUS_WORDS: Record<PointStatus, string> = {
  clear: "clear",
  caution: "caution",
  fail: "fails the thermal check",
  refused: "refused by the engine",
};

/** Status of point p. */
export function pointStatus(run: ExplorationRun, p: number): PointStatus {
  return POINT_STATUSES[run.status[p] ?? 0] ?? "clear";
}

/**
 * Index of an output in run.outputs (by key), or −1 when the run did not compute it.
 * @example outputIndex(run, "refractiveIndex") // 0
 */
export function outputIndex(run: ExplorationRun, info: OutputInfo): number {
  return run.outputs.indexOf(info.key);
}

/** Counts of points by status. */
export function statusCounts(run: ExplorationRun): Record<PointStatus, number> {
  const counts: Record<PointStatus, number> = { clear: 0, caution: 0, fail: 0, refused: 0 };
  for (let p = 0; p < run.plan.count; p++) counts[pointStatus(run, p)] += 1;
  return counts;
}

/** "3 caution, 2 fail the thermal check, 1 refused" (only the non-zero ones), or "all clear". */
export function statusSummary(run: ExplorationRun): string {
  const c = statusCounts(run);
  const parts: string[] = [];
  if (c.caution) parts.push(`${c.caution} caution`);
  if (c.fail) parts.push(`${c.fail} ${c.fail === 1 ? "fails" : "fail"} the thermal check`);
  if (c.refused) parts.push(`${c.refused} refused by the engine`);
  return parts.length ? parts.join(", ") : "all clear on the thermal check";
}
