/**
 * The HTTP front (lib/server/*), on real sockets of an in-process Node server:
 * the client's address, byte limits while a body streams in, same-origin JSON
 * for changes, the page policy and JSON for 405.
 */
import { once } from "node:events";
import { createServer, type IncomingMessage, type Server, type ServerResponse } from "node:http";
import type { AddressInfo } from "node:net";
import { afterEach, describe, expect, it } from "vitest";
import { bodyLimitFor, MAX_AUTH_BODY_BYTES, MAX_JSON_BODY_BYTES } from "@/lib/server/body-limit";
import { CLIENT_ADDRESS_HEADER } from "@/lib/server/client-address";
import { changeRefusal, createFront, pagePolicy, routePath } from "@/lib/server/front";
import { rawRequest, type RawAnswer, type RawRequest } from "@/tests/helpers/raw-http";
import { parseSettings, SettingsError } from "@/lib/settings";

const ORIGIN = "http://localhost:3000";
let server: Server | undefined;

afterEach(async () => {
  if (server) {
    server.closeAllConnections();
    await new Promise((resolve) => server!.close(resolve));
    server = undefined;
  }
});

interface Seen {
  address?: string;
  forwardedFor?: string;
  bodyBytes: number;
  policyOnRequest?: string;
}

/** A server with the front before a handler that reads the whole body, as a route would. */
async function start(trustedProxies: string, handler?: (req: IncomingMessage, res: ServerResponse) => void) {
  const prepare = createFront(parseSettings({ BETTER_AUTH_URL: ORIGIN, GELWRIGHT_TRUSTED_PROXIES: trustedProxies }).server, { dev: false });
  const seen: Seen = { bodyBytes: 0 };
  server = createServer((req, res) => {
    if (!prepare(req, res)) return;
    seen.address = req.headers[CLIENT_ADDRESS_HEADER] as string;
    seen.forwardedFor = req.headers["x-forwarded-for"] as string;
    seen.policyOnRequest = req.headers["content-security-policy"] as string | undefined;
    if (handler) return handler(req, res);
    req.on("data", (chunk: Buffer) => (seen.bodyBytes += chunk.length));
    req.on("end", () => res.end("ok"));
    req.on("error", () => undefined);
  });
  server.listen(0, "127.0.0.1");
  await once(server, "listening");
  return { port: (server.address() as AddressInfo).port, seen };
}

type Answer = RawAnswer;
const send = (port: number, opts: Omit<RawRequest, "port">) => rawRequest({ port, path: "/api/x", ...opts });

describe("client address", () => {
  // Choosing the client address from X-Forwarded-For: only entries added by trusted
  // proxies count, walking from the socket outwards (MDN Web Docs, "X-Forwarded-For",
  // section "Selecting an IP address"; proxy-addr's documented behaviour).
  it("ignores X-Forwarded-For when no proxy is trusted (the default) and uses the socket's address", async () => {
    const { port, seen } = await start("");
    await send(port, { headers: { "x-forwarded-for": "203.0.113.7", [CLIENT_ADDRESS_HEADER]: "198.51.100.9" } });
    expect(seen.address).toBe("127.0.0.1");
    expect(seen.forwardedFor).toBe("127.0.0.1");
  });

  it("takes the address a trusted proxy added, and the first untrusted one in a chain", async () => {
    const { port, seen } = await start("127.0.0.1");
    await send(port, { headers: { "x-forwarded-for": "203.0.113.7" } });
    expect(seen.address).toBe("203.0.113.7");
    // A client that forged an entry before the proxy's: the forged one is never reached.
    await send(port, { headers: { "x-forwarded-for": "198.51.100.1, 203.0.113.8" } });
    expect(seen.address).toBe("203.0.113.8");
  });

  it("does not believe a client on another address that sends X-Forwarded-For", async () => {
    const { port, seen } = await start("127.0.0.1");
    await send(port, { headers: { "x-forwarded-for": "203.0.113.7" }, localAddress: "127.0.0.9" });
    expect(seen.address).toBe("127.0.0.9");
  });
});

