/**
 * Draws a ternary map on a canvas: a hexagonal cell around each point (the
 * cells of a triangular grid tile the triangle), coloured from the scale in
 * 256 batches, refused cells dotted grey, caution and fail hatched and
 * outlined (dashed, solid). Browser
 * only (canvas).
 */
import { scalePosition, SCALE_STEPS, type FigureRange } from "./colour-scale";
import { overlayPattern, strokeRegionOutline } from "./overlay-patterns";
import { CORNERS, hexCell, ternaryToXY, TRIANGLE_HEIGHT } from "./ternary";

/** Where the triangle of side 1 sits on the canvas: px = left + x·side, py = top + (h − y)·side. */
export interface TernaryLayout {
  left: number;
  top: number;
  side: number;
}

/** Canvas pixel of a point (x, y) of the triangle of side 1. */
export function ternaryPixel(layout: TernaryLayout, x: number, y: number): [number, number] {
  return [layout.left + x * layout.side, layout.top + (TRIANGLE_HEIGHT - y) * layout.side];
}

function hexPath(path: Path2D, layout: TernaryLayout, x: number, y: number, d: number) {
  const cell = hexCell(x, y, d);
  cell.forEach(([cx, cy], k) => {
    const [px, py] = ternaryPixel(layout, cx, cy);
    if (k === 0) path.moveTo(px, py);
    else path.lineTo(px, py);
  });
  path.closePath();
}

/** Lattice steps to the six neighbours of a point, in (share 0, share 1) steps; share 2 takes the rest. */
const NEIGHBOURS: readonly (readonly [number, number])[] = [
  [1, 0],
  [-1, 0],
  [0, 1],
  [0, -1],
  [1, -1],
  [-1, 1],
];

/**
 * Edges of the cells of status `code` that face a neighbour of another status
 * (or the triangle's edge): the outline of a caution or fail region.
 */
function outlinePath(layout: TernaryLayout, shares: Float64Array, status: Uint8Array, d: number, code: number): Path2D | null {
  const n = Math.round(1 / d);
  const count = status.length;
  const at = new Map<number, number>();
  const key = (a: number, b: number) => a * (n + 1) + b;
  for (let p = 0; p < count; p++) at.set(key(Math.round(shares[3 * p]! * n), Math.round(shares[3 * p + 1]! * n)), p);
  const path = new Path2D();
  let any = false;
  const r = d / Math.sqrt(3);
  for (let p = 0; p < count; p++) {
    if (status[p] !== code) continue;
    const a = Math.round(shares[3 * p]! * n);
    const b = Math.round(shares[3 * p + 1]! * n);
    const [x, y] = ternaryToXY(a, b, n - a - b);
    for (const [da, db] of NEIGHBOURS) {
      const q = a + da >= 0 && b + db >= 0 && a + da + b + db <= n ? at.get(key(a + da, b + db)) : undefined;
      if (q !== undefined && status[q] === code) continue;
      const [nx, ny] = ternaryToXY(a + da, b + db, n - a - b - da - db);
      const angle = Math.atan2(ny - y, nx - x);
      const [x1, y1] = ternaryPixel(layout, x + r * Math.cos(angle - Math.PI / 6), y + r * Math.sin(angle - Math.PI / 6));
      const [x2, y2] = ternaryPixel(layout, x + r * Math.cos(angle + Math.PI / 6), y + r * Math.sin(angle + Math.PI / 6));
      path.moveTo(x1, y1);
      path.lineTo(x2, y2);
      any = true;
    }
  }
  return any ? path : null;
}

/**
 * Draws the map (ctx scaled to CSS px) and returns the time it took, ms.
 * xs, ys: each point's place on the triangle of side 1; shares: the plan's shares (3 a point);
 * d: spacing of the grid (the step, a whole fraction of 1).
 * @example drawTernary(ctx, layout, xs, ys, plan.ternary.shares, 0.05, values, range, run.status, scaleTable())
 */
export function drawTernary(
  ctx: CanvasRenderingContext2D,
  layout: TernaryLayout,
  xs: Float64Array,
  ys: Float64Array,
  shares: Float64Array,
  d: number,
  values: Float64Array,
  range: FigureRange | null,
  status: Uint8Array,
  table: Uint8ClampedArray,
): number {
  const t0 = performance.now();
  const triangle = new Path2D();
  CORNERS.forEach(([x, y], k) => {
    const [px, py] = ternaryPixel(layout, x, y);
    if (k === 0) triangle.moveTo(px, py);
    else triangle.lineTo(px, py);
  });
  triangle.closePath();
  ctx.save();
  ctx.fillStyle = "#ffffff";
  ctx.fill(triangle);
  ctx.clip(triangle);

  const buckets = new Map<number, Path2D>();
  const refused = new Path2D();
  const caution = new Path2D();
  const fail = new Path2D();
  let anyRefused = false;
  let anyCaution = false;
  let anyFail = false;
  for (let p = 0; p < xs.length; p++) {
    const v = values[p]!;
    const s = status[p];
    if (s === 3 || !Number.isFinite(v) || !range) {
      hexPath(refused, layout, xs[p]!, ys[p]!, d);
      anyRefused = true;
    } else {
      const k = Math.round(Math.min(1, Math.max(0, scalePosition(v, range))) * (SCALE_STEPS - 1));
      let path = buckets.get(k);
      if (!path) buckets.set(k, (path = new Path2D()));
      hexPath(path, layout, xs[p]!, ys[p]!, d);
    }
    if (s === 1) {
      hexPath(caution, layout, xs[p]!, ys[p]!, d);
      anyCaution = true;
    } else if (s === 2) {
      hexPath(fail, layout, xs[p]!, ys[p]!, d);
      anyFail = true;
    }
  }
  if (anyRefused) {
    ctx.fillStyle = overlayPattern(ctx, "refused");
    ctx.fill(refused);
  }
  for (const [k, path] of buckets) {
    ctx.fillStyle = `rgb(${table[k * 4]} ${table[k * 4 + 1]} ${table[k * 4 + 2]})`;
    ctx.fill(path);
    // A hairline in the cell's own colour closes the anti-aliasing seams between cells.
    ctx.strokeStyle = ctx.fillStyle;
    ctx.lineWidth = 0.6;
    ctx.stroke(path);
  }
  if (anyCaution) {
    ctx.fillStyle = overlayPattern(ctx, "caution");
    ctx.fill(caution);
  }
  if (anyFail) {
    ctx.fillStyle = overlayPattern(ctx, "fail");
    ctx.fill(fail);
  }
  for (const [code, verdict] of [
    [1, "caution"],
    [2, "fail"],
  ] as const) {
    const outline = outlinePath(layout, shares, status, d, code);
    if (outline) strokeRegionOutline(ctx, outline, verdict);
  }
  ctx.restore();
  ctx.strokeStyle = "#22262a";
  ctx.lineWidth = 1.25;
  ctx.stroke(triangle);
  return performance.now() - t0;
}
