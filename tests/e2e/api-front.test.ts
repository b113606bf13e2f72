/**
 * Attacks on the HTTP front of the running app (scripts/server.ts): a made-up
 * client address to dodge the sign-in limit, bodies far over their limit sent
 * in chunks, changes without Origin or as text/plain, and the headers every
 * answer must carry.
 */
import { describe, expect, it } from "vitest";
import { rawRequest, type RawAnswer } from "@/tests/helpers/raw-http";
import { bombSheet, workbookWith } from "@/tests/helpers/zip";
import { coatInput, library } from "./fixtures";
import { BASE, demo, signIn } from "./http";
import { pidListeningOn, watchMemory } from "./server-process";

const PORT = Number(new URL(BASE).port);
const json = (answer: RawAnswer | "closed") => (answer === "closed" ? null : (JSON.parse(answer.body) as { error?: { code: string; message: string } }));

describe("client address for the sign-in limit", () => {
  it("counts a client that invents a new X-Forwarded-For on each try as one client (429 on the sixth try)", async () => {
    // The test app trusts X-Forwarded-For from 127.0.0.1 only (scripts/test.sh);
    // this client connects from 127.0.0.9, so what it claims is not believed.
    const statuses: number[] = [];
    for (let i = 0; i < 6; i++) {
      const answer = await rawRequest({
        port: PORT,
        localAddress: "127.0.0.9",
        method: "POST",
        path: "/api/auth/sign-in/email",
        headers: { host: new URL(BASE).host, origin: BASE, "content-type": "application/json", "x-forwarded-for": `198.51.100.${i + 1}` },
        body: JSON.stringify({ email: demo.production, password: "wrong-password-123" }),
      });
      statuses.push(answer === "closed" ? 0 : answer.status);
    }
    expect(statuses).toEqual([401, 401, 401, 401, 401, 429]);
  });
});

describe("request bodies over their limit", () => {
  it("cuts off a 200 MB chunked body to the sign-in route (no session) and keeps answering", async () => {
    const answer = await rawRequest({
      port: PORT,
      method: "POST",
      path: "/api/auth/sign-in/email",
      headers: { host: new URL(BASE).host, origin: BASE, "content-type": "application/json", "transfer-encoding": "chunked" },
      chunks: { size: 1024 * 1024, count: 200 },
    });
    // The server answers 413 at 64 kB and hangs up; a client still writing may see only the hang-up.
    if (answer !== "closed") {
      expect(answer.status).toBe(413);
      expect(json(answer)?.error?.code).toBe("too_large");
    }
    expect((await fetch(`${BASE}/api/health`)).status).toBe(200);
  });

  it("fault test: ten 200 MB chunked bodies and ten decompression bombs at once leave /api/health answering 200 and the server under 1 GB", async () => {
    const pid = pidListeningOn(PORT);
    expect(pid, "the app's process").not.toBeNull();
    const formulator = await signIn(demo.formulator);
    // About 2 MB each: a sheet declaring 2,000 MiB unpacked, and one that claims 1,000 bytes but inflates to 300 MiB.
    const bombs = [workbookWith(bombSheet(2000)), workbookWith({ ...bombSheet(300), centralSize: 1000, localSize: 1000 })];
    const memory = watchMemory(pid!);
    const targets = ["/api/auth/sign-in/email", "/api/auth/sign-up/email", "/api/compute", "/api/formulations", "/api/imports?kind=materials"];
    const bodies = Array.from({ length: 10 }, (_, i) =>
      rawRequest({
        port: PORT,
        method: "POST",
        path: targets[i % targets.length],
        headers: { host: new URL(BASE).host, origin: BASE, "content-type": i % 5 === 4 ? "multipart/form-data; boundary=x" : "application/json", "transfer-encoding": "chunked" },
        chunks: { size: 1024 * 1024, count: 200 },
      }),
    );
    const uploads = Array.from({ length: 10 }, (_, i) => {
      const form = new FormData();
      form.set("file", new Blob([new Uint8Array(bombs[i % 2]!)]), `bomb-${i}.xlsx`);
      form.set("kind", "materials");
      return formulator.fetch("/api/imports?kind=materials", { method: "POST", body: form });
    });
    const health = await fetch(`${BASE}/api/health`);
    const answers = await Promise.all(bodies);
    const uploaded = await Promise.all(uploads);
    const peak = memory.stop();
    console.log(
      `[fault] ten 200 MB chunked bodies and ten zip bombs: server peak resident memory ${(peak / 1024 / 1024).toFixed(0)} MB; ` +
        `bodies ${answers.map((a) => (a === "closed" ? "closed" : a.status)).join(" ")}; bombs ${uploaded.map((r) => r.status).join(" ")}`,
    );
    expect(health.status).toBe(200);
    expect((await fetch(`${BASE}/api/health`)).status).toBe(200);
    for (const a of answers) if (a !== "closed") expect([401, 413]).toContain(a.status);
    // 413 for the declared size, 422 for the size that lied.
    expect(uploaded.map((r) => r.status)).toEqual(Array.from({ length: 10 }, (_, i) => (i % 2 === 0 ? 413 : 422)));
    expect(peak).toBeLessThan(1024 * 1024 * 1024);
  });
});

