/**
 * The one error shape of every route, { error: { code, message, fields? } },
 * and the one place that maps what was thrown to a status: domain errors
 * (lib/errors.ts) by class, zod and engine errors to 422, MariaDB's refusals
 * (db/errors.ts), the sign-in library's refusals, upload problems, and
 * anything else to a generic 500 whose detail stays in the server log.
 */
import { ZodError } from "zod";
import { duplicateConflict, isDbUnavailable, tooLongColumn } from "@/db/errors";
import { authRefusal } from "@/lib/auth-errors";
import { ConflictError, DomainError, ExpiredError, NotFoundError, RuleError, SeparationError } from "@/lib/errors";
import { FormulationError } from "@/lib/formulation/errors";
import { UploadError } from "@/lib/uploads/upload-error";

export interface ApiErrorBody {
  error: { code: string; message: string; fields?: Record<string, string> };
}

/**
 * An error of the HTTP layer itself, with its status: not signed in, not
 * allowed, a body that is not JSON or too large. The data layer never throws
 * it (it throws domain errors).
 */
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

/** The answer to a request body that is not JSON. */
export const malformedJson = () => new ApiError(400, "malformed_json", "The request body is not valid JSON.");

/** A request body that broke off while it was being read. */
export const unreadableBody = () => new ApiError(400, "unreadable_body", "The request body could not be read; try again.");

/** Turns a zod issue path into "components.2.weightFraction". */
export function issuePath(path: readonly PropertyKey[]): string {
  return path.length ? path.map(String).join(".") : "body";
}

export function zodFields(err: ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of err.issues) fields[issuePath(issue.path)] ??= issue.message;
  return fields;
}

/** The status of each domain error class; the first match wins. */
const DOMAIN_STATUS: [abstract new (...args: never[]) => DomainError, number][] = [
  [NotFoundError, 404],
  [SeparationError, 403],
  [ConflictError, 409],
  [ExpiredError, 410],
  [RuleError, 422],
];

const json = (status: number, body: ApiErrorBody, headers?: HeadersInit) => Response.json(body, { status, headers });

function domainResponse(err: DomainError): Response {
  const status = DOMAIN_STATUS.find(([cls]) => err instanceof cls)?.[1] ?? 422;
  return json(status, { error: { code: err.code, message: err.message, fields: err.fields } });
}

/**
 * Maps any thrown value to a JSON response; unknown errors never leak detail.
 * A duplicate key (two people saving the same name at once) is 409 naming the
 * field; a value too long for its column is 422; the database out of reach 503.
 */
export function errorResponse(err: unknown): Response {
  if (err instanceof ApiError) {
    return json(err.status, { error: { code: err.code, message: err.message, fields: err.fields } });
  }
  if (err instanceof DomainError) return domainResponse(err);
  if (err instanceof ZodError) {
    const fields = zodFields(err);
    const first = Object.entries(fields)[0];
    return json(422, {
      error: { code: "invalid_input", message: first ? `${first[0]}: ${first[1]}` : "The input is not valid.", fields },
    });
  }
  if (err instanceof FormulationError) {
    const fields: Record<string, string> = {};
    // An issue with the input as a whole has no path: it is about the body, as for zod errors.
    for (const i of err.issues) fields[i.field || "body"] ??= i.message;
    fields[err.field || "body"] ??= err.message;
    return json(422, { error: { code: err.code, message: err.message, fields } });
  }
  if (err instanceof UploadError) {
    return json(err.status, { error: { code: err.code, message: err.message, fields: { file: err.message } } });
  }
  const refusal = authRefusal(err);
  if (refusal) return json(refusal.status, { error: { code: refusal.code, message: refusal.message } });
  const duplicate = duplicateConflict(err);
  if (duplicate) return domainResponse(duplicate);
  const tooLong = tooLongColumn(err);
  if (tooLong !== null) {
    const message = `${tooLong}: the value is too long.`;
    return json(422, { error: { code: "invalid_input", message, fields: { [tooLong]: message } } });
  }
  if (isDbUnavailable(err)) {
    console.error("[api] database unavailable:", err instanceof Error ? err.message : err);
    const message = "The database is not reachable. Nothing was saved; try again shortly.";
    return json(503, { error: { code: "unavailable", message } }, { "Retry-After": "5" });
  }
  console.error("[api] unexpected error:", err);
  return json(500, { error: { code: "internal", message: "Something went wrong on our side. Nothing was changed." } });
}
