/**
 * Hand-built exploration runs for the plots' tests (no numeric path): small
 * arrays whose figures are simple formulas of the point, so expected values
 * can be worked out by hand.
 */
import type { Axis, ExplorationRun, OutputInfo } from "@/lib/explore/types";

export const INDEX: OutputInfo = { key: "refractiveIndex", label: "Refractive index", unit: "" };
export const ORGANIC: OutputInfo = { key: "organicWeightFraction", label: "Organic content", unit: "wt%", percent: true };
export const VOC: OutputInfo = { key: "vocGPerL", label: "VOC", unit: "g/L" };

export function titaniaAxis(values: number[]): Axis {
  return { variable: { kind: "weightFraction", materialId: "ti", from: values[0]!, to: values.at(-1)!, step: 0.05 }, label: "Titania precursor, weight fraction", unit: "wt%", values };
}

export function temperatureAxis(values: number[]): Axis {
  return { variable: { kind: "stepTemperature", index: 0, from: values[0]!, to: values.at(-1)!, step: 10 }, label: "Cure temperature", unit: "°C", values };
}

/** A sweep of the titania fraction 0–0.2 in 5 points: index 1.50 + 0.4·w, organic 0.6 − w, statuses clear, clear, caution, fail, refused. */
export function lineRun(): ExplorationRun {
  const axis = titaniaAxis([0, 0.05, 0.1, 0.15, 0.2]);
  const index = Float64Array.from(axis.values, (w) => 1.5 + 0.4 * w);
  const organic = Float64Array.from(axis.values, (w) => 0.6 - w);
  index[4] = NaN;
  organic[4] = NaN;
  return {
    plan: { grid: { kind: "sweep", variables: [axis.variable] }, count: 5, axes: [axis], base: [0.05] },
    outputs: [INDEX.key, ORGANIC.key],
    values: [index, organic],
    status: Uint8Array.of(0, 0, 1, 2, 3),
    refusals: [{ point: 4, code: "fractions_sum", field: "components.2.fraction" }],
  };
}

/** A 3 × 2 map: titania 0, 0.1, 0.2 across, cure 100, 120 °C up; VOC = 100 + 1000·w + T/10; point 5 fails. */
export function mapRun(): ExplorationRun {
  const a0 = titaniaAxis([0, 0.1, 0.2]);
  const a1 = temperatureAxis([100, 120]);
  const voc = new Float64Array(6);
  for (let i0 = 0; i0 < 3; i0++) for (let i1 = 0; i1 < 2; i1++) voc[i0 * 2 + i1] = 100 + 1000 * a0.values[i0]! + a1.values[i1]! / 10;
  return {
    plan: { grid: { kind: "sweep", variables: [a0.variable, a1.variable] }, count: 6, axes: [a0, a1], base: [0.1, 100] },
    outputs: [VOC.key],
    values: [voc],
    status: Uint8Array.of(0, 0, 0, 1, 0, 2),
    refusals: [],
  };
}

/** A ternary grid of step 0.5 (6 points) over three components sharing 0.4 of the composition; VOC = 100·share of component 0. */
export function ternaryRun(): ExplorationRun {
  const pts: [number, number, number][] = [
    [1, 0, 0],
    [0.5, 0.5, 0],
    [0.5, 0, 0.5],
    [0, 1, 0],
    [0, 0.5, 0.5],
    [0, 0, 1],
  ];
  return {
    plan: {
      grid: { kind: "ternary", materialIds: ["a", "b", "c"], step: 0.5 },
      count: 6,
      axes: [],
      ternary: { materialIds: ["a", "b", "c"], labels: ["TEOS", "GPTMS", "Titania precursor"], total: 0.4, shares: Float64Array.from(pts.flat()) },
      base: [0.5, 0.25, 0.25],
    },
    outputs: [VOC.key],
    values: [Float64Array.from(pts, (s) => 100 * s[0])],
    status: Uint8Array.of(2, 1, 0, 0, 0, 3),
    refusals: [{ point: 5, code: "missing_density", field: "components.2.materialId" }],
  };
}
