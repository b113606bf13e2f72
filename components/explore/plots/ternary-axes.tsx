"use client";

import { ternaryPixel, type TernaryLayout } from "./draw-ternary";
import { CORNERS, gridline } from "./ternary";
import { niceTicks, tickText } from "./ticks";

interface TernaryAxesProps {
  layout: TernaryLayout;
  labels: [string, string, string];
}

const MUTED = "#5d6268";

/**
 * Gridlines of constant share with their figures (% of the three components'
 * shared total) and the components' names at the corners: component 0's
 * figures on the left edge, component 1's on the bottom edge, component 2's on
 * the right edge.
 */
export function TernaryAxes({ layout, labels }: TernaryAxesProps) {
  const ticks = niceTicks(0, 100, layout.side > 320 ? 10 : 5);
  const inner = ticks.values.filter((v) => v > 0 && v < 100);
  // Which end of each gridline carries its figure, and the figure's offset outwards (px).
  const ends: { end: 0 | 1; dx: number; dy: number; anchor: "end" | "middle" | "start" }[] = [
    { end: 0, dx: -6, dy: 0, anchor: "end" },
    { end: 1, dx: 0, dy: 14, anchor: "middle" },
    { end: 0, dx: 6, dy: 0, anchor: "start" },
  ];
  const corner = (k: number) => ternaryPixel(layout, CORNERS[k]![0], CORNERS[k]![1]);
  const [tx, ty] = corner(0);
  const [lx, ly] = corner(1);
  const [rx, ry] = corner(2);
  return (
    <g className="num" fontSize={10} fill={MUTED} data-testid="ternary-axes">
      {([0, 1, 2] as const).map((k) =>
        inner.map((v) => {
          const line = gridline(k, v / 100);
          const [x1, y1] = ternaryPixel(layout, ...line[0]);
          const [x2, y2] = ternaryPixel(layout, ...line[1]);
          const e = ends[k]!;
          const [ex, ey] = e.end === 0 ? [x1, y1] : [x2, y2];
          return (
            <g key={`${k}-${v}`}>
              <line x1={x1} y1={y1} x2={x2} y2={y2} stroke="rgba(34,38,42,0.28)" strokeWidth={0.75} />
              <text x={ex + e.dx} y={ey + e.dy} dy={e.dy ? 0 : "0.32em"} textAnchor={e.anchor}>
                {tickText(v, ticks.decimals)}
              </text>
            </g>
          );
        }),
      )}
      <g fontSize={11} fontWeight={600} fill="#22262a">
        <text x={tx} y={ty - 8} textAnchor="middle">
          {labels[0]} (100 %)
        </text>
        <text x={lx} y={ly + 30} textAnchor="start">
          {labels[1]} (100 %)
        </text>
        <text x={rx} y={ry + 30} textAnchor="end">
          {labels[2]} (100 %)
        </text>
      </g>
    </g>
  );
}
