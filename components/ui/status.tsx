import type { ThermalStatus } from "@/lib/formulation";
import { STATE_LABELS, type RevisionState } from "@/lib/workflow";

const STATE_STYLE: Record<RevisionState, string> = {
  draft: "bg-paper text-ink border-rule",
  in_review: "bg-caution-soft text-caution border-caution/40",
  approved: "bg-clear-soft text-clear border-clear/40",
  released: "bg-accent-soft text-accent border-accent/40",
  archived: "bg-paper text-muted border-rule",
};

const STATE_MARK: Record<RevisionState, string> = {
  draft: "○",
  in_review: "◐",
  approved: "●",
  released: "▲",
  archived: "–",
};

interface StateBadgeProps {
  state: RevisionState;
}

/** A revision's state: a mark, a colour and always its words. */
export function StateBadge({ state }: StateBadgeProps) {
  return (
    <span className={`inline-flex items-center gap-1 rounded border px-1.5 py-0.5 text-xs font-medium whitespace-nowrap ${STATE_STYLE[state]}`}>
      <span aria-hidden="true">{STATE_MARK[state]}</span>
      {STATE_LABELS[state]}
    </span>
  );
}

const THERMAL_LABELS: Record<ThermalStatus, string> = {
  clear: "Clear",
  caution: "Caution",
  fail: "Fails",
};

const THERMAL_STYLE: Record<ThermalStatus, string> = {
  clear: "bg-clear-soft text-clear border-clear/40",
  caution: "bg-caution-soft text-caution border-caution/50",
  fail: "bg-fail-soft text-fail border-fail/50",
};

const THERMAL_MARK: Record<ThermalStatus, string> = { clear: "✓", caution: "!", fail: "✕" };

interface ThermalBadgeProps {
  status: ThermalStatus;
  /** Extra words after the status word. */
  detail?: string;
}

/** A thermal check's status as a word, a mark and a colour. */
export function ThermalBadge({ status, detail }: ThermalBadgeProps) {
  return (
    <span className={`inline-flex items-center gap-1 rounded border px-1.5 py-0.5 text-xs font-medium whitespace-nowrap ${THERMAL_STYLE[status]}`}>
      <span aria-hidden="true">{THERMAL_MARK[status]}</span>
      {THERMAL_LABELS[status]}
      {detail ? <span className="font-normal">{detail}</span> : null}
    </span>
  );
}

/** Background/text classes of a thermal status, for table cells. */
export function thermalCellClass(status: ThermalStatus): string {
  return THERMAL_STYLE[status];
}
