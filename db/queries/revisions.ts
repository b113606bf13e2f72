/**
 * Changes of a formulation's revisions: saving a draft, starting a new
 * revision, and moving a revision through its life (lib/workflow.ts). Every
 * change locks the formulation's row first, then the revision's, in one
 * transaction with one audit event.
 */
import { and, desc, eq, inArray, sql } from "drizzle-orm";
import { db } from "@/db";
import type { DbOrTx } from "@/db/client";
import { explorations, formulations, reviews, revisions, type RevisionRow } from "@/db/schema";
import { ConflictError, NotFoundError, RuleError } from "@/lib/errors";
import { ENGINE_VERSION, type FormulationInput } from "@/lib/formulation";
import { assertReviewable, assertSubmittable, nextState, type RevisionState, type WorkflowAction } from "@/lib/workflow";
import { recordEvent } from "./audit";
import { authorsOf, evaluate, type Actor } from "./formulations";

/**
 * The formulation a revision belongs to (it never changes). Read before the
 * transaction starts, so that the transaction's first read is its lock.
 */
export async function formulationOfRevision(teamId: string, revisionId: string): Promise<string> {
  const [owner] = await db
    .select({ formulationId: revisions.formulationId })
    .from(revisions)
    .where(and(eq(revisions.teamId, teamId), eq(revisions.id, revisionId)))
    .limit(1);
  if (!owner) throw new NotFoundError("revision");
  return owner.formulationId;
}

/**
 * Locks a revision for a change, and its formulation first: every change of a
 * formulation's revisions (save, submit, review, release, archive, a new
 * revision) takes the formulation's row lock before a revision's, so two
 * people releasing two revisions at once wait for each other instead of both
 * finding no other released revision, and the locks are always taken in one
 * order (no deadlock). Call it first in the transaction: a plain read before
 * it would fix the transaction's snapshot before the lock was granted, and
 * later plain reads would miss what the previous lock holder committed.
 */
export async function lockRevision(tx: DbOrTx, teamId: string, revisionId: string, formulationId: string): Promise<RevisionRow> {
  await tx
    .select({ id: formulations.id })
    .from(formulations)
    .where(and(eq(formulations.teamId, teamId), eq(formulations.id, formulationId)))
    .for("update");
  const [row] = await tx
    .select()
    .from(revisions)
    .where(and(eq(revisions.teamId, teamId), eq(revisions.id, revisionId), eq(revisions.formulationId, formulationId)))
    .for("update")
    .limit(1);
  if (!row) throw new NotFoundError("revision");
  return row;
}

async function touchFormulation(tx: DbOrTx, formulationId: string, number: number, state: RevisionState) {
  // The list shows the newest revision's state; older revisions changing state do not move it.
  await tx
    .update(formulations)
    .set({ latestState: state, latestRevision: number, updatedAt: new Date() })
    .where(and(eq(formulations.id, formulationId), sql`${formulations.latestRevision} <= ${number}`));
}

/**
 * Saves a draft. `version` is the counter the client read: when someone saved
 * in between, nothing is written and a 409 tells the user to reload.
 */
export async function saveDraft(actor: Actor, revisionId: string, data: { input: FormulationInput; version: number }) {
  const { result, computeError } = evaluate(data.input);
  const formulationId = await formulationOfRevision(actor.teamId, revisionId);
  return db.transaction(async (tx) => {
    const current = await lockRevision(tx, actor.teamId, revisionId, formulationId);
    if (current.state !== "draft") {
      throw new ConflictError(
        "conflict",
        `Revision ${current.number} is ${current.state.replace("_", " ")} and can no longer change. Start a new revision to edit it.`,
      );
    }
    if (current.version !== data.version) {
      throw new ConflictError(
        "conflict",
        `Someone saved this draft after you opened it (your copy is version ${data.version}, the saved one is ${current.version}). Nothing was overwritten: reload to see their changes, then apply yours again.`,
      );
    }
    const res = await tx
      .update(revisions)
      .set({ input: data.input, result, computeError, engineVersion: ENGINE_VERSION, version: current.version + 1 })
      .where(and(eq(revisions.id, revisionId), eq(revisions.version, data.version), eq(revisions.state, "draft")));
    if (res[0].affectedRows !== 1) throw new ConflictError("conflict", "This draft changed while saving; reload and try again.");
    await touchFormulation(tx, current.formulationId, current.number, "draft");
    await recordEvent(tx, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "revision.saved",
      entityType: "revision",
      entityId: revisionId,
      summary: { before: { version: current.version }, after: { version: current.version + 1, computeError } },
    });
    return { version: current.version + 1, result, computeError };
  });
}

