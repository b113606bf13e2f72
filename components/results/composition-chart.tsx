"use client";

import { Bar, BarChart, CartesianGrid, Legend, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";

interface CompositionChartProps {
  phases: { materialId: string; label: string; weightFraction: number; volumeFraction: number }[];
}

const pct = (x: number) => Number((x * 100).toFixed(2));

/** Weight versus volume fraction of each dry phase. */
export function CompositionChart({ phases }: CompositionChartProps) {
  const data = phases.map((p) => ({ name: p.label.split(" from ")[0], full: p.label, weight: pct(p.weightFraction), volume: pct(p.volumeFraction) }));
  return (
    <figure className="min-w-0">
      <figcaption className="mb-1 text-xs font-semibold text-muted">Composition: weight vs volume fraction (%)</figcaption>
      <div className="h-48 w-full" role="img" aria-label={data.map((d) => `${d.full}: ${d.weight} wt%, ${d.volume} vol%`).join("; ")}>
        <ResponsiveContainer width="100%" height="100%">
          <BarChart data={data} margin={{ top: 4, right: 8, left: 0, bottom: 4 }}>
            <CartesianGrid stroke="#d9d6cc" strokeDasharray="2 3" vertical={false} />
            <XAxis dataKey="name" tick={{ fontSize: 11, fill: "#5d6268" }} interval={0} />
            <YAxis unit=" %" tick={{ fontSize: 11, fill: "#5d6268" }} width={48} domain={[0, 100]} />
            <Tooltip formatter={(v, name) => [`${v} %`, name === "weight" ? "Weight fraction" : "Volume fraction"]} />
            <Legend formatter={(v) => (v === "weight" ? "Weight fraction" : "Volume fraction")} wrapperStyle={{ fontSize: 12 }} />
            <Bar dataKey="weight" fill="#8c4a1f" isAnimationActive={false} />
            <Bar dataKey="volume" fill="#6f8a9c" isAnimationActive={false} />
          </BarChart>
        </ResponsiveContainer>
      </div>
    </figure>
  );
}
