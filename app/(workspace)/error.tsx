"use client";

import { useEffect } from "react";
import { Button } from "@/components/ui/button";

export default function WorkspaceError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  useEffect(() => {
    console.error(error);
  }, [error]);
  return (
    <div role="alert" className="rounded border border-fail/50 bg-fail-soft p-4">
      <h1 className="text-lg font-semibold text-fail">This page could not be shown</h1>
      <p className="mt-1 text-sm">
        Something went wrong while loading it (the database may be unreachable). Nothing was changed.
      </p>
      {error.digest ? <p className="mt-1 text-xs text-muted">Reference: {error.digest}</p> : null}
      <Button className="mt-3" onClick={reset}>
        Try again
      </Button>
    </div>
  );
}
