/**
 * Browser helpers for the end-to-end tests: Debian's Chromium driven by
 * playwright-core (never a downloaded browser), one context per user with its
 * own client address, axe-core scans and screenshots.
 */
import { mkdirSync } from "node:fs";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { chromium, type BrowserContext, type Page } from "playwright-core";
import { expect } from "vitest";
import { BASE, DEMO_PASSWORD, nextClientIp } from "./http";

export const CHROMIUM = process.env.CHROMIUM_PATH ?? "/usr/bin/chromium";
export const SCREENSHOT_DIR = join(process.cwd(), ".tmp", "test", "screenshots");

const FLAGS = [
  "--headless",
  "--no-sandbox",
  "--disable-gpu",
  "--disable-dev-shm-usage",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
  "--no-first-run",
];

export interface Session {
  context: BrowserContext;
  page: Page;
  ip: string;
  close: () => Promise<void>;
}

/**
 * A fresh browser profile (its own --user-data-dir) with a distinct
 * x-forwarded-for address, so each user's sign-ins count separately.
 */
export async function openSession(opts: { width?: number; height?: number } = {}): Promise<Session> {
  const ip = nextClientIp();
  const userDataDir = mkdtempSync(join(tmpdir(), "gelwright-e2e-"));
  const context = await chromium.launchPersistentContext(userDataDir, {
    executablePath: CHROMIUM,
    headless: true,
    args: FLAGS,
    viewport: { width: opts.width ?? 1280, height: opts.height ?? 900 },
    extraHTTPHeaders: { "x-forwarded-for": ip },
    baseURL: BASE,
    bypassCSP: true,
  });
  context.setDefaultTimeout(20_000);
  const page = context.pages()[0] ?? (await context.newPage());
  return {
    context,
    page,
    ip,
    close: async () => {
      await context.close().catch(() => undefined);
      rmSync(userDataDir, { recursive: true, force: true });
    },
  };
}

/** Signs in through the sign-in page and waits for the home page. */
export async function signInAs(page: Page, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail address").fill(email);
  await page.getByLabel("Password", { exact: true }).fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(/\/home$/);
}

export interface AxeViolation {
  id: string;
  impact: string | null;
  help: string;
  nodes: string[];
}

/** Runs axe-core on the page; returns serious and critical violations only. */
export async function seriousViolations(page: Page): Promise<AxeViolation[]> {
  await page.addScriptTag({ path: join(process.cwd(), "node_modules", "axe-core", "axe.min.js") });
  const violations = await page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run: (ctx: Document, opts: unknown) => Promise<{ violations: { id: string; impact: string | null; help: string; nodes: { target: string[] }[] }[] }> } }).axe;
    const result = await axe.run(document, { resultTypes: ["violations"] });
    return result.violations.map((v) => ({ id: v.id, impact: v.impact, help: v.help, nodes: v.nodes.slice(0, 5).map((n) => n.target.join(" ")) }));
  });
  return violations.filter((v) => v.impact === "serious" || v.impact === "critical");
}

/** Saves a full-page screenshot as a test artifact. */
export async function screenshot(page: Page, name: string): Promise<string> {
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  const path = join(SCREENSHOT_DIR, `${name}.png`);
  await page.screenshot({ path, fullPage: true });
  return path;
}

/** A suffix that makes names unique across reruns. */
export function unique(): string {
  return `${Date.now().toString(36)}${Math.floor(Math.random() * 1000)}`;
}

/** Selects the first option of a <select> whose text matches `pattern`. */
export async function pickOption(page: Page, selector: string, pattern: RegExp): Promise<string> {
  const value = await page.locator(selector).evaluate((el, source) => {
    const re = new RegExp(source, "i");
    const option = Array.from((el as HTMLSelectElement).options).find((o) => re.test(o.textContent ?? ""));
    return option?.value ?? null;
  }, pattern.source);
  if (!value) throw new Error(`no option matching ${pattern} in ${selector}`);
  await page.locator(selector).selectOption(value);
  return value;
}

/** Fills a number input so react-hook-form sees the change. */
export async function setNumber(page: Page, selector: string, value: number | string): Promise<void> {
  const input = page.locator(selector);
  await input.fill(String(value));
  await input.blur();
}

/** The revision id in a URL such as /revisions/<id> or /revisions/<id>/edit. */
export function revisionIdOf(url: string): string {
  const m = /\/revisions\/([0-9a-f-]{36})/.exec(url);
  if (!m) throw new Error(`no revision id in ${url}`);
  return m[1]!;
}

/** expect.poll with a timeout that suits a page talking to a server (vitest's default is 1 s). */
export function poll<T>(fn: () => T | Promise<T>, timeout = 15_000) {
  return expect.poll(fn, { timeout, interval: 100 });
}
