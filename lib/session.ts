import "server-only";
import { and, asc, eq } from "drizzle-orm";
import { LRUCache } from "lru-cache";
import { headers as nextHeaders } from "next/headers";
import { db } from "@/db";
import { member, organization } from "@/db/schema";
import { auth } from "./auth";
import type { RoleName } from "./permissions";

/** Who is asking, in which team, with which role. */
export interface TeamContext {
  userId: string;
  userName: string;
  email: string;
  teamId: string;
  teamName: string;
  role: RoleName;
}

/** A signed-in user who is not (or no longer) a member of any team. */
export interface TeamlessContext {
  userId: string;
  userName: string;
  email: string;
  teamId: null;
}

/**
 * The signed-in user and their current team, or null when not signed in.
 * Pages call it; route handlers get it through route() (lib/http/route.ts).
 */
export async function getContext(reqHeaders?: Headers): Promise<TeamContext | TeamlessContext | null> {
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

/** How long getContextBriefly trusts an answer: less than the session cookie cache (60 s). */
export const BRIEF_CONTEXT_TTL_MS = 30_000;
const briefContexts = new LRUCache<string, TeamContext>({ max: 10_000, ttl: BRIEF_CONTEXT_TTL_MS });
const SESSION_TOKEN = /(?:^|;\s*)(?:__Secure-)?gelwright\.session_token=([^;]+)/;

/**
 * getContext for routes that read and change nothing stored (the
 * calculator; declared with `brief: true`, see lib/http/route.ts): who a
 * session cookie belongs to is remembered in this process for
 * BRIEF_CONTEXT_TTL_MS, so a run of requests pays for one session check and
 * one membership query. Only members of a team are remembered, keyed by the
 * signed session cookie; a sign-out, a removal from the team or a role
 * change reaches these routes within that time.
 */
export async function getContextBriefly(reqHeaders: Headers): Promise<Awaited<ReturnType<typeof getContext>>> {
  const token = SESSION_TOKEN.exec(reqHeaders.get("cookie") ?? "")?.[1];
  const known = token ? briefContexts.get(token) : undefined;
  if (known) return known;
  const ctx = await getContext(reqHeaders);
  if (token && ctx?.teamId) briefContexts.set(token, ctx);
  return ctx;
}
