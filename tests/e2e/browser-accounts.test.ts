/**
 * End to end, in Chromium: the account pages besides sign-in. A newcomer
 * creates an account and a team of their own; an invited colleague opens the
 * mailed invitation, creates an account from it, confirms the address by
 * the mailed link and joins with the role given; a user who forgot the password asks for a link, follows the mailed
 * link, sets a new password and signs in with it.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { openSession, poll, screenshot, seriousViolations, unique, type Session } from "./browser";
import { BASE, DEMO_PASSWORD, demo, signIn, signUp, type Client } from "./http";
import { waitForMail } from "./mailbox";

let session: Session;
let admin: Client;

beforeAll(async () => {
  admin = await signIn(demo.admin);
});

afterAll(async () => {
  await session?.close();
});

async function freshSession(): Promise<Session> {
  await session?.close();
  session = await openSession();
  return session;
}

/** The link of a mail that points into the app, or fails the test. */
function linkIn(text: string): string {
  const link = text.match(new RegExp(`${BASE.replace(/[.*+?^${}()|[\]\\]/g, "\\$&")}/\\S+`))?.[0];
  expect(link, text).toBeDefined();
  return link!;
}

describe("creating an account", () => {
  it("refuses two different passwords beside the field, then creates the account and a team of its own", async () => {
    const { page } = await freshSession();
    const email = `newcomer-${unique()}@elsewhere.example`;
    await page.goto("/sign-up");
    await page.getByLabel("Your name").fill("Nell Newcomer");
    await page.getByLabel("E-mail address").fill(email);
    await page.locator("#signup-password").fill("a-long-password-1");
    await page.locator("#signup-confirm").fill("a-long-password-2");
    await page.getByRole("button", { name: "Create account" }).click();
    await poll(() => page.locator("#signup-confirm-error").textContent()).toMatch(/The two passwords differ/);
    expect(await seriousViolations(page)).toEqual([]);

    await page.locator("#signup-confirm").fill("a-long-password-1");
    await page.getByRole("button", { name: "Create account" }).click();
    await page.waitForURL(/\/create-team$/);
    const team = `Nell's lab ${unique()}`;
    await page.locator("#team-name").fill(team);
    await page.getByRole("button", { name: /Create/ }).click();
    await page.waitForURL(/\/home$/);
    await poll(() => page.getByText(team).count()).toBeGreaterThan(0);
    await screenshot(page, "account-new-team");

    // The new team is the account's own: its admin, with a library of its own.
    const api = await signIn(email, "a-long-password-1");
    const me = (await (await api.fetch("/api/members")).json()) as { rows: { email: string; role: string }[] };
    expect(me.rows).toEqual([expect.objectContaining({ email, role: "admin" })]);
  });
});

describe("the sign-in library's errors on screen", () => {
  it("shows a clear message for a wrong password and for an address that already has an account", async () => {
    const { page } = await freshSession();
    await page.goto("/sign-in");
    await page.getByLabel("E-mail address").fill(demo.reviewer);
    await page.getByLabel("Password", { exact: true }).fill("not-the-password-1");
    await page.getByRole("button", { name: "Sign in" }).click();
    await poll(() => page.getByText("That e-mail address and password do not match an account.").count()).toBe(1);

    await page.goto("/sign-up");
    await page.getByLabel("Your name").fill("Rita Repeat");
    await page.getByLabel("E-mail address").fill(demo.reviewer);
    await page.locator("#signup-password").fill("a-long-password-1");
    await page.locator("#signup-confirm").fill("a-long-password-1");
    await page.getByRole("button", { name: "Create account" }).click();
    await poll(() => page.getByText("An account with this e-mail address already exists. Sign in instead.").count()).toBe(1);
  });
});

