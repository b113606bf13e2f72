"use client";

import { CartesianGrid, Label, Line, LineChart, ReferenceDot, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import { fmtQuantity, sig } from "@/lib/format";
import type { CoatCurve } from "./coat-curve";

interface CoatPlotProps {
  curve: CoatCurve;
}

const INK = "#22262a";
const MUTED = "#5d6268";
const TARGET = "#8c4a1f";

const xText = (c: CoatCurve, x: number) => fmtQuantity(x, c.xUnit, c.axis === "dip" ? 3 : 4);

/**
 * Dry thickness against withdrawal or spin speed, with the chosen point (a
 * filled dot) and the target (a dashed line and a ring) marked. Shapes and
 * dashes, not colour alone, tell them apart, so it reads in grey; a summary
 * and a small table of figures serve screen readers.
 */
export function CoatPlot({ curve }: CoatPlotProps) {
  const { chosen, target } = curve;
  const yMax = Math.max(...curve.points.map((p) => p.dryNm), target?.dryNm ?? 0) * 1.08;
  const summary =
    `Dry thickness against ${curve.xLabel.toLowerCase()}: ${fmtQuantity(chosen.dryNm, "nm", 3)} at the chosen ${xText(curve, chosen.x)}` +
    (target ? `; target ${fmtQuantity(target.dryNm, "nm", 3)} reached at ${xText(curve, target.x)}` : "; no target set") +
    (curve.caLimitX !== undefined ? `; above ${xText(curve, curve.caLimitX)} the capillary number exceeds 0.01 and the prediction is less reliable` : "") +
    ".";
  const tableRows = [curve.points[0]!, curve.points[Math.floor(curve.points.length / 2)]!, curve.points.at(-1)!];
  return (
    <figure className="min-w-0" data-testid="coat-plot">
      <figcaption className="mb-1 text-xs font-semibold text-muted">
        Dry thickness (nm) against {curve.xLabel.toLowerCase()} ({curve.xUnit}), this sol
      </figcaption>
      <div className="h-56 w-full" role="img" aria-label={summary}>
        <ResponsiveContainer width="100%" height="100%">
          <LineChart data={curve.points} margin={{ top: 8, right: 16, left: 4, bottom: 16 }}>
            <CartesianGrid stroke="#d9d6cc" strokeDasharray="2 3" />
            <XAxis
              dataKey="x"
              type="number"
              domain={["dataMin", "dataMax"]}
              tickFormatter={(v: number) => sig(v, 3)}
              tick={{ fontSize: 11, fill: MUTED }}
            >
              <Label value={`${curve.xLabel.toLowerCase()} (${curve.xUnit})`} position="insideBottom" offset={-8} style={{ fontSize: 11, fill: MUTED }} />
            </XAxis>
            <YAxis type="number" domain={[0, Math.ceil(yMax)]} tickFormatter={(v: number) => sig(v, 3)} unit=" nm" tick={{ fontSize: 11, fill: MUTED }} width={64} />
            <Tooltip formatter={(v) => [fmtQuantity(Number(v), "nm", 3), "dry thickness"]} labelFormatter={(l) => xText(curve, Number(l))} />
            {curve.caLimitX !== undefined ? (
              <ReferenceLine x={curve.caLimitX} stroke={MUTED} strokeDasharray="1 3">
                <Label value="Ca = 0.01" position="insideTopRight" style={{ fontSize: 10, fill: MUTED }} />
              </ReferenceLine>
            ) : null}
            {target ? (
              <ReferenceLine y={target.dryNm} stroke={TARGET} strokeDasharray="6 4">
                <Label value={`target ${fmtQuantity(target.dryNm, "nm", 3)}`} position="insideTopLeft" style={{ fontSize: 10, fill: TARGET }} />
              </ReferenceLine>
            ) : null}
            <Line type="monotone" dataKey="dryNm" stroke={INK} strokeWidth={2} dot={false} isAnimationActive={false} />
            {target ? (
              <ReferenceDot x={target.x} y={target.dryNm} r={6} fill="#ffffff" stroke={TARGET} strokeWidth={2} ifOverflow="extendDomain" className="coat-target-dot" />
            ) : null}
            <ReferenceDot x={chosen.x} y={chosen.dryNm} r={5} fill={INK} stroke={INK} ifOverflow="extendDomain" className="coat-chosen-dot" />
          </LineChart>
        </ResponsiveContainer>
      </div>
      <p className="mt-1 flex flex-wrap gap-x-4 text-xs">
        <span data-testid="coat-plot-chosen">
          <span aria-hidden="true">● </span>chosen: {fmtQuantity(chosen.dryNm, "nm", 3)} at {xText(curve, chosen.x)}
        </span>
        {target ? (
          <span data-testid="coat-plot-target">
            <span aria-hidden="true">○ </span>target: {fmtQuantity(target.dryNm, "nm", 3)} at {xText(curve, target.x)}
          </span>
        ) : null}
      </p>
      <table className="sr-only">
        <caption>Dry thickness at three speeds along the curve</caption>
        <thead>
          <tr>
            <th scope="col">
              {curve.xLabel} ({curve.xUnit})
            </th>
            <th scope="col">Dry thickness (nm)</th>
          </tr>
        </thead>
        <tbody>
          {tableRows.map((p) => (
            <tr key={p.x}>
              <td>{sig(p.x, 3)}</td>
              <td>{sig(p.dryNm, 3)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </figure>
  );
}