/** Where a new draft's input came from when it is not the newest revision's: a candidate of an exploration. */
export interface StartFrom {
  /** The new draft's input (validated by the caller with formulationInputSchema). */
  input: FormulationInput;
  /** The saved exploration (of this formulation) and the point of its grid the input is. */
  fromExploration?: { explorationId?: string; point: number };
}

/**
 * Starts a new draft revision from the newest one (approved and released
 * revisions never change), or with `from.input` (a candidate opened from the
 * design explorer), computed by the full engine like any draft. Refused while
 * a draft or a review is open. An `explorationId` that is not a saved
 * exploration of this formulation is a RuleError naming it.
 *
 * @example
 * ```ts
 * await startRevision(actor, formulationId, { input, fromExploration: { explorationId, point: 42 } });
 * ```
 */
export async function startRevision(actor: Actor, formulationId: string, from?: StartFrom) {
  return db.transaction(async (tx) => {
    const [f] = await tx
      .select()
      .from(formulations)
      .where(and(eq(formulations.teamId, actor.teamId), eq(formulations.id, formulationId)))
      .for("update")
      .limit(1);
    if (!f) throw new NotFoundError("formulation");
    const [latest] = await tx
      .select()
      .from(revisions)
      .where(eq(revisions.formulationId, formulationId))
      .orderBy(desc(revisions.number))
      .limit(1);
    if (!latest) throw new NotFoundError("revision");
    const open = await tx
      .select({ number: revisions.number, state: revisions.state })
      .from(revisions)
      .where(and(eq(revisions.formulationId, formulationId), inArray(revisions.state, ["draft", "in_review"])))
      .limit(1);
    if (open[0]) {
      throw new ConflictError("conflict", `Revision ${open[0].number} is still ${open[0].state === "draft" ? "a draft" : "in review"}: edit that one instead.`);
    }
    const note = from?.fromExploration ? await explorationNote(tx, actor.teamId, formulationId, from.fromExploration) : undefined;
    const id = crypto.randomUUID();
    const number = latest.number + 1;
    const input = from?.input ?? latest.input;
    const { result, computeError } = evaluate(input);
    await tx.insert(revisions).values({
      id,
      teamId: actor.teamId,
      formulationId,
      number,
      input,
      result,
      computeError,
      engineVersion: ENGINE_VERSION,
      authorId: actor.userId,
      // Specifications are copied as they were approved; the formulator edits them in the new draft.
      specifications: latest.specifications ?? [],
    });
    await touchFormulation(tx, formulationId, number, "draft");
    await recordEvent(tx, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "revision.started",
      entityType: "revision",
      entityId: id,
      summary: {
        before: { revision: latest.number },
        after: { revision: number, state: "draft", ...(from ? { fromExploration: from.fromExploration ?? null, computeError } : {}) },
        note: note ?? (from ? "opened with an input of its own" : undefined),
      },
    });
    return { revisionId: id, number };
  });
}

