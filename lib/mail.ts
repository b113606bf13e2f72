import "server-only";
import nodemailer, { type Transporter } from "nodemailer";
import { settings } from "./settings";

let transport: Transporter | undefined;

function getTransport(): Transporter {
  if (!transport) {
    const url = new URL(settings().mail.smtpUrl);
    const loopback = url.hostname === "127.0.0.1" || url.hostname === "localhost";
    transport = nodemailer.createTransport({
      host: url.hostname,
      port: Number(url.port || 587),
      secure: url.protocol === "smtps:",
      // The local fake speaks plain SMTP on loopback; a real provider uses TLS.
      ignoreTLS: loopback,
      auth: url.username ? { user: decodeURIComponent(url.username), pass: decodeURIComponent(url.password) } : undefined,
    });
  }
  return transport;
}

/**
 * What a mail is about: "team" for a team's own business (invitations, review
 * and release notices), "account" for mail about one person's account
 * (password reset, address confirmation), which belongs to no team.
 */
export type MailKind = "team" | "account";

/** Headers that tag each mail with its team and kind; the local mail catcher stores them. */
export const MAIL_TEAM_HEADER = "X-Gelwright-Team";
export const MAIL_KIND_HEADER = "X-Gelwright-Kind";

export type MailMessage = {
  to: string | string[];
  subject: string;
  text: string;
} & ({ kind: "team"; teamId: string } | { kind: "account"; teamId?: never });

/**
 * Sends one plain-text mail. A failure to deliver is logged and swallowed:
 * a state change in the app never fails because the mail server is down.
 */
export async function sendMail(message: MailMessage): Promise<boolean> {
  const to = Array.isArray(message.to) ? message.to : [message.to];
  if (to.length === 0) return false;
  try {
    const headers: Record<string, string> = { [MAIL_KIND_HEADER]: message.kind };
    if (message.kind === "team") headers[MAIL_TEAM_HEADER] = message.teamId;
    await getTransport().sendMail({ from: settings().mail.from, to, subject: message.subject, text: message.text, headers });
    return true;
  } catch (err) {
    console.error("[mail] could not send", message.subject, "to", to.join(", "), err instanceof Error ? err.message : err);
    return false;
  }
}