describe("settings", () => {
  const proxies = (value: string | undefined) => parseSettings({ GELWRIGHT_TRUSTED_PROXIES: value }).server.trustedProxies;
  const origins = (base: string, extra: string | undefined) => parseSettings({ BETTER_AUTH_URL: base, GELWRIGHT_TRUSTED_ORIGINS: extra }).server.trustedOrigins;

  it("accepts addresses, CIDR ranges and proxy-addr's named ranges", () => {
    expect(proxies(" 10.0.0.5, 10.1.0.0/16 ,::1, fd00::/8, loopback")).toEqual(["10.0.0.5", "10.1.0.0/16", "::1", "fd00::/8", "loopback"]);
    expect(proxies(undefined)).toEqual([]);
    expect([...origins(ORIGIN, "https://lab.example/path")]).toEqual([ORIGIN, "https://lab.example"]);
  });

  describe("edge cases", () => {
    it("stops with a message naming the setting and the bad entry", () => {
      expect(() => proxies("10.0.0.5, proxy.example")).toThrow(SettingsError);
      expect(() => proxies("10.0.0.0/33")).toThrow(/GELWRIGHT_TRUSTED_PROXIES=“10.0.0.0\/33”: expected IP addresses or CIDR ranges.*not “10.0.0.0\/33”/);
      expect(() => origins(ORIGIN, "not a url")).toThrow(/GELWRIGHT_TRUSTED_ORIGINS=“not a url”: expected URLs starting with http:\/\/ or https:\/\//);
      expect(() => origins("ftp://x.example", undefined)).toThrow(/BETTER_AUTH_URL=“ftp:\/\/x.example”/);
    });
  });
});

describe("body limits", () => {
  it("gives each kind of route its own limit", () => {
    expect(bodyLimitFor("POST", "/api/auth/sign-in/email")).toBe(MAX_AUTH_BODY_BYTES);
    expect(bodyLimitFor("POST", "/api/compute")).toBe(MAX_JSON_BODY_BYTES);
    expect(bodyLimitFor("POST", "/api/imports")).toBeGreaterThan(5 * 1024 * 1024);
    expect(bodyLimitFor("POST", "/api/attachments")).toBeGreaterThan(10 * 1024 * 1024);
  });

  it("refuses a declared Content-Length over the limit before reading any of it", async () => {
    const { port, seen } = await start("");
    const answer = await send(port, {
      method: "POST",
      path: "/api/auth/sign-in/email",
      headers: { origin: ORIGIN, "content-type": "application/json", "content-length": String(MAX_AUTH_BODY_BYTES + 1) },
      body: "x".repeat(MAX_AUTH_BODY_BYTES + 1),
    });
    expect(answer).not.toBe("closed");
    expect((answer as Answer).status).toBe(413);
    expect(JSON.parse((answer as Answer).body)).toMatchObject({ error: { code: "too_large" } });
    expect(seen.bodyBytes).toBe(0);
  });

  it("reads a sender slightly over the limit to the end and answers 413, so that fetch sees the answer", async () => {
    const { port, seen } = await start("");
    const body = JSON.stringify({ pad: "x".repeat(MAX_JSON_BODY_BYTES + 100_000) });
    const res = await fetch(`http://127.0.0.1:${port}/api/compute`, { method: "POST", headers: { origin: ORIGIN, "content-type": "application/json" }, body });
    expect(res.status).toBe(413);
    expect(seen.bodyBytes).toBe(0);
    const chunked = await send(port, {
      method: "POST",
      path: "/api/compute",
      headers: { origin: ORIGIN, "content-type": "application/json", "transfer-encoding": "chunked" },
      chunks: { size: 100_000, count: 12 },
    });
    expect((chunked as Answer).status).toBe(413);
    expect(seen.bodyBytes).toBeLessThanOrEqual(MAX_JSON_BODY_BYTES);
  });

  it("cuts a chunked body off at the limit: the route never receives more, the sender is answered 413 or hung up on", async () => {
    const { port, seen } = await start("");
    // 64 MB in 64 kB chunks, with no Content-Length, to a route that allows 64 kB.
    const answer = await send(port, {
      method: "POST",
      path: "/api/auth/sign-in/email",
      headers: { origin: ORIGIN, "content-type": "application/json", "transfer-encoding": "chunked" },
      chunks: { size: 64 * 1024, count: 1024 },
    });
    if (answer !== "closed") expect(answer.status).toBe(413);
    expect(seen.bodyBytes).toBeLessThanOrEqual(MAX_AUTH_BODY_BYTES);
  });

  it("passes a chunked body within the limit whole", async () => {
    const { port, seen } = await start("");
    const answer = await send(port, {
      method: "POST",
      path: "/api/compute",
      headers: { origin: ORIGIN, "content-type": "application/json", "transfer-encoding": "chunked" },
      chunks: { size: 1000, count: 900 },
    });
    expect((answer as Answer).status).toBe(200);
    expect(seen.bodyBytes).toBe(900_000);
  });
});

describe("changes to the API", () => {
  const post = (headers: Record<string, string>) => ({ method: "POST", headers: { host: "localhost:3000", ...headers } }) as IncomingMessage;
  const origins = parseSettings({ BETTER_AUTH_URL: ORIGIN }).server.trustedOrigins;

  it("are refused without an Origin, from another origin, or with a body that is not JSON", () => {
    expect(changeRefusal(post({ "content-type": "application/json", "content-length": "2" }), "/api/formulations", origins)).toMatchObject({ status: 403 });
    expect(changeRefusal(post({ origin: "https://evil.example", "content-type": "application/json", "content-length": "2" }), "/api/formulations", origins)).toMatchObject({ status: 403 });
    expect(changeRefusal(post({ origin: ORIGIN, "content-type": "text/plain", "content-length": "2" }), "/api/formulations", origins)).toMatchObject({ status: 415 });
    expect(changeRefusal(post({ origin: ORIGIN, "content-type": "application/x-www-form-urlencoded", "content-length": "2" }), "/api/auth/sign-in/email", origins)).toMatchObject({ status: 415 });
    expect(changeRefusal(post({ origin: ORIGIN, "content-type": "multipart/form-data; boundary=x", "content-length": "2" }), "/api/formulations", origins)).toMatchObject({ status: 415 });
  });

  it("are let through from our origin as JSON, to the upload routes, and without a body", () => {
    expect(changeRefusal(post({ origin: ORIGIN, "content-type": "application/json; charset=utf-8", "content-length": "2" }), "/api/formulations", origins)).toBeNull();
    expect(changeRefusal(post({ origin: ORIGIN, "content-type": "multipart/form-data; boundary=x", "content-length": "2" }), "/api/imports", origins)).toBeNull();
    // The upload routes say themselves that they want multipart, after the role check (400 not_multipart).
    expect(changeRefusal(post({ origin: ORIGIN, "content-type": "application/json", "content-length": "2" }), "/api/attachments", origins)).toBeNull();
    expect(changeRefusal(post({ origin: ORIGIN }), "/api/revisions/x/release", origins)).toBeNull();
    expect(changeRefusal({ method: "GET", headers: {} } as IncomingMessage, "/api/formulations", origins)).toBeNull();
  });

  it("meets a path written another way (dot segments, percent-escapes) with the same checks", async () => {
    expect(routePath("/%61pi/./compute?x=1")).toBe("/api/compute");
    expect(routePath("/api/x/../auth/sign-in/email")).toBe("/api/auth/sign-in/email");
    expect(routePath("/api/%E0%A4%A")).toBe("/api/%E0%A4%A");
    const { port, seen } = await start("");
    for (const path of ["/%61pi/formulations", "/api/./formulations"]) {
      const answer = (await send(port, { method: "POST", path, headers: { "content-type": "text/plain" }, body: "{}" })) as Answer;
      expect(answer.status, path).toBe(403);
    }
    expect(seen.bodyBytes).toBe(0);
  });

  it("answers a refused change in the API's error shape, without reading the body", async () => {
    const { port, seen } = await start("");
    const answer = (await send(port, { method: "POST", path: "/api/formulations", headers: { "content-type": "text/plain" }, body: "{}" })) as Answer;
    expect(answer.status).toBe(403);
    expect(JSON.parse(answer.body)).toMatchObject({ error: { code: "bad_origin" } });
    expect(seen.bodyBytes).toBe(0);
  });
});

describe("headers", () => {
  it("gives each page a fresh script nonce and never allows inline script without it", async () => {
    const { port, seen } = await start("", (_req, res) => res.end("page"));
    const first = (await send(port, { path: "/sign-in", headers: { "content-security-policy": "script-src *" } })) as Answer;
    const policy = String(first.headers["content-security-policy"]);
    expect(policy).toMatch(/script-src 'self' 'nonce-[A-Za-z0-9+/=]{24}' 'strict-dynamic'/);
    expect(policy.split(";").find((d) => d.trim().startsWith("script-src"))).not.toMatch(/unsafe-inline|unsafe-eval/);
    // Next.js reads the nonce from the request's policy: ours, never the client's.
    expect(seen.policyOnRequest).toBe(policy);
    const second = (await send(port, { path: "/sign-in" })) as Answer;
    expect(second.headers["content-security-policy"]).not.toBe(policy);
    expect(pagePolicy("n", false)).toMatch(/frame-ancestors 'none'/);
  });

  it("marks API answers no-store and gives a bodyless 405 a JSON body, however the empty answer is written", async () => {
    const ways: ((res: ServerResponse) => void)[] = [
      (res) => res.end(),
      (res) => {
        res.flushHeaders();
        res.write(new Uint8Array(0));
        res.end();
      },
      (res) => {
        res.writeHead(405, { "content-length": "0" });
        res.end("");
      },
    ];
    for (const [i, way] of ways.entries()) {
      const { port } = await start("", (_req, res) => {
        res.statusCode = 405;
        way(res);
      });
      const answer = (await send(port, { method: "PATCH", path: "/api/health", headers: { origin: ORIGIN } })) as Answer;
      expect(answer.status, `way ${i}`).toBe(405);
      expect(answer.headers["cache-control"]).toBe("no-store");
      expect(answer.headers["content-type"], `way ${i}`).toBe("application/json");
      expect(JSON.parse(answer.body)).toEqual({ error: { code: "method_not_allowed", message: "PATCH is not accepted at this address." } });
      server!.closeAllConnections();
      await new Promise((resolve) => server!.close(resolve));
      server = undefined;
    }
  });

  it("leaves other answers as the handler wrote them", async () => {
    const { port } = await start("", (_req, res) => {
      res.writeHead(200, { "content-type": "text/plain" });
      res.write("a");
      res.end("b");
    });
    const answer = (await send(port, { path: "/api/health" })) as Answer;
    expect([answer.status, answer.body, answer.headers["content-type"]]).toEqual([200, "ab", "text/plain"]);
  });
});
