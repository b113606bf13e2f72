/**
 * Test results of a batch against its revision's specifications: list,
 * enter (out of specification marked at once, lib/quality/out-of-spec.ts),
 * acknowledge an out-of-specification result. A disposed batch (a row in
 * batch_dispositions) takes no more results and no acknowledgement. Each
 * change locks the batch record's row first, then reads the disposition with
 * a locking read, so a result and a disposition made at once wait for each
 * other.
 */
import { and, asc, eq, inArray } from "drizzle-orm";
import { db } from "@/db";
import type { DbOrTx } from "@/db/client";
import { batchDispositions, batchRecords, batchResults, formulations, revisions, user } from "@/db/schema";
import { ConflictError, NotFoundError, RuleError } from "@/lib/errors";
import { isOutOfSpec } from "@/lib/quality/out-of-spec";
import type { Specification } from "@/lib/quality/specification";
import { recordEvent } from "./audit";
import type { Actor } from "./batches";

/** Locks the batch record and returns it with its revision's specifications; refuses a disposed batch (409). */
async function lockOpenForResults(tx: DbOrTx, teamId: string, batchId: string) {
  const [batch] = await tx
    .select({ id: batchRecords.id, revisionId: batchRecords.revisionId })
    .from(batchRecords)
    .where(and(eq(batchRecords.teamId, teamId), eq(batchRecords.id, batchId)))
    .for("update")
    .limit(1);
  if (!batch) throw new NotFoundError("batch record");
  const [disposed] = await tx
    .select({ disposition: batchDispositions.disposition })
    .from(batchDispositions)
    .where(eq(batchDispositions.batchId, batchId))
    .for("update")
    .limit(1);
  if (disposed) {
    throw new ConflictError(
      "conflict",
      `This batch was already ${disposed.disposition.replaceAll("_", " ")}: its test results can no longer change.`,
    );
  }
  const [rev] = await tx
    .select({ specifications: revisions.specifications, number: revisions.number, formulationName: formulations.name, formulationId: formulations.id })
    .from(revisions)
    .innerJoin(formulations, eq(formulations.id, revisions.formulationId))
    .where(eq(revisions.id, batch.revisionId))
    .limit(1);
  return { batch, specifications: rev?.specifications ?? [], revisionNumber: rev?.number ?? 0, formulationName: rev?.formulationName ?? "", formulationId: rev?.formulationId ?? "" };
}

/** The batch's specifications, its results (oldest first, with names) and whether it is disposed; `null` for another team's or an unknown batch. */
export async function listResults(teamId: string, batchId: string) {
  const [batch] = await db
    .select({ id: batchRecords.id, specifications: revisions.specifications, disposition: batchDispositions.disposition })
    .from(batchRecords)
    .innerJoin(revisions, eq(revisions.id, batchRecords.revisionId))
    .leftJoin(batchDispositions, eq(batchDispositions.batchId, batchRecords.id))
    .where(and(eq(batchRecords.teamId, teamId), eq(batchRecords.id, batchId)))
    .limit(1);
  if (!batch) return null;
  const rows = await db
    .select()
    .from(batchResults)
    .where(and(eq(batchResults.teamId, teamId), eq(batchResults.batchId, batchId)))
    .orderBy(asc(batchResults.enteredAt), asc(batchResults.id));
  const userIds = [...new Set(rows.flatMap((r) => [r.enteredBy, r.acknowledgedBy]).filter((x): x is string => !!x))];
  const names = new Map(
    userIds.length ? (await db.select({ id: user.id, name: user.name }).from(user).where(inArray(user.id, userIds))).map((u) => [u.id, u.name]) : [],
  );
  return {
    specifications: batch.specifications ?? [],
    disposition: batch.disposition ?? null,
    results: rows.map((r) => ({
      id: r.id,
      specId: r.specId,
      valueNumber: r.valueNumber,
      valueText: r.valueText,
      outOfSpec: r.outOfSpec,
      instrument: r.instrument,
      enteredBy: r.enteredBy,
      enteredByName: r.enteredBy ? (names.get(r.enteredBy) ?? null) : null,
      enteredAt: r.enteredAt,
      acknowledgedBy: r.acknowledgedBy,
      acknowledgedByName: r.acknowledgedBy ? (names.get(r.acknowledgedBy) ?? null) : null,
      acknowledgedAt: r.acknowledgedAt,
      acknowledgement: r.acknowledgement,
    })),
  };
}

