/**
 * better-auth in the browser: sign-in, sign-up, password reset and the
 * organization (team) plugin. The base URL is the page's own origin.
 */
import { organizationClient } from "better-auth/client/plugins";
import { createAuthClient } from "better-auth/react";

export const authClient = createAuthClient({
  plugins: [organizationClient()],
});

/** The message of a better-auth client error, in plain words. */
export function authErrorMessage(error: { message?: string; status?: number; code?: string } | null | undefined): string {
  if (!error) return "Something went wrong.";
  if (error.status === 429) return "Too many attempts from this address. Wait a few seconds and try again.";
  if (error.code === "INVALID_EMAIL_OR_PASSWORD") return "That e-mail address and password do not match an account.";
  if (error.code === "USER_ALREADY_EXISTS" || error.code === "USER_ALREADY_EXISTS_USE_ANOTHER_EMAIL")
    return "An account with this e-mail address already exists. Sign in instead.";
  return error.message || "Something went wrong.";
}
