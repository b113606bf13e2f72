import { ApiRequestError, errorMessage } from "@/lib/client/fetcher";

/**
 * What a lot form shows when saving failed: each named field's message beside
 * its field (through `setError`), whether someone else changed the lot first
 * (a 409 naming `version`: the form then offers to reload the saved lot), and
 * the line for the form's outcome.
 *
 * @example
 * ```ts
 * const failure = lotSaveFailure(err, ["reason", "note"], (f, message) => setError(f, { message }));
 * setStale(failure.stale);
 * setOutcome({ tone: "error", text: failure.text });
 * ```
 */
export function lotSaveFailure<F extends string>(err: unknown, fields: readonly F[], showAt: (field: F, message: string) => void): { stale: boolean; text: string } {
  let stale = false;
  if (err instanceof ApiRequestError) {
    for (const f of fields) if (err.fields[f]) showAt(f, err.fields[f]);
    stale = err.status === 409 && !!err.fields.version;
  }
  return { stale, text: `Not saved: ${errorMessage(err)}` };
}
