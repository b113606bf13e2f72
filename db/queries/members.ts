import { and, asc, eq } from "drizzle-orm";
import { db } from "@/db";
import type { Tx } from "@/db/client";
import { invitation, member, organization, user } from "@/db/schema";
import { ConflictError, NotFoundError } from "@/lib/errors";
import type { RoleName } from "@/lib/permissions";
import { recordEvent } from "./audit";

export async function listMembers(teamId: string) {
  return db
    .select({ id: member.id, userId: member.userId, role: member.role, createdAt: member.createdAt, name: user.name, email: user.email })
    .from(member)
    .innerJoin(user, eq(user.id, member.userId))
    .where(eq(member.organizationId, teamId))
    .orderBy(asc(user.name));
}

/** E-mail addresses of the team's members with one of `roles`. */
export async function emailsByRole(teamId: string, roles: RoleName[]): Promise<string[]> {
  const rows = await db
    .select({ email: user.email, role: member.role })
    .from(member)
    .innerJoin(user, eq(user.id, member.userId))
    .where(eq(member.organizationId, teamId));
  return rows.filter((r) => roles.includes(r.role as RoleName)).map((r) => r.email);
}

export async function emailOfUser(userId: string | null): Promise<string | null> {
  if (!userId) return null;
  const [row] = await db.select({ email: user.email }).from(user).where(eq(user.id, userId)).limit(1);
  return row?.email ?? null;
}

export async function listInvitations(teamId: string) {
  return db
    .select({ id: invitation.id, email: invitation.email, role: invitation.role, status: invitation.status, expiresAt: invitation.expiresAt, createdAt: invitation.createdAt })
    .from(invitation)
    .where(eq(invitation.organizationId, teamId))
    .orderBy(asc(invitation.createdAt));
}

/**
 * Locks the team for a change of its members, then the member row, and counts
 * the team's admins with a locking read. Two admins demoting or removing each
 * other at the same moment are thus taken one after the other, and the
 * second sees the first's change: the team always keeps an admin.
 */
async function lockMember(tx: Tx, teamId: string, memberId: string) {
  const [team] = await tx.select({ id: organization.id }).from(organization).where(eq(organization.id, teamId)).for("update");
  if (!team) throw new NotFoundError("member");
  const [m] = await tx.select().from(member).where(and(eq(member.organizationId, teamId), eq(member.id, memberId))).for("update").limit(1);
  if (!m) throw new NotFoundError("member");
  const admins = await tx
    .select({ id: member.id })
    .from(member)
    .where(and(eq(member.organizationId, teamId), eq(member.role, "admin")))
    .for("update");
  return { m, adminCount: admins.length };
}

/** Changes a member's role; the team always keeps at least one admin. */
export async function changeRole(teamId: string, actorId: string, memberId: string, role: RoleName) {
  return db.transaction(async (tx) => {
    const { m, adminCount } = await lockMember(tx, teamId, memberId);
    if (m.role === "admin" && role !== "admin" && adminCount <= 1) {
      throw new ConflictError("conflict", "This is the team's last admin. Make someone else admin first.");
    }
    await tx.update(member).set({ role }).where(eq(member.id, memberId));
    await recordEvent(tx, {
      teamId,
      actorId,
      action: "member.role_changed",
      entityType: "member",
      entityId: memberId,
      summary: { before: { role: m.role }, after: { role } },
    });
    return { ...m, role };
  });
}

/** Removes a member; never the team's last admin. */
export async function removeMember(teamId: string, actorId: string, memberId: string) {
  return db.transaction(async (tx) => {
    const { m, adminCount } = await lockMember(tx, teamId, memberId);
    if (m.role === "admin" && adminCount <= 1) {
      throw new ConflictError("conflict", "This is the team's last admin and cannot be removed.");
    }
    await tx.delete(member).where(eq(member.id, memberId));
    await recordEvent(tx, {
      teamId,
      actorId,
      action: "member.removed",
      entityType: "member",
      entityId: memberId,
      summary: { before: { userId: m.userId, role: m.role } },
    });
    return true;
  });
}
