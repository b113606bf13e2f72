import "server-only";
import { readdir, readFile } from "node:fs/promises";
import { join } from "node:path";
import { settings } from "./settings";

export interface CapturedMail {
  id: string;
  receivedAt: string;
  from: string | null;
  to: string[];
  subject: string;
  text: string;
}

/** A stored mail as the local mail catcher writes it, with the app's tags. */
interface StoredMail extends CapturedMail {
  team?: string | null;
  kind?: string | null;
}

/**
 * True when a captured mail may be shown to `teamId`: mail the app tagged as
 * that team's own business. Mail about an account (password reset, address
 * confirmation), another team's mail and untagged mail are never shown, so a
 * team that invites an address cannot read what else is sent to it.
 */
export function belongsToTeam(mail: { team?: string | null; kind?: string | null }, teamId: string): boolean {
  return mail.kind === "team" && typeof mail.team === "string" && mail.team === teamId;
}

/** Mails captured by the local fake SMTP server for one team; null when a real provider is configured. */
export async function readMailbox(teamId: string, limit = 200): Promise<CapturedMail[] | null> {
  const { mailboxDir } = settings().mail;
  if (!mailboxDir) return null;
  let files: string[];
  try {
    files = (await readdir(mailboxDir)).filter((f) => f.endsWith(".json"));
  } catch {
    return [];
  }
  const mails: CapturedMail[] = [];
  for (const f of files) {
    try {
      const { team, kind, ...m } = JSON.parse(await readFile(join(mailboxDir, f), "utf8")) as StoredMail;
      if (belongsToTeam({ team, kind }, teamId)) mails.push(m);
    } catch {
      // A half-written file: skip it.
    }
  }
  return mails.sort((a, b) => b.receivedAt.localeCompare(a.receivedAt)).slice(0, limit);
}
