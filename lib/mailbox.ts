import "server-only";
import { readdir, readFile } from "node:fs/promises";
import { join } from "node:path";
import { config } from "./config";

export interface CapturedMail {
  id: string;
  receivedAt: string;
  from: string | null;
  to: string[];
  subject: string;
  text: string;
}

/** Mails captured by the local fake SMTP server; null when a real provider is configured. */
export async function readMailbox(visibleTo: Set<string>, limit = 200): Promise<CapturedMail[] | null> {
  if (!config.mailboxDir) return null;
  let files: string[];
  try {
    files = (await readdir(config.mailboxDir)).filter((f) => f.endsWith(".json"));
  } catch {
    return [];
  }
  const mails: CapturedMail[] = [];
  for (const f of files) {
    try {
      const m = JSON.parse(await readFile(join(config.mailboxDir, f), "utf8")) as CapturedMail;
      if (m.to.some((t) => visibleTo.has(t.toLowerCase()))) mails.push(m);
    } catch {
      // A half-written file: skip it.
    }
  }
  return mails.sort((a, b) => b.receivedAt.localeCompare(a.receivedAt)).slice(0, limit);
}
