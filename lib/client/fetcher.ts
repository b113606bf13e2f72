/**
 * Client-side access to our JSON API: a fetcher for SWR and a sender for
 * mutations. Every error becomes an ApiRequestError carrying the server's
 * { error: { code, message, fields? } } body.
 */

/** An API call that did not succeed, with the server's message and field errors. */
export class ApiRequestError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields: Record<string, string> = {},
  ) {
    super(message);
    this.name = "ApiRequestError";
  }
}

/**
 * The ApiRequestError for a failed answer: the server's { error } body when
 * there is one, otherwise a plain message for the status.
 */
export function apiErrorFrom(status: number, body: unknown): ApiRequestError {
  const err = (body as { error?: { code?: string; message?: string; fields?: Record<string, string> } } | null)?.error;
  const fallback =
    status === 401
      ? "Your session has ended. Sign in again."
      : status === 403
        ? "Your role in this team does not allow this."
        : status === 404
          ? "Not found."
          : status === 413
            ? "The file is too large."
            : `The server answered ${status}.`;
  return new ApiRequestError(status, err?.code ?? `http_${status}`, err?.message ?? fallback, err?.fields ?? {});
}

async function toError(res: Response): Promise<ApiRequestError> {
  let body: unknown = null;
  try {
    body = await res.json();
  } catch {
    // Not JSON (a proxy error page, say): fall through to a generic message.
  }
  return apiErrorFrom(res.status, body);
}

/** SWR fetcher: GET a JSON resource, throwing ApiRequestError on failure. */
export async function fetcher<T>(url: string): Promise<T> {
  let res: Response;
  try {
    res = await fetch(url, { headers: { accept: "application/json" }, credentials: "same-origin" });
  } catch {
    throw new ApiRequestError(0, "network", "The server could not be reached. Check the connection and try again.");
  }
  if (!res.ok) throw await toError(res);
  return (await res.json()) as T;
}

/** Sends a JSON body with POST/PUT/PATCH/DELETE; returns the parsed JSON (or null for 204). */
export async function apiSend<T = unknown>(method: "POST" | "PUT" | "PATCH" | "DELETE", url: string, body?: unknown): Promise<T> {
  let res: Response;
  try {
    res = await fetch(url, {
      method,
      credentials: "same-origin",
      headers: body === undefined ? { accept: "application/json" } : { "content-type": "application/json", accept: "application/json" },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
  } catch {
    throw new ApiRequestError(0, "network", "The server could not be reached. Nothing was saved; try again.");
  }
  if (!res.ok) throw await toError(res);
  if (res.status === 204) return null as T;
  return (await res.json()) as T;
}

/** The message to show for any thrown value. */
export function errorMessage(err: unknown): string {
  if (err instanceof Error) return err.message;
  return "Something went wrong.";
}

/** Builds a query string from defined, non-empty values. */
export function query(params: Record<string, string | number | undefined | null>): string {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(params)) {
    if (value !== undefined && value !== null && value !== "") search.set(key, String(value));
  }
  const s = search.toString();
  return s ? `?${s}` : "";
}
