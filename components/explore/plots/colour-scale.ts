/**
 * The explorer's sequential colour scale: dark navy through teal and green to
 * pale yellow. Our own anchors, chosen in CIELAB: lightness L* rises in equal
 * steps from 16 to 93 while the hue turns from blue (285°) to yellow (95°), so
 * the scale reads in grey (luminance strictly rising) and runs along the
 * blue–yellow axis that the common red–green colour vision deficiencies keep.
 * Plain TypeScript, no framework.
 */

/** sRGB colour, 0–255 per channel. */
export type Rgb = readonly [number, number, number];

/**
 * Anchors at t = 0, 1/8, …, 1 (sRGB). Worked out from CIELAB L* = 16 + 77·t,
 * hue 285° → 95°, chroma as high as the sRGB gamut allows up to 45 (D65
 * white; CIE 15:2004 formulas, IEC 61966-2-1 sRGB transfer).
 */
export const SCALE_ANCHORS: readonly Rgb[] = [
  [0x0b, 0x27, 0x51],
  [0x01, 0x40, 0x63],
  [0x01, 0x5a, 0x73],
  [0x04, 0x75, 0x82],
  [0x05, 0x92, 0x8c],
  [0x30, 0xaf, 0x87],
  [0x80, 0xc5, 0x81],
  [0xc1, 0xd9, 0x84],
  [0xfc, 0xeb, 0xb1],
];

/** Entries of the lookup table the maps draw with. */
export const SCALE_STEPS = 256;

/**
 * Colour at t (0 = lowest figure, 1 = highest), linear between anchors in
 * sRGB; t outside 0–1 is clamped, NaN gives the lowest colour.
 * @example colourAt(0) // [11, 39, 81]
 */
export function colourAt(t: number): Rgb {
  const u = Number.isFinite(t) ? Math.min(1, Math.max(0, t)) : 0;
  const pos = u * (SCALE_ANCHORS.length - 1);
  const i = Math.min(SCALE_ANCHORS.length - 2, Math.floor(pos));
  const f = pos - i;
  const a = SCALE_ANCHORS[i]!;
  const b = SCALE_ANCHORS[i + 1]!;
  return [a[0] + (b[0] - a[0]) * f, a[1] + (b[1] - a[1]) * f, a[2] + (b[2] - a[2]) * f];
}

/** sRGB channel (0–255) to linear light (0–1), IEC 61966-2-1. */
function linear(channel: number): number {
  const c = channel / 255;
  return c <= 0.04045 ? c / 12.92 : Math.pow((c + 0.055) / 1.055, 2.4);
}

/**
 * Relative luminance (0 black – 1 white) of an sRGB colour, with the Rec. 709
 * weights of WCAG 2.x.
 * @example relativeLuminance([255, 255, 255]) // 1
 */
export function relativeLuminance(rgb: Rgb): number {
  return 0.2126 * linear(rgb[0]) + 0.7152 * linear(rgb[1]) + 0.0722 * linear(rgb[2]);
}

/**
 * The scale as a table of SCALE_STEPS colours, packed as RGBA bytes (for
 * ImageData): entry k is colourAt(k / (SCALE_STEPS − 1)) rounded, with
 * luminance kept strictly rising.
 * @example scaleTable()[0] // 11 (red of the lowest colour)
 */
export function scaleTable(): Uint8ClampedArray {
  const table = new Uint8ClampedArray(SCALE_STEPS * 4);
  let previous = -1;
  for (let k = 0; k < SCALE_STEPS; k++) {
    const [r, g, b] = colourAt(k / (SCALE_STEPS - 1)).map(Math.round) as [number, number, number];
    // Rounding to bytes can undo a rise where one channel falls: lift green until the luminance rises again.
    let green = g;
    while (green < 255 && relativeLuminance([r, green, b]) <= previous) green += 1;
    previous = relativeLuminance([r, green, b]);
    table.set([r, green, b, 255], k * 4);
  }
  return table;
}

/** CSS colour of t: "rgb(r g b)". */
export function cssColourAt(t: number): string {
  const [r, g, b] = colourAt(t);
  return `rgb(${Math.round(r)} ${Math.round(g)} ${Math.round(b)})`;
}

/** Lowest and highest finite value, or null when there is none. */
export interface FigureRange {
  min: number;
  max: number;
}

/**
 * Range of the finite values of a figure (NaN and ±∞ skipped).
 * @example figureRange(Float64Array.of(2, NaN, 5)) // { min: 2, max: 5 }
 */
export function figureRange(values: ArrayLike<number>): FigureRange | null {
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!;
    if (!Number.isFinite(v)) continue;
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return min <= max ? { min, max } : null;
}

/**
 * Position of v on the scale of a range (0–1); a range of one value puts
 * everything at the middle.
 * @example scalePosition(7.5, { min: 5, max: 10 }) // 0.5
 */
export function scalePosition(v: number, range: FigureRange): number {
  if (range.max === range.min) return 0.5;
  return (v - range.min) / (range.max - range.min);
}
