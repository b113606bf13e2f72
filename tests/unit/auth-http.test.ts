import { describe, expect, it, vi } from "vitest";
import { isAuthPathAllowed, serveAuth, toOurErrorShape } from "@/lib/auth-http";
import { belongsToTeam } from "@/lib/mailbox";

// The allow-list and the error shape are the product's own contract (lib/auth-http.ts, DEVELOPERS.md); no external source.
describe("isAuthPathAllowed", () => {
  it("returns true for the endpoints the pages use, with their method", () => {
    for (const [method, path] of [
      ["POST", "/api/auth/sign-in/email"],
      ["POST", "/api/auth/sign-up/email"],
      ["POST", "/api/auth/sign-out"],
      ["GET", "/api/auth/get-session"],
      ["POST", "/api/auth/request-password-reset"],
      ["GET", "/api/auth/reset-password/abc123"],
      ["POST", "/api/auth/reset-password"],
      ["POST", "/api/auth/send-verification-email"],
      ["GET", "/api/auth/verify-email"],
      ["GET", "/api/auth/organization/get-invitation"],
      ["POST", "/api/auth/organization/accept-invitation"],
    ]) {
      expect(isAuthPathAllowed(method!, path!), `${method} ${path}`).toBe(true);
    }
  });

  it("returns false for the library's own team and account changes", () => {
    for (const path of [
      "/api/auth/organization/update-member-role",
      "/api/auth/organization/remove-member",
      "/api/auth/organization/invite-member",
      "/api/auth/organization/set-active",
      "/api/auth/organization/delete",
      "/api/auth/update-user",
      "/api/auth/change-email",
      "/api/auth/delete-user",
    ]) {
      expect(isAuthPathAllowed("POST", path), path).toBe(false);
      expect(isAuthPathAllowed("GET", path), path).toBe(false);
    }
  });

  describe("edge cases", () => {
    it("returns false for a kept path under another method, with a trailing slash or a doubled slash", () => {
      expect(isAuthPathAllowed("GET", "/api/auth/sign-in/email")).toBe(false);
      expect(isAuthPathAllowed("PUT", "/api/auth/sign-in/email")).toBe(false);
      expect(isAuthPathAllowed("POST", "/api/auth/sign-in/email/")).toBe(false);
      expect(isAuthPathAllowed("POST", "/api/auth//sign-in/email")).toBe(false);
      expect(isAuthPathAllowed("GET", "/api/auth/reset-password/a/b")).toBe(false);
      expect(isAuthPathAllowed("GET", "/api/other/get-session")).toBe(false);
    });
  });
});

describe("toOurErrorShape", () => {
  it("returns the library's error code in lower case and its message, with the status kept", async () => {
    const res = await toOurErrorShape(
      Response.json({ code: "INVALID_EMAIL_OR_PASSWORD", message: "Invalid email or password" }, { status: 401, headers: { "set-cookie": "a=b; Path=/" } }),
    );
    expect(res.status).toBe(401);
    expect(await res.json()).toEqual({ error: { code: "invalid_email_or_password", message: "Invalid email or password" } });
    expect(res.headers.get("set-cookie")).toBe("a=b; Path=/");
  });

  it("returns 422 for the library's 400 (bad input), as our routes do", async () => {
    const res = await toOurErrorShape(Response.json({ code: "VALIDATION_ERROR", message: "[body.email] Invalid email" }, { status: 400 }));
    expect(res.status).toBe(422);
    expect(await res.json()).toEqual({ error: { code: "validation_error", message: "[body.email] Invalid email" } });
  });

  it("returns a successful answer or a redirect unchanged", async () => {
    const ok = Response.json({ user: { id: "u" } });
    expect(await toOurErrorShape(ok)).toBe(ok);
    const redirect = new Response(null, { status: 302, headers: { location: "/reset-password?error=INVALID_TOKEN" } });
    expect(await toOurErrorShape(redirect)).toBe(redirect);
  });

  describe("edge cases", () => {
    it("names a code from the status when the library sends none, and keeps Retry-After", async () => {
      const res = await toOurErrorShape(Response.json({ message: "Too many requests. Please try again later." }, { status: 429, headers: { "X-Retry-After": "7" } }));
      expect(res.status).toBe(429);
      expect(await res.json()).toEqual({ error: { code: "too_many_requests", message: "Too many requests. Please try again later." } });
      expect(res.headers.get("x-retry-after")).toBe("7");
    });

    it("turns a plain-text or empty error body into our shape", async () => {
      const text = await toOurErrorShape(new Response("Not Found", { status: 404 }));
      expect(await text.json()).toEqual({ error: { code: "not_found", message: "Not Found" } });
      const empty = await toOurErrorShape(new Response(null, { status: 403 }));
      expect(((await empty.json()) as { error: { code: string } }).error.code).toBe("forbidden");
    });

    it("never passes a server error's detail on", async () => {
      const res = await toOurErrorShape(Response.json({ message: "Table 'user' doesn't exist at /srv/app/node_modules/x.js" }, { status: 500 }));
      expect(res.status).toBe(500);
      expect(JSON.stringify(await res.json())).not.toMatch(/Table|node_modules/);
    });
  });
});

