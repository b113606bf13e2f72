import type { ReactNode } from "react";
import { Alert } from "./alert";

interface PanelProps {
  title?: ReactNode;
  /** Controls or figures shown at the right of the title. */
  aside?: ReactNode;
  children: ReactNode;
  className?: string;
  id?: string;
}

/** A bordered section of a page with an optional heading. */
export function Panel({ title, aside, children, className = "", id }: PanelProps) {
  const headingId = id ? `${id}-title` : undefined;
  return (
    <section id={id} aria-labelledby={title ? headingId : undefined} className={`rounded border border-rule bg-panel ${className}`}>
      {title ? (
        <div className="flex flex-wrap items-center justify-between gap-2 border-b border-rule px-3 py-2">
          <h2 id={headingId} className="text-sm font-semibold text-ink">
            {title}
          </h2>
          {aside}
        </div>
      ) : null}
      <div className="p-3">{children}</div>
    </section>
  );
}

interface PageHeaderProps {
  title: ReactNode;
  subtitle?: ReactNode;
  actions?: ReactNode;
}

/** The title row of a page. */
export function PageHeader({ title, subtitle, actions }: PageHeaderProps) {
  return (
    <div className="mb-4 flex flex-wrap items-end justify-between gap-3">
      <div className="min-w-0">
        <h1 className="text-xl font-semibold text-ink">{title}</h1>
        {subtitle ? <div className="mt-0.5 text-sm text-muted">{subtitle}</div> : null}
      </div>
      {actions ? <div className="flex flex-wrap gap-2">{actions}</div> : null}
    </div>
  );
}

interface NotAllowedProps {
  what: string;
}

/** Shown instead of a page the user's role does not allow. */
export function NotAllowed({ what }: NotAllowedProps) {
  return (
    <Alert tone="info" role="alert" className="p-4">
      <h1 className="text-lg font-semibold">Not allowed</h1>
      <p className="mt-1 text-muted">Your role in this team does not allow you to {what}. Ask a team admin if you need it.</p>
    </Alert>
  );
}
