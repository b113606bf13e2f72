/**
 * The words that go with each plot: a summary of what is drawn and the range
 * of the figure (aria-label and caption), and the readout of one point.
 * Plain TypeScript, no framework.
 */
import type { Axis, ExplorationRun, OutputInfo } from "@/lib/explore/types";
import { figureRange, type FigureRange } from "./colour-scale";
import { axisFactor, inSentence, outputFactor, outputIndex, placeText, pointStatus, STATUS_WORDS, statusSummary, valueText, withUnit } from "./display";

/**
 * Range of a figure over the run's points in shown units (×100 for a percent
 * figure), or null when no point has it.
 * @example shownRange(run, { key: "refractiveIndex", label: "Refractive index", unit: "" }) // { min: 1.48, max: 1.59 }
 */
export function shownRange(run: ExplorationRun, info: OutputInfo): FigureRange | null {
  const o = outputIndex(run, info);
  const values = o >= 0 ? run.values[o] : undefined;
  if (!values) return null;
  const r = figureRange(values);
  if (!r) return null;
  const f = outputFactor(info);
  return { min: r.min * f, max: r.max * f };
}

/** "Titania, weight fraction from 0 to 20 wt% (21 values)". */
export function axisSummary(axis: Axis): string {
  const f = axisFactor(axis);
  const first = axis.values[0];
  const last = axis.values.at(-1);
  if (first === undefined || last === undefined) return `${axis.label} (no values)`;
  return `${axis.label} from ${placeText(first * f, axis.unit)} to ${placeText(last * f, axis.unit)} (${axis.values.length} ${axis.values.length === 1 ? "value" : "values"})`;
}

/** "refractive index from 1.48 to 1.59" or "refractive index: no point has a value". */
export function rangeSummary(info: OutputInfo, range: FigureRange | null): string {
  const name = inSentence(info.label);
  if (!range) return `${name}: no point has a value`;
  if (range.min === range.max) return `${name} ${valueText(range.min, info.unit)} at every point`;
  return `${name} from ${valueText(range.min, info.unit)} to ${valueText(range.max, info.unit)}`;
}

function baseSummary(run: ExplorationRun): string {
  const { plan } = run;
  if (!plan.base) return "this revision lies outside the ranges";
  if (plan.ternary) {
    const t = plan.ternary;
    return `this revision at ${t.labels.map((l, k) => `${l} ${placeText((plan.base![k] ?? NaN) * 100, "%", 3)}`).join(", ")}`;
  }
  return `this revision at ${plan.axes.map((a, k) => `${a.label} ${placeText((plan.base![k] ?? NaN) * axisFactor(a), a.unit)}`).join(", ")}`;
}

/**
 * Summary of a line plot: what is drawn against what, each figure's range,
 * the thermal verdict, the reference and the revision.
 * @example lineSummary(run, outputs) // "Line plot of refractive index against Titania, weight fraction from 0 to 20 wt% (21 values): …"
 */
export function lineSummary(run: ExplorationRun, outputs: OutputInfo[], reference?: { value: number; label: string }): string {
  const axis = run.plan.axes[0];
  const against = axis ? axisSummary(axis) : "no variable";
  const ranges = outputs.map((o) => rangeSummary(o, shownRange(run, o))).join("; ");
  const ref = reference ? `; reference line ${reference.label} at ${valueText(reference.value, outputs[0]?.unit ?? "")}` : "";
  return `Line plot of ${outputs.map((o) => inSentence(o.label)).join(", ")} against ${against}: ${ranges}${ref}; ${statusSummary(run)}; ${baseSummary(run)}.`;
}

/**
 * Summary of a two-variable colour map.
 * @example mapSummary(run, info) // "Colour map of refractive index over A … across and B … up, 55 points: …"
 */
export function mapSummary(run: ExplorationRun, info: OutputInfo): string {
  const [a0, a1] = run.plan.axes;
  const over = a0 && a1 ? `${axisSummary(a0)} across and ${axisSummary(a1)} up` : "no variables";
  return `Colour map of ${inSentence(info.label)} over ${over}, ${run.plan.count.toLocaleString("en-GB")} points: ${rangeSummary(info, shownRange(run, info))}; ${statusSummary(run)}; ${baseSummary(run)}.`;
}

/**
 * Summary of a ternary map.
 * @example ternarySummary(run, info) // "Ternary map of VOC over A, B and C (shares of their 45 wt% total), 231 points: …"
 */
export function ternarySummary(run: ExplorationRun, info: OutputInfo): string {
  const t = run.plan.ternary;
  const over = t ? `${t.labels.join(", ").replace(/, ([^,]*)$/, " and $1")} (shares of their ${placeText(t.total * 100, "wt%", 3)} total)` : "no components";
  return `Ternary map of ${inSentence(info.label)} over ${over}, ${run.plan.count.toLocaleString("en-GB")} points: ${rangeSummary(info, shownRange(run, info))}; ${statusSummary(run)}; ${baseSummary(run)}.`;
}

/** The variables of point p in words: "Titania 12 wt%, water ratio 4" or ternary shares. */
export function pointPlace(run: ExplorationRun, p: number): string {
  const { plan } = run;
  if (plan.ternary) {
    const t = plan.ternary;
    return t.labels.map((l, k) => `${l} ${placeText((t.shares[3 * p + k] ?? NaN) * 100, "%", 3)} (${placeText((t.shares[3 * p + k] ?? NaN) * t.total * 100, "wt%", 3)})`).join(", ");
  }
  if (plan.axes.length === 2) {
    const n1 = plan.axes[1]!.values.length;
    const idx = [Math.floor(p / n1), p % n1];
    return plan.axes.map((a, k) => `${a.label} ${placeText((a.values[idx[k]!] ?? NaN) * axisFactor(a), a.unit)}`).join(", ");
  }
  const a = plan.axes[0];
  return a ? `${a.label} ${placeText((a.values[p] ?? NaN) * axisFactor(a), a.unit)}` : `point ${p + 1}`;
}

/**
 * Readout of point p: where it lies, the figures and the thermal verdict.
 * @example pointReadout(run, 3, [info]) // "Titania 15 wt%: Refractive index 1.571; caution"
 */
export function pointReadout(run: ExplorationRun, p: number, outputs: OutputInfo[]): string {
  const status = pointStatus(run, p);
  const figures = outputs
    .map((info) => {
      const o = outputIndex(run, info);
      const v = o >= 0 ? (run.values[o]?.[p] ?? NaN) : NaN;
      return `${info.label} ${valueText(v * outputFactor(info), info.unit)}`;
    })
    .join(", ");
  const refusal = status === "refused" ? run.refusals.find((r) => r.point === p) : undefined;
  const why = refusal ? ` (${refusal.code} at ${refusal.field})` : "";
  return `${pointPlace(run, p)}: ${status === "refused" ? "no figures" : figures}; ${STATUS_WORDS[status]}${why}`;
}

/** Caption of a map: "Refractive index over A (wt%) and B (°C)". */
export function mapCaption(run: ExplorationRun, info: OutputInfo): string {
  const names = run.plan.ternary ? run.plan.ternary.labels.join(", ") : run.plan.axes.map((a) => withUnit(a.label, a.unit)).join(" and ");
  return `${withUnit(info.label, info.unit)} over ${names}`;
}
