/**
 * Security basics over HTTP: response headers, cookie flags, the sign-in rate
 * limit, cross-site requests, and errors that never leak internals.
 */
import { describe, expect, it } from "vitest";
import { computeFormulation } from "@/lib/formulation";
import { coatInput, library } from "./fixtures";
import { BASE, DEMO_PASSWORD, demo, nextClientIp, signIn, signUp } from "./http";

describe("security headers", () => {
  it("sends a content security policy that forbids framing, plus nosniff and a referrer policy", async () => {
    for (const [path, defaultSrc] of [["/api/health", "'none'"], ["/sign-in", "'self'"]] as const) {
      const res = await fetch(`${BASE}${path}`);
      const csp = res.headers.get("content-security-policy") ?? "";
      expect(csp, path).toContain(`default-src ${defaultSrc}`);
      expect(csp, path).toMatch(/frame-ancestors 'none'/);
      expect(res.headers.get("x-content-type-options"), path).toBe("nosniff");
      expect(res.headers.get("referrer-policy"), path).toBe("strict-origin-when-cross-origin");
      expect(res.headers.get("x-powered-by"), path).toBeNull();
    }
  });
});

describe("session cookie", () => {
  it("is HttpOnly, SameSite=Lax and scoped to the whole site", async () => {
    const ip = nextClientIp();
    const res = await fetch(`${BASE}/api/auth/sign-in/email`, {
      method: "POST",
      headers: { "content-type": "application/json", origin: BASE, "x-forwarded-for": ip },
      body: JSON.stringify({ email: demo.reviewer, password: DEMO_PASSWORD }),
    });
    expect(res.status).toBe(200);
    const session = res.headers.getSetCookie().find((c) => c.startsWith("gelwright.session_token="));
    expect(session).toBeDefined();
    expect(session).toMatch(/HttpOnly/i);
    expect(session).toMatch(/SameSite=Lax/i);
    expect(session).toMatch(/Path=\//i);
  });
});

describe("sign-in rate limit", () => {
  it("refuses the sixth sign-in attempt within 10 s from one address with 429", async () => {
    const ip = nextClientIp();
    const statuses: number[] = [];
    for (let i = 0; i < 6; i++) {
      const res = await fetch(`${BASE}/api/auth/sign-in/email`, {
        method: "POST",
        headers: { "content-type": "application/json", origin: BASE, "x-forwarded-for": ip },
        body: JSON.stringify({ email: demo.production, password: "wrong-password-123" }),
      });
      statuses.push(res.status);
    }
    expect(statuses).toEqual([401, 401, 401, 401, 401, 429]);
  });
});

describe("cross-site requests", () => {
  it("refuses a change sent from another origin, with a session cookie, and changes nothing", async () => {
    const formulator = await signIn(demo.formulator);
    const lib = await library(formulator);
    const name = `Cross-site ${Date.now().toString(36)}`;
    const res = await fetch(`${BASE}/api/formulations`, {
      method: "POST",
      headers: { cookie: formulator.cookie, origin: "https://evil.example", "content-type": "application/json", "x-forwarded-for": formulator.ip },
      body: JSON.stringify({ name, input: coatInput(lib) }),
    });
    expect(res.status).toBe(403);
    const list = (await (await formulator.fetch(`/api/formulations?q=${encodeURIComponent(name)}`)).json()) as { total: number };
    expect(list.total).toBe(0);
  });

  it("refuses better-auth calls from another origin", async () => {
    const res = await fetch(`${BASE}/api/auth/sign-in/email`, {
      method: "POST",
      headers: { "content-type": "application/json", origin: "https://evil.example", "x-forwarded-for": nextClientIp() },
      body: JSON.stringify({ email: demo.formulator, password: DEMO_PASSWORD }),
    });
    expect(res.status).toBe(403);
  });
});

describe("errors", () => {
  it("answers malformed JSON with 400 and an oversized body with 413, without internals", async () => {
    const formulator = await signIn(demo.formulator);
    const bad = await formulator.fetch("/api/compute", { method: "POST", body: "{not json", headers: { "content-type": "application/json" } });
    expect(bad.status).toBe(400);
    const big = await formulator.fetch("/api/compute", { method: "POST", body: JSON.stringify({ pad: "x".repeat(1_100_000) }), headers: { "content-type": "application/json" } });
    expect(big.status).toBe(413);
    for (const res of [bad, big]) {
      const text = JSON.stringify(await res.json());
      expect(text).toMatch(/"error":\{"code"/);
      expect(text).not.toMatch(/node_modules|at .*\(|stack/i);
    }
  });

  it("answers an engine error with 422 naming the field", async () => {
    const formulator = await signIn(demo.formulator);
    const input = coatInput(await library(formulator), { teos: 0.4 });
    input.components[1]!.weightFraction = 0.5; // 0.4 + 0.5 = 0.9, not 1
    const res = await formulator.fetch("/api/compute", { method: "POST", json: input });
    expect(res.status).toBe(422);
    const body = (await res.json()) as { error: { fields: Record<string, string> } };
    expect(Object.keys(body.error.fields).some((f) => f.startsWith("components"))).toBe(true);
  });
});

describe("the calculator's engine thread", () => {
  it("answers exactly what the engine computes here, for 24 different inputs sent at once", async () => {
    const formulator = await signIn(demo.formulator);
    const lib = await library(formulator);
    const inputs = Array.from({ length: 24 }, (_, i) => coatInput(lib, { teos: 0.2 + i * 0.025, cureC: 60 + i }));
    const answers = await Promise.all(inputs.map((input) => formulator.fetch("/api/compute", { method: "POST", json: input })));
    expect(answers.map((res) => res.status)).toEqual(inputs.map(() => 200));
    for (const [i, res] of answers.entries()) {
      // The same engine in the test process; JSON drops what JSON drops (undefined fields).
      expect(await res.json()).toEqual(JSON.parse(JSON.stringify(computeFormulation(inputs[i] as Parameters<typeof computeFormulation>[0]))));
    }
  });

  it("names the body when the input as a whole is wrong", async () => {
    const formulator = await signIn(demo.formulator);
    const res = await formulator.fetch("/api/compute", { method: "POST", body: "[]", headers: { "content-type": "application/json" } });
    expect(res.status).toBe(422);
    const body = (await res.json()) as { error: { fields: Record<string, string> } };
    expect(Object.keys(body.error.fields)).toEqual(["body"]);
  });
});

describe("the calculator's brief session memo", () => {
  it("answers a signed-in member, and still refuses no cookie, an altered cookie and a user without a team", async () => {
    const formulator = await signIn(demo.formulator);
    const lib = await library(formulator);
    const input = coatInput(lib);
    const post = (cookie: string) =>
      fetch(`${BASE}/api/compute`, {
        method: "POST",
        headers: { cookie, origin: BASE, "content-type": "application/json", "x-forwarded-for": formulator.ip },
        body: JSON.stringify(input),
      });
    // Twice: the second answer comes from the memo and must be the same.
    const first = await post(formulator.cookie);
    const second = await post(formulator.cookie);
    expect([first.status, second.status]).toEqual([200, 200]);
    expect(await second.json()).toEqual(await first.json());

    expect((await post("")).status).toBe(401);
    // The token with one character of its signature changed: never taken from the memo.
    const altered = formulator.cookie.replace(/(gelwright\.session_token=[^;]*)(.)(;|$)/, (_m, head: string, last: string, tail: string) => `${head}${last === "A" ? "B" : "A"}${tail}`);
    expect(altered).not.toBe(formulator.cookie);
    const onlyToken = altered.split("; ").filter((c) => c.startsWith("gelwright.session_token=")).join("; ");
    expect((await post(onlyToken)).status).toBe(401);
    expect((await post(onlyToken)).status).toBe(401);

    const loner = await signUp(`memo-${Date.now().toString(36)}@elsewhere.example`, "Lone Calculator");
    expect((await post(loner.cookie)).status).toBe(403);
    expect((await post(loner.cookie)).status).toBe(403);
  });
});

describe("the address to return to after signing in", () => {
  // Open-redirect bypasses (OWASP "Unvalidated Redirects and Forwards Cheat Sheet"):
  // a browser reads "/\evil.example" as "//evil.example", another site.
  const offSite = ["/\\evil.example", "//evil.example", "/\\/evil.example", "/\t/evil.example", "https://evil.example/home"];

  it("redirects a signed-in member only within the site, whatever next= says", async () => {
    const member = await signIn(demo.reviewer);
    for (const next of offSite) {
      const res = await member.fetch(`/sign-in?next=${encodeURIComponent(next)}`);
      expect(res.status, next).toBeGreaterThanOrEqual(300);
      expect(res.status, next).toBeLessThan(400);
      const location = res.headers.get("location") ?? "";
      expect(new URL(location, BASE).origin, `${next} → ${location}`).toBe(new URL(BASE).origin);
      expect(new URL(location, BASE).pathname, `${next} → ${location}`).toBe("/home");
    }
  });

  it("keeps a good path on our site", async () => {
    const member = await signIn(demo.reviewer);
    const res = await member.fetch(`/sign-in?next=${encodeURIComponent("/materials?sort=name")}`);
    const location = res.headers.get("location") ?? "";
    expect(new URL(location, BASE).origin).toBe(new URL(BASE).origin);
    expect(location).toMatch(/\/materials\?sort=name$/);
  });
});