describe("accepting an invitation", () => {
  it("takes an invited colleague from the mailed link through a new account into the team with the given role", async () => {
    const email = `invited-${unique()}@larkspur.example`;
    const invite = await admin.fetch("/api/invitations", { method: "POST", json: { email, role: "production" } });
    expect(invite.status).toBe(201);
    const mail = await waitForMail(email, /invited/i);
    const link = linkIn(mail.text);
    expect(link).toMatch(/\/invitations\/[^/\s]+$/);

    const { page } = await freshSession();
    await page.goto(link);
    await page.getByRole("link", { name: "Create an account" }).click();
    await page.waitForURL(/\/sign-up\?next=/);
    await page.getByLabel("Your name").fill("Ivo Invited");
    await page.getByLabel("E-mail address").fill(email);
    await page.locator("#signup-password").fill("an-invited-password");
    await page.locator("#signup-confirm").fill("an-invited-password");
    await page.getByRole("button", { name: "Create account" }).click();
    await page.waitForURL(/\/invitations\//);
    // A new account's address is not confirmed yet: the page says so and mails a link that leads back.
    await poll(() => page.getByRole("heading", { name: "Confirm your e-mail address first" }).count()).toBe(1);
    expect(await page.getByRole("button", { name: "Accept and join" }).count()).toBe(0);
    expect(await seriousViolations(page)).toEqual([]);
    await page.getByRole("button", { name: "Send the confirmation link" }).click();
    await poll(() => page.getByText(/A confirmation link is on its way/).count()).toBe(1);
    const confirm = await waitForMail(email, /confirm your e-mail/i);
    await page.goto(linkIn(confirm.text));
    await page.waitForURL(/\/invitations\/[^/?]+$/);
    await page.getByRole("button", { name: "Accept and join" }).click();
    await page.waitForURL(/\/home$/);
    await poll(() => page.getByText("Larkspur Coatings Lab").count()).toBeGreaterThan(0);

    const members = (await (await admin.fetch("/api/members")).json()) as { rows: { email: string; role: string }[] };
    expect(members.rows).toContainEqual(expect.objectContaining({ email, role: "production" }));
  });
});

describe("signing in with a next= address", () => {
  it("stays on our site when next= is a backslash path that browsers read as another host", async () => {
    // Open-redirect bypass (OWASP "Unvalidated Redirects and Forwards Cheat Sheet"): "/\evil.example" is "//evil.example" to a browser.
    const { page } = await freshSession();
    const requested: string[] = [];
    page.on("request", (req) => requested.push(req.url()));
    await page.goto(`/sign-in?next=${encodeURIComponent("/\\evil.example")}`);
    await page.getByLabel("E-mail address").fill(demo.reviewer);
    await page.getByLabel("Password", { exact: true }).fill(DEMO_PASSWORD);
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL(/\/home$/);
    expect(new URL(page.url()).origin).toBe(new URL(BASE).origin);
    expect(requested.filter((url) => url.includes("evil.example") && !url.startsWith(BASE))).toEqual([]);
  });
});

describe("a forgotten password", () => {
  it("mails a link, sets the new password from it, and signs in with the new one only", async () => {
    const email = `forgetful-${unique()}@elsewhere.example`;
    await signUp(email, "Fay Forgetful", "the-old-password-1");

    const { page } = await freshSession();
    await page.goto("/forgot-password");
    await page.getByLabel("E-mail address").fill(email);
    await page.getByRole("button", { name: "Send the link" }).click();
    await poll(() => page.getByText(/a link is on its way/).count()).toBe(1);
    const mail = await waitForMail(email, /reset/i);

    await page.goto(linkIn(mail.text));
    await page.waitForURL(/\/reset-password\?token=/);
    await page.locator("#new-password").fill("the-new-password-2");
    await page.locator("#new-password-again").fill("the-new-password-2");
    await page.getByRole("button", { name: "Set the new password" }).click();
    await page.waitForURL(/\/sign-in\?reset=done$/);
    expect(await seriousViolations(page)).toEqual([]);

    await poll(() => page.getByText("Your password has been changed. Sign in with the new one.").count()).toBe(1);
    await page.getByLabel("E-mail address").fill(email);
    await page.getByLabel("Password", { exact: true }).fill("the-new-password-2");
    await page.getByRole("button", { name: "Sign in" }).click();
    // Without a team yet, signing in leads on to creating one.
    await page.waitForURL(/\/create-team$/);
    await expect(signIn(email, "the-old-password-1")).rejects.toThrow(/401/);

    // The link works once.
    await page.goto(linkIn(mail.text));
    await poll(() => page.getByText("This link does not work").count()).toBe(1);
  });
});
