import { and, desc, eq, type SQL } from "drizzle-orm";
import { db } from "@/db";
import type { DbOrTx } from "@/db/client";
import { batchLotUses, batchRecords, batchSettings, formulations, materialLots, revisions, user, type BatchLine, type BatchRecordRow } from "@/db/schema";
import { ConflictError, NotFoundError, RuleError } from "@/lib/errors";
import type { FormulationInput, FormulationResult } from "@/lib/formulation";
import {
  actualComposition,
  batchLinesFrom,
  DEFAULT_BALANCE_RESOLUTION_G,
  DEFAULT_TOLERANCE_FRACTION,
  lineDeviation,
} from "@/lib/batches";
import { recordEvent } from "./audit";

export interface Actor {
  userId: string;
  teamId: string;
}

/** The team's batch settings, or the defaults (±1 %, 0.01 g) when none are saved. */
export async function getBatchSettings(teamId: string) {
  const [row] = await db.select().from(batchSettings).where(eq(batchSettings.teamId, teamId)).limit(1);
  return {
    toleranceFraction: row?.toleranceFraction ?? DEFAULT_TOLERANCE_FRACTION,
    balanceResolutionGrams: row?.balanceResolutionGrams ?? DEFAULT_BALANCE_RESOLUTION_G,
    isDefault: !row,
  };
}

export async function saveBatchSettings(actor: Actor, values: { toleranceFraction: number; balanceResolutionGrams: number }) {
  const before = await getBatchSettings(actor.teamId);
  await db.transaction(async (tx) => {
    await tx
      .insert(batchSettings)
      .values({ teamId: actor.teamId, ...values, updatedBy: actor.userId })
      .onDuplicateKeyUpdate({ set: { ...values, updatedBy: actor.userId, updatedAt: new Date() } });
    await recordEvent(tx, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "batch.settings_changed",
      entityType: "team",
      entityId: actor.teamId,
      summary: { before: { toleranceFraction: before.toleranceFraction, balanceResolutionGrams: before.balanceResolutionGrams }, after: values },
    });
  });
  return getBatchSettings(actor.teamId);
}

type Joined = {
  batch: BatchRecordRow;
  formulationId: string;
  formulationName: string;
  revisionNumber: number;
  input: FormulationInput;
  result: FormulationResult | null;
};

async function loadBatch(teamId: string, id: string): Promise<Joined | null> {
  const [row] = await db
    .select({
      batch: batchRecords,
      formulationId: formulations.id,
      formulationName: formulations.name,
      revisionNumber: revisions.number,
      input: revisions.input,
      result: revisions.result,
    })
    .from(batchRecords)
    .innerJoin(revisions, eq(revisions.id, batchRecords.revisionId))
    .innerJoin(formulations, eq(formulations.id, revisions.formulationId))
    .where(and(eq(batchRecords.teamId, teamId), eq(batchRecords.id, id)))
    .limit(1);
  return row ?? null;
}

async function userName(id: string | null): Promise<string | null> {
  if (!id) return null;
  const [u] = await db.select({ name: user.name }).from(user).where(eq(user.id, id)).limit(1);
  return u?.name ?? null;
}

/** A batch record with each line's deviation and the composition made (once every line is weighed). */
/**
 * The lots picked for a batch's lines, with each lot's supplier lot number
 * as it stands (a lot may be corrected after it was picked). `lock` reads
 * them with a locking read (MariaDB 10.11 has no FOR SHARE), inside a
 * transaction that holds the batch row: batch first, then lots, the order
 * every change of lots keeps.
 */
function pickedLots(tx: DbOrTx, teamId: string, batchId: string, lock = false) {
  const q = tx
    .select({ lineIndex: batchLotUses.lineIndex, lotId: batchLotUses.lotId, supplierLot: materialLots.supplierLot })
    .from(batchLotUses)
    .innerJoin(materialLots, eq(materialLots.id, batchLotUses.lotId))
    .where(and(eq(batchLotUses.teamId, teamId), eq(batchLotUses.batchId, batchId)))
    .orderBy(batchLotUses.lotId);
  return lock ? q.for("update") : q;
}

