"use client";

import { useEffect } from "react";
import { PageError } from "@/components/ui/page-error";

export default function WorkspaceError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  useEffect(() => {
    console.error(error);
  }, [error]);
  return (
    <PageError
      message="Something went wrong while loading it (the database may be unreachable). Nothing was changed."
      digest={error.digest}
      onRetry={reset}
    />
  );
}
