"use client";

import { Alert } from "./alert";
import { Button } from "./button";

interface PageErrorProps {
  /** What went wrong, in a sentence a person can act on. */
  message: string;
  /** The server's reference for the failure, to quote to an admin. */
  digest?: string;
  onRetry: () => void;
}

/** A page that could not be shown: a failure alert with the reference and a retry (the error boundaries). */
export function PageError({ message, digest, onRetry }: PageErrorProps) {
  return (
    <Alert tone="fail" className="p-4">
      <h1 className="text-lg font-semibold text-fail">This page could not be shown</h1>
      <p className="mt-1">{message}</p>
      {digest ? <p className="mt-1 text-xs text-muted">Reference: {digest}</p> : null}
      <Button className="mt-3" onClick={onRetry}>
        Try again
      </Button>
    </Alert>
  );
}
