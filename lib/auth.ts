import "server-only";
import { betterAuth } from "better-auth";
import { drizzleAdapter } from "better-auth/adapters/drizzle";
import { nextCookies } from "better-auth/next-js";
import { organization } from "better-auth/plugins";
import { db } from "@/db";
import * as schema from "@/db/schema";
import { config } from "./config";
import { sendMail } from "./mail";
import { ac, roles } from "./permissions";

const secure = config.baseUrl.startsWith("https://");

export const auth = betterAuth({
  appName: "Gelwright",
  baseURL: config.baseUrl,
  secret: config.authSecret,
  trustedOrigins: [config.baseUrl],
  telemetry: { enabled: false },
  database: drizzleAdapter(db, { provider: "mysql", schema }),
  emailAndPassword: {
    enabled: true,
    minPasswordLength: 10,
    maxPasswordLength: 128,
    resetPasswordTokenExpiresIn: 60 * 60,
    revokeSessionsOnPasswordReset: true,
    async sendResetPassword({ user, url }) {
      // Mail about an account belongs to no team: no team's captured mailbox shows it.
      await sendMail({
        kind: "account",
        to: user.email,
        subject: "Reset your Gelwright password",
        text: `Someone asked to reset the password of ${user.email}.\n\nOpen this link within an hour to choose a new one:\n${url}\n\nIf it was not you, ignore this mail; your password stays as it is.`,
      });
    },
  },
  session: {
    expiresIn: 60 * 60 * 24 * 7,
    updateAge: 60 * 60 * 24,
    // A signed copy of the session in a cookie saves a database read per request;
    // a revoked session stops working within this many seconds.
    cookieCache: { enabled: true, maxAge: 60 },
  },
  rateLimit: {
    enabled: process.env.GELWRIGHT_RATE_LIMIT !== "off",
    window: 60,
    max: 300,
    customRules: {
      "/sign-in/email": { window: 10, max: config.signInRateLimit },
      "/request-password-reset": { window: 60, max: 3 },
      "/sign-up/email": { window: 60, max: 5 },
    },
  },
  advanced: {
    useSecureCookies: secure,
    defaultCookieAttributes: { httpOnly: true, sameSite: "lax", secure },
    cookiePrefix: "gelwright",
  },
  plugins: [
    organization({
      ac,
      roles,
      creatorRole: "admin",
      invitationExpiresIn: 60 * 60 * 24 * 7,
      cancelPendingInvitationsOnReInvite: true,
      async sendInvitationEmail({ id, email, role, organization: team, inviter }) {
        await sendMail({
          kind: "team",
          teamId: team.id,
          to: email,
          subject: `You are invited to ${team.name} on Gelwright`,
          text: `${inviter.user.name} (${inviter.user.email}) invites you to join ${team.name} as ${role}.\n\nAccept within 7 days:\n${config.baseUrl}/invitations/${id}\n`,
        });
      },
    }),
    nextCookies(),
  ],
});

export type Session = typeof auth.$Infer.Session;
