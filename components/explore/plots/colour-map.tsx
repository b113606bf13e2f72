"use client";

import { useEffect, useId, useMemo, useRef, useState, type KeyboardEvent, type MouseEvent } from "react";
import type { ExplorationRun, OutputInfo } from "@/lib/explore/types";
import { figureRange, scaleTable } from "./colour-scale";
import { axisFactor, inSentence, outputFactor, outputIndex, statusCounts } from "./display";
import { drawMap } from "./draw-map";
import { MapAxes } from "./map-axes";
import { axisPixel, cellOf, cellRect, pointAtPixel, pointOf, type MapLayout } from "./map-layout";
import { MapLegend, RevisionMark } from "./map-legend";
import { prepareCanvas } from "./overlay-patterns";
import { mapCaption, mapSummary, pointReadout } from "./summaries";
import { useWidth } from "./use-width";

export interface ColourMapProps {
  run: ExplorationRun;
  output: OutputInfo;
}

const HEIGHT = 380;
const MARGIN = { left: 66, right: 12, top: 10, bottom: 46 };
const TABLE = typeof window === "undefined" ? null : scaleTable();

/**
 * A two-variable sweep as a colour map: variable 0 across, variable 1 up,
 * one cell per point (p = i0 · n1 + i1) drawn on a canvas from ImageData,
 * thermal verdict hatched and outlined, refused points dotted grey, the
 * revision marked. Hover, or focus and use the arrow keys, to read a point.
 */
export function ColourMap({ run, output }: ColourMapProps) {
  const [boxRef, width] = useWidth<HTMLDivElement>();
  const canvasRef = useRef<HTMLCanvasElement>(null);
  const [cursor, setCursor] = useState<number | null>(null);
  const readoutId = useId();
  const [drawMs, setDrawMs] = useState<number | null>(null);
  const [a0, a1] = run.plan.axes;
  const n0 = a0?.values.length ?? 0;
  const n1 = a1?.values.length ?? 0;
  const o = outputIndex(run, output);
  const values = o >= 0 ? run.values[o] : undefined;
  const range = useMemo(() => (values ? figureRange(values) : null), [values]);
  const f = outputFactor(output);
  const shown = range ? { min: range.min * f, max: range.max * f } : null;
  const ok = Boolean(a0 && a1 && n0 > 0 && n1 > 0 && values && n0 * n1 === run.plan.count);
  const layout: MapLayout | null =
    ok && width > MARGIN.left + MARGIN.right + 40
      ? { left: MARGIN.left, top: MARGIN.top, width: width - MARGIN.left - MARGIN.right, height: HEIGHT - MARGIN.top - MARGIN.bottom, n0, n1 }
      : null;
  const lw = layout?.width ?? 0;

  useEffect(() => {
    const canvas = canvasRef.current;
    if (!canvas || !layout || !values || !TABLE) return;
    const ctx = prepareCanvas(canvas, width, HEIGHT);
    if (!ctx) return;
    setDrawMs(drawMap(ctx, layout, values, range, run.status, TABLE));
    // layout is rebuilt each render; its parts are the dependencies.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [width, lw, n0, n1, values, range, run.status]);

  const summary = mapSummary(run, output);
  const counts = statusCounts(run);
  if (!ok || !a0 || !a1) {
    return (
      <figure data-testid="colour-map" className="min-w-0">
        <p className="text-sm text-muted">A colour map needs a sweep of two variables and the figure {inSentence(output.label)} in the run.</p>
      </figure>
    );
  }
  const xs = a0.values.map((v) => v * axisFactor(a0));
  const ys = a1.values.map((v) => v * axisFactor(a1));
  const base = run.plan.base;
  const baseXY = layout && base ? [axisPixel(layout, 0, xs, (base[0] ?? NaN) * axisFactor(a0)), axisPixel(layout, 1, ys, (base[1] ?? NaN) * axisFactor(a1))] : null;
  const showBase = baseXY && !baseXY.some(Number.isNaN);
  const cursorRect = layout && cursor !== null ? cellRect(layout, cellOf(cursor, n1).i0, cellOf(cursor, n1).i1) : null;

  const onMove = (e: MouseEvent<HTMLDivElement>) => {
    if (!layout) return;
    const box = e.currentTarget.getBoundingClientRect();
    const p = pointAtPixel(layout, e.clientX - box.left, e.clientY - box.top);
    setCursor(p >= 0 ? p : null);
  };
  const onKey = (e: KeyboardEvent<HTMLDivElement>) => {
    const start = cursor ?? 0;
    const { i0, i1 } = cellOf(start, n1);
    const moves: Record<string, [number, number]> = { ArrowLeft: [-1, 0], ArrowRight: [1, 0], ArrowUp: [0, 1], ArrowDown: [0, -1] };
    let next: number | null = start;
    if (e.key in moves && cursor !== null) {
      const [d0, d1] = moves[e.key]!;
      next = pointOf(Math.min(n0 - 1, Math.max(0, i0 + d0)), Math.min(n1 - 1, Math.max(0, i1 + d1)), n1);
    } else if (e.key === "Home") next = 0;
    else if (e.key === "End") next = n0 * n1 - 1;
    else if (e.key === "Escape") next = null;
    else if (!(e.key in moves)) return;
    e.preventDefault();
    setCursor(next);
  };

  return (
    <figure
      data-testid="colour-map"
      data-figure-min={shown?.min ?? ""}
      data-figure-max={shown?.max ?? ""}
      data-figure-unit={output.unit}
      data-points={run.plan.count}
      data-draw-ms={drawMs === null ? "" : drawMs.toFixed(1)}
      className="min-w-0"
    >
      <figcaption className="mb-1 text-xs font-semibold text-muted">{mapCaption(run, output)}</figcaption>
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
        style={{ height: HEIGHT }}
      >
        <canvas ref={canvasRef} className="absolute inset-0" aria-hidden="true" />
        {layout ? (
          <svg width={width} height={HEIGHT} className="absolute inset-0" aria-hidden="true">
            <MapAxes layout={layout} x={{ label: a0.label, unit: a0.unit, values: xs }} y={{ label: a1.label, unit: a1.unit, values: ys }} />
            {showBase ? (
              <g data-testid="colour-map-revision">
                <RevisionMark x={baseXY[0]!} y={baseXY[1]!} />
                <text x={baseXY[0]! + 10} y={baseXY[1]! - 8} fontSize={11} fontWeight={600} fill="#22262a" stroke="#ffffff" strokeWidth={3} paintOrder="stroke">
                  this revision
                </text>
              </g>
            ) : null}
            {cursorRect ? <rect x={cursorRect.x} y={cursorRect.y} width={cursorRect.w} height={cursorRect.h} fill="none" stroke="#8c4a1f" strokeWidth={2} /> : null}
          </svg>
        ) : null}
      </div>
      <p id={readoutId} className="num mt-1 min-h-5 text-xs text-ink" aria-live="polite" data-testid="colour-map-readout">
        {cursor !== null ? pointReadout(run, cursor, [output]) : "Point at a cell, or focus the map and use the arrow keys, to read a point."}
      </p>
      <MapLegend label={output.label} unit={output.unit} range={shown} counts={counts} revision={Boolean(showBase)} outlines />
    </figure>
  );
}
