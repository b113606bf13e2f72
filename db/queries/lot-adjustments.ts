/**
 * Stock adjustments of a material lot: its quantity on hand set by hand to
 * what was counted on the shelf (a recount, a spill, a disposal, a sample
 * sent out, or another reason with a note), and the list of them.
 */
import { and, desc, eq } from "drizzle-orm";
import { db } from "@/db";
import { lotAdjustments, materialLots, user } from "@/db/schema";
import { ConflictError, NotFoundError, RuleError } from "@/lib/errors";
import { ADJUSTED_QUANTITY_FACTOR, type AdjustLotInput } from "@/lib/validations/lot-adjustments";
import { recordEvent } from "./audit";
import { fmt, getLot, type Actor } from "./lots";

/**
 * Sets a lot's quantity on hand to `input.quantityOnHand` (in the lot's unit)
 * for a reason, in one transaction: the lot row `FOR UPDATE`, the version
 * check (a stale one is a 409 naming `version`, nothing written), then the
 * adjustment row, the lot's new quantity with `version + 1`, and the audit
 * event `lot.adjusted` (on hand and version before and after, the unit and reason with the after, the note). The amount is what
 * was counted, not a difference: a batch released from the lot while the
 * adjustment waits for the lock takes from the amount as it was, and one
 * released after takes from the counted amount; neither change is lost.
 * Refused (422 naming quantityOnHand): the amount already on hand, or more
 * than `ADJUSTED_QUANTITY_FACTOR` × the quantity received.
 * Another team's lot is a NotFoundError.
 */
export async function adjustLot(actor: Actor, lotId: string, input: AdjustLotInput) {
  const id = crypto.randomUUID();
  await db.transaction(async (tx) => {
    const [lot] = await tx
      .select()
      .from(materialLots)
      .where(and(eq(materialLots.teamId, actor.teamId), eq(materialLots.id, lotId)))
      .for("update")
      .limit(1);
    if (!lot) throw new NotFoundError("material lot");
    if (lot.version !== input.version) {
      throw new ConflictError(
        "conflict",
        `Someone changed this lot after you opened it (your copy is version ${input.version}, the saved one is ${lot.version}). Nothing was overwritten: reload to see their changes, then apply yours again.`,
        "version",
      );
    }
    const cap = lot.quantityReceived * ADJUSTED_QUANTITY_FACTOR;
    if (input.quantityOnHand > cap) {
      throw new RuleError(
        "too_much",
        `The quantity on hand may be at most ${ADJUSTED_QUANTITY_FACTOR} × the quantity received (${fmt(cap)} ${lot.unit}); check the unit (the lot is counted in ${lot.unit}).`,
        "quantityOnHand",
      );
    }
    if (input.quantityOnHand === lot.quantityOnHand) {
      throw new RuleError("no_change", `The lot already has ${fmt(lot.quantityOnHand)} ${lot.unit} on hand: nothing to adjust.`, "quantityOnHand");
    }
    const note = input.note?.trim() || null;
    const version = lot.version + 1;
    await tx.insert(lotAdjustments).values({
      id,
      teamId: actor.teamId,
      lotId,
      quantityBefore: lot.quantityOnHand,
      quantityAfter: input.quantityOnHand,
      lotVersion: version,
      reason: input.reason,
      note,
      adjustedBy: actor.userId,
    });
    const res = await tx
      .update(materialLots)
      .set({ quantityOnHand: input.quantityOnHand, version })
      .where(and(eq(materialLots.id, lotId), eq(materialLots.version, lot.version)));
    if (res[0].affectedRows !== 1) throw new ConflictError("conflict", "This lot changed while saving; reload and try again.", "version");
    await recordEvent(tx, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "lot.adjusted",
      entityType: "lot",
      entityId: lotId,
      summary: {
        before: { quantityOnHand: lot.quantityOnHand, version: lot.version },
        after: { quantityOnHand: input.quantityOnHand, version, unit: lot.unit, reason: input.reason },
        ...(note ? { note } : {}),
      },
    });
  });
  const lot = (await getLot(actor.teamId, lotId))!;
  const [adjustment] = (await listLotAdjustments(actor.teamId, lotId))!.rows.filter((r) => r.id === id);
  return { lot, adjustment: adjustment! };
}

/**
 * A lot's stock adjustments, newest first (by the lot version each made), with
 * who made them and the lot's unit; null when the team has no such lot.
 */
export async function listLotAdjustments(teamId: string, lotId: string) {
  const [lot] = await db
    .select({ id: materialLots.id, unit: materialLots.unit })
    .from(materialLots)
    .where(and(eq(materialLots.teamId, teamId), eq(materialLots.id, lotId)))
    .limit(1);
  if (!lot) return null;
  const rows = await db
    .select({
      id: lotAdjustments.id,
      quantityBefore: lotAdjustments.quantityBefore,
      quantityAfter: lotAdjustments.quantityAfter,
      lotVersion: lotAdjustments.lotVersion,
      reason: lotAdjustments.reason,
      note: lotAdjustments.note,
      adjustedBy: lotAdjustments.adjustedBy,
      adjustedByName: user.name,
      adjustedAt: lotAdjustments.adjustedAt,
    })
    .from(lotAdjustments)
    .leftJoin(user, eq(user.id, lotAdjustments.adjustedBy))
    .where(and(eq(lotAdjustments.teamId, teamId), eq(lotAdjustments.lotId, lotId)))
    .orderBy(desc(lotAdjustments.lotVersion))
    .limit(1000);
  return { lotId, unit: lot.unit, rows };
}
export type LotAdjustmentsView = NonNullable<Awaited<ReturnType<typeof listLotAdjustments>>>;
