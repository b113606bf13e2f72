import { isAPIError } from "better-auth/api";

/** A refusal of the sign-in library, in our error shape's terms. */
export interface AuthRefusal {
  status: number;
  code: string;
  message: string;
}

/**
 * What an error thrown by better-auth's server API (auth.api.*) means to the
 * caller, or null when `err` is not one: its status (400, bad input, becomes
 * 422 as for our own validation), its code in lower case and its message.
 */
export function authRefusal(err: unknown): AuthRefusal | null {
  if (!isAPIError(err) || typeof err.statusCode !== "number") return null;
  const body = err.body as { message?: string; code?: string } | undefined;
  return {
    status: err.statusCode === 400 ? 422 : err.statusCode,
    code: (body?.code ?? "auth_error").toLowerCase(),
    message: body?.message ?? err.message ?? "Request refused.",
  };
}
