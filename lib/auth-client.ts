/**
 * better-auth in the browser: sign-in, sign-up, password reset, address
 * confirmation and accepting an invitation. The base URL is the page's own origin.
 */
import { organizationClient } from "better-auth/client/plugins";
import { createAuthClient } from "better-auth/react";

export const authClient = createAuthClient({
  plugins: [organizationClient()],
});

/**
 * A failed better-auth client call. The server answers in our error shape
 * `{ error: { code, message } }` (lib/auth-http.ts), which the client spreads
 * into its error object; `code` and `message` at the top are the library's own
 * shape, kept for answers that never reached our route.
 */
export interface AuthClientError {
  status?: number;
  code?: string;
  message?: string;
  error?: { code?: string; message?: string };
}

/** The error's code in lower case ("invalid_email_or_password"), or "". */
export function authErrorCode(error: AuthClientError | null | undefined): string {
  return (error?.error?.code ?? error?.code ?? "").toLowerCase();
}

const MESSAGES: Record<string, string> = {
  invalid_email_or_password: "That e-mail address and password do not match an account.",
  user_already_exists: "An account with this e-mail address already exists. Sign in instead.",
  user_already_exists_use_another_email: "An account with this e-mail address already exists. Sign in instead.",
  email_verification_required_before_accepting_or_rejecting_invitation:
    "Confirm your e-mail address with the mailed link before joining the team.",
  email_verification_required_for_invitation: "Confirm your e-mail address with the mailed link before opening the invitation.",
  you_are_not_the_recipient_of_the_invitation: "This invitation was sent to another e-mail address. Sign in with that address.",
  invitation_not_found: "This invitation has expired, was withdrawn or was already used.",
  invalid_token: "This link does not work any more. Ask for a new one.",
  token_expired: "This link has expired. Ask for a new one.",
};

/** The message of a better-auth client error, in plain words. */
export function authErrorMessage(error: AuthClientError | null | undefined): string {
  if (!error) return "Something went wrong.";
  if (error.status === 429) return "Too many attempts from this address. Wait a few seconds and try again.";
  const known = MESSAGES[authErrorCode(error)];
  if (known) return known;
  return error.error?.message || error.message || "Something went wrong.";
}
