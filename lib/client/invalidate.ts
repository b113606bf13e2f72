"use client";

import { useSWRConfig } from "swr";

/**
 * The API resources whose cached answers the client keeps (SWR keys are the
 * request URLs). A change to one of them refreshes every cached answer under
 * its path: lists, pages of lists, single records.
 */
export type Resource =
  | "formulations"
  | "revisions"
  | "materials"
  | "batches"
  | "imports"
  | "attachments"
  | "members"
  | "invitations"
  | "audit"
  | "mailbox";

/** True when `key` is a cached answer of one of `resources`. */
export function isKeyOf(key: unknown, resources: readonly Resource[]): boolean {
  if (typeof key !== "string") return false;
  return resources.some((r) => key === `/api/${r}` || key.startsWith(`/api/${r}/`) || key.startsWith(`/api/${r}?`));
}

/**
 * A function that refetches every cached answer of the given resources.
 *
 * @example
 * ```ts
 * const invalidate = useInvalidate();
 * await invalidate("formulations", "revisions");
 * ```
 */
export function useInvalidate(): (...resources: Resource[]) => Promise<void> {
  const { mutate } = useSWRConfig();
  return async (...resources) => {
    await mutate((key) => isKeyOf(key, resources));
  };
}
