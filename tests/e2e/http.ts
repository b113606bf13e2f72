/** Helpers for tests that talk HTTP to the app that scripts/test.sh started. */
import { appLink, waitForMail } from "./mailbox";
export const BASE = `http://localhost:${process.env.TEST_APP_PORT ?? 3100}`;
export const DEMO_PASSWORD = "larkspur-demo-2026";

// Each test file loads this module afresh: a random block keeps their addresses apart.
const block = Math.floor(Math.random() * 250);
let ip = 0;
/** A distinct client address per sign-in, so the sign-in rate limit applies per test client. */
export function nextClientIp(): string {
  ip++;
  return `10.${block}.${Math.floor(ip / 250) % 250}.${(ip % 250) + 1}`;
}

export interface Client {
  cookie: string;
  ip: string;
  fetch: (path: string, init?: RequestInit & { json?: unknown }) => Promise<Response>;
}

function makeFetch(cookie: string, clientIp: string) {
  return (path: string, init: RequestInit & { json?: unknown } = {}) => {
    const headers = new Headers(init.headers);
    if (cookie) headers.set("cookie", cookie);
    headers.set("origin", BASE);
    headers.set("x-forwarded-for", clientIp);
    let body = init.body;
    if (init.json !== undefined) {
      headers.set("content-type", "application/json");
      body = JSON.stringify(init.json);
    }
    return fetch(`${BASE}${path}`, { ...init, headers, body, redirect: "manual" });
  };
}

export function anonymous(): Client {
  const clientIp = nextClientIp();
  return { cookie: "", ip: clientIp, fetch: makeFetch("", clientIp) };
}

/** Calls a better-auth sign-in or sign-up endpoint from a fresh client address; returns the signed-in client. */
async function authenticate(path: string, body: Record<string, string>, what: string): Promise<Client> {
  const clientIp = nextClientIp();
  const res = await makeFetch("", clientIp)(path, { method: "POST", json: body });
  if (res.status !== 200) throw new Error(`${what} failed: ${res.status} ${await res.text()}`);
  const cookie = res.headers
    .getSetCookie()
    .map((c) => c.split(";")[0])
    .join("; ");
  return { cookie, ip: clientIp, fetch: makeFetch(cookie, clientIp) };
}

/** The same client with the cookies of `res` set over its own (a refreshed session, a new sign-in). */
export function withCookies(client: Client, res: Response): Client {
  const jar = new Map(client.cookie ? client.cookie.split("; ").map((c) => [c.split("=")[0]!, c] as const) : []);
  for (const c of res.headers.getSetCookie()) {
    const pair = c.split(";")[0]!;
    jar.set(pair.split("=")[0]!, pair);
  }
  const cookie = [...jar.values()].filter((c) => !/^[^=]+=$/.test(c)).join("; ");
  return { cookie, ip: client.ip, fetch: makeFetch(cookie, client.ip) };
}

export function signIn(email: string, password = DEMO_PASSWORD): Promise<Client> {
  return authenticate("/api/auth/sign-in/email", { email, password }, `sign-in of ${email}`);
}

export function signUp(email: string, name: string, password = "a-test-password-1"): Promise<Client> {
  return authenticate("/api/auth/sign-up/email", { email, password, name }, `sign-up of ${email}`);
}

export const demo = {
  admin: "admin@larkspur.example",
  formulator: "formulator@larkspur.example",
  reviewer: "reviewer@larkspur.example",
  production: "production@larkspur.example",
} as const;

/**
 * Confirms a signed-in client's e-mail address as a person would: asks for the
 * mailed link, opens it, and keeps the refreshed session cookies it sets.
 */
export async function verifyAddress(client: Client, email: string): Promise<Client> {
  const since = Date.now() - 1_000;
  const sent = await client.fetch("/api/auth/send-verification-email", { method: "POST", json: { email, callbackURL: "/home" } });
  if (sent.status !== 200) throw new Error(`verification mail for ${email}: ${sent.status} ${await sent.text()}`);
  const mail = await waitForMail(email, /confirm your e-mail/i, 5_000, since);
  const link = appLink(mail.text, BASE);
  if (!link) throw new Error(`no link in the verification mail to ${email}`);
  const opened = await client.fetch(link.slice(BASE.length));
  if (opened.status !== 302 && opened.status !== 307) throw new Error(`verification link: ${opened.status} ${await opened.text()}`);
  return withCookies(client, opened);
}