export type ResultsView = NonNullable<Awaited<ReturnType<typeof listResults>>>;

/** What the route needs to tell the reviewers about an out-of-specification result. */
export interface EnteredResult {
  id: string;
  outOfSpec: boolean;
  spec: Specification;
  value: number | string;
  batchId: string;
  formulationName: string;
  revisionNumber: number;
}

/**
 * Enters one result against a specification of the batch's revision. A
 * numeric specification takes a number only (a text is a 422 naming `value`);
 * a non-numeric one stores the text. Who and when come from the session.
 */
export async function enterResult(
  actor: Actor,
  batchId: string,
  data: { specId: string; value: number | string; instrument?: string | null },
): Promise<EnteredResult> {
  return db.transaction(async (tx) => {
    const ctx = await lockOpenForResults(tx, actor.teamId, batchId);
    const spec = ctx.specifications.find((s) => s.id === data.specId);
    if (!spec) {
      throw new RuleError("invalid", `Revision ${ctx.revisionNumber} has no specification with this id.`, "specId");
    }
    let valueNumber: number | null = null;
    let valueText: string | null = null;
    if (spec.numeric) {
      if (typeof data.value !== "number") {
        throw new RuleError(
          "invalid",
          `value: ${spec.property} takes a number${spec.unit ? ` in ${spec.unit}` : ""}, not a text ("${String(data.value).slice(0, 40)}").`,
          "value",
        );
      }
      valueNumber = data.value;
    } else {
      valueText = String(data.value);
    }
    const outOfSpec = valueNumber !== null ? isOutOfSpec(spec, valueNumber) : false;
    const id = crypto.randomUUID();
    await tx.insert(batchResults).values({
      id,
      teamId: actor.teamId,
      batchId,
      specId: spec.id,
      valueNumber,
      valueText,
      outOfSpec,
      instrument: data.instrument?.trim() || null,
      enteredBy: actor.userId,
    });
    await recordEvent(tx, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "batch.result_entered",
      entityType: "batch",
      entityId: batchId,
      summary: { after: { property: spec.property, value: valueNumber ?? valueText, unit: spec.unit, outOfSpec, instrument: data.instrument ?? null } },
    });
    return { id, outOfSpec, spec, value: valueNumber ?? valueText ?? "", batchId, formulationName: ctx.formulationName, revisionNumber: ctx.revisionNumber };
  });
}

/** Acknowledges an out-of-specification result with a written note (reviewer or admin). 409 when it is not out of spec, already acknowledged, or the batch is disposed. */
export async function acknowledgeResult(actor: Actor, batchId: string, resultId: string, note: string) {
  return db.transaction(async (tx) => {
    await lockOpenForResults(tx, actor.teamId, batchId);
    const [row] = await tx
      .select()
      .from(batchResults)
      .where(and(eq(batchResults.teamId, actor.teamId), eq(batchResults.batchId, batchId), eq(batchResults.id, resultId)))
      .for("update")
      .limit(1);
    if (!row) throw new NotFoundError("result");
    if (!row.outOfSpec) throw new ConflictError("conflict", "This result is within its specification: there is nothing to acknowledge.");
    if (row.acknowledgedAt) throw new ConflictError("conflict", "This result was already acknowledged.");
    const now = new Date();
    await tx
      .update(batchResults)
      .set({ acknowledgedBy: actor.userId, acknowledgedAt: now, acknowledgement: note })
      .where(eq(batchResults.id, resultId));
    await recordEvent(tx, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "batch.result_acknowledged",
      entityType: "batch",
      entityId: batchId,
      summary: { before: { resultId, acknowledged: false }, after: { resultId, acknowledged: true }, note },
    });
    return { id: resultId, acknowledgedBy: actor.userId, acknowledgedAt: now, acknowledgement: note };
  });
}
