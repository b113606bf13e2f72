import "server-only";
import { ApiError } from "./api";

/** Converts an error thrown by better-auth's server API into our error shape. */
export function fromAuthError(err: unknown): unknown {
  const e = err as { name?: string; statusCode?: number; body?: { message?: string; code?: string }; message?: string };
  if (e && e.name === "APIError" && typeof e.statusCode === "number") {
    const status = e.statusCode === 400 ? 422 : e.statusCode;
    return new ApiError(status, (e.body?.code ?? "auth_error").toLowerCase(), e.body?.message ?? e.message ?? "Request refused.");
  }
  return err;
}
