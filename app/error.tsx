"use client";

import { useEffect } from "react";
import { PageError } from "@/components/ui/page-error";

export default function RootError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  useEffect(() => {
    console.error(error);
  }, [error]);
  return (
    <main className="mx-auto max-w-lg px-4 py-16">
      <PageError message="Something went wrong on our side. Nothing was changed. Try again in a moment." digest={error.digest} onRetry={reset} />
    </main>
  );
}
