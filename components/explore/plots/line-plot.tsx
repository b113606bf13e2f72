"use client";

import { useId, useMemo, useState, type KeyboardEvent } from "react";
import { CartesianGrid, Label, Line, LineChart, ReferenceArea, ReferenceLine, ResponsiveContainer, XAxis, YAxis } from "recharts";
import type { ExplorationRun, OutputInfo } from "@/lib/explore/types";
import { axisFactor, placeText, STATUS_WORDS, valueText, withUnit } from "./display";
import { crossings, lineRows, thinRows, unitGroups } from "./line-data";
import { BandPatterns, SERIES, SeriesKey } from "./line-parts";
import { lineSummary, pointReadout, shownRange } from "./summaries";
import { thermalBands } from "./thermal-bands";
import { niceTicks, paddedTicks, tickText } from "./ticks";

export interface LinePlotProps {
  run: ExplorationRun;
  outputs: OutputInfo[];
  /** A level to compare with, drawn as a horizontal line in the first figure's panel (e.g. the substrate's refractive index). */
  reference?: { value: number; label: string };
}

const INK = "#22262a";
const MUTED = "#5d6268";
const ACCENT = "#8c4a1f";
/** Words inside a band: the full words when they fit, else the short ones, else none (the key below names every band). */
/** Most rows a panel draws (a few per pixel of a wide plot). */
const MAX_DRAWN = 1600;

const BAND_WORDS: Record<string, [string, string]> = { caution: ["caution", "caution"], fail: ["fails the thermal check", "fails"], refused: ["refused", "refused"] };

function bandLabel(status: string) {
  function BandLabel(props: { viewBox?: unknown }) {
    const box = props.viewBox as { x?: number; y?: number; width?: number } | undefined;
    const words = BAND_WORDS[status];
    if (!box || !words || box.x === undefined || box.y === undefined || box.width === undefined) return <g />;
    // About 5.5 px a character at 10 px.
    const text = words.find((w) => w.length * 5.5 + 6 <= box.width!);
    if (!text) return <g />;
    return (
      <text x={box.x + box.width / 2} y={box.y + 12} textAnchor="middle" fontSize={10} fill={INK} stroke="#ffffff" strokeWidth={3} paintOrder="stroke">
        {text}
      </text>
    );
  }
  return BandLabel;
}

/**
 * A one-variable sweep: each figure against the variable, figures of one unit
 * per panel, the thermal verdict as labelled, patterned x-bands, refused
 * points as gaps, the revision as a labelled vertical line and an optional
 * reference level. Focus it and use ←/→ (Home/End) to read a point.
 */
