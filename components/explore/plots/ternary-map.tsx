"use client";

import { useEffect, useId, useMemo, useRef, useState, type KeyboardEvent, type MouseEvent } from "react";
import type { ExplorationRun, OutputInfo } from "@/lib/explore/types";
import { figureRange, scaleTable } from "./colour-scale";
import { inSentence, outputFactor, outputIndex, statusCounts } from "./display";
import { drawTernary, ternaryPixel, type TernaryLayout } from "./draw-ternary";
import { MapLegend, RevisionMark } from "./map-legend";
import { prepareCanvas } from "./overlay-patterns";
import { mapCaption, pointReadout, ternarySummary } from "./summaries";
import { hexCell, nearestPoint, stepToward, ternaryToXY, TRIANGLE_HEIGHT } from "./ternary";
import { TernaryAxes } from "./ternary-axes";
import { useWidth } from "./use-width";

export interface TernaryMapProps {
  run: ExplorationRun;
  output: OutputInfo;
}

const PAD = { x: 44, top: 26, bottom: 40 };
const MAX_SIDE = 520;
const TABLE = typeof window === "undefined" ? null : scaleTable();

/**
 * A ternary composition map: the triangle with the three components at its
 * corners (component 0 top, 1 bottom left, 2 bottom right), gridlines in % of
 * their shared total, a coloured hexagonal cell per point, thermal verdict
 * hatched, refused points dotted grey, the revision marked. Hover, or focus
 * and use the arrow keys, to read a point.
 */
export function TernaryMap({ run, output }: TernaryMapProps) {
  const [boxRef, width] = useWidth<HTMLDivElement>();
  const canvasRef = useRef<HTMLCanvasElement>(null);
  const readoutId = useId();
  const [cursor, setCursor] = useState<number | null>(null);
  const [drawMs, setDrawMs] = useState<number | null>(null);
  const t = run.plan.ternary;
  const o = outputIndex(run, output);
  const values = o >= 0 ? run.values[o] : undefined;
  const range = useMemo(() => (values ? figureRange(values) : null), [values]);
  const f = outputFactor(output);
  const shown = range ? { min: range.min * f, max: range.max * f } : null;
  const count = run.plan.count;
  const places = useMemo(() => {
    const xs = new Float64Array(count);
    const ys = new Float64Array(count);
    if (t) {
      for (let p = 0; p < count; p++) {
        const [x, y] = ternaryToXY(t.shares[3 * p]!, t.shares[3 * p + 1]!, t.shares[3 * p + 2]!);
        xs[p] = x;
        ys[p] = y;
      }
    }
    return { xs, ys };
  }, [t, count]);
  const grid = run.plan.grid;
  const spacing = grid.kind === "ternary" ? grid.step : 0.05;
  const side = Math.max(0, Math.min(MAX_SIDE, width - 2 * PAD.x));
  const height = Math.round(side * TRIANGLE_HEIGHT + PAD.top + PAD.bottom);
  const layout: TernaryLayout | null = t && values && side > 80 ? { left: Math.round((width - side) / 2), top: PAD.top, side } : null;

  useEffect(() => {
    const canvas = canvasRef.current;
    if (!canvas || !layout || !values || !TABLE || !t) return;
    const ctx = prepareCanvas(canvas, width, height);
    if (!ctx) return;
    setDrawMs(drawTernary(ctx, layout, places.xs, places.ys, t.shares, spacing, values, range, run.status, TABLE));
    // layout is rebuilt each render; its parts are the dependencies.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [width, height, side, places, t, spacing, values, range, run.status]);

  if (!t || !values) {
    return (
      <figure data-testid="ternary-map" className="min-w-0">
        <p className="text-sm text-muted">A ternary map needs a ternary grid and the figure {inSentence(output.label)} in the run.</p>
      </figure>
    );
  }
  const summary = ternarySummary(run, output);
  const base = run.plan.base;
  const basePx = layout && base && base.length === 3 ? ternaryPixel(layout, ...ternaryToXY(base[0]!, base[1]!, base[2]!)) : null;
  const cursorHex =
    layout && cursor !== null
      ? hexCell(places.xs[cursor]!, places.ys[cursor]!, spacing)
          .map(([x, y]) => ternaryPixel(layout, x, y).join(","))
          .join(" ")
      : null;

  const onMove = (e: MouseEvent<HTMLDivElement>) => {
    if (!layout) return;
    const box = e.currentTarget.getBoundingClientRect();
    const x = (e.clientX - box.left - layout.left) / layout.side;
    const y = TRIANGLE_HEIGHT - (e.clientY - box.top - layout.top) / layout.side;
    const p = nearestPoint(places.xs, places.ys, x, y, spacing * 0.75);
    setCursor(p >= 0 ? p : null);
  };
  const onKey = (e: KeyboardEvent<HTMLDivElement>) => {
    const moves: Record<string, [number, number]> = { ArrowLeft: [-1, 0], ArrowRight: [1, 0], ArrowUp: [0, 1], ArrowDown: [0, -1] };
    let next: number | null;
    if (e.key in moves) {
      const [dx, dy] = moves[e.key]!;
      next = cursor === null ? 0 : stepToward(places.xs, places.ys, cursor, dx, dy);
    } else if (e.key === "Home") next = 0;
    else if (e.key === "End") next = count - 1;
    else if (e.key === "Escape") next = null;
    else return;
    e.preventDefault();
    setCursor(count > 0 ? next : null);
  };

  return (
    <figure
      data-testid="ternary-map"
      data-figure-min={shown?.min ?? ""}
      data-figure-max={shown?.max ?? ""}
      data-figure-unit={output.unit}
      data-points={count}
      data-draw-ms={drawMs === null ? "" : drawMs.toFixed(1)}
      className="min-w-0"
    >
      <figcaption className="mb-1 text-xs font-semibold text-muted">
        {mapCaption(run, output)}, in % of the {(t.total * 100).toPrecision(3)} wt% they share
      </figcaption>
      <div
        ref={boxRef}
        tabIndex={0}
        role="group"
        aria-label={summary}
        aria-describedby={readoutId}
        onMouseMove={onMove}
        onMouseLeave={() => setCursor(null)}
        onKeyDown={onKey}
        className="relative w-full rounded bg-panel"
        style={{ height: Math.max(height, 120) }}
      >
        <canvas ref={canvasRef} className="absolute inset-0" aria-hidden="true" />
        {layout ? (
          <svg width={width} height={height} className="absolute inset-0" aria-hidden="true">
            <TernaryAxes layout={layout} labels={t.labels} />
            {basePx ? (
              <g data-testid="ternary-map-revision">
                <RevisionMark x={basePx[0]} y={basePx[1]} />
                <text x={basePx[0] + 10} y={basePx[1] - 8} fontSize={11} fontWeight={600} fill="#22262a" stroke="#ffffff" strokeWidth={3} paintOrder="stroke">
                  this revision
                </text>
              </g>
            ) : null}
            {cursorHex ? <polygon points={cursorHex} fill="none" stroke="#8c4a1f" strokeWidth={2} /> : null}
          </svg>
        ) : null}
      </div>
      <p id={readoutId} className="num mt-1 min-h-5 text-xs text-ink" aria-live="polite" data-testid="ternary-map-readout">
        {cursor !== null ? pointReadout(run, cursor, [output]) : "Point at a cell, or focus the map and use the arrow keys, to read a point."}
      </p>
      <MapLegend label={output.label} unit={output.unit} range={shown} counts={statusCounts(run)} revision={Boolean(basePx)} outlines />
    </figure>
  );
}