/** A batch's lines with the lot number of each picked lot as it stands now (what an open batch shows and closes with). */
function withPickedLotNumbers(lines: BatchLine[], picked: { lineIndex: number; supplierLot: string }[]): BatchLine[] {
  const byLine = new Map(picked.map((p) => [p.lineIndex, p.supplierLot]));
  return lines.map((l, i) => (byLine.has(i) ? { ...l, lotNumber: byLine.get(i)! } : l));
}

export async function getBatch(teamId: string, id: string) {
  const row = await loadBatch(teamId, id);
  if (!row) return null;
  const b = row.batch;
  const uses = await pickedLots(db, teamId, id);
  const picked = new Map(uses.map((u) => [u.lineIndex, u.lotId]));
  // An open batch shows a picked lot's number as the lot has it now; a closed one as it was closed.
  const recorded = b.state === "open" ? withPickedLotNumbers(b.lines, uses) : b.lines;
  const lines = recorded.map((line, index) => ({
    index,
    ...line,
    /** The lot picked for the line (its lot number text then comes from the lot), or null. */
    lotId: picked.get(index) ?? null,
    deviation:
      line.actualGrams !== null && line.targetGrams !== undefined
        ? lineDeviation(line.targetGrams, line.actualGrams, b.toleranceFraction, b.balanceResolutionGrams)
        : null,
  }));
  return {
    id: b.id,
    state: b.state,
    formulationId: row.formulationId,
    formulationName: row.formulationName,
    revisionId: b.revisionId,
    revisionNumber: row.revisionNumber,
    toleranceFraction: b.toleranceFraction,
    balanceResolutionGrams: b.balanceResolutionGrams,
    notes: b.notes,
    startedBy: b.startedBy,
    startedByName: await userName(b.startedBy),
    closedBy: b.closedBy,
    closedByName: await userName(b.closedBy),
    createdAt: b.createdAt,
    updatedAt: b.updatedAt,
    closedAt: b.closedAt,
    lines,
    summary: {
      lines: lines.length,
      weighed: lines.filter((l) => l.actualGrams !== null).length,
      outside: lines.filter((l) => l.deviation?.outside).length,
    },
    composition: row.result ? actualComposition(row.input, row.result, b.lines) : null,
  };
}

export type BatchView = NonNullable<Awaited<ReturnType<typeof getBatch>>>;

/** Batch records of the team, newest first; filter by formulation, revision or state. */
export async function listBatches(teamId: string, filter: { formulationId?: string; revisionId?: string; state?: "open" | "closed" } = {}) {
  const where: SQL[] = [eq(batchRecords.teamId, teamId)];
  if (filter.formulationId) where.push(eq(revisions.formulationId, filter.formulationId));
  if (filter.revisionId) where.push(eq(batchRecords.revisionId, filter.revisionId));
  if (filter.state) where.push(eq(batchRecords.state, filter.state));
  const rows = await db
    .select({
      id: batchRecords.id,
      state: batchRecords.state,
      revisionId: batchRecords.revisionId,
      revisionNumber: revisions.number,
      formulationId: formulations.id,
      formulationName: formulations.name,
      lines: batchRecords.lines,
      toleranceFraction: batchRecords.toleranceFraction,
      balanceResolutionGrams: batchRecords.balanceResolutionGrams,
      startedBy: batchRecords.startedBy,
      startedByName: user.name,
      createdAt: batchRecords.createdAt,
      closedAt: batchRecords.closedAt,
    })
    .from(batchRecords)
    .innerJoin(revisions, eq(revisions.id, batchRecords.revisionId))
    .innerJoin(formulations, eq(formulations.id, revisions.formulationId))
    .leftJoin(user, eq(user.id, batchRecords.startedBy))
    .where(and(...where))
    .orderBy(desc(batchRecords.createdAt), desc(batchRecords.id))
    .limit(500);
  return {
    rows: rows.map(({ lines, ...rest }) => ({
      ...rest,
      lineCount: lines.length,
      weighed: lines.filter((l) => l.actualGrams !== null).length,
      outside: lines.filter(
        (l) =>
          l.actualGrams !== null &&
          l.targetGrams !== undefined &&
          lineDeviation(l.targetGrams, l.actualGrams, rest.toleranceFraction, rest.balanceResolutionGrams).outside,
      ).length,
    })),
  };
}