/** "from the exploration “name”, point 43" (points counted from 1 for people); a RuleError when the exploration is not this formulation's. */
async function explorationNote(tx: DbOrTx, teamId: string, formulationId: string, from: { explorationId?: string; point: number }): Promise<string> {
  if (!from.explorationId) return `from a design exploration not saved, point ${from.point + 1}`;
  const [e] = await tx
    .select({ name: explorations.name })
    .from(explorations)
    .where(and(eq(explorations.teamId, teamId), eq(explorations.formulationId, formulationId), eq(explorations.id, from.explorationId)))
    .limit(1);
  if (!e) throw new RuleError("unknown_exploration", "There is no such saved exploration of this formulation.", "fromExploration.explorationId");
  return `from the exploration “${e.name}”, point ${from.point + 1}`;
}

export interface TransitionOutcome {
  revisionId: string;
  formulationId: string;
  formulationName: string;
  number: number;
  from: RevisionState;
  to: RevisionState;
  authorId: string | null;
}

/** Moves a revision through its life; one transaction, one audit event. */
export async function transition(
  actor: Actor,
  revisionId: string,
  action: WorkflowAction,
  opts: { comment?: string | null } = {},
): Promise<TransitionOutcome> {
  const formulationId = await formulationOfRevision(actor.teamId, revisionId);
  return db.transaction(async (tx) => {
    const rev = await lockRevision(tx, actor.teamId, revisionId, formulationId);
    const to = nextState(rev.state, action);
    const now = new Date();
    const set: Partial<typeof revisions.$inferInsert> = { state: to };
    if (action === "submit") {
      assertSubmittable(rev.result ?? null, rev.computeError);
      set.submittedAt = now;
    }
    if (action === "approve" || action === "return") {
      assertReviewable({
        decision: action === "approve" ? "approved" : "returned",
        reviewerId: actor.userId,
        authorIds: await authorsOf(tx, actor.teamId, rev),
        comment: opts.comment,
        thermalStatus: rev.result?.thermal.status,
      });
      await tx.insert(reviews).values({
        teamId: actor.teamId,
        revisionId,
        reviewerId: actor.userId,
        decision: action === "approve" ? "approved" : "returned",
        comment: opts.comment?.trim() || null,
      });
      if (action === "approve") {
        set.approvedAt = now;
        set.approvedBy = actor.userId;
      }
    }
    if (action === "release") {
      set.releasedAt = now;
      // One released revision per formulation: the previous one is archived.
      // Under the formulation's lock; a locking read besides, so it sees the latest committed state.
      const older = await tx
        .select({ id: revisions.id, number: revisions.number })
        .from(revisions)
        .where(and(eq(revisions.formulationId, rev.formulationId), eq(revisions.state, "released")))
        .for("update");
      for (const o of older) {
        await tx.update(revisions).set({ state: "archived" }).where(eq(revisions.id, o.id));
        await recordEvent(tx, {
          teamId: actor.teamId,
          actorId: actor.userId,
          action: "revision.archived",
          entityType: "revision",
          entityId: o.id,
          summary: { before: { state: "released" }, after: { state: "archived" }, note: `superseded by revision ${rev.number}` },
        });
      }
    }
    await tx.update(revisions).set(set).where(eq(revisions.id, revisionId));
    await touchFormulation(tx, rev.formulationId, rev.number, to);
    await recordEvent(tx, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: `revision.${action === "approve" ? "approved" : action === "return" ? "returned" : action === "submit" ? "submitted" : action === "release" ? "released" : "archived"}`,
      entityType: "revision",
      entityId: revisionId,
      summary: { before: { state: rev.state }, after: { state: to }, note: opts.comment?.trim() || undefined },
    });
    const [f] = await tx.select({ name: formulations.name }).from(formulations).where(eq(formulations.id, rev.formulationId));
    return {
      revisionId,
      formulationId: rev.formulationId,
      formulationName: f?.name ?? "",
      number: rev.number,
      from: rev.state,
      to,
      authorId: rev.authorId,
    };
  });
}
