/**
 * What the HTTP front does to every request before Next.js sees it: it
 * establishes the client's address, holds the body to its route's byte
 * limit, refuses changes that are not same-origin JSON, and sets the
 * headers that depend on the request (a fresh script nonce for each page).
 */
import { randomBytes } from "node:crypto";
import type { IncomingMessage, ServerResponse } from "node:http";
import { bodyLimitFor, limitBody } from "./body-limit";
import { compileTrust, setClientAddress } from "./client-address";
import { sendRefusal, type Refusal } from "./refusal";
import type { Settings } from "@/lib/settings";

const CHANGE_METHODS = new Set(["POST", "PUT", "PATCH", "DELETE"]);

/** Routes that take a file as multipart/form-data (they check that themselves, after the caller's role); every other change is JSON. */
const UPLOAD_ROUTES = new Set(["/api/imports", "/api/attachments"]);

/** API answers are data, never documents: nothing may load, nothing may frame them. */
export const API_POLICY = "default-src 'none'; frame-ancestors 'none'";

/**
 * The content security policy of a page: scripts only with this response's
 * nonce (Next.js puts it on its own script tags when it finds the policy on
 * the request), no inline event handlers, no framing.
 *
 * @example pagePolicy("abc", false) // "default-src 'self'; script-src 'self' 'nonce-abc' 'strict-dynamic'; …"
 */
export function pagePolicy(nonce: string, dev: boolean): string {
  return [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${dev ? " 'unsafe-eval'" : ""}`,
    // React and the chart library set style attributes; styles cannot run code.
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self'",
    `connect-src 'self'${dev ? " ws: wss:" : ""}`,
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join("; ");
}


/** The media type of a Content-Type header, lower case, without parameters. */
function mediaType(header: string | undefined): string {
  return (header ?? "").split(";")[0]!.trim().toLowerCase();
}

/** True when the request carries a body (a length above zero, or chunks). */
function hasBody(req: IncomingMessage): boolean {
  const length = req.headers["content-length"];
  if (length !== undefined) return Number(length) > 0;
  return req.headers["transfer-encoding"] !== undefined;
}

/**
 * Why a change to the API is refused, or null: it must come from one of our
 * own origins (a browser always sends Origin on these methods; a missing one
 * is refused too), and a body must be JSON (the upload routes answer a body
 * that is not multipart/form-data themselves, once they know who is asking).
 */
export function changeRefusal(req: IncomingMessage, pathname: string, trustedOrigins: ReadonlySet<string>): Refusal | null {
  if (!CHANGE_METHODS.has(req.method ?? "")) return null;
  const origin = req.headers.origin;
  if (!origin || !trustedOrigins.has(origin)) {
    return {
      status: 403,
      code: "bad_origin",
      message: origin ? "This request came from another site and was refused." : "Changes are accepted only from Gelwright's own pages (the request had no Origin header).",
    };
  }
  if (!hasBody(req) || UPLOAD_ROUTES.has(pathname)) return null;
  const type = mediaType(req.headers["content-type"]);
  if (type !== "application/json") {
    return {
      status: 415,
      code: "unsupported_media_type",
      message: `Send the body as application/json${type ? `, not ${type}` : " (the Content-Type header is missing)"}.`,
    };
  }
  return null;
}


/**
 * Next.js answers a method a route does not have with an empty 405; this
 * gives that answer a JSON body in our shape instead.
 */
function jsonMethodNotAllowed(req: IncomingMessage, res: ServerResponse): void {
  type Fn = (...args: unknown[]) => unknown;
  const target = res as unknown as Record<"writeHead" | "write" | "end", Fn>;
  const [writeHead, write, end] = [target.writeHead.bind(res), target.write.bind(res), target.end.bind(res)];
  let is405 = false;
  const body = () => JSON.stringify({ error: { code: "method_not_allowed", message: `${req.method} is not accepted at this address.` } });
  const empty = (chunk: unknown) => chunk === undefined || chunk === null || typeof chunk === "function" || (chunk as { length?: number }).length === 0;
  target.writeHead = (status, ...rest) => {
    if (status === 405) {
      is405 = true;
      res.setHeader("content-type", "application/json");
      res.removeHeader("content-length");
      // Headers given with the call win over set ones: drop the empty answer's length and type there too.
      const headers = rest.find((r) => r && typeof r === "object" && !Array.isArray(r)) as Record<string, unknown> | undefined;
      for (const key of Object.keys(headers ?? {})) {
        if (/^content-(length|type)$/i.test(key)) delete headers![key];
      }
    }
    return writeHead(status, ...rest);
  };
  // Next.js writes nothing for its 405 but may write empty chunks; those are dropped, the JSON is sent at the end.
  target.write = (chunk, ...rest) => (is405 && empty(chunk) ? true : write(chunk, ...rest));
  target.end = (chunk, ...rest) => {
    if (!res.headersSent && res.statusCode === 405) target.writeHead(405);
    return is405 && empty(chunk) ? end(body()) : end(chunk, ...rest);
  };
}

/**
 * The path a request is routed by: dot segments resolved and percent-escapes
 * decoded, so that "/api/./auth/x" or "/%61pi/x" meet the same checks as the
 * plain path.
 *
 * @example routePath("/%61pi/./compute?x=1") // "/api/compute"
 */
export function routePath(url: string): string {
  const { pathname } = new URL(url, "http://front.invalid");
  try {
    return decodeURIComponent(pathname);
  } catch {
    return pathname; // A broken escape: Next.js refuses such a path itself.
  }
}

/**
 * Builds the per-request step of the front. It returns false when it has
 * answered the request itself (refused), true when Next.js should handle it.
 */
export function createFront(settings: Pick<Settings["server"], "trustedProxies" | "trustedOrigins">, options: { dev: boolean }) {
  const trust = compileTrust(settings.trustedProxies);
  return function prepare(req: IncomingMessage, res: ServerResponse): boolean {
    const pathname = routePath(req.url ?? "/");
    setClientAddress(req, trust);
    // The policy Next.js reads its nonce from is ours alone, never the client's.
    delete req.headers["content-security-policy"];
    delete req.headers["content-security-policy-report-only"];
    if (pathname.startsWith("/api/")) {
      res.setHeader("cache-control", "no-store");
      res.setHeader("content-security-policy", API_POLICY);
      jsonMethodNotAllowed(req, res);
      const refusal = changeRefusal(req, pathname, settings.trustedOrigins);
      if (refusal) {
        sendRefusal(res, refusal);
        return false;
      }
    } else {
      const policy = pagePolicy(randomBytes(16).toString("base64"), options.dev);
      req.headers["content-security-policy"] = policy;
      res.setHeader("content-security-policy", policy);
    }
    return limitBody(req, res, bodyLimitFor(req.method ?? "GET", pathname));
  };
}
