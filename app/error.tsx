"use client";

import { useEffect } from "react";

export default function RootError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  useEffect(() => {
    console.error(error);
  }, [error]);
  return (
    <main className="mx-auto max-w-lg px-4 py-16">
      <div role="alert" className="rounded border border-fail/50 bg-fail-soft p-4">
        <h1 className="text-lg font-semibold text-fail">This page could not be shown</h1>
        <p className="mt-1 text-sm">Something went wrong on our side. Nothing was changed. Try again in a moment.</p>
        {error.digest ? <p className="mt-1 text-xs text-muted">Reference: {error.digest}</p> : null}
        <button type="button" onClick={reset} className="mt-3 rounded border border-rule bg-panel px-3 py-1.5 text-sm">
          Try again
        </button>
      </div>
    </main>
  );
}
