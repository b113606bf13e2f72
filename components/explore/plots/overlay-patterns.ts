/**
 * The patterns the maps draw over (thermal verdict) and under (refused points)
 * the colour, so the verdict never rests on colour alone: caution a single
 * diagonal hatch, fail a cross-hatch, refused a grey dotted fill. Each line is
 * drawn twice (dark and light, side by side) so it shows on every colour of
 * the scale. Browser only (canvas).
 */

/** Size of a pattern tile, CSS px. */
export const PATTERN_TILE = 8;

/** Ink colours of the overlays. */
export const OVERLAY_DARK = "rgba(20, 22, 24, 0.85)";
export const OVERLAY_LIGHT = "rgba(255, 255, 255, 0.9)";
/** Fill of refused points (under their dots). */
export const REFUSED_FILL = "#e4e1d8";
export const REFUSED_DOT = "#5d6268";

export type OverlayKind = "caution" | "fail" | "refused";

function tile(draw: (c: CanvasRenderingContext2D, s: number) => void): HTMLCanvasElement {
  const canvas = document.createElement("canvas");
  canvas.width = PATTERN_TILE;
  canvas.height = PATTERN_TILE;
  draw(canvas.getContext("2d")!, PATTERN_TILE);
  return canvas;
}

function diagonal(c: CanvasRenderingContext2D, s: number, rising: boolean) {
  const line = (offset: number, colour: string) => {
    c.strokeStyle = colour;
    c.lineWidth = 1;
    c.beginPath();
    for (const shift of [-s, 0, s]) {
      if (rising) {
        c.moveTo(shift + offset, s);
        c.lineTo(shift + offset + s, 0);
      } else {
        c.moveTo(shift + offset, 0);
        c.lineTo(shift + offset + s, s);
      }
    }
    c.stroke();
  };
  line(0, OVERLAY_DARK);
  line(1.2, OVERLAY_LIGHT);
}

/**
 * A repeating canvas pattern for an overlay (tiles of PATTERN_TILE CSS px once
 * the context's transform applies).
 * @example ctx.fillStyle = overlayPattern(ctx, "fail")
 */
export function overlayPattern(ctx: CanvasRenderingContext2D, kind: OverlayKind): CanvasPattern | string {
  const canvas = tile((c, s) => {
    if (kind === "refused") {
      c.fillStyle = REFUSED_FILL;
      c.fillRect(0, 0, s, s);
      c.fillStyle = REFUSED_DOT;
      c.beginPath();
      c.arc(s / 4, s / 4, 0.9, 0, Math.PI * 2);
      c.arc((3 * s) / 4, (3 * s) / 4, 0.9, 0, Math.PI * 2);
      c.fill();
      return;
    }
    diagonal(c, s, true);
    if (kind === "fail") diagonal(c, s, false);
  });
  return ctx.createPattern(canvas, "repeat") ?? (kind === "refused" ? REFUSED_FILL : OVERLAY_DARK);
}

/**
 * Sets up a canvas for drawing in CSS pixels at the screen's resolution and
 * returns its context, cleared.
 * @example const ctx = prepareCanvas(canvas, 640, 360)
 */
export function prepareCanvas(canvas: HTMLCanvasElement, width: number, height: number): CanvasRenderingContext2D | null {
  const ratio = typeof window === "undefined" ? 1 : Math.min(3, window.devicePixelRatio || 1);
  const w = Math.max(1, Math.round(width * ratio));
  const h = Math.max(1, Math.round(height * ratio));
  if (canvas.width !== w) canvas.width = w;
  if (canvas.height !== h) canvas.height = h;
  canvas.style.width = `${width}px`;
  canvas.style.height = `${height}px`;
  const ctx = canvas.getContext("2d");
  if (!ctx) return null;
  ctx.setTransform(ratio, 0, 0, ratio, 0, 0);
  ctx.clearRect(0, 0, width, height);
  return ctx;
}

/**
 * Outlines a caution or fail region so it reads on any colour: a wide dark
 * stroke under a thin light one; caution dashed, fail solid.
 *
 * @example
 * ```ts
 * strokeRegionOutline(ctx, outline, "caution");
 * ```
 */
export function strokeRegionOutline(ctx: CanvasRenderingContext2D, outline: Path2D, verdict: "caution" | "fail"): void {
  ctx.setLineDash(verdict === "caution" ? [5, 3] : []);
  ctx.lineWidth = 2.5;
  ctx.strokeStyle = OVERLAY_DARK;
  ctx.stroke(outline);
  ctx.lineWidth = 1;
  ctx.strokeStyle = OVERLAY_LIGHT;
  ctx.stroke(outline);
  ctx.setLineDash([]);
}
