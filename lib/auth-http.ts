import "server-only";
import { ApiError, errorResponse } from "./http/errors";

/**
 * The sign-in library's HTTP endpoints (under /api/auth) that Gelwright offers,
 * by method: the ones the sign-in, sign-up, password, address-confirmation and
 * invitation pages call. Every other endpoint of the library, among them its
 * own team routes (change a role, remove or add a member, invite, leave,
 * delete a team) and account changes, answers 404: team membership changes go
 * through our API (/api/members, /api/invitations, /api/teams), which checks
 * roles and writes audit events. Our own server code calls the library
 * directly, not through these paths.
 */
export const AUTH_ALLOWED: Readonly<Record<"GET" | "POST", readonly RegExp[]>> = {
  GET: [/^\/get-session$/, /^\/reset-password\/[^/]+$/, /^\/verify-email$/, /^\/organization\/get-invitation$/],
  POST: [
    /^\/sign-in\/email$/,
    /^\/sign-up\/email$/,
    /^\/sign-out$/,
    /^\/request-password-reset$/,
    /^\/reset-password$/,
    /^\/send-verification-email$/,
    /^\/organization\/accept-invitation$/,
  ],
};

const PREFIX = "/api/auth";

/** True when the library endpoint at `pathname` (e.g. "/api/auth/sign-out") is offered for `method`. */
export function isAuthPathAllowed(method: string, pathname: string): boolean {
  if (!pathname.startsWith(`${PREFIX}/`)) return false;
  const rest = pathname.slice(PREFIX.length);
  const patterns = AUTH_ALLOWED[method as "GET" | "POST"];
  return !!patterns && patterns.some((p) => p.test(rest));
}

export const authPathClosed = () =>
  new ApiError(
    404,
    "not_found",
    "This sign-in service address is not offered. Members, roles and invitations are changed through /api/members and /api/invitations.",
  );

const CODE_BY_STATUS: Record<number, string> = {
  400: "invalid_input",
  401: "unauthorized",
  403: "forbidden",
  404: "not_found",
  409: "conflict",
  422: "invalid_input",
  429: "too_many_requests",
};

/**
 * Puts a failed answer of the sign-in library into our error shape
 * `{ error: { code, message } }`, keeping its headers (cookies, Retry-After).
 * Its 400 (bad input) becomes 422, as for our own routes; other statuses stay.
 * Successful answers and redirects pass unchanged.
 */
export async function toOurErrorShape(res: Response): Promise<Response> {
  if (res.status < 400) return res;
  const text = await res.text();
  let body: { code?: unknown; message?: unknown; error?: unknown } = {};
  try {
    body = text ? (JSON.parse(text) as typeof body) : {};
  } catch {
    body = { message: text };
  }
  if (body && typeof body.error === "object" && body.error !== null) return rebuild(res, res.status, body);
  const status = res.status === 400 ? 422 : res.status;
  const code = typeof body.code === "string" && body.code ? body.code.toLowerCase() : (CODE_BY_STATUS[status] ?? (status >= 500 ? "internal" : "error"));
  const message =
    status >= 500
      ? "Something went wrong on our side. Nothing was changed."
      : typeof body.message === "string" && body.message
        ? body.message
        : res.statusText || "The request was refused.";
  return rebuild(res, status, { error: { code, message } });
}

function rebuild(res: Response, status: number, body: unknown): Response {
  const headers = new Headers(res.headers);
  for (const h of ["content-length", "content-type", "content-encoding"]) headers.delete(h);
  return Response.json(body, { status, headers });
}

/** Serves one library request: closed paths answer 404, errors come back in our shape. */
export async function serveAuth(req: Request, handler: (req: Request) => Promise<Response>): Promise<Response> {
  try {
    if (!isAuthPathAllowed(req.method, new URL(req.url).pathname)) throw authPathClosed();
    return await toOurErrorShape(await handler(req));
  } catch (err) {
    return errorResponse(err);
  }
}
