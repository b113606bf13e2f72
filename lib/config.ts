import "server-only";
import { readFrontSettings } from "./server/settings";

const front = readFrontSettings();

/** Settings from the environment, each with a working local default. */
export const config = {
  baseUrl: front.baseUrl,
  /** Origins allowed to send changes: the app's own and GELWRIGHT_TRUSTED_ORIGINS. */
  trustedOrigins: front.trustedOrigins,
  authSecret:
    process.env.BETTER_AUTH_SECRET ??
    // Local default so `npm start` needs no env file; scripts/start.sh sets a generated one.
    "gelwright-local-development-secret-change-me-0000",
  smtpUrl: process.env.SMTP_URL ?? "smtp://127.0.0.1:2525",
  mailFrom: process.env.MAIL_FROM ?? "Gelwright <no-reply@gelwright.local>",
  /** Folder where the local fake SMTP server stores captured mails; unset with a real provider. */
  mailboxDir: process.env.MAILBOX_DIR ?? (process.env.SMTP_URL ? undefined : ".data/mailbox"),
  /** Sign-in attempts allowed per address per 10 s window. */
  signInRateLimit: Number(process.env.GELWRIGHT_SIGNIN_RATE_LIMIT ?? 5),
} as const;
