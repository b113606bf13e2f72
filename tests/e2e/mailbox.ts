/** Reads the mails that the fake SMTP server of the test run captured. */
import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";

export interface Captured {
  to: string[];
  /** The team a mail belongs to and its kind ("team" or "account"), from the app's own headers. */
  team?: string | null;
  kind?: string | null;
  subject: string;
  text: string;
  receivedAt: string;
}

export function capturedMails(): Captured[] {
  const dir = process.env.MAILBOX_DIR ?? ".data/mailbox-test";
  let files: string[] = [];
  try {
    files = readdirSync(dir).filter((f) => f.endsWith(".json"));
  } catch {
    return [];
  }
  return files.map((f) => JSON.parse(readFileSync(join(dir, f), "utf8")) as Captured);
}

/** Waits (bounded) for a mail whose subject matches, sent to `to` (received at `since` or later, when given). */
export async function waitForMail(to: string, subject: RegExp, timeoutMs = 5_000, since = 0): Promise<Captured> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const found = capturedMails().find((m) => m.to.includes(to) && subject.test(m.subject) && Date.parse(m.receivedAt) >= since);
    if (found) return found;
    if (Date.now() > until) throw new Error(`no mail to ${to} matching ${subject}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** The first link into the app in a mail's text. */
export function appLink(text: string, base: string): string | undefined {
  return text.match(new RegExp(`${base.replace(/[.*+?^${}()|[\]\\]/g, "\\$&")}/\\S+`))?.[0];
}
