"use client";

import type { OutputInfo, PointStatus } from "@/lib/explore/types";
import { withUnit } from "./display";

/** Line styles: colour and dash differ, so the lines part in grey too. */
export const SERIES: readonly { stroke: string; dash?: string }[] = [
  { stroke: "#22262a" },
  { stroke: "#3d5a80", dash: "7 3" },
  { stroke: "#6a4c93", dash: "2 3" },
  { stroke: "#2d6a3e", dash: "9 3 2 3" },
  { stroke: "#8a5b00", dash: "4 2" },
];

const BAND_FILL: Record<"caution" | "fail" | "refused", string> = {
  caution: "#fbf0d6",
  fail: "#f8e1e1",
  refused: "#ecebe6",
};

/**
 * The fills of the thermal bands, as SVG patterns other SVGs of the page use
 * by id: caution a soft hatch, fail a soft cross-hatch, refused plain grey.
 */
export function BandPatterns({ id }: { id: string }) {
  const hatch = (cross: boolean) => (
    <>
      <path d="M0 8 L8 0 M-2 2 L2 -2 M6 10 L10 6" stroke="#8a7a5a" strokeOpacity={0.45} strokeWidth={1} />
      {cross ? <path d="M0 0 L8 8 M-2 6 L2 10 M6 -2 L10 2" stroke="#8a5a5a" strokeOpacity={0.45} strokeWidth={1} /> : null}
    </>
  );
  return (
    <svg width={0} height={0} aria-hidden="true" className="absolute">
      <defs>
        {(["caution", "fail", "refused"] as const).map((k) => (
          <pattern key={k} id={`${id}-${k}`} width={8} height={8} patternUnits="userSpaceOnUse">
            <rect width={8} height={8} fill={BAND_FILL[k]} />
            {k === "refused" ? null : hatch(k === "fail")}
          </pattern>
        ))}
      </defs>
    </svg>
  );
}

interface SeriesKeyProps {
  id: string;
  outputs: OutputInfo[];
  reference?: { value: number; label: string };
  revision: boolean;
  bands: PointStatus[];
  words: Record<PointStatus, string>;
}

/** The key below a line plot: each line's style and name with its unit, the reference, the revision and the bands shown. */
export function SeriesKey({ id, outputs, reference, revision, bands, words }: SeriesKeyProps) {
  const line = (stroke: string, dash?: string, width = 2) => (
    <svg width={28} height={10} aria-hidden="true" className="shrink-0">
      <line x1={1} x2={27} y1={5} y2={5} stroke={stroke} strokeDasharray={dash} strokeWidth={width} />
    </svg>
  );
  const shown = (["caution", "fail", "refused"] as const).filter((s) => bands.includes(s));
  return (
    <ul className="mt-1 flex flex-wrap gap-x-4 gap-y-1 text-xs text-muted">
      {outputs.map((o, i) => {
        const s = SERIES[i % SERIES.length]!;
        return (
          <li key={o.key} className="inline-flex items-center gap-1.5">
            {line(s.stroke, s.dash)}
            {withUnit(o.label, o.unit)}
          </li>
        );
      })}
      {reference ? (
        <li className="inline-flex items-center gap-1.5">
          {line("#8c4a1f", "8 4", 1.5)}
          {reference.label}
        </li>
      ) : null}
      {revision ? (
        <li className="inline-flex items-center gap-1.5">
          {line("#22262a", "1 2", 1.5)}
          this revision
        </li>
      ) : null}
      {shown.map((s) => (
        <li key={s} className="inline-flex items-center gap-1.5">
          <svg width={18} height={12} aria-hidden="true">
            <rect x={0.5} y={0.5} width={17} height={11} fill={`url(#${id}-${s})`} stroke="#5d6268" strokeWidth={0.5} />
          </svg>
          {s === "refused" ? "refused by the engine (gap in the lines)" : words[s]}
        </li>
      ))}
    </ul>
  );
}
