import { fmtMass, fmtPercent } from "@/lib/format";
import type { LineDeviationDto } from "./types";

const STATE_STYLE = {
  open: "bg-accent-soft text-accent border-accent/40",
  closed: "bg-paper text-ink border-rule",
} as const;
const STATE_MARK = { open: "◔", closed: "■" } as const;
export const BATCH_STATE_WORDS = { open: "Open, being weighed", closed: "Closed" } as const;

interface BatchStateBadgeProps {
  state: "open" | "closed";
}

/** A batch record's state: a mark, a colour and always its words. */
export function BatchStateBadge({ state }: BatchStateBadgeProps) {
  return (
    <span className={`inline-flex items-center gap-1 rounded border px-1.5 py-0.5 text-xs font-medium whitespace-nowrap ${STATE_STYLE[state]}`}>
      <span aria-hidden="true">{STATE_MARK[state]}</span>
      {BATCH_STATE_WORDS[state]}
    </span>
  );
}

/**
 * Deviation of an actual mass from target, for the live display while typing:
 * |actual − target| beyond max(tolerance × target, balance resolution) is
 * outside. The server's figure (lib/spreadsheet/batch-record.ts, in decimal
 * arithmetic) replaces this one once the line is saved.
 */
export function liveDeviation(targetGrams: number, actualGrams: number, toleranceFraction: number, resolutionGrams: number): LineDeviationDto {
  const diff = actualGrams - targetGrams;
  const tolerance = Math.max(Math.abs(targetGrams * toleranceFraction), resolutionGrams);
  // A relative margin of 1e-9 keeps float noise from flagging a mass exactly at the limit.
  return {
    absoluteGrams: diff,
    relative: targetGrams === 0 ? null : diff / targetGrams,
    toleranceGrams: tolerance,
    outside: Math.abs(diff) > tolerance * (1 + 1e-9),
  };
}

/** "+4.95 g (+5.0 %)"; a deviation that rounds to nothing at the balance resolution reads "±0.00 g (0.0 %)". */
export function deviationWords(d: LineDeviationDto, resolution: number): string {
  const rounded = Math.round(d.absoluteGrams / resolution);
  const sign = rounded > 0 ? "+" : rounded < 0 ? "−" : "±";
  const mass = fmtMass(Math.abs(d.absoluteGrams), resolution);
  if (d.relative === null) return `${sign}${mass}`;
  const pct = fmtPercent(Math.abs(d.relative), 1);
  const pctSign = pct.startsWith("0.0") ? "" : d.relative > 0 ? "+" : "−";
  return `${sign}${mass} (${pctSign}${pct})`;
}

interface ToleranceBadgeProps {
  deviation: LineDeviationDto | null;
  toleranceFraction: number;
  resolution: number;
}

/** Within or outside the tolerance, in words with a mark and a colour; "Not weighed" before a mass is entered. */
export function ToleranceBadge({ deviation, toleranceFraction, resolution }: ToleranceBadgeProps) {
  if (!deviation) {
    return (
      <span className="inline-flex items-center gap-1 rounded border border-rule bg-paper px-1.5 py-0.5 text-xs font-medium whitespace-nowrap text-muted">
        <span aria-hidden="true">○</span>Not weighed
      </span>
    );
  }
  const limit = `±${fmtPercent(toleranceFraction, toleranceFraction * 100 < 1 ? 1 : 0)}, ${fmtMass(deviation.toleranceGrams, resolution)}`;
  return deviation.outside ? (
    <span className="inline-flex items-center gap-1 rounded border border-fail/50 bg-fail-soft px-1.5 py-0.5 text-xs font-semibold whitespace-nowrap text-fail">
      <span aria-hidden="true">✕</span>Outside tolerance
      <span className="num font-normal">({limit})</span>
    </span>
  ) : (
    <span className="inline-flex items-center gap-1 rounded border border-clear/40 bg-clear-soft px-1.5 py-0.5 text-xs font-medium whitespace-nowrap text-clear">
      <span aria-hidden="true">✓</span>Within tolerance
      <span className="num font-normal">({limit})</span>
    </span>
  );
}
