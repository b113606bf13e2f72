import type { ReactNode } from "react";
import { Alert } from "@/components/ui/alert";

interface AuthCardProps {
  title: string;
  intro?: ReactNode;
  children: ReactNode;
  footer?: ReactNode;
}

/** The frame of every sign-in, sign-up and password page. */
export function AuthCard({ title, intro, children, footer }: AuthCardProps) {
  return (
    <div className="rounded border border-rule bg-panel p-5">
      <h1 className="text-lg font-semibold">{title}</h1>
      {intro ? <div className="mt-1 text-sm text-muted">{intro}</div> : null}
      <div className="mt-4">{children}</div>
      {footer ? <div className="mt-4 border-t border-rule pt-3 text-sm text-muted">{footer}</div> : null}
    </div>
  );
}

interface FormMessageProps {
  tone: "error" | "info";
  message: string | null;
}

/** A form-level message in a live region. */
export function FormMessage({ tone, message }: FormMessageProps) {
  return (
    <div aria-live="assertive">{message ? <Alert tone={tone === "error" ? "fail" : "clear"}>{message}</Alert> : null}</div>
  );
}
