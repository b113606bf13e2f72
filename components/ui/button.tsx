import Link from "next/link";
import type { ButtonHTMLAttributes, ReactNode } from "react";

type Variant = "primary" | "secondary" | "danger" | "ghost";

const VARIANTS: Record<Variant, string> = {
  primary: "bg-accent text-white border-accent hover:bg-[#733c18]",
  secondary: "bg-panel text-ink border-rule hover:border-muted",
  danger: "bg-panel text-fail border-fail/60 hover:bg-fail-soft",
  ghost: "bg-transparent text-accent border-transparent hover:underline",
};

const BASE =
  "inline-flex items-center justify-center gap-1.5 rounded border px-3 py-1.5 text-sm font-medium whitespace-nowrap disabled:cursor-not-allowed disabled:opacity-50";

/** Class names of a button of the given variant (for links styled as buttons). */
export function buttonClass(variant: Variant = "secondary", extra = ""): string {
  return `${BASE} ${VARIANTS[variant]} ${extra}`;
}

interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  variant?: Variant;
  busy?: boolean;
}

/** A button; `busy` disables it and says so to screen readers. */
export function Button({ variant = "secondary", busy = false, className = "", type = "button", children, disabled, ...rest }: ButtonProps) {
  return (
    <button type={type} className={buttonClass(variant, className)} disabled={disabled || busy} aria-busy={busy || undefined} {...rest}>
      {children}
    </button>
  );
}

interface ButtonLinkProps {
  href: string;
  variant?: Variant;
  className?: string;
  children: ReactNode;
}

/** A link that looks like a button. */
export function ButtonLink({ href, variant = "secondary", className = "", children }: ButtonLinkProps) {
  return (
    <Link href={href} className={buttonClass(variant, className)}>
      {children}
    </Link>
  );
}