/**
 * Starts a batch from a released revision of the team: its lines are the
 * recipe's, with the team's tolerance fixed for the batch.
 */
export async function startBatch(
  actor: Actor,
  revisionId: string,
  opts: { notes?: string | null; balanceResolutionGrams?: number; releasedOnly?: boolean } = {},
) {
  const settings = await getBatchSettings(actor.teamId);
  const id = crypto.randomUUID();
  await db.transaction(async (tx) => {
    const [rev] = await tx
      .select({ id: revisions.id, state: revisions.state, number: revisions.number, input: revisions.input, result: revisions.result })
      .from(revisions)
      .where(and(eq(revisions.teamId, actor.teamId), eq(revisions.id, revisionId)))
      .for("update")
      .limit(1);
    // Roles that never see unreleased work get the same 404 as for a missing revision.
    if (!rev || (opts.releasedOnly && rev.state !== "released")) throw new NotFoundError("revision");
    if (rev.state !== "released") {
      throw new ConflictError("conflict", `Revision ${rev.number} is ${rev.state.replace("_", " ")}: batches are made from released revisions only.`);
    }
    if (!rev.result) throw new RuleError("not_computed", "This revision has no computed recipe, so no batch can be made from it.");
    const lines = batchLinesFrom(rev.input, rev.result) as BatchLine[];
    await tx.insert(batchRecords).values({
      id,
      teamId: actor.teamId,
      revisionId,
      lines,
      notes: opts.notes?.trim() || null,
      toleranceFraction: settings.toleranceFraction,
      balanceResolutionGrams: opts.balanceResolutionGrams ?? settings.balanceResolutionGrams,
      startedBy: actor.userId,
    });
    await recordEvent(tx, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "batch.started",
      entityType: "batch",
      entityId: id,
      summary: { after: { revisionId, revision: rev.number, lines: lines.length } },
    });
  });
  return (await getBatch(actor.teamId, id))!;
}

async function lockOpenBatch(tx: Parameters<Parameters<typeof db.transaction>[0]>[0], teamId: string, id: string) {
  const [row] = await tx
    .select()
    .from(batchRecords)
    .where(and(eq(batchRecords.teamId, teamId), eq(batchRecords.id, id)))
    .for("update")
    .limit(1);
  if (!row) throw new NotFoundError("batch record");
  if (row.state === "closed") throw new ConflictError("conflict", "This batch record is closed and can no longer change.");
  return row;
}

