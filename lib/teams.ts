/**
 * Team changes that go through the sign-in library's organization plugin
 * (teams are its organizations): creating a team and inviting someone. Its
 * refusals reach the route layer as they are thrown; errorResponse maps them
 * (lib/auth-errors.ts).
 */
import "server-only";
import { db } from "@/db";
import { recordEvent } from "@/db/queries/audit";
import { copyReferenceMaterials } from "@/db/queries/library";
import { auth } from "./auth";
import type { RoleName } from "./permissions";

/** A URL-safe, unique slug from a team's name, e.g. "larkspur-lab-3f9a1c". */
function slugOf(name: string): string {
  const base = name.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-|-$/g, "").slice(0, 40) || "team";
  return `${base}-${crypto.randomUUID().slice(0, 6)}`;
}

/** Creates a team with the caller as its admin, makes it their current team, and starts its library from the reference materials. */
export async function createTeam(headers: Headers, userId: string, name: string): Promise<{ id: string; name: string; slug: string }> {
  const team = await auth.api.createOrganization({ headers, body: { name, slug: slugOf(name) } });
  if (!team) throw new Error("The sign-in library created no team.");
  await auth.api.setActiveOrganization({ headers, body: { organizationId: team.id } });
  await copyReferenceMaterials(db, team.id, userId);
  return { id: team.id, name: team.name, slug: team.slug };
}

/** Invites someone by e-mail with a role (the mail carries a link valid for 7 days) and records it in the audit trail. */
export async function inviteMember(headers: Headers, actor: { userId: string; teamId: string }, email: string, role: RoleName) {
  const created = (await auth.api.createInvitation({
    headers,
    body: { email, role: role as "admin", organizationId: actor.teamId, resend: true },
  })) as { id: string } | null;
  if (created) {
    await recordEvent(db, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "member.invited",
      entityType: "invitation",
      entityId: created.id,
      summary: { after: { email, role } },
    });
  }
  return created;
}
