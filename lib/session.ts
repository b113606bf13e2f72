import "server-only";
import { and, asc, eq } from "drizzle-orm";
import { LRUCache } from "lru-cache";
import { headers as nextHeaders } from "next/headers";
import { db } from "@/db";
import { member, organization } from "@/db/schema";
import { forbidden, unauthorized } from "./api";
import { auth } from "./auth";
import { can, type Permission, type RoleName } from "./permissions";

/** Who is asking, in which team, with which role. */
export interface TeamContext {
  userId: string;
  userName: string;
  email: string;
  teamId: string;
  teamName: string;
  role: RoleName;
}

/** The signed-in user and their current team, or null when not signed in. */
export async function getContext(reqHeaders?: Headers): Promise<TeamContext | { userId: string; email: string; userName: string; teamId: null } | null> {
  const h = reqHeaders ?? (await nextHeaders());
  const session = await auth.api.getSession({ headers: h });
  if (!session) return null;
  const { user } = session;
  const active = (session.session as { activeOrganizationId?: string | null }).activeOrganizationId ?? null;
  const rows = await db
    .select({ teamId: member.organizationId, role: member.role, teamName: organization.name })
    .from(member)
    .innerJoin(organization, eq(organization.id, member.organizationId))
    .where(active ? and(eq(member.userId, user.id), eq(member.organizationId, active)) : eq(member.userId, user.id))
    .orderBy(asc(member.createdAt))
    .limit(1);
  let row = rows[0];
  if (!row && active) {
    // The active team is gone (removed from it): fall back to the first membership.
    const first = await db
      .select({ teamId: member.organizationId, role: member.role, teamName: organization.name })
      .from(member)
      .innerJoin(organization, eq(organization.id, member.organizationId))
      .where(eq(member.userId, user.id))
      .orderBy(asc(member.createdAt))
      .limit(1);
    row = first[0];
  }
  if (!row) return { userId: user.id, email: user.email, userName: user.name, teamId: null };
  return {
    userId: user.id,
    userName: user.name,
    email: user.email,
    teamId: row.teamId,
    teamName: row.teamName,
    role: row.role as RoleName,
  };
}

/**
 * For route handlers and server actions: 401 when not signed in, 403 when the
 * user has no team or their role lacks `permission`.
 */
export async function requireContext(reqHeaders: Headers | undefined, permission?: Permission): Promise<TeamContext> {
  const ctx = await getContext(reqHeaders);
  if (!ctx) throw unauthorized();
  if (!ctx.teamId) throw forbidden("use a team's data before joining a team");
  if (permission && !can(ctx.role, permission)) {
    throw forbidden(describe(permission));
  }
  return ctx;
}

/** How long requireContextBriefly trusts an answer: less than the session cookie cache (60 s). */
export const BRIEF_CONTEXT_TTL_MS = 30_000;
const briefContexts = new LRUCache<string, TeamContext>({ max: 10_000, ttl: BRIEF_CONTEXT_TTL_MS });
const SESSION_TOKEN = /(?:^|;\s*)(?:__Secure-)?gelwright\.session_token=([^;]+)/;

/**
 * requireContext for routes that read and change nothing stored (the
 * calculator): who a session cookie belongs to is remembered in this
 * process for BRIEF_CONTEXT_TTL_MS, so a run of requests pays for one
 * session check and one membership query. Only answers that passed the
 * full check are remembered, keyed by the signed session cookie; a sign-out,
 * a removal from the team or a role change reaches these routes within that
 * time. Routes that touch team data use requireContext.
 */
export async function requireContextBriefly(reqHeaders: Headers, permission?: Permission): Promise<TeamContext> {
  const token = SESSION_TOKEN.exec(reqHeaders.get("cookie") ?? "")?.[1];
  let ctx = token ? briefContexts.get(token) : undefined;
  if (!ctx) {
    ctx = await requireContext(reqHeaders);
    if (token) briefContexts.set(token, ctx);
  }
  if (permission && !can(ctx.role, permission)) throw forbidden(describe(permission));
  return ctx;
}

function describe(permission: Permission): string {
  const [resource, action] = permission.split(":");
  const words: Record<string, string> = {
    readUnreleased: "see work that is not released",
    review: "review revisions",
  };
  return words[action ?? ""] ?? `${action} ${resource === "formulation" ? "formulations" : resource}`;
}