describe("changes to the API", () => {
  it("refuses a change without an Origin header, and one sent as text/plain or as a form, and saves nothing", async () => {
    const formulator = await signIn(demo.formulator);
    const lib = await library(formulator);
    const name = `Not JSON ${Date.now().toString(36)}`;
    const body = JSON.stringify({ name, input: coatInput(lib) });
    const noOrigin = await fetch(`${BASE}/api/formulations`, {
      method: "POST",
      headers: { cookie: formulator.cookie, "content-type": "application/json", "x-forwarded-for": formulator.ip },
      body,
    });
    expect(noOrigin.status).toBe(403);
    expect(((await noOrigin.json()) as { error: { code: string } }).error.code).toBe("bad_origin");
    for (const type of ["text/plain", "application/x-www-form-urlencoded"]) {
      const res = await formulator.fetch("/api/formulations", { method: "POST", headers: { "content-type": type }, body });
      expect(res.status, type).toBe(415);
      expect(((await res.json()) as { error: { message: string } }).error.message).toMatch(/application\/json/);
    }
    const list = (await (await formulator.fetch(`/api/formulations?q=${encodeURIComponent(name)}`)).json()) as { total: number };
    expect(list.total).toBe(0);
  });
});

describe("answer headers", () => {
  it("marks API answers holding team data no-store", async () => {
    const formulator = await signIn(demo.formulator);
    const res = await formulator.fetch("/api/formulations");
    expect(res.status).toBe(200);
    expect(res.headers.get("cache-control")).toBe("no-store");
  });

  it("answers a method a route does not have with 405 and a JSON body", async () => {
    const res = await fetch(`${BASE}/api/health`, { method: "DELETE", headers: { origin: BASE } });
    expect(res.status).toBe(405);
    expect(res.headers.get("content-type")).toMatch(/application\/json/);
    expect(((await res.json()) as { error: { code: string } }).error.code).toBe("method_not_allowed");
  });

  it("allows page scripts only by a fresh nonce, and every script tag of the page carries it", async () => {
    const first = await fetch(`${BASE}/sign-in`);
    const policy = first.headers.get("content-security-policy") ?? "";
    const scriptSrc = policy.split(";").find((d) => d.trim().startsWith("script-src")) ?? "";
    expect(scriptSrc).not.toMatch(/unsafe-inline/);
    const nonce = /'nonce-([^']+)'/.exec(scriptSrc)?.[1];
    expect(nonce).toBeTruthy();
    const html = await first.text();
    const tags = html.match(/<script\b[^>]*>/g) ?? [];
    expect(tags.length).toBeGreaterThan(0);
    for (const tag of tags) expect(tag).toContain(`nonce="${nonce}"`);
    const second = await fetch(`${BASE}/sign-in`);
    expect(second.headers.get("content-security-policy")).not.toBe(policy);
  });
});