/** Records one line's actual mass, lot number and initials; the time is set by the server. */
export async function recordLine(
  actor: Actor,
  id: string,
  index: number,
  values: { actualGrams?: number | null; lotNumber?: string | null; initials?: string | null },
) {
  await db.transaction(async (tx) => {
    const row = await lockOpenBatch(tx, actor.teamId, id);
    const line = row.lines[index];
    if (!line) throw new NotFoundError("line", `This batch has no line ${index + 1}.`);
    if (values.lotNumber !== undefined) {
      const [use] = (await pickedLots(tx, actor.teamId, id, true)).filter((u) => u.lineIndex === index);
      if (use && (values.lotNumber?.trim() || null) !== use.supplierLot) {
        throw new RuleError(
          "lot_picked",
          `Line ${index + 1} (${line.name ?? line.materialId}): the lot number comes from the picked lot (${use.supplierLot}). To type one by hand, first clear the line's lot choice.`,
          "lotNumber",
        );
      }
    }
    const next: BatchLine = {
      ...line,
      actualGrams: values.actualGrams !== undefined ? values.actualGrams : line.actualGrams,
      lotNumber: values.lotNumber !== undefined ? values.lotNumber?.trim() || null : line.lotNumber,
      at: new Date().toISOString(),
    };
    if (values.initials !== undefined) {
      if (values.initials?.trim()) next.initials = values.initials.trim();
      else delete next.initials;
    }
    const lines = row.lines.map((l, i) => (i === index ? next : l));
    await tx.update(batchRecords).set({ lines }).where(eq(batchRecords.id, id));
    await recordEvent(tx, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "batch.line_recorded",
      entityType: "batch",
      entityId: id,
      summary: {
        before: { line: index + 1, actualGrams: line.actualGrams, lotNumber: line.lotNumber, initials: line.initials ?? null },
        after: { line: index + 1, actualGrams: next.actualGrams, lotNumber: next.lotNumber, initials: next.initials ?? null },
      },
    });
  });
  return (await getBatch(actor.teamId, id))!;
}

/** Changes the notes of an open batch; a change is kept in the audit trail with the notes before and after. */
export async function saveBatchNotes(actor: Actor, id: string, notes: string | null) {
  await db.transaction(async (tx) => {
    const row = await lockOpenBatch(tx, actor.teamId, id);
    const after = notes?.trim() || null;
    if (after === row.notes) return;
    await tx.update(batchRecords).set({ notes: after }).where(eq(batchRecords.id, id));
    await recordEvent(tx, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "batch.notes_changed",
      entityType: "batch",
      entityId: id,
      summary: { before: { notes: row.notes }, after: { notes: after } },
    });
  });
  return (await getBatch(actor.teamId, id))!;
}

/**
 * Closes a batch: every line needs its actual mass, and every line but
 * water its lot number. A closed record never changes again.
 */
export async function closeBatch(actor: Actor, id: string) {
  await db.transaction(async (tx) => {
    const row = await lockOpenBatch(tx, actor.teamId, id);
    // The record closes with each picked lot's number as the lot has it now (it may have been corrected since it was picked).
    const lines = withPickedLotNumbers(row.lines, await pickedLots(tx, actor.teamId, id, true));
    const missing: { field: string; message: string }[] = [];
    lines.forEach((line, i) => {
      const label = `Line ${i + 1} (${line.name ?? line.materialId})`;
      if (line.actualGrams === null) missing.push({ field: `lines.${i}.actualGrams`, message: `${label} has no actual mass.` });
      else if (!line.lotNumber && line.role !== "water") missing.push({ field: `lines.${i}.lotNumber`, message: `${label} has no lot number.` });
    });
    if (missing.length > 0) {
      throw new RuleError("incomplete", `The batch cannot be closed yet: ${missing.map((m) => m.message).join(" ")}`, undefined, missing);
    }
    const now = new Date();
    await tx.update(batchRecords).set({ state: "closed", closedAt: now, closedBy: actor.userId, lines }).where(eq(batchRecords.id, id));
    // A lot corrected after it was picked: the record closes with its new number, said in the audit trail.
    const relabelled = lines.flatMap((line, i) => {
      const stored = row.lines[i]?.lotNumber ?? null;
      return line.lotNumber !== stored ? [`line ${i + 1} ${stored ?? "none"} → ${line.lotNumber ?? "none"}`] : [];
    });
    await recordEvent(tx, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "batch.closed",
      entityType: "batch",
      entityId: id,
      summary: {
        before: { state: "open" },
        after: { state: "closed" },
        ...(relabelled.length > 0 ? { note: `lot numbers as their lots were corrected: ${relabelled.join("; ")}` } : {}),
      },
    });
  });
  return (await getBatch(actor.teamId, id))!;
}
