import type { ReactNode } from "react";

/** How serious a message is: a failure, a caution, all clear, or plain information. */
export type AlertTone = "fail" | "caution" | "clear" | "info";

const TONE: Record<AlertTone, string> = {
  fail: "border-fail/50 bg-fail-soft",
  caution: "border-caution/50 bg-caution-soft",
  clear: "border-clear/40 bg-clear-soft",
  info: "border-rule bg-panel",
};

interface AlertProps {
  tone: AlertTone;
  /** A heading line in the tone's colour. */
  title?: ReactNode;
  children?: ReactNode;
  /**
   * "alert" interrupts a screen reader (errors that need action); "status"
   * is read when it is idle (outcomes, summaries). Failures default to alert.
   */
  role?: "alert" | "status";
  className?: string;
  "data-testid"?: string;
}

/**
 * A boxed message in one of four tones, announced to screen readers.
 *
 * @example
 * ```tsx
 * <Alert tone="fail" title="Not saved">The name is taken.</Alert>
 * ```
 */
export function Alert({ tone, title, children, role, className = "", ...rest }: AlertProps) {
  const titleColour = tone === "fail" ? "text-fail" : tone === "caution" ? "text-caution" : tone === "clear" ? "text-clear" : "text-ink";
  return (
    <div role={role ?? (tone === "fail" ? "alert" : "status")} className={`rounded border px-3 py-2 text-sm text-ink ${TONE[tone]} ${className}`} data-testid={rest["data-testid"]}>
      {title ? <p className={`font-medium ${titleColour}`}>{title}</p> : null}
      {children ? <div className={title ? "mt-0.5" : undefined}>{children}</div> : null}
    </div>
  );
}
