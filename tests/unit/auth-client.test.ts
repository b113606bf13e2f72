import { describe, expect, it } from "vitest";
import { authErrorCode, authErrorMessage } from "@/lib/auth-client";

// The messages are the product's own words (lib/auth-client.ts); no external source.
describe("authErrorMessage", () => {
  it("returns a plain message for an error in our shape, as the client receives it", () => {
    // better-fetch spreads the JSON body into its error object and adds status and statusText.
    const wrongPassword = { status: 401, statusText: "Unauthorized", error: { code: "invalid_email_or_password", message: "Invalid email or password" } };
    expect(authErrorMessage(wrongPassword)).toBe("That e-mail address and password do not match an account.");
    const unconfirmed = { status: 403, error: { code: "email_verification_required_before_accepting_or_rejecting_invitation", message: "x" } };
    expect(authErrorMessage(unconfirmed)).toMatch(/Confirm your e-mail address/);
  });

  it("returns the server's message when the code has no words of our own", () => {
    expect(authErrorMessage({ status: 422, error: { code: "password_too_short", message: "Password too short" } })).toBe("Password too short");
  });

  describe("edge cases", () => {
    it("reads the library's own shape too, and says to wait on 429", () => {
      expect(authErrorMessage({ status: 401, code: "INVALID_EMAIL_OR_PASSWORD", message: "Invalid email or password" })).toBe(
        "That e-mail address and password do not match an account.",
      );
      expect(authErrorMessage({ status: 429, error: { code: "too_many_requests", message: "Too many requests." } })).toMatch(/Too many attempts/);
      expect(authErrorMessage(null)).toBe("Something went wrong.");
      expect(authErrorMessage({ status: 500 })).toBe("Something went wrong.");
    });

    it("returns the code in lower case from either shape, or an empty string", () => {
      expect(authErrorCode({ error: { code: "not_found" } })).toBe("not_found");
      expect(authErrorCode({ code: "USER_ALREADY_EXISTS" })).toBe("user_already_exists");
      expect(authErrorCode(undefined)).toBe("");
    });
  });
});