export function LinePlot({ run, outputs, reference }: LinePlotProps) {
  const id = useId().replace(/:/g, "");
  const [cursor, setCursor] = useState<number | null>(null);
  const axis = run.plan.axes[0];
  const rows = useMemo(() => lineRows(run, outputs), [run, outputs]);
  const xs = useMemo(() => rows.map((r) => r.x), [rows]);
  // A long sweep draws a thinned copy (same shape, gaps kept); readouts use every point.
  const drawn = useMemo(() => thinRows(rows, outputs.length, MAX_DRAWN), [rows, outputs.length]);
  const bands = useMemo(() => thermalBands(xs, run.status, ["caution", "fail", "refused"]), [xs, run.status]);
  if (!axis || rows.length === 0 || outputs.length === 0) {
    return (
      <figure data-testid="line-plot" className="min-w-0">
        <p className="text-sm text-muted">A line plot needs a sweep of one variable and at least one figure.</p>
      </figure>
    );
  }
  const fx = axisFactor(axis);
  const xLow = Math.min(...xs);
  const xHigh = Math.max(...xs);
  const xt = niceTicks(xLow, xHigh, 6);
  // Half the narrowest band drawn (about 2 px on a wide plot), so a lone point's verdict stays visible.
  const minBand = (xHigh - xLow) / 800;
  const baseX = run.plan.base?.[0] !== undefined ? run.plan.base[0] * fx : undefined;
  const groups = unitGroups(outputs);
  const ranges = outputs.map((o) => ({ key: o.key, unit: o.unit, ...(shownRange(run, o) ?? { min: null, max: null }) }));
  const first = ranges[0]!;
  const crossAt = reference ? crossings(xs, rows.map((r) => r.y0 ?? null), reference.value) : [];
  const crossText = reference
    ? crossAt.length
      ? ` ${outputs[0]!.label} crosses ${reference.label} at ${crossAt.map((x) => placeText(x, axis.unit, 3)).join(", ")}.`
      : ` ${outputs[0]!.label} does not cross ${reference.label}.`
    : "";
  const summary = lineSummary(run, outputs, reference) + crossText;
  const increasing = axis.values.length < 2 || axis.values[0]! <= axis.values.at(-1)!;

  const onKey = (e: KeyboardEvent<HTMLDivElement>) => {
    const n = rows.length;
    const dir = e.key === "ArrowRight" || e.key === "ArrowUp" ? 1 : e.key === "ArrowLeft" || e.key === "ArrowDown" ? -1 : 0;
    let next: number | null;
    if (dir) next = cursor === null ? (increasing ? 0 : n - 1) : Math.min(n - 1, Math.max(0, cursor + (increasing ? dir : -dir)));
    else if (e.key === "Home") next = increasing ? 0 : n - 1;
    else if (e.key === "End") next = increasing ? n - 1 : 0;
    else if (e.key === "Escape") next = null;
    else return;
    e.preventDefault();
    setCursor(next);
  };

  return (
    <figure
      data-testid="line-plot"
      data-figure-min={first.min ?? ""}
      data-figure-max={first.max ?? ""}
      data-figure-unit={first.unit}
      data-ranges={JSON.stringify(ranges)}
      data-crossings={crossAt.join(" ")}
      data-points={run.plan.count}
      className="min-w-0"
    >
      <figcaption className="mb-1 text-xs font-semibold text-muted">
        {outputs.map((o) => withUnit(o.label, o.unit)).join(", ")} against {withUnit(axis.label, axis.unit)}
      </figcaption>
      <BandPatterns id={id} />
      <div
        tabIndex={0}
        role="group"
        aria-label={summary}
        aria-describedby={`${id}-readout`}
        onKeyDown={onKey}
        onMouseLeave={() => setCursor(null)}
        className="rounded bg-panel"
      >
        {groups.map((g, gi) => {
          const own = g.members.some((m) => m.index === 0);
          const lo = Math.min(...g.members.map((m) => ranges[m.index]!.min ?? Infinity), own && reference ? reference.value : Infinity);
          const hi = Math.max(...g.members.map((m) => ranges[m.index]!.max ?? -Infinity), own && reference ? reference.value : -Infinity);
          const yt = paddedTicks(lo, hi, 5);
          const last = gi === groups.length - 1;
          return (
            <div key={g.unit || "plain"} className={last ? "h-64 w-full" : "h-52 w-full"} data-testid="line-plot-panel">
              <ResponsiveContainer width="100%" height="100%">
                <LineChart
                  data={drawn}
                  margin={{ top: 14, right: 16, left: 4, bottom: last ? 20 : 4 }}
                  accessibilityLayer={false}
                  onMouseMove={(state) => {
                    const i = state?.activeTooltipIndex;
                    setCursor(i === undefined || i === null ? null : (drawn[Number(i)]?.p ?? null));
                  }}
                >
                  <CartesianGrid stroke="#d9d6cc" strokeDasharray="2 3" />
                  <XAxis
                    dataKey="x"
                    type="number"
                    domain={[xLow, xHigh]}
                    ticks={xt.values}
                    tickFormatter={(v: number) => tickText(v, xt.decimals)}
                    tick={last ? { fontSize: 11, fill: MUTED } : false}
                    height={last ? 30 : 4}
                    allowDataOverflow
                  >
                    {last ? <Label value={withUnit(axis.label, axis.unit)} position="insideBottom" offset={-12} style={{ fontSize: 11, fill: MUTED }} /> : null}
                  </XAxis>
                  <YAxis type="number" domain={yt.domain} ticks={yt.values} tickFormatter={(v: number) => tickText(v, yt.decimals)} tick={{ fontSize: 11, fill: MUTED }} width={64}>
                    <Label value={g.members.length === 1 ? withUnit(g.members[0]!.info.label, g.unit) : g.unit || "value"} angle={-90} position="insideLeft" offset={2} style={{ fontSize: 11, fill: MUTED, textAnchor: "middle" }} />
                  </YAxis>
                  {bands.map((b) => (
                    <ReferenceArea
                      key={`${b.status}-${b.first}`}
                      x1={Math.min(b.from, (b.from + b.to) / 2 - minBand)}
                      x2={Math.max(b.to, (b.from + b.to) / 2 + minBand)}
                      fill={`url(#${id}-${b.status})`}
                      fillOpacity={1}
                      ifOverflow="hidden"
                    >
                      {gi === 0 ? <Label content={bandLabel(b.status)} /> : null}
                    </ReferenceArea>
                  ))}
                  {own && reference ? (
                    <ReferenceLine y={reference.value} stroke={ACCENT} strokeDasharray="8 4" strokeWidth={1.5}>
                      <Label value={`${reference.label} ${valueText(reference.value, g.unit)}`} position="insideBottomLeft" style={{ fontSize: 10, fill: ACCENT }} />
                    </ReferenceLine>
                  ) : null}
                  {baseX !== undefined ? (
                    <ReferenceLine x={baseX} stroke={INK} strokeWidth={1.5} strokeDasharray="1 2">
                      {gi === 0 ? <Label value={`this revision ${placeText(baseX, axis.unit, 3)}`} position="insideTopLeft" offset={4} style={{ fontSize: 10, fill: INK }} /> : null}
                    </ReferenceLine>
                  ) : null}
                  {cursor !== null && rows[cursor] ? <ReferenceLine x={rows[cursor]!.x} stroke={ACCENT} strokeWidth={1} /> : null}
                  {g.members.map((m) => {
                    const s = SERIES[m.index % SERIES.length]!;
                    return (
                      <Line
                        key={m.info.key}
                        type="linear"
                        dataKey={`y${m.index}`}
                        name={m.info.label}
                        stroke={s.stroke}
                        strokeDasharray={s.dash}
                        strokeWidth={2}
                        dot={rows.length <= 60 ? { r: 2.5, fill: s.stroke, strokeWidth: 0 } : false}
                        activeDot={false}
                        connectNulls={false}
                        isAnimationActive={false}
                      />
                    );
                  })}
                </LineChart>
              </ResponsiveContainer>
            </div>
          );
        })}
      </div>
      <p id={`${id}-readout`} className="num mt-1 min-h-5 text-xs text-ink" aria-live="polite" data-testid="line-plot-readout">
        {cursor !== null ? pointReadout(run, rows[cursor]?.p ?? cursor, outputs) : "Point at the plot, or focus it and use ← and →, to read a point."}
      </p>
      <SeriesKey id={id} outputs={outputs} reference={reference} revision={baseX !== undefined} bands={bands.map((b) => b.status)} words={STATUS_WORDS} />
    </figure>
  );
}
