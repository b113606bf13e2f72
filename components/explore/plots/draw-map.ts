/**
 * Draws a two-variable map on a canvas: refused cells in their dotted grey,
 * the figure's colours from ImageData (one image pixel per point, scaled up
 * without smoothing), the thermal hatches, and outlines around the caution
 * (dashed) and fail (solid) regions. Browser only (canvas).
 */
import type { FigureRange } from "./colour-scale";
import { cellRect, mapImage, type MapLayout } from "./map-layout";
import { overlayPattern, strokeRegionOutline } from "./overlay-patterns";

/** Status codes (indexes into POINT_STATUSES). */
const CAUTION = 1;
const FAIL = 2;
const REFUSED = 3;

function cellsPath(layout: MapLayout, status: Uint8Array, code: number): Path2D | null {
  const path = new Path2D();
  let any = false;
  for (let p = 0; p < layout.n0 * layout.n1; p++) {
    if (status[p] !== code) continue;
    const r = cellRect(layout, Math.floor(p / layout.n1), p % layout.n1);
    path.rect(r.x, r.y, r.w, r.h);
    any = true;
  }
  return any ? path : null;
}

/** Edges between a cell of `code` and a neighbour that is not (or the map's edge). */
function outlinePath(layout: MapLayout, status: Uint8Array, code: number): Path2D | null {
  const { n0, n1 } = layout;
  const path = new Path2D();
  let any = false;
  const at = (i0: number, i1: number) => (i0 < 0 || i1 < 0 || i0 >= n0 || i1 >= n1 ? -1 : status[i0 * n1 + i1]);
  for (let i0 = 0; i0 < n0; i0++) {
    for (let i1 = 0; i1 < n1; i1++) {
      if (status[i0 * n1 + i1] !== code) continue;
      const r = cellRect(layout, i0, i1);
      const edge = (x1: number, y1: number, x2: number, y2: number) => {
        path.moveTo(x1, y1);
        path.lineTo(x2, y2);
        any = true;
      };
      if (at(i0 - 1, i1) !== code) edge(r.x, r.y, r.x, r.y + r.h);
      if (at(i0 + 1, i1) !== code) edge(r.x + r.w, r.y, r.x + r.w, r.y + r.h);
      if (at(i0, i1 + 1) !== code) edge(r.x, r.y, r.x + r.w, r.y);
      if (at(i0, i1 - 1) !== code) edge(r.x, r.y + r.h, r.x + r.w, r.y + r.h);
    }
  }
  return any ? path : null;
}

/**
 * Draws the map into ctx (already scaled to CSS px) and returns the time it
 * took, ms.
 * @example drawMap(ctx, layout, values, range, run.status, scaleTable())
 */
export function drawMap(ctx: CanvasRenderingContext2D, layout: MapLayout, values: Float64Array, range: FigureRange | null, status: Uint8Array, table: Uint8ClampedArray): number {
  const t0 = performance.now();
  const { n0, n1, left, top, width, height } = layout;
  ctx.fillStyle = "#ffffff";
  ctx.fillRect(left, top, width, height);

  const refused = cellsPath(layout, status, REFUSED);
  if (refused) {
    ctx.fillStyle = overlayPattern(ctx, "refused");
    ctx.fill(refused);
  }

  const image = document.createElement("canvas");
  image.width = n0;
  image.height = n1;
  const ictx = image.getContext("2d");
  if (ictx) {
    ictx.putImageData(new ImageData(mapImage(values, n0, n1, range, table) as Uint8ClampedArray<ArrayBuffer>, n0, n1), 0, 0);
    ctx.imageSmoothingEnabled = false;
    ctx.drawImage(image, left, top, width, height);
  }

  for (const [code, kind] of [
    [CAUTION, "caution"],
    [FAIL, "fail"],
  ] as const) {
    const cells = cellsPath(layout, status, code);
    if (!cells) continue;
    ctx.fillStyle = overlayPattern(ctx, kind);
    ctx.fill(cells);
    const outline = outlinePath(layout, status, code);
    if (outline) strokeRegionOutline(ctx, outline, kind);
  }

  ctx.lineWidth = 1;
  ctx.strokeStyle = "#22262a";
  ctx.strokeRect(left + 0.5, top + 0.5, width - 1, height - 1);
  return performance.now() - t0;
}
