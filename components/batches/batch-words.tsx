import { ToneBadge, type BadgeTone } from "@/components/ui/tone-badge";
import type { LineDeviation } from "@/lib/client/batches";
import type { BatchState } from "@/lib/enums";
import { fmtMass } from "@/lib/format";
import { toleranceWords } from "./batch-deviation";

/** A batch record's state in words. */
export const BATCH_STATE_LABELS: Record<BatchState, string> = { open: "Open, being weighed", closed: "Closed" };
const STATE_TONE: Record<BatchState, BadgeTone> = { open: "accent", closed: "plain" };
const STATE_MARK: Record<BatchState, string> = { open: "◔", closed: "■" };

interface BatchStateBadgeProps {
  state: BatchState;
}

/** A batch record's state: a mark, a colour and always its words. */
export function BatchStateBadge({ state }: BatchStateBadgeProps) {
  return (
    <ToneBadge tone={STATE_TONE[state]} mark={STATE_MARK[state]}>
      {BATCH_STATE_LABELS[state]}
    </ToneBadge>
  );
}

interface ToleranceBadgeProps {
  deviation: LineDeviation | null;
  toleranceFraction: number;
  resolution: number;
}

/** Within or outside the tolerance, in words with a mark and a colour; "Not weighed" before a mass is entered. */
export function ToleranceBadge({ deviation, toleranceFraction, resolution }: ToleranceBadgeProps) {
  if (!deviation) {
    return (
      <ToneBadge tone="muted" mark="○">
        Not weighed
      </ToneBadge>
    );
  }
  const limit = <span className="num font-normal">({`${toleranceWords(toleranceFraction)}, ${fmtMass(deviation.toleranceGrams, resolution)}`})</span>;
  return deviation.outside ? (
    <ToneBadge tone="fail" mark="✕">
      Outside tolerance
      {limit}
    </ToneBadge>
  ) : (
    <ToneBadge tone="clear" mark="✓">
      Within tolerance
      {limit}
    </ToneBadge>
  );
}
