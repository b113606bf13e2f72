import "server-only";
import { ZodError, type ZodType } from "zod";
import { settings } from "./settings";
import { MAX_JSON_BODY_BYTES } from "./server/body-limit";

/** The one error shape of every route: { error: { code, message, fields? } }. */
export interface ApiErrorBody {
  error: { code: string; message: string; fields?: Record<string, string> };
}

/** An error meant for the client, with its HTTP status. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
  ) {
    super(message);
    this.name = "ApiError";
  }
}

export const unauthorized = () => new ApiError(401, "unauthorized", "Sign in to continue.");
export const forbidden = (what = "do this") =>
  new ApiError(403, "forbidden", `Your role in this team does not allow you to ${what}.`);
export const notFound = (what = "record") => new ApiError(404, "not_found", `No such ${what}.`);
export const conflict = (message: string, fields?: Record<string, string>) => new ApiError(409, "conflict", message, fields);

/** Turns a zod issue path into "components.2.weightFraction". */
export function issuePath(path: readonly PropertyKey[]): string {
  return path.length ? path.map(String).join(".") : "body";
}

export function zodFields(err: ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of err.issues) {
    const key = issuePath(issue.path);
    fields[key] ??= issue.message;
  }
  return fields;
}

interface FieldError {
  code: string;
  field: string;
  message: string;
  issues?: { field: string; message: string }[];
}

function isFieldError(err: unknown): err is FieldError {
  return (
    err instanceof Error &&
    err.name === "FormulationError" &&
    typeof (err as Partial<FieldError>).field === "string" &&
    typeof (err as Partial<FieldError>).code === "string"
  );
}

const DB_DOWN_CODES = new Set([
  "ECONNREFUSED",
  "ECONNRESET",
  "ETIMEDOUT",
  "EPIPE",
  "PROTOCOL_CONNECTION_LOST",
  "PROTOCOL_ENQUEUE_AFTER_FATAL_ERROR",
  "PROTOCOL_SEQUENCE_TIMEOUT",
  "ER_CON_COUNT_ERROR",
  "ER_SERVER_SHUTDOWN",
  "ER_CONNECTION_KILLED",
]);

/** True when the error (or one of its causes) says MariaDB is unreachable or went away. */
export function isDbUnavailable(err: unknown): boolean {
  for (let e: unknown = err, i = 0; e && i < 6; i++) {
    const { code, fatal, message } = e as { code?: unknown; fatal?: unknown; message?: unknown };
    if (typeof code === "string" && DB_DOWN_CODES.has(code)) return true;
    if (fatal === true) return true;
    if (typeof message === "string" && /connection is in closed state|connection lost|server has gone away/i.test(message)) return true;
    e = (e as { cause?: unknown }).cause;
  }
  return false;
}

interface MysqlError {
  code?: unknown;
  errno?: unknown;
  sqlMessage?: unknown;
  message?: unknown;
}

/** The MariaDB error (ER_… code) behind `err`, following Drizzle's `cause` chain. */
function mysqlError(err: unknown, code: string, errno: number): MysqlError | null {
  for (let e: unknown = err, i = 0; e && i < 6; i++) {
    const m = e as MysqlError;
    if (m.code === code || m.errno === errno) return m;
    e = (e as { cause?: unknown }).cause;
  }
  return null;
}

/**
 * The unique key that a duplicate-key error (ER_DUP_ENTRY, errno 1062) names,
 * or null when `err` is no such error.
 *
 * @example
 * ```ts
 * duplicateKey(err); // "materials_team_name_uq"
 * ```
 */
