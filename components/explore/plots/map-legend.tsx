"use client";

import { useId, type ReactNode } from "react";
import { sig } from "@/lib/format";
import { SCALE_ANCHORS, type FigureRange } from "./colour-scale";
import { OVERLAY_DARK, OVERLAY_LIGHT, PATTERN_TILE, REFUSED_DOT, REFUSED_FILL } from "./overlay-patterns";
import { niceTicks, tickText } from "./ticks";
import { withUnit } from "./display";

interface MapLegendProps {
  /** The figure's words and unit. */
  label: string;
  unit: string;
  /** Shown range of the figure (×100 already applied for percent figures); null when no point has a value. */
  range: FigureRange | null;
  counts: { caution: number; fail: number; refused: number };
  /** The revision's own point is on the map. */
  revision: boolean;
  /** The map outlines the caution (dashed) and fail (solid) regions as well as hatching them. */
  outlines?: boolean;
}

const BAR_W = 240;
const BAR_H = 12;

function Hatch({ id, cross }: { id: string; cross: boolean }) {
  const s = PATTERN_TILE;
  const lines = (rising: boolean) => (
    <>
      <path d={rising ? `M0 ${s} L${s} 0` : `M0 0 L${s} ${s}`} stroke={OVERLAY_DARK} strokeWidth={1} />
      <path d={rising ? `M1.2 ${s} L${s + 1.2} 0` : `M1.2 0 L${s + 1.2} ${s}`} stroke={OVERLAY_LIGHT} strokeWidth={1} />
    </>
  );
  return (
    <pattern id={id} width={s} height={s} patternUnits="userSpaceOnUse">
      <rect width={s} height={s} fill="#8fa3a8" />
      {lines(true)}
      {cross ? lines(false) : null}
    </pattern>
  );
}

function Swatch({ fill, children }: { fill: string; children: ReactNode }) {
  return (
    <span className="inline-flex items-center gap-1.5">
      <svg width={18} height={14} aria-hidden="true" className="shrink-0">
        <rect x={0.5} y={0.5} width={17} height={13} fill={fill} stroke="#22262a" strokeWidth={1} />
      </svg>
      {children}
    </span>
  );
}

/**
 * Colour scale bar with its figures and unit, and the key to the overlays
 * (caution hatch, fail cross-hatch, refused dots, the revision's mark).
 */
export function MapLegend({ label, unit, range, counts, revision, outlines = false }: MapLegendProps) {
  const id = useId().replace(/:/g, "");
  const ticks = range ? niceTicks(range.min, range.max, 4) : null;
  const span = range ? range.max - range.min : 0;
  const at = (v: number) => (range && span > 0 ? ((v - range.min) / span) * BAR_W : BAR_W / 2);
  return (
    <div className="mt-2 flex flex-wrap items-start gap-x-6 gap-y-2 text-xs text-muted">
      <div>
        <p className="mb-0.5 font-semibold">{withUnit(label, unit)}</p>
        {range ? (
          <svg width={BAR_W + 24} height={BAR_H + 18} aria-hidden="true" className="num overflow-visible">
            <defs>
              <linearGradient id={`${id}-scale`} x1="0" x2="1" y1="0" y2="0">
                {SCALE_ANCHORS.map((c, i) => (
                  <stop key={i} offset={i / (SCALE_ANCHORS.length - 1)} stopColor={`rgb(${c[0]} ${c[1]} ${c[2]})`} />
                ))}
              </linearGradient>
            </defs>
            <rect x={12} y={0} width={BAR_W} height={BAR_H} fill={`url(#${id}-scale)`} stroke="#22262a" strokeWidth={0.5} />
            {(span > 0 ? ticks!.values : [range.min]).map((v) => (
              <g key={v} transform={`translate(${12 + at(v)},0)`}>
                <line y1={BAR_H} y2={BAR_H + 4} stroke="#5d6268" />
                <text y={BAR_H + 14} textAnchor="middle" fill="#5d6268" fontSize={10}>
                  {span > 0 ? tickText(v, ticks!.decimals) : sig(v, 4)}
                </text>
              </g>
            ))}
          </svg>
        ) : (
          <p>No point has this figure.</p>
        )}
      </div>
      <div className="flex flex-wrap items-center gap-x-4 gap-y-1 pt-4">
        <svg width={0} height={0} aria-hidden="true" className="absolute">
          <defs>
            <Hatch id={`${id}-caution`} cross={false} />
            <Hatch id={`${id}-fail`} cross />
            <pattern id={`${id}-refused`} width={PATTERN_TILE} height={PATTERN_TILE} patternUnits="userSpaceOnUse">
              <rect width={PATTERN_TILE} height={PATTERN_TILE} fill={REFUSED_FILL} />
              <circle cx={2} cy={2} r={0.9} fill={REFUSED_DOT} />
              <circle cx={6} cy={6} r={0.9} fill={REFUSED_DOT} />
            </pattern>
          </defs>
        </svg>
        <Swatch fill={`url(#${id}-caution)`}>caution{outlines ? ", dashed outline" : ""} ({counts.caution})</Swatch>
        <Swatch fill={`url(#${id}-fail)`}>fails the thermal check{outlines ? ", solid outline" : ""} ({counts.fail})</Swatch>
        <Swatch fill={`url(#${id}-refused)`}>refused by the engine ({counts.refused})</Swatch>
        {revision ? (
          <span className="inline-flex items-center gap-1.5">
            <svg width={16} height={16} aria-hidden="true">
              <RevisionMark x={8} y={8} />
            </svg>
            this revision
          </span>
        ) : null}
      </div>
    </div>
  );
}

/** The revision's mark: a white diamond with a dark rim and a dark centre dot (reads on every colour). */
export function RevisionMark({ x, y }: { x: number; y: number }) {
  return (
    <g transform={`translate(${x},${y})`}>
      <path d="M0 -7 L7 0 L0 7 L-7 0 Z" fill="#ffffff" stroke="#22262a" strokeWidth={1.5} />
      <circle r={2} fill="#22262a" />
    </g>
  );
}
