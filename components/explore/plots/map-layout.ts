/**
 * Layout of a two-variable map: point p = i0 · n1 + i1 of the grid (the
 * second variable varies fastest) drawn as a cell, variable 0 across (left to
 * right in the axis's order), variable 1 up. Plain TypeScript, no framework.
 */
import { SCALE_STEPS, scalePosition, type FigureRange } from "./colour-scale";

/** The plot area in pixels and the grid's size. */
export interface MapLayout {
  left: number;
  top: number;
  width: number;
  height: number;
  /** Values of variable 0 (columns) and variable 1 (rows). */
  n0: number;
  n1: number;
}

/** A cell's rectangle in pixels. */
export interface CellRect {
  x: number;
  y: number;
  w: number;
  h: number;
}

/**
 * Column and row of point p (p = i0 · n1 + i1).
 * @example cellOf(7, 3) // { i0: 2, i1: 1 }
 */
export function cellOf(p: number, n1: number): { i0: number; i1: number } {
  return { i0: Math.floor(p / n1), i1: p % n1 };
}

/** Point index of column i0, row i1. */
export function pointOf(i0: number, i1: number, n1: number): number {
  return i0 * n1 + i1;
}

/**
 * Rectangle of cell (i0, i1): column i0 from the left, row i1 from the bottom.
 * @example cellRect({ left: 0, top: 0, width: 100, height: 50, n0: 4, n1: 2 }, 0, 0) // { x: 0, y: 25, w: 25, h: 25 }
 */
export function cellRect(layout: MapLayout, i0: number, i1: number): CellRect {
  const w = layout.width / layout.n0;
  const h = layout.height / layout.n1;
  return { x: layout.left + i0 * w, y: layout.top + (layout.n1 - 1 - i1) * h, w, h };
}

/**
 * Point under pixel (x, y), or −1 outside the plot area.
 * @example pointAtPixel({ left: 0, top: 0, width: 100, height: 50, n0: 4, n1: 2 }, 10, 40) // 0
 */
export function pointAtPixel(layout: MapLayout, x: number, y: number): number {
  const fx = (x - layout.left) / layout.width;
  const fy = (y - layout.top) / layout.height;
  if (!(fx >= 0 && fx < 1 && fy >= 0 && fy < 1)) return -1;
  const i0 = Math.min(layout.n0 - 1, Math.floor(fx * layout.n0));
  const i1 = layout.n1 - 1 - Math.min(layout.n1 - 1, Math.floor(fy * layout.n1));
  return pointOf(i0, i1, layout.n1);
}

/**
 * Fractional index of value v along an axis's values (rising or falling),
 * linear between neighbouring values; NaN outside the axis. Index i is the
 * centre of cell i.
 * @example axisIndex([0, 0.1, 0.2], 0.15) // 1.5
 */
export function axisIndex(values: readonly number[], v: number): number {
  if (values.length === 0 || !Number.isFinite(v)) return NaN;
  if (values.length === 1) return v === values[0] ? 0 : NaN;
  for (let i = 0; i < values.length - 1; i++) {
    const a = values[i]!;
    const b = values[i + 1]!;
    if ((v >= a && v <= b) || (v <= a && v >= b)) return a === b ? i : i + (v - a) / (b - a);
  }
  return NaN;
}

/**
 * Pixel of value v along the horizontal (axis 0) or vertical (axis 1) axis:
 * the centre of its cell, interpolated between cells; NaN outside the axis.
 * @example axisPixel(layout, 0, [0, 1, 2, 3], 0) // layout.left + cell width / 2
 */
export function axisPixel(layout: MapLayout, axis: 0 | 1, values: readonly number[], v: number): number {
  const idx = axisIndex(values, v);
  if (Number.isNaN(idx)) return NaN;
  if (axis === 0) return layout.left + ((idx + 0.5) / layout.n0) * layout.width;
  return layout.top + layout.height - ((idx + 0.5) / layout.n1) * layout.height;
}

/**
 * The map as an image of n0 × n1 pixels (one per point, variable 1 up), RGBA
 * bytes for ImageData: finite values coloured from the scale table, NaN left
 * transparent so the refused pattern beneath shows.
 * @example mapImage(Float64Array.of(0, 1), 2, 1, { min: 0, max: 1 }, scaleTable()).length // 8
 */
export function mapImage(values: Float64Array, n0: number, n1: number, range: FigureRange | null, table: Uint8ClampedArray, out?: Uint8ClampedArray): Uint8ClampedArray {
  const image = out ?? new Uint8ClampedArray(n0 * n1 * 4);
  const last = SCALE_STEPS - 1;
  for (let i0 = 0; i0 < n0; i0++) {
    for (let i1 = 0; i1 < n1; i1++) {
      const v = values[i0 * n1 + i1]!;
      const o = ((n1 - 1 - i1) * n0 + i0) * 4;
      if (!range || !Number.isFinite(v)) {
        image[o + 3] = 0;
        continue;
      }
      const k = Math.round(Math.min(1, Math.max(0, scalePosition(v, range))) * last) * 4;
      image[o] = table[k]!;
      image[o + 1] = table[k + 1]!;
      image[o + 2] = table[k + 2]!;
      image[o + 3] = 255;
    }
  }
  return image;
}
