import type { ReactNode } from "react";

/** The colours a badge can take: the alert tones, the accent, and plain or muted paper. */
export type BadgeTone = "fail" | "caution" | "clear" | "accent" | "plain" | "muted";

const TONE: Record<BadgeTone, string> = {
  fail: "border-fail/50 bg-fail-soft text-fail font-semibold",
  caution: "border-caution/50 bg-caution-soft text-caution font-medium",
  clear: "border-clear/40 bg-clear-soft text-clear font-medium",
  accent: "border-accent/40 bg-accent-soft text-accent font-medium",
  plain: "border-rule bg-paper text-ink font-medium",
  muted: "border-rule bg-paper text-muted font-medium",
};

interface ToneBadgeProps {
  tone: BadgeTone;
  /** A mark before the words (✓, ✕, !), hidden from screen readers: the words carry the meaning. */
  mark: string;
  children: ReactNode;
}

/**
 * A short state in words with a mark and a colour, never colour alone.
 *
 * @example
 * ```tsx
 * <ToneBadge tone="fail" mark="✕">Error</ToneBadge>
 * ```
 */
export function ToneBadge({ tone, mark, children }: ToneBadgeProps) {
  return (
    <span className={`inline-flex items-center gap-1 rounded border px-1.5 py-0.5 text-xs whitespace-nowrap ${TONE[tone]}`}>
      <span aria-hidden="true">{mark}</span>
      {children}
    </span>
  );
}