export function duplicateKey(err: unknown): string | null {
  const m = mysqlError(err, "ER_DUP_ENTRY", 1062);
  if (!m) return null;
  const text = String(m.sqlMessage ?? m.message ?? "");
  return /for key '(?:[^'.]*\.)?([^']+)'/.exec(text)?.[1] ?? "";
}

/** What a clash on each unique key means to the person who sent the request. */
const UNIQUE_KEYS: Record<string, { field: string; message: string }> = {
  materials_team_name_uq: { field: "material.name", message: "The library already has a material with this name." },
  formulations_team_name_uq: { field: "name", message: "A formulation with this name already exists in this team." },
  revisions_formulation_number_uq: { field: "body", message: "Someone started a revision at the same moment; reload and try again." },
};

/** The column that a value was too long for (ER_DATA_TOO_LONG, errno 1406), or null. */
function tooLongColumn(err: unknown): string | null {
  const m = mysqlError(err, "ER_DATA_TOO_LONG", 1406);
  if (!m) return null;
  return /for column [`']?([^`' ]+)[`']?/.exec(String(m.sqlMessage ?? m.message ?? ""))?.[1] ?? "body";
}

/**
 * Maps any thrown value to a JSON response; unknown errors never leak detail.
 * A duplicate key (two people saving the same name at once) is 409 naming the
 * field; a value too long for its column is 422.
 */
export function errorResponse(err: unknown): Response {
  const json = (status: number, body: ApiErrorBody) => Response.json(body, { status });
  if (err instanceof ApiError) {
    return json(err.status, { error: { code: err.code, message: err.message, fields: err.fields } });
  }
  if (err instanceof ZodError) {
    const fields = zodFields(err);
    const first = Object.entries(fields)[0];
    return json(422, {
      error: { code: "invalid_input", message: first ? `${first[0]}: ${first[1]}` : "The input is not valid.", fields },
    });
  }
  if (isFieldError(err)) {
    const fields: Record<string, string> = {};
    // An issue with the input as a whole has no path: it is about the body, as for zod errors.
    for (const i of err.issues ?? [{ field: err.field, message: err.message }]) fields[i.field || "body"] ??= i.message;
    fields[err.field || "body"] ??= err.message;
    return json(422, { error: { code: err.code, message: err.message, fields } });
  }
  if (err instanceof Error && err.name === "WorkflowError") {
    const w = err as Error & { code: string; field?: string };
    const status = w.code === "wrong_state" ? 409 : 422;
    return json(status, { error: { code: w.code, message: w.message, fields: w.field ? { [w.field]: w.message } : undefined } });
  }
  const dup = duplicateKey(err);
  if (dup !== null) {
    const known = UNIQUE_KEYS[dup] ?? { field: "body", message: "A record with these values already exists." };
    return json(409, { error: { code: "duplicate", message: known.message, fields: { [known.field]: known.message } } });
  }
  const tooLong = tooLongColumn(err);
  if (tooLong !== null) {
    const message = `${tooLong}: the value is too long.`;
    return json(422, { error: { code: "invalid_input", message, fields: { [tooLong]: message } } });
  }
  if (isDbUnavailable(err)) {
    console.error("[api] database unavailable:", err instanceof Error ? err.message : err);
    return Response.json(
      { error: { code: "unavailable", message: "The database is not reachable. Nothing was saved; try again shortly." } },
      { status: 503, headers: { "Retry-After": "5" } },
    );
  }
  console.error("[api] unexpected error:", err);
  return json(500, { error: { code: "internal", message: "Something went wrong on our side. Nothing was changed." } });
}

/** The answer to a request body that is not JSON. */
export const malformedJson = () => new ApiError(400, "malformed_json", "The request body is not valid JSON.");

/** A request body that broke off while it was being read. */
export const unreadableBody = () => new ApiError(400, "unreadable_body", "The request body could not be read; try again.");

/**
 * Reads a request body as bytes, throwing `tooLarge()` as soon as more than
 * `limit` bytes have arrived (the rest is never read). The HTTP front,
 * lib/server/body-limit.ts, has already held the body to its route's limit;
 * this is the route's own, possibly smaller, one, and holds also where the
 * app is reached some other way.
 */
export async function readBodyBytes(req: Request, limit: number, tooLarge: () => ApiError): Promise<Uint8Array<ArrayBuffer>> {
  if (Number(req.headers.get("content-length") ?? 0) > limit) throw tooLarge();
  if (!req.body) return new Uint8Array(0);
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    let step: ReadableStreamReadResult<Uint8Array>;
    try {
      step = await reader.read();
    } catch {
      throw unreadableBody();
    }
    if (step.done) break;
    total += step.value.byteLength;
    if (total > limit) {
      void reader.cancel().catch(() => undefined);
      throw tooLarge();
    }
    chunks.push(step.value);
  }
  const out = new Uint8Array(total);
  let offset = 0;
  for (const chunk of chunks) {
    out.set(chunk, offset);
    offset += chunk.byteLength;
  }
  return out;
}

/** Reads a request body as text, refusing more than `maxBytes` with 413 while it streams in. */
export async function readText(req: Request, maxBytes = MAX_JSON_BODY_BYTES): Promise<string> {
  const tooLarge = () => new ApiError(413, "too_large", `The request body is larger than ${maxBytes} bytes.`);
  return Buffer.from(await readBodyBytes(req, maxBytes, tooLarge)).toString("utf8");
}

/** Reads and validates a JSON body: 413 when too large, 400 when not JSON, 422 when invalid. */
export async function readJson<T>(req: Request, schema: ZodType<T>, maxBytes = MAX_JSON_BODY_BYTES): Promise<T> {
  const text = await readText(req, maxBytes);
  let data: unknown;
  try {
    data = text.length ? JSON.parse(text) : {};
  } catch {
    throw malformedJson();
  }
  return schema.parse(data);
}

type RouteContext<P> = { params: Promise<P> };

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

/**
 * Cross-site request check for changes, as the HTTP front makes it too (a
 * second line for a handler reached some other way): a browser always sends
 * Origin on a POST/PUT/PATCH/DELETE, and it must be one of ours; a change
 * without one is refused. (Cookies are SameSite=Lax as well.)
 */
function assertSameOrigin(req: Request): void {
  if (SAFE_METHODS.has(req.method)) return;
  const origin = req.headers.get("origin");
  if (!origin || !settings().server.trustedOrigins.has(origin)) {
    throw new ApiError(403, "bad_origin", origin ? "This request came from another site and was refused." : "Changes are accepted only from Gelwright's own pages (the request had no Origin header).");
  }
}

/** Wraps a route handler so every error becomes the one JSON error shape. */
export function route<P = Record<string, string>>(
  fn: (req: Request, ctx: RouteContext<P>) => Promise<Response>,
): (req: Request, ctx: RouteContext<P>) => Promise<Response> {
  return async (req, ctx) => {
    try {
      assertSameOrigin(req);
      return await fn(req, ctx);
    } catch (err) {
      return errorResponse(err);
    }
  };
}
