"use client";

import { Button } from "./button";

interface ErrorPanelProps {
  title?: string;
  message: string;
  onRetry?: () => void;
}

/** An error in plain words, with a way to try again. */
export function ErrorPanel({ title = "This could not be loaded", message, onRetry }: ErrorPanelProps) {
  return (
    <div role="alert" className="rounded border border-fail/50 bg-fail-soft px-3 py-2 text-sm text-ink">
      <p className="font-medium text-fail">{title}</p>
      <p className="mt-0.5">{message}</p>
      {onRetry ? (
        <Button className="mt-2" onClick={onRetry}>
          Try again
        </Button>
      ) : null}
    </div>
  );
}
