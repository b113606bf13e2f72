/**
 * Ternary coordinates: three shares (summing to 1) to a point of an
 * equilateral triangle of side 1 and back. Component 0 sits at the top corner,
 * component 1 bottom left, component 2 bottom right; y points up. Plain
 * TypeScript, no framework.
 */

/** Height of the triangle of side 1: √3 / 2. */
export const TRIANGLE_HEIGHT = Math.sqrt(3) / 2;

/** Corners of the triangle (x, y), y up: component 0 top, 1 bottom left, 2 bottom right. */
export const CORNERS: readonly (readonly [number, number])[] = [
  [0.5, TRIANGLE_HEIGHT],
  [0, 0],
  [1, 0],
];

/**
 * Point of the triangle (side 1, y up) for shares a, b, c of components 0, 1, 2
 * (normalised by their sum, so shares need not sum exactly to 1).
 * @example ternaryToXY(1, 0, 0) // [0.5, 0.866…] (top corner)
 */
export function ternaryToXY(a: number, b: number, c: number): [number, number] {
  const s = a + b + c;
  const [na, nb, nc] = s > 0 ? [a / s, b / s, c / s] : [1 / 3, 1 / 3, 1 / 3];
  return [na * CORNERS[0]![0] + nb * CORNERS[1]![0] + nc * CORNERS[2]![0], na * CORNERS[0]![1] + nb * CORNERS[1]![1] + nc * CORNERS[2]![1]];
}

/**
 * Shares (summing to 1; negative outside the triangle) of a point (x, y) of the
 * triangle of side 1, y up.
 * @example xyToTernary(0.5, 0) // [0, 0.5, 0.5]
 */
export function xyToTernary(x: number, y: number): [number, number, number] {
  const a = y / TRIANGLE_HEIGHT;
  const c = x - a / 2;
  const b = 1 - a - c;
  return [a, b, c];
}

/**
 * Ends (x, y) of the gridline where component k has share s: the line joins
 * the two edges that meet at the corners of the other components.
 * @example gridline(0, 0.5) // [[0.25, 0.433], [0.75, 0.433]]
 */
export function gridline(k: 0 | 1 | 2, s: number): [[number, number], [number, number]] {
  const sh = (i: number, rest: number): [number, number, number] => {
    const v: [number, number, number] = [0, 0, 0];
    v[k] = s;
    const others = [0, 1, 2].filter((j) => j !== k);
    v[others[0]!] = i === 0 ? rest : 0;
    v[others[1]!] = i === 0 ? 0 : rest;
    return v;
  };
  return [ternaryToXY(...sh(0, 1 - s)), ternaryToXY(...sh(1, 1 - s))];
}

/**
 * Corners of the hexagonal cell (pointy top) around a lattice point of a
 * triangular grid of spacing d: the cells tile the triangle without gaps.
 * @example hexCell(0, 0, 1).length // 6
 */
export function hexCell(x: number, y: number, d: number): [number, number][] {
  const r = d / Math.sqrt(3);
  const out: [number, number][] = [];
  for (let k = 0; k < 6; k++) {
    const angle = Math.PI / 6 + (k * Math.PI) / 3;
    out.push([x + r * Math.cos(angle), y + r * Math.sin(angle)]);
  }
  return out;
}

/**
 * Index of the point nearest to (x, y) among points at xs[i], ys[i], or −1 when
 * there is none within maxDistance.
 * @example nearestPoint([0, 1], [0, 0], 0.9, 0, 1) // 1
 */
export function nearestPoint(xs: ArrayLike<number>, ys: ArrayLike<number>, x: number, y: number, maxDistance = Infinity): number {
  let best = -1;
  let bestD = maxDistance * maxDistance;
  for (let i = 0; i < xs.length; i++) {
    const dx = xs[i]! - x;
    const dy = ys[i]! - y;
    const d = dx * dx + dy * dy;
    if (d <= bestD) {
      bestD = d;
      best = i;
    }
  }
  return best;
}

/**
 * The next point from `from` in direction (dx, dy): the nearest point within
 * 60° of the direction, or `from` itself when there is none (keyboard moves).
 * @example stepToward([0, 1, 2], [0, 0, 0], 0, 1, 0) // 1
 */
export function stepToward(xs: ArrayLike<number>, ys: ArrayLike<number>, from: number, dx: number, dy: number): number {
  const x0 = xs[from]!;
  const y0 = ys[from]!;
  let best = from;
  let bestScore = Infinity;
  const len = Math.hypot(dx, dy);
  for (let i = 0; i < xs.length; i++) {
    if (i === from) continue;
    const ex = xs[i]! - x0;
    const ey = ys[i]! - y0;
    const dist = Math.hypot(ex, ey);
    if (dist === 0) continue;
    const cos = (ex * dx + ey * dy) / (dist * len);
    if (cos < 0.5 - 1e-9) continue;
    const score = dist * (2 - cos);
    if (score < bestScore) {
      bestScore = score;
      best = i;
    }
  }
  return best;
}
