import { eq } from "drizzle-orm";
import { db } from "@/db";
import { organization, teamSettings } from "@/db/schema";
import { DEFAULT_CURRENCY } from "@/lib/currency";
import { NotFoundError } from "@/lib/errors";
import { recordEvent } from "./audit";
import type { Actor } from "./batches";

/** The team's settings, or the defaults (currency EUR) when none are saved. */
export async function getTeamSettings(teamId: string) {
  const [row] = await db.select({ currency: teamSettings.currency }).from(teamSettings).where(eq(teamSettings.teamId, teamId)).limit(1);
  return { currency: row?.currency ?? DEFAULT_CURRENCY, isDefault: !row };
}

/**
 * Sets the team's currency (admins). Two admins saving at once are serialised
 * on the team's `organization` row, so each audit event's "before" is the
 * currency the other one left, never a stale read.
 */
export async function saveTeamSettings(actor: Actor, values: { currency: string }) {
  await db.transaction(async (tx) => {
    const [team] = await tx.select({ id: organization.id }).from(organization).where(eq(organization.id, actor.teamId)).for("update");
    if (!team) throw new NotFoundError("team");
    const [before] = await tx.select({ currency: teamSettings.currency }).from(teamSettings).where(eq(teamSettings.teamId, actor.teamId)).for("update");
    await tx
      .insert(teamSettings)
      .values({ teamId: actor.teamId, currency: values.currency, updatedBy: actor.userId })
      .onDuplicateKeyUpdate({ set: { currency: values.currency, updatedBy: actor.userId, updatedAt: new Date() } });
    await recordEvent(tx, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "team.currency_changed",
      entityType: "team",
      entityId: actor.teamId,
      summary: { before: { currency: before?.currency ?? DEFAULT_CURRENCY }, after: { currency: values.currency } },
    });
  });
  return getTeamSettings(actor.teamId);
}
