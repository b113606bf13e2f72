"use client";

import { Alert } from "./alert";
import { Button } from "./button";

interface ErrorPanelProps {
  title?: string;
  message: string;
  onRetry?: () => void;
}

/** An error in plain words, with a way to try again. */
export function ErrorPanel({ title = "This could not be loaded", message, onRetry }: ErrorPanelProps) {
  return (
    <Alert tone="fail" title={title}>
      <p>{message}</p>
      {onRetry ? (
        <Button className="mt-2" onClick={onRetry}>
          Try again
        </Button>
      ) : null}
    </Alert>
  );
}
