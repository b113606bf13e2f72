import "server-only";
import { betterAuth } from "better-auth";
import { APIError } from "better-auth/api";
import { drizzleAdapter } from "better-auth/adapters/drizzle";
import { nextCookies } from "better-auth/next-js";
import { organization } from "better-auth/plugins";
import { eq } from "drizzle-orm";
import { db } from "@/db";
import { recordEvent } from "@/db/queries/audit";
import * as schema from "@/db/schema";
import { settings } from "./settings";
import { textProblem } from "./formulation/text-rules";
import { CLIENT_ADDRESS_HEADER } from "./server/client-address";
import { sendMail } from "./mail";
import { ac, ROLE_NAMES, roles } from "./permissions";

/** Refuses a membership role other than our four (the library would accept "owner" and the like). */
function assertOurRole(role: string): void {
  const given = role.split(",").map((r) => r.trim());
  if (given.length !== 1 || !(ROLE_NAMES as string[]).includes(given[0]!)) {
    throw APIError.from("BAD_REQUEST", { code: "INVALID_ROLE", message: `A member's role is one of ${ROLE_NAMES.join(", ")}.` });
  }
}

const { server, auth: authSettings } = settings();
const secure = server.baseUrl.startsWith("https://");

export const auth = betterAuth({
  appName: "Gelwright",
  baseURL: server.baseUrl,
  secret: authSettings.secret,
  trustedOrigins: [server.baseUrl],
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
  // Sign-up needs no confirmed address (a newcomer starts a team of their own at
  // once); joining a team by invitation does (see the organization plugin below).
  emailVerification: {
    sendOnSignUp: false,
    sendOnSignIn: false,
    // Opening the mailed link refreshes the session's cached copy of the user,
    // so an invitation can be accepted right away.
    autoSignInAfterVerification: true,
    expiresIn: 60 * 60 * 24,
    async sendVerificationEmail({ user, url }) {
      await sendMail({
        kind: "account",
        to: user.email,
        subject: "Confirm your e-mail address for Gelwright",
        text: `Someone asked to confirm ${user.email} for a Gelwright account.\n\nOpen this link within a day to confirm it:\n${url}\n\nIf it was not you, ignore this mail; nothing changes.`,
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
    enabled: authSettings.rateLimit,
    window: 60,
    max: 300,
    customRules: {
      "/sign-in/email": { window: 10, max: authSettings.signInRateLimit },
      "/request-password-reset": { window: 60, max: 3 },
      "/sign-up/email": { window: 60, max: 5 },
      "/send-verification-email": { window: 60, max: 5 },
    },
  },
  // Errors that are not the library's own (the database down, a bug) reach our
  // handler (lib/auth-http.ts), which answers 503 or a generic 500 in our shape.
  onAPIError: { throw: true },
  // A display name typed at sign-up follows the same rule as every other name
  // (visible, no bidirectional or control characters; lib/formulation/text-rules.ts).
  databaseHooks: {
    user: {
      create: {
        async before(newUser) {
          const problem = textProblem(String(newUser.name ?? ""));
          if (problem) throw APIError.from("BAD_REQUEST", { code: "INVALID_NAME", message: `Name ${problem}.` });
          return { data: newUser };
        },
      },
    },
  },
  advanced: {
    useSecureCookies: secure,
    defaultCookieAttributes: { httpOnly: true, sameSite: "lax", secure },
    cookiePrefix: "gelwright",
    // The client's address as the HTTP front established it (scripts/server.ts):
    // X-Forwarded-For counts only from GELWRIGHT_TRUSTED_PROXIES, and the front
    // overwrites this header whatever the client sent.
    ipAddress: { ipAddressHeaders: [CLIENT_ADDRESS_HEADER] },
  },
  plugins: [
    organization({
      ac,
      roles,
      creatorRole: "admin",
      invitationExpiresIn: 60 * 60 * 24 * 7,
      cancelPendingInvitationsOnReInvite: true,
      // Only the invited address, confirmed by a mailed link, may see or accept an invitation.
      requireEmailVerificationOnInvitation: true,
      organizationHooks: {
        async beforeAcceptInvitation({ invitation, user: accepting }) {
          // Checked again from the database, not from the session's cached copy.
          const [row] = await db
            .select({ email: schema.user.email, emailVerified: schema.user.emailVerified })
            .from(schema.user)
            .where(eq(schema.user.id, accepting.id))
            .limit(1);
          if (!row || row.email.toLowerCase() !== invitation.email.toLowerCase()) {
            throw APIError.from("FORBIDDEN", { code: "YOU_ARE_NOT_THE_RECIPIENT_OF_THE_INVITATION", message: "This invitation was sent to another e-mail address." });
          }
          if (!row.emailVerified) {
            throw APIError.from("FORBIDDEN", {
              code: "EMAIL_VERIFICATION_REQUIRED_BEFORE_ACCEPTING_OR_REJECTING_INVITATION",
              message: "Confirm your e-mail address with the mailed link before joining a team.",
            });
          }
          assertOurRole(invitation.role);
        },
        async afterAcceptInvitation({ invitation, member: joined, user: accepting }) {
          await recordEvent(db, {
            teamId: invitation.organizationId,
            actorId: accepting.id,
            action: "member.joined",
            entityType: "member",
            entityId: joined.id,
            summary: { after: { email: accepting.email, role: joined.role } },
          });
        },
        async beforeAddMember({ member: added }) {
          assertOurRole(added.role);
        },
        async beforeUpdateMemberRole({ newRole }) {
          assertOurRole(newRole);
        },
      },
      async sendInvitationEmail({ id, email, role, organization: team, inviter }) {
        await sendMail({
          kind: "team",
          teamId: team.id,
          to: email,
          subject: `You are invited to ${team.name} on Gelwright`,
          text: `${inviter.user.name} (${inviter.user.email}) invites you to join ${team.name} as ${role}.\n\nAccept within 7 days:\n${server.baseUrl}/invitations/${id}\n`,
        });
      },
    }),
    nextCookies(),
  ],
});

export type Session = typeof auth.$Infer.Session;
