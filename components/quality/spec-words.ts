import type { Specification } from "@/lib/quality/specification";

/** A number for display: six significant figures, no trailing zeros (stored values keep full precision). */
export function showNumber(v: number | null | undefined): string {
  if (v === null || v === undefined) return "—";
  return String(Number(v.toPrecision(6)));
}

/** The limits of a specification in words, with its unit: "4 – 6 mPa·s", "≤ 6 mPa·s", or the requirement. */
export function limitWords(s: Specification): string {
  if (!s.numeric) return s.requirement ?? "—";
  const unit = s.unit ? ` ${s.unit}` : "";
  if (s.lower !== null && s.upper !== null) return `${showNumber(s.lower)} – ${showNumber(s.upper)}${unit}`;
  if (s.lower !== null) return `≥ ${showNumber(s.lower)}${unit}`;
  return `≤ ${showNumber(s.upper)}${unit}`;
}
