"use client";

import { CartesianGrid, Line, LineChart, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import { RUN_RULE_WORDS, type IMRChart, type RunRule } from "@/lib/quality/control-chart";

export interface ControlChartViewProps {
  /** Heading of the chart, e.g. "Solids content" or "GPTMS weighing deviation". */
  title: string;
  unit: string;
  /** Batch dates (ISO 8601), one per point, in order. */
  dates: string[];
  chart: IMRChart;
  /** Specification limits and target, drawn apart from the control limits; null when none. */
  lower?: number | null;
  upper?: number | null;
  target?: number | null;
  capability?: { cpk: number; count: number; caution: string } | null;
  /** Out-of-specification marks per point, when known. */
  outOfSpec?: boolean[];
  testId?: string;
}

const fmt = new Intl.NumberFormat("en-GB", { maximumSignificantDigits: 4 });
const f = (x: number) => fmt.format(x);
const day = (iso: string) => iso.slice(0, 10);

/** A point's marker: a circle when in control, a triangle when a run rule flags it (readable in grey). */
function Marker(props: { cx?: number; cy?: number; payload?: { flagged: boolean; index: number } }) {
  const { cx, cy, payload } = props;
  if (cx === undefined || cy === undefined || !payload) return null;
  if (payload.flagged) {
    return <path d={`M${cx},${cy - 6} L${cx + 6},${cy + 5} L${cx - 6},${cy + 5} Z`} fill="#1f1f1f" stroke="#1f1f1f" data-flagged="true" />;
  }
  return <circle cx={cx} cy={cy} r={3} fill="#ffffff" stroke="#3d4a55" strokeWidth={1.5} />;
}

/**
 * Individuals and moving-range charts of one series: centre line and control
 * limits from the data, specification limits drawn apart (dotted, labelled),
 * points flagged by the run rules marked by shape, the limits in words, Cpk
 * with its caution, and the values as a table.
 */
export function ControlChartView({ title, unit, dates, chart, lower = null, upper = null, target = null, capability = null, outOfSpec, testId }: ControlChartViewProps) {
  const u = unit ? ` ${unit}` : "";
  const data = chart.points.map((p) => ({ batch: p.index + 1, value: p.value, mr: p.movingRange, flagged: p.rules.length > 0, index: p.index }));
  const flagged = chart.points.filter((p) => p.rules.length > 0);
  const byRule = new Map<RunRule, number[]>();
  for (const p of flagged) for (const r of p.rules) byRule.set(r, [...(byRule.get(r) ?? []), p.index + 1]);
  const values = chart.points.map((p) => p.value);
  const lo = Math.min(...values, chart.lowerControlLimit, ...(lower !== null ? [lower] : []));
  const hi = Math.max(...values, chart.upperControlLimit, ...(upper !== null ? [upper] : []));
  const pad = (hi - lo) * 0.05 || 1;
  const label = `${title}: individuals chart of ${values.length} batches, centre line ${f(chart.mean)}${u}, control limits ${f(chart.lowerControlLimit)} to ${f(chart.upperControlLimit)}${u}${flagged.length ? `, ${flagged.length} points flagged by run rules` : ", no run rule broken"}.`;
  return (
    <figure className="min-w-0" data-testid={testId}>
      <figcaption className="mb-1 text-sm font-semibold">{title}{unit ? ` (${unit})` : ""}</figcaption>
      <dl className="mb-2 grid grid-cols-2 gap-x-4 gap-y-0.5 text-xs sm:grid-cols-4" data-testid="chart-limits">
        <div><dt className="inline text-muted">Centre line x̄: </dt><dd className="inline">{f(chart.mean)}{u}</dd></div>
        <div><dt className="inline text-muted">Upper control limit: </dt><dd className="inline">{f(chart.upperControlLimit)}{u}</dd></div>
        <div><dt className="inline text-muted">Lower control limit: </dt><dd className="inline">{f(chart.lowerControlLimit)}{u}</dd></div>
        <div><dt className="inline text-muted">σ (MR̄/1.128): </dt><dd className="inline">{f(chart.sigma)}{u}</dd></div>
        <div><dt className="inline text-muted">Mean moving range MR̄: </dt><dd className="inline">{f(chart.meanMovingRange)}{u}</dd></div>
        <div><dt className="inline text-muted">Moving range upper limit: </dt><dd className="inline">{f(chart.movingRangeUpperLimit)}{u}</dd></div>
        {lower !== null || upper !== null ? (
          <div className="col-span-2">
            <dt className="inline text-muted">Specification: </dt>
            <dd className="inline">
              {lower !== null ? `lower ${f(lower)}` : "no lower limit"}, {upper !== null ? `upper ${f(upper)}` : "no upper limit"}
              {target !== null ? `, target ${f(target)}` : ""}
              {u}
            </dd>
          </div>
        ) : null}
      </dl>
      <div className="h-56 w-full" role="img" aria-label={label}>
        <ResponsiveContainer width="100%" height="100%">
          <LineChart data={data} margin={{ top: 8, right: 56, left: 0, bottom: 4 }}>
            <CartesianGrid stroke="#d9d6cc" strokeDasharray="2 3" />
            <XAxis dataKey="batch" tick={{ fontSize: 11, fill: "#5d6268" }} label={{ value: "Batch (in time order)", position: "insideBottom", offset: -2, fontSize: 11 }} height={32} />
            <YAxis tick={{ fontSize: 11, fill: "#5d6268" }} width={56} domain={[lo - pad, hi + pad]} tickFormatter={(v: number) => f(v)} />
            <Tooltip formatter={(v) => [`${f(Number(v))}${u}`, title]} labelFormatter={(b) => `Batch ${b}, ${day(dates[Number(b) - 1] ?? "")}`} />
            <ReferenceLine y={chart.mean} stroke="#3d4a55" strokeWidth={1.5} label={{ value: "CL", position: "right", fontSize: 11 }} />
            <ReferenceLine y={chart.upperControlLimit} stroke="#3d4a55" strokeDasharray="6 3" label={{ value: "UCL", position: "right", fontSize: 11 }} />
            <ReferenceLine y={chart.lowerControlLimit} stroke="#3d4a55" strokeDasharray="6 3" label={{ value: "LCL", position: "right", fontSize: 11 }} />
            {upper !== null ? <ReferenceLine y={upper} stroke="#8c4a1f" strokeDasharray="1 3" strokeWidth={2} label={{ value: "USL (spec)", position: "right", fontSize: 11 }} /> : null}
            {lower !== null ? <ReferenceLine y={lower} stroke="#8c4a1f" strokeDasharray="1 3" strokeWidth={2} label={{ value: "LSL (spec)", position: "right", fontSize: 11 }} /> : null}
            <Line type="linear" dataKey="value" stroke="#6f7a84" strokeWidth={1} dot={<Marker />} isAnimationActive={false} />
          </LineChart>
        </ResponsiveContainer>
      </div>
      <div className="h-28 w-full" role="img" aria-label={`${title}: moving range chart, mean ${f(chart.meanMovingRange)}${u}, upper limit ${f(chart.movingRangeUpperLimit)}${u}.`}>
        <ResponsiveContainer width="100%" height="100%">
          <LineChart data={data} margin={{ top: 4, right: 56, left: 0, bottom: 4 }}>
            <CartesianGrid stroke="#d9d6cc" strokeDasharray="2 3" />
            <XAxis dataKey="batch" tick={{ fontSize: 11, fill: "#5d6268" }} />
            <YAxis tick={{ fontSize: 11, fill: "#5d6268" }} width={56} tickFormatter={(v: number) => f(v)} />
            <ReferenceLine y={chart.meanMovingRange} stroke="#3d4a55" label={{ value: "MR̄", position: "right", fontSize: 11 }} />
            <ReferenceLine y={chart.movingRangeUpperLimit} stroke="#3d4a55" strokeDasharray="6 3" label={{ value: "UCL", position: "right", fontSize: 11 }} />
            <Line type="linear" dataKey="mr" stroke="#6f7a84" strokeWidth={1} dot={{ r: 2 }} isAnimationActive={false} connectNulls={false} />
          </LineChart>
        </ResponsiveContainer>
      </div>
      <p className="mt-1 text-xs text-muted">Circle: in control. Triangle: flagged by a run rule. Dashed: control limits from the data. Dotted: specification limits.</p>
      <div className="mt-2 text-sm" data-testid="run-rules">
        {flagged.length === 0 ? (
          <p>No run rule broken.</p>
        ) : (
          <ul className="list-disc pl-5">
            {[...byRule.entries()].map(([rule, batches]) => (
              <li key={rule}>
                Flagged: {RUN_RULE_WORDS[rule]} — batch{batches.length > 1 ? "es" : ""} {batches.join(", ")}
              </li>
            ))}
          </ul>
        )}
      </div>
      {capability ? (
        <p className="mt-2 text-sm" data-testid="cpk">
          Cpk = {capability.cpk.toFixed(2)} from {capability.count} results. <span className="text-muted">{capability.caution}</span>
        </p>
      ) : lower !== null || upper !== null ? (
        <p className="mt-2 text-xs text-muted">Cpk is shown from 25 results on ({values.length} so far).</p>
      ) : null}
      <details className="mt-2 text-sm">
        <summary className="cursor-pointer">Values as a table</summary>
        <table className="mt-1 text-xs">
          <caption className="sr-only">{label}</caption>
          <thead>
            <tr>
              <th scope="col" className="pr-3 text-left">Batch</th>
              <th scope="col" className="pr-3 text-left">Date</th>
              <th scope="col" className="pr-3 text-right">Value{u}</th>
              <th scope="col" className="pr-3 text-right">Moving range{u}</th>
              <th scope="col" className="text-left">Flags</th>
            </tr>
          </thead>
          <tbody>
            {chart.points.map((p) => (
              <tr key={p.index}>
                <td className="pr-3">{p.index + 1}</td>
                <td className="pr-3">{day(dates[p.index] ?? "")}</td>
                <td className="pr-3 text-right">{f(p.value)}</td>
                <td className="pr-3 text-right">{p.movingRange === null ? "—" : f(p.movingRange)}</td>
                <td>
                  {[...(outOfSpec?.[p.index] ? ["out of specification"] : []), ...p.rules.map((r) => RUN_RULE_WORDS[r])].join("; ") || "—"}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </details>
    </figure>
  );
}
