import type { ReactNode } from "react";

interface FieldProps {
  /** id of the control, so the label and messages point at it. */
  id: string;
  label: ReactNode;
  /** Unit, source or other short help shown beside the label. */
  hint?: ReactNode;
  error?: string | null;
  children: ReactNode;
  className?: string;
}

/** A labelled control with its hint and its error message (announced when it appears). */
export function Field({ id, label, hint, error, children, className = "" }: FieldProps) {
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={id} className="text-[13px] font-medium text-ink">
        {label}
        {hint ? <span className="ml-1.5 font-normal text-muted">{hint}</span> : null}
      </label>
      {children}
      <FieldError id={`${id}-error`} message={error} />
    </div>
  );
}

interface FieldErrorProps {
  id: string;
  message?: string | null;
}

/** A live region beside a field: empty until there is something to say. */
export function FieldError({ id, message }: FieldErrorProps) {
  return (
    <p id={id} aria-live="polite" className="min-h-0 text-[13px] text-fail empty:hidden">
      {message ? message : null}
    </p>
  );
}

/** Class names of a text input, select or textarea. */
export function inputClass(invalid = false, extra = ""): string {
  return `w-full rounded border bg-panel px-2 py-1.5 text-sm text-ink placeholder:text-muted/70 ${
    invalid ? "border-fail" : "border-rule"
  } focus:border-accent focus:outline-none ${extra}`;
}