describe("serveAuth", () => {
  it("returns 404 in our shape for a closed endpoint without calling the library", async () => {
    const handler = vi.fn(async () => Response.json({ ok: true }));
    const res = await serveAuth(new Request("http://localhost/api/auth/organization/update-member-role", { method: "POST" }), handler);
    expect(res.status).toBe(404);
    const body = (await res.json()) as { error: { code: string; message: string } };
    expect(body.error.code).toBe("not_found");
    expect(body.error.message).toMatch(/\/api\/members/);
    expect(handler).not.toHaveBeenCalled();
  });

  it("returns the library's answer for a kept endpoint", async () => {
    const res = await serveAuth(new Request("http://localhost/api/auth/get-session"), async () => Response.json(null));
    expect(res.status).toBe(200);
    expect(await res.json()).toBeNull();
  });

  describe("edge cases", () => {
    it("returns 503 in our shape when the library throws because the database is down", async () => {
      const spy = vi.spyOn(console, "error").mockImplementation(() => {});
      const res = await serveAuth(new Request("http://localhost/api/auth/sign-in/email", { method: "POST" }), async () => {
        throw Object.assign(new Error("connect ECONNREFUSED 127.0.0.1:3317"), { code: "ECONNREFUSED" });
      });
      spy.mockRestore();
      expect(res.status).toBe(503);
      expect(((await res.json()) as { error: { code: string } }).error.code).toBe("unavailable");
    });

    it("returns a generic 500 in our shape when the library throws", async () => {
      const spy = vi.spyOn(console, "error").mockImplementation(() => {});
      const res = await serveAuth(new Request("http://localhost/api/auth/get-session"), async () => {
        throw new Error("boom at /srv/secret.js");
      });
      spy.mockRestore();
      expect(res.status).toBe(500);
      expect(JSON.stringify(await res.json())).not.toMatch(/boom|secret/);
    });
  });
});

describe("belongsToTeam", () => {
  it("returns true only for mail tagged as the team's own business", () => {
    expect(belongsToTeam({ kind: "team", team: "t1" }, "t1")).toBe(true);
    expect(belongsToTeam({ kind: "team", team: "t2" }, "t1")).toBe(false);
    expect(belongsToTeam({ kind: "account", team: null }, "t1")).toBe(false);
  });

  describe("edge cases", () => {
    it("returns false for untagged mail and for account mail that names a team", () => {
      expect(belongsToTeam({}, "t1")).toBe(false);
      expect(belongsToTeam({ kind: null, team: "t1" }, "t1")).toBe(false);
      expect(belongsToTeam({ kind: "account", team: "t1" }, "t1")).toBe(false);
      expect(belongsToTeam({ kind: "team", team: null }, "")).toBe(false);
    });
  });
});
