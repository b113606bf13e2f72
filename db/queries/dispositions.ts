/**
 * The disposition of a closed batch: released, rejected or released under
 * deviation. What blocks a release (unacknowledged out-of-specification
 * results, unacknowledged weighing deviations), who may not dispose (the
 * people who made the batch), and the release itself, which takes each
 * used lot's amount off its quantity on hand in one transaction.
 */
import { and, asc, eq, inArray, isNull } from "drizzle-orm";
import { db } from "@/db";
import { auditEvents, batchDispositions, batchLotUses, batchRecords, batchResults, materialLots, materials, user, type BatchRecordRow } from "@/db/schema";
import { lineDeviation } from "@/lib/batches";
import { ConflictError, NotFoundError, RuleError, SeparationError, type FieldProblem } from "@/lib/errors";
import { Dec, toNumber } from "@/lib/formulation/decimal";
import type { DisposeInput } from "@/lib/validations/lots";
import { recordEvent } from "./audit";
import { lineAmountInLotUnit } from "./lots";

export interface Actor {
  userId: string;
  teamId: string;
}

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];
type Reader = Tx | typeof db;

/** Audit actions by which a person made (part of) a batch: they may never dispose of it. */
const MAKING_ACTIONS = ["batch.started", "batch.line_recorded", "batch.lot_chosen", "batch.notes_changed", "batch.closed"] as const;

/** Everyone who started the batch, recorded a line or chose a lot in it (separation of duties). */
async function makersOf(r: Reader, batch: Pick<BatchRecordRow, "id" | "teamId" | "startedBy">): Promise<string[]> {
  const rows = await r
    .selectDistinct({ actorId: auditEvents.actorId })
    .from(auditEvents)
    .where(and(eq(auditEvents.teamId, batch.teamId), eq(auditEvents.entityType, "batch"), eq(auditEvents.entityId, batch.id), inArray(auditEvents.action, [...MAKING_ACTIONS])));
  const ids = new Set<string>(rows.map((row) => row.actorId).filter((x): x is string => !!x));
  if (batch.startedBy) ids.add(batch.startedBy);
  return [...ids];
}

/** The weighed lines outside tolerance (the batch's own tolerance and balance). */
function deviations(batch: BatchRecordRow) {
  return batch.lines.flatMap((line, index) => {
    if (line.actualGrams === null || line.targetGrams === undefined) return [];
    const d = lineDeviation(line.targetGrams, line.actualGrams, batch.toleranceFraction, batch.balanceResolutionGrams);
    return d.outside ? [{ lineIndex: index, name: line.name ?? line.materialId, targetGrams: line.targetGrams, actualGrams: line.actualGrams, relative: d.relative }] : [];
  });
}

async function unacknowledgedResults(r: Reader, teamId: string, batchId: string) {
  return r
    .select({ id: batchResults.id, specId: batchResults.specId, valueNumber: batchResults.valueNumber, valueText: batchResults.valueText })
    .from(batchResults)
    .where(and(eq(batchResults.teamId, teamId), eq(batchResults.batchId, batchId), eq(batchResults.outOfSpec, true), isNull(batchResults.acknowledgedAt)));
}

/**
 * Where the batch stands: its disposition if it has one, else what blocks a
 * release, and whether `userId` may dispose of it.
 */
export async function dispositionStatus(teamId: string, batchId: string, userId: string) {
  const [batch] = await db.select().from(batchRecords).where(and(eq(batchRecords.teamId, teamId), eq(batchRecords.id, batchId))).limit(1);
  if (!batch) return null;
  const [disposition] = await db
    .select({ d: batchDispositions, disposedByName: user.name })
    .from(batchDispositions)
    .leftJoin(user, eq(user.id, batchDispositions.disposedBy))
    .where(eq(batchDispositions.batchId, batchId))
    .limit(1);
  const makers = await makersOf(db, batch);
  return {
    batchId,
    state: batch.state,
    disposition: disposition ? { ...disposition.d, disposedByName: disposition.disposedByName } : null,
    madeByYou: makers.includes(userId),
    outOfSpecResults: await unacknowledgedResults(db, teamId, batchId),
    deviations: deviations(batch),
  };
}
export type DispositionStatus = NonNullable<Awaited<ReturnType<typeof dispositionStatus>>>;

/**
 * Disposes of a closed batch. A release (plain or under deviation) needs
 * every out-of-specification result acknowledged and a note for every
 * weighing deviation; under deviation also a justification. In one
 * transaction it locks the batch, then each used lot in lot-id order,
 * checks each has enough on hand, takes the amount off and records it (with
 * the lot's measured assay at that moment); a
 * lot that would go below zero is a 409 and nothing changes. A rejection
 * takes nothing.
 */
