"use client";

import { CartesianGrid, Label, Line, LineChart, ReferenceArea, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import type { FormulationInput, FormulationResult } from "@/lib/formulation";
import { fmtTemp } from "@/lib/format";
import { LIMIT_LABELS } from "@/components/results/words";
import { stepConditions, thermalRows } from "./thermal-model";

interface ScheduleChartProps {
  input: FormulationInput;
  result: FormulationResult;
}

const LINE_COLOURS = ["#a3262a", "#3d5a80", "#6a4c93", "#2d6a3e", "#8a5b00"];

/** Temperature against cumulative time, with each organic phase's and the substrate's hard limit as a line. */
export function ScheduleChart({ input, result }: ScheduleChartProps) {
  const points: { t: number; T: number; step: string }[] = [];
  const spans: { from: number; to: number; inert: boolean }[] = [];
  let t = 0;
  for (const s of input.steps) {
    const label = `${s.name} (${stepConditions(s)})`;
    points.push({ t: Number(t.toFixed(4)), T: s.temperatureC, step: label });
    const from = t;
    t += Math.max(0, s.durationH);
    points.push({ t: Number(t.toFixed(4)), T: s.temperatureC, step: label });
    spans.push({ from: Number(from.toFixed(4)), to: Number(t.toFixed(4)), inert: s.atmosphere === "inert" });
  }
  const limits = thermalRows(input, result)
    .filter((r) => r.hard)
    .map((r, i) => ({ name: r.name, limit: r.hard!.limit, C: r.hard!.limitC, colour: LINE_COLOURS[i % LINE_COLOURS.length]! }));
  const maxAllowed = result.thermal.maxAllowedC;
  const top = Math.max(...points.map((p) => p.T), ...limits.map((l) => l.C), 50) * 1.1;
  const summary =
    `Process schedule: ${input.steps.map((s) => `${s.name} ${s.temperatureC} °C for ${s.durationH} h (${stepConditions(s)})`).join(", ")}. ` +
    limits.map((l) => `${l.name} ${LIMIT_LABELS[l.limit as keyof typeof LIMIT_LABELS]} ${l.C} °C`).join("; ");
  if (points.length === 0) return <p className="text-sm text-muted">Add process steps to see the schedule.</p>;
  return (
    <figure className="min-w-0">
      <figcaption className="mb-1 text-xs font-semibold text-muted">Process schedule: temperature (°C) against cumulative time (h)</figcaption>
      <div className="h-60 w-full" role="img" aria-label={summary}>
        <ResponsiveContainer width="100%" height="100%">
          <LineChart data={points} margin={{ top: 8, right: 16, left: 0, bottom: 16 }}>
            <CartesianGrid stroke="#d9d6cc" strokeDasharray="2 3" />
            <XAxis dataKey="t" type="number" domain={[0, "dataMax"]} tick={{ fontSize: 11, fill: "#5d6268" }}>
              <Label value="cumulative time (h)" position="insideBottom" offset={-8} style={{ fontSize: 11, fill: "#5d6268" }} />
            </XAxis>
            <YAxis type="number" domain={[0, Math.ceil(top / 10) * 10]} unit=" °C" tick={{ fontSize: 11, fill: "#5d6268" }} width={56} />
            {spans
              .filter((sp) => sp.inert && sp.to > sp.from)
              .map((sp) => (
                <ReferenceArea key={`inert-${sp.from}`} x1={sp.from} x2={sp.to} fill="#3d5a80" fillOpacity={0.08} ifOverflow="visible" />
              ))}
            <Tooltip
              formatter={(v, _n, item) => [`${v} °C`, (item?.payload as { step?: string } | undefined)?.step ?? "Temperature"]}
              labelFormatter={(l) => `${l} h`}
            />
            {limits.map((l) => (
              <ReferenceLine key={l.name} y={l.C} stroke={l.colour} strokeWidth={1.5}>
                <Label value={`${l.name}: ${LIMIT_LABELS[l.limit as keyof typeof LIMIT_LABELS]} ${fmtTemp(l.C)}`} position="insideTopLeft" style={{ fontSize: 10, fill: l.colour }} />
              </ReferenceLine>
            ))}
            {maxAllowed !== undefined ? (
              <ReferenceLine y={maxAllowed} stroke="#8a5b00" strokeDasharray="5 4">
                <Label value={`highest allowed ${fmtTemp(maxAllowed)}`} position="insideBottomRight" style={{ fontSize: 10, fill: "#8a5b00" }} />
              </ReferenceLine>
            ) : null}
            <Line type="linear" dataKey="T" stroke="#22262a" strokeWidth={2} dot={false} isAnimationActive={false} />
          </LineChart>
        </ResponsiveContainer>
      </div>
      <ol className="mt-1 flex flex-wrap gap-x-3 gap-y-0.5 text-xs" data-testid="schedule-steps">
        {input.steps.map((s, i) => (
          <li key={i}>
            <span className="font-medium">
              {i + 1}. {s.name}
            </span>{" "}
            <span className="text-muted">{stepConditions(s)}</span>
          </li>
        ))}
      </ol>
      <p className="mt-1 text-xs text-muted">
        Solid lines: hard limits in air. Dashed: highest allowed step temperature (hard limit less the margin). Shaded: steps under inert gas.
      </p>
    </figure>
  );
}
