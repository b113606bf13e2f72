import "server-only";
import nodemailer, { type Transporter } from "nodemailer";
import { config } from "./config";

let transport: Transporter | undefined;

function getTransport(): Transporter {
  if (!transport) {
    const url = new URL(config.smtpUrl);
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

export interface MailMessage {
  to: string | string[];
  subject: string;
  text: string;
}

/**
 * Sends one plain-text mail. A failure to deliver is logged and swallowed:
 * a state change in the app never fails because the mail server is down.
 */
export async function sendMail(message: MailMessage): Promise<boolean> {
  const to = Array.isArray(message.to) ? message.to : [message.to];
  if (to.length === 0) return false;
  try {
    await getTransport().sendMail({ from: config.mailFrom, to, subject: message.subject, text: message.text });
    return true;
  } catch (err) {
    console.error("[mail] could not send", message.subject, "to", to.join(", "), err instanceof Error ? err.message : err);
    return false;
  }
}