export async function disposeBatch(actor: Actor, batchId: string, input: DisposeInput) {
  const released = input.disposition !== "rejected";
  await db.transaction(async (tx) => {
    const [batch] = await tx
      .select()
      .from(batchRecords)
      .where(and(eq(batchRecords.teamId, actor.teamId), eq(batchRecords.id, batchId)))
      .for("update")
      .limit(1);
    if (!batch) throw new NotFoundError("batch record");
    if (batch.state !== "closed") throw new ConflictError("not_closed", "Only a closed batch record can be released or rejected; close it first.");
    const [existing] = await tx.select({ disposition: batchDispositions.disposition }).from(batchDispositions).where(eq(batchDispositions.batchId, batchId)).limit(1);
    // A plain read: the batch row's lock already keeps a second disposition of this batch out, and a
    // locking read of a missing row would take a gap lock that two releases then deadlock on at insert.
    if (existing) throw new ConflictError("already_disposed", `This batch was already ${existing.disposition.replaceAll("_", " ")}.`);
    if ((await makersOf(tx, batch)).includes(actor.userId)) {
      throw new SeparationError("own_batch", "You started or recorded this batch; another reviewer must release or reject it.");
    }
    const justification = input.justification?.trim() || null;
    const notes = new Map((input.acknowledgedDeviations ?? []).map((a) => [a.lineIndex, a.note.trim()]));
    const problems: FieldProblem[] = [];
    if (input.disposition === "released_under_deviation" && !justification) {
      problems.push({ field: "justification", message: "A release under deviation needs a written justification." });
    }
    if (released) {
      const open = await unacknowledgedResults(tx, actor.teamId, batchId);
      if (open.length > 0) {
        problems.push({
          field: "results",
          message: `${open.length} out-of-specification result${open.length === 1 ? " is" : "s are"} not acknowledged; acknowledge ${open.length === 1 ? "it" : "them"} before release.`,
        });
      }
      for (const d of deviations(batch)) {
        if (!notes.get(d.lineIndex)) {
          problems.push({
            field: `acknowledgedDeviations.${d.lineIndex}`,
            message: `Line ${d.lineIndex + 1} (${d.name}) is outside the weighing tolerance: acknowledge it with a note.`,
          });
        }
      }
    }
    if (problems.length > 0) {
      throw new RuleError("not_releasable", `The batch cannot be ${released ? "released" : "rejected"} yet: ${problems.map((p) => p.message).join(" ")}`, undefined, problems);
    }
    const taken: { lotId: string; supplierLot: string; quantity: number; unit: string; onHandAfter: number }[] = [];
    if (released) {
      const uses = await tx.select().from(batchLotUses).where(and(eq(batchLotUses.teamId, actor.teamId), eq(batchLotUses.batchId, batchId))).orderBy(asc(batchLotUses.lotId));
      const lotIds = [...new Set(uses.map((u) => u.lotId))].sort();
      // One order for every release (lot id), so two releases never wait on each other crosswise.
      const locked = lotIds.length
        ? await tx
            .select()
            .from(materialLots)
            .where(and(eq(materialLots.teamId, actor.teamId), inArray(materialLots.id, lotIds)))
            .orderBy(asc(materialLots.id))
            .for("update")
        : [];
      const materialIds = [...new Set(locked.map((l) => l.materialId))];
      const data = materialIds.length ? await tx.select({ id: materials.id, data: materials.data }).from(materials).where(inArray(materials.id, materialIds)) : [];
      const densities = new Map(data.map((m) => [m.id, m.data.density]));
      const lots = locked.map((lot) => ({ lot, density: densities.get(lot.materialId) }));
      const byId = new Map(lots.map((l) => [l.lot.id, l]));
      const need = new Map<string, Dec>();
      const perUse: { useId: string; amount: number; assay: number | null }[] = [];
      for (const u of uses) {
        const l = byId.get(u.lotId)!;
        const line = batch.lines[u.lineIndex];
        if (!line) continue;
        const amount = lineAmountInLotUnit(line, u.lineIndex, l.lot.unit, l.density);
        perUse.push({ useId: u.id, amount, assay: l.lot.measuredAssay });
        need.set(u.lotId, (need.get(u.lotId) ?? new Dec(0)).plus(amount));
      }
      for (const id of lotIds) {
        const l = byId.get(id)!.lot;
        const amount = need.get(id) ?? new Dec(0);
        if (amount.greaterThan(l.quantityOnHand)) {
          throw new ConflictError(
            "lot_short",
            `Lot ${l.supplierLot} has ${l.quantityOnHand} ${l.unit} on hand and this batch takes ${toNumber(amount)} ${l.unit}: it cannot be released from this lot.`,
            "lots",
          );
        }
        const after = toNumber(new Dec(l.quantityOnHand).minus(amount));
        await tx.update(materialLots).set({ quantityOnHand: after }).where(eq(materialLots.id, id));
        taken.push({ lotId: id, supplierLot: l.supplierLot, quantity: toNumber(amount), unit: l.unit, onHandAfter: after });
      }
      // The assay is kept with the use, so a later correction of the lot's assay leaves this release as it was.
      for (const p of perUse) await tx.update(batchLotUses).set({ quantityUsed: p.amount, measuredAssayUsed: p.assay }).where(eq(batchLotUses.id, p.useId));
    }
    const acknowledged = released ? [...notes].filter(([i]) => batch.lines[i]).map(([lineIndex, note]) => ({ lineIndex, note })) : [];
    await tx.insert(batchDispositions).values({
      batchId,
      teamId: actor.teamId,
      disposition: input.disposition,
      justification,
      acknowledgedDeviations: acknowledged,
      disposedBy: actor.userId,
    });
    await recordEvent(tx, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "batch.disposed",
      entityType: "batch",
      entityId: batchId,
      summary: { after: { disposition: input.disposition, justification, acknowledgedDeviations: acknowledged, lotsTaken: taken } },
    });
  });
  return (await dispositionStatus(actor.teamId, batchId, actor.userId))!;
}
