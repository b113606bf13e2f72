"use client";

import { axisPixel, type MapLayout } from "./map-layout";
import { niceTicks, tickText } from "./ticks";
import { withUnit } from "./display";

interface MapAxesProps {
  layout: MapLayout;
  /** Shown values (×100 for fractions) of variable 0 (across) and variable 1 (up). */
  x: { label: string; unit: string; values: number[] };
  y: { label: string; unit: string; values: number[] };
}

const MUTED = "#5d6268";

function lowHigh(values: number[]): [number, number] {
  return [Math.min(...values), Math.max(...values)];
}

/** Ticks, tick figures and titles (with units) of a map's two axes, drawn in SVG over the canvas. */
export function MapAxes({ layout, x, y }: MapAxesProps) {
  const xt = niceTicks(...lowHigh(x.values), Math.max(2, Math.floor(layout.width / 72)));
  const yt = niceTicks(...lowHigh(y.values), Math.max(2, Math.floor(layout.height / 40)));
  const bottom = layout.top + layout.height;
  return (
    <g className="num" fontSize={11} fill={MUTED} data-testid="map-axes">
      {xt.values.map((v) => {
        const px = axisPixel(layout, 0, x.values, v);
        if (Number.isNaN(px)) return null;
        return (
          <g key={`x${v}`} transform={`translate(${px},${bottom})`}>
            <line y2={5} stroke={MUTED} />
            <text y={17} textAnchor="middle">
              {tickText(v, xt.decimals)}
            </text>
          </g>
        );
      })}
      {yt.values.map((v) => {
        const py = axisPixel(layout, 1, y.values, v);
        if (Number.isNaN(py)) return null;
        return (
          <g key={`y${v}`} transform={`translate(${layout.left},${py})`}>
            <line x2={-5} stroke={MUTED} />
            <text x={-8} dy="0.32em" textAnchor="end">
              {tickText(v, yt.decimals)}
            </text>
          </g>
        );
      })}
      <text x={layout.left + layout.width / 2} y={bottom + 36} textAnchor="middle" fontWeight={600}>
        {withUnit(x.label, x.unit)}
      </text>
      <text transform={`translate(14,${layout.top + layout.height / 2}) rotate(-90)`} textAnchor="middle" fontWeight={600}>
        {withUnit(y.label, y.unit)}
      </text>
    </g>
  );
}
