import { Alert } from "./alert";

/** What became of an action: it failed ("error"), or it went through ("info"); null before any. */
export type Outcome = { tone: "error" | "info"; text: string } | null;

interface OutcomeMessageProps {
  outcome: Outcome;
  className?: string;
}

/**
 * The outcome of the last action on a panel, in a live region: a failure as
 * a failure alert, success as an all-clear note.
 *
 * @example
 * ```tsx
 * <OutcomeMessage outcome={{ tone: "info", text: "Saved." }} />
 * ```
 */
export function OutcomeMessage({ outcome, className = "" }: OutcomeMessageProps) {
  return (
    <div aria-live="polite" className={className}>
      {outcome ? <Alert tone={outcome.tone === "error" ? "fail" : "clear"}>{outcome.text}</Alert> : null}
    </div>
  );
}
