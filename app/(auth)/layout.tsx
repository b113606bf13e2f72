import type { ReactNode } from "react";

export default function AuthLayout({ children }: { children: ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col items-center bg-paper px-4 py-10">
      <p className="mb-6 text-lg font-semibold tracking-tight text-ink">
        <span aria-hidden="true" className="mr-1.5 inline-block h-3 w-3 rounded-sm bg-accent align-middle" />
        Gelwright
      </p>
      <main className="w-full max-w-sm">{children}</main>
      <p className="mt-8 max-w-sm text-center text-xs text-muted">
        Hybrid sol-gel formulations, thermal checks, review and batch sheets for your team.
      </p>
    </div>
  );
}
