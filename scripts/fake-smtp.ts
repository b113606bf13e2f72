/**
 * A local stand-in for a mail provider: accepts SMTP on loopback and stores each
 * message as JSON in MAILBOX_DIR (default .data/mailbox), where the app's
 * mailbox page and the tests read it, with the team and kind the app tagged
 * it with (X-Gelwright-Team, X-Gelwright-Kind; null when absent). Never use
 * it in production.
 */
import { mkdirSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { simpleParser, type ParsedMail } from "mailparser";
import { SMTPServer } from "smtp-server";

const port = Number(process.env.FAKE_SMTP_PORT ?? 2525);
const dir = process.env.MAILBOX_DIR ?? ".data/mailbox";
mkdirSync(dir, { recursive: true });

/** A header's value as one trimmed string, or null. */
function header(mail: ParsedMail, name: string): string | null {
  const value = mail.headers.get(name);
  return typeof value === "string" && value.trim() ? value.trim() : null;
}

const server = new SMTPServer({
  authOptional: true,
  disabledCommands: ["STARTTLS", "AUTH"],
  size: 1024 * 1024,
  logger: false,
  onData(stream, session, callback) {
    simpleParser(stream)
      .then((mail) => {
        const receivedAt = new Date().toISOString();
        const record = {
          id: `${Date.now()}-${Math.random().toString(36).slice(2, 8)}`,
          receivedAt,
          from: session.envelope.mailFrom ? session.envelope.mailFrom.address : null,
          to: session.envelope.rcptTo.map((r) => r.address),
          team: header(mail, "x-gelwright-team"),
          kind: header(mail, "x-gelwright-kind"),
          subject: mail.subject ?? "",
          text: mail.text ?? "",
        };
        writeFileSync(join(dir, `${record.id}.json`), JSON.stringify(record, null, 2));
        callback();
      })
      .catch((err: Error) => callback(err));
  },
});

server.listen(port, "127.0.0.1", () => {
  console.log(`[fake-smtp] listening on 127.0.0.1:${port}, storing mail in ${dir}`);
});

const stop = () => server.close(() => process.exit(0));
process.on("SIGINT", stop);
process.on("SIGTERM", stop);
