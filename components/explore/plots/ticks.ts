/**
 * Axis ticks at "nice" numbers (1, 2, 2.5 or 5 × a power of ten), after
 * Heckbert, "Nice numbers for graph labels", Graphics Gems (1990). Plain
 * TypeScript, no framework.
 */

/** Ticks of an axis and the decimals that print them without noise. */
export interface Ticks {
  values: number[];
  step: number;
  /** Decimals that show every tick exactly (e.g. 2 for a step of 0.25). */
  decimals: number;
}

const NICE_STEPS = [1, 2, 2.5, 5, 10] as const;

/**
 * A nice step near span / target: the smallest of 1, 2, 2.5, 5, 10 × 10^k
 * that gives at most `target` intervals.
 * @example niceStep(17, 5) // 5
 */
export function niceStep(span: number, target = 5): number {
  if (!(span > 0) || !Number.isFinite(span)) return 1;
  const raw = span / Math.max(1, target);
  const power = Math.pow(10, Math.floor(Math.log10(raw)));
  for (const m of NICE_STEPS) if (m * power >= raw * (1 - 1e-9)) return m * power;
  return 10 * power;
}

/** Decimals a step needs: 0.25 → 2, 5 → 0, 0.1 → 1. */
export function stepDecimals(step: number): number {
  for (let d = 0; d <= 12; d++) {
    const scaled = step * Math.pow(10, d);
    if (Math.abs(scaled - Math.round(scaled)) < 1e-6 * Math.max(1, scaled)) return d;
  }
  return 12;
}

/**
 * Nice ticks inside [lo, hi] (either order); a single value gets one tick.
 * @example niceTicks(0, 0.2, 5).values // [0, 0.05, 0.1, 0.15, 0.2]
 */
export function niceTicks(lo: number, hi: number, target = 5): Ticks {
  const min = Math.min(lo, hi);
  const max = Math.max(lo, hi);
  if (!Number.isFinite(min) || !Number.isFinite(max)) return { values: [], step: 1, decimals: 0 };
  if (max === min) {
    const step = min === 0 ? 1 : niceStep(Math.abs(min), 1);
    return { values: [min], step, decimals: Math.max(stepDecimals(step), stepDecimals(Math.abs(min) % step)) };
  }
  const step = niceStep(max - min, target);
  const first = Math.ceil(min / step - 1e-9);
  const last = Math.floor(max / step + 1e-9);
  const decimals = stepDecimals(step);
  const values: number[] = [];
  for (let k = first; k <= last; k++) values.push(Number((k * step).toFixed(decimals)));
  return { values, step, decimals };
}

/** A tick value printed with its axis's decimals ("−" for negatives). */
export function tickText(value: number, decimals: number): string {
  const text = value.toFixed(decimals);
  return Number(text) === 0 ? (0).toFixed(decimals) : text.replace("-", "−");
}

/**
 * Nice ticks that enclose [lo, hi]: the domain runs from the tick at or below
 * the lowest value to the tick at or above the highest (for a y axis).
 * @example paddedTicks(1.4712, 1.5934, 5) // { domain: [1.45, 1.6], values: [1.45, 1.475, …, 1.6], … }
 */
export function paddedTicks(lo: number, hi: number, target = 5): Ticks & { domain: [number, number] } {
  let min = Math.min(lo, hi);
  let max = Math.max(lo, hi);
  if (!Number.isFinite(min) || !Number.isFinite(max)) return { values: [0, 1], step: 1, decimals: 0, domain: [0, 1] };
  if (min === max) {
    const pad = min === 0 ? 1 : Math.abs(min) * 0.05;
    min -= pad;
    max += pad;
  }
  const step = niceStep(max - min, target);
  const a = Math.floor(min / step + 1e-9) * step;
  const b = Math.ceil(max / step - 1e-9) * step;
  const t = niceTicks(a, b, Math.round((b - a) / step));
  return { ...t, domain: [t.values[0] ?? a, t.values.at(-1) ?? b] };
}
