import type { AuditAction } from "@/lib/enums";
import { and, asc, desc, eq, exists, inArray, like, or, sql, type SQL } from "drizzle-orm";
import { db } from "@/db";
import type { DbOrTx } from "@/db/client";
import { auditEvents, formulations, reviews, revisions, user, REVISION_STATES, type RevisionRow } from "@/db/schema";
import { ConflictError, NotFoundError } from "@/lib/errors";
import { diffRevisions } from "@/lib/diff";
import { computeFormulation, ENGINE_VERSION, type FormulationInput, type FormulationResult } from "@/lib/formulation";
import { FormulationError } from "@/lib/formulation/errors";
import { assertReviewable, assertSubmittable, nextState, type RevisionState, type WorkflowAction } from "@/lib/workflow";
import { onDuplicate } from "../errors";
import { recordEvent } from "./audit";

export interface Actor {
  userId: string;
  teamId: string;
}

/** Runs the engine; an engine error is kept as a message so a draft can still be saved. */
export function evaluate(input: FormulationInput): { result: FormulationResult | null; computeError: string | null } {
  try {
    return { result: computeFormulation(input), computeError: null };
  } catch (err) {
    if (err instanceof FormulationError) return { result: null, computeError: err.message };
    throw err;
  }
}

export interface FormulationListQuery {
  q?: string;
  state?: RevisionState;
  project?: string;
  sort?: "name" | "updatedAt" | "state" | "project";
  dir?: "asc" | "desc";
  page?: number;
  pageSize?: number;
  /** Production sees only formulations with a released revision. */
  releasedOnly?: boolean;
}

const releasedExists = exists(
  db
    .select({ one: sql`1` })
    .from(revisions)
    .where(and(eq(revisions.formulationId, formulations.id), eq(revisions.state, "released"))),
);

export async function listFormulations(teamId: string, query: FormulationListQuery = {}) {
  const where: SQL[] = [eq(formulations.teamId, teamId)];
  if (query.state) where.push(eq(formulations.latestState, query.state));
  if (query.project) where.push(eq(formulations.project, query.project));
  if (query.q) {
    const pattern = `%${query.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
    where.push(or(like(formulations.name, pattern), like(formulations.project, pattern))!);
  }
  if (query.releasedOnly) where.push(releasedExists);
  const column = {
    name: formulations.name,
    updatedAt: formulations.updatedAt,
    state: formulations.latestState,
    project: formulations.project,
  }[query.sort ?? "updatedAt"];
  const order = (query.dir ?? (query.sort === "name" ? "asc" : "desc")) === "desc" ? desc(column) : asc(column);
  const pageSize = Math.min(query.pageSize ?? 25, 200);
  const page = Math.max(query.page ?? 1, 1);
  const [rows, [count]] = await Promise.all([
    db
      .select({
        id: formulations.id,
        name: formulations.name,
        project: formulations.project,
        latestState: formulations.latestState,
        latestRevision: formulations.latestRevision,
        updatedAt: formulations.updatedAt,
        createdBy: formulations.createdBy,
      })
      .from(formulations)
      .where(and(...where))
      .orderBy(order, asc(formulations.id))
      .limit(pageSize)
      .offset((page - 1) * pageSize),
    db.select({ n: sql<number>`count(*)` }).from(formulations).where(and(...where)),
  ]);
  return { rows, total: Number(count?.n ?? 0), page, pageSize };
}

/** A formulation with the list of its revisions; production sees released ones only. */
export async function getFormulation(teamId: string, id: string, opts: { releasedOnly?: boolean } = {}) {
  const [f] = await db.select().from(formulations).where(and(eq(formulations.teamId, teamId), eq(formulations.id, id))).limit(1);
  if (!f) return null;
  const revs = await db
    .select({
      id: revisions.id,
      number: revisions.number,
      state: revisions.state,
      version: revisions.version,
      authorId: revisions.authorId,
      authorName: user.name,
      createdAt: revisions.createdAt,
      updatedAt: revisions.updatedAt,
      engineVersion: revisions.engineVersion,
    })
    .from(revisions)
    .leftJoin(user, eq(user.id, revisions.authorId))
    .where(
      and(
        eq(revisions.formulationId, id),
        opts.releasedOnly ? eq(revisions.state, "released") : undefined,
      ),
    )
    .orderBy(desc(revisions.number));
  if (opts.releasedOnly && revs.length === 0) return null;
  return { ...f, revisions: revs };
}

/** One revision with its reviews; null when not in this team (or not released, for production). */
export async function getRevision(teamId: string, revisionId: string, opts: { releasedOnly?: boolean } = {}) {
  const [row] = await db
    .select({ revision: revisions, formulationName: formulations.name, project: formulations.project, authorName: user.name })
    .from(revisions)
    .innerJoin(formulations, eq(formulations.id, revisions.formulationId))
    .leftJoin(user, eq(user.id, revisions.authorId))
    .where(and(eq(revisions.teamId, teamId), eq(revisions.id, revisionId)))
    .limit(1);
  if (!row) return null;
  if (opts.releasedOnly && row.revision.state !== "released") return null;
  const revReviews = await db
    .select({
      id: reviews.id,
      decision: reviews.decision,
      comment: reviews.comment,
      createdAt: reviews.createdAt,
      reviewerId: reviews.reviewerId,
      reviewerName: user.name,
    })
    .from(reviews)
    .leftJoin(user, eq(user.id, reviews.reviewerId))
    .where(eq(reviews.revisionId, revisionId))
    .orderBy(asc(reviews.createdAt));
  // Everyone who wrote or changed it: none of them may review it (lib/workflow.ts).
  const authorIds = row.revision.state === "in_review" ? await authorsOf(db, teamId, row.revision) : [];
  return { ...row.revision, formulationName: row.formulationName, project: row.project, authorName: row.authorName, authorIds, reviews: revReviews };
}

/**
 * Inserts a formulation with its first draft revision and an audit event,
 * inside the caller's transaction. A ConflictError naming `name` when the team already has the name.
 */
export async function insertFormulation(
  tx: DbOrTx,
  actor: Actor,
  data: { name: string; project?: string | null; description?: string | null; input: FormulationInput },
  opts: { duplicateMessage?: string; note?: string } = {},
): Promise<{ formulationId: string; revisionId: string }> {
  const { result, computeError } = evaluate(data.input);
  const formulationId = crypto.randomUUID();
  const revisionId = crypto.randomUUID();
  // The unique key refuses a name the team has, also when two people create it at once.
  await tx
    .insert(formulations)
    .values({
      id: formulationId,
      teamId: actor.teamId,
      name: data.name,
      project: data.project ?? null,
      description: data.description ?? null,
      createdBy: actor.userId,
    })
    .catch(onDuplicate("formulations_team_name_uq", opts.duplicateMessage ?? `A formulation named "${data.name}" already exists in this team.`));
  await tx.insert(revisions).values({
    id: revisionId,
    teamId: actor.teamId,
    formulationId,
    number: 1,
    input: data.input,
    result,
    computeError,
    engineVersion: ENGINE_VERSION,
    authorId: actor.userId,
  });
  await recordEvent(tx, {
    teamId: actor.teamId,
    actorId: actor.userId,
    action: "formulation.created",
    entityType: "formulation",
    entityId: formulationId,
    summary: { after: { name: data.name, revision: 1, state: "draft" }, note: opts.note },
  });
  return { formulationId, revisionId };
}

export async function createFormulation(
  actor: Actor,
  data: { name: string; project?: string | null; description?: string | null; input: FormulationInput },
) {
  return db.transaction((tx) => insertFormulation(tx, actor, data));
}

/**
 * The formulation a revision belongs to (it never changes). Read before the
 * transaction starts, so that the transaction's first read is its lock.
 */
async function formulationOfRevision(teamId: string, revisionId: string): Promise<string> {
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
async function lockRevision(tx: DbOrTx, teamId: string, revisionId: string, formulationId: string): Promise<RevisionRow> {
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

/**
 * Everyone who authored a revision's content: its creator, and whoever saved,
 * started or submitted it (from the audit trail, written in the same
 * transaction as each change). None of them may review it.
 */
async function authorsOf(tx: DbOrTx, teamId: string, rev: RevisionRow): Promise<string[]> {
  const rows = await tx
    .selectDistinct({ actorId: auditEvents.actorId })
    .from(auditEvents)
    .where(
      and(
        eq(auditEvents.teamId, teamId),
        eq(auditEvents.entityType, "revision"),
        eq(auditEvents.entityId, rev.id),
        inArray(auditEvents.action, AUTHORING_ACTIONS),
      ),
    );
  const ids = new Set(rows.map((r) => r.actorId).filter((id): id is string => !!id));
  if (rev.authorId) ids.add(rev.authorId);
  return [...ids];
}

/** Audit actions on a revision that change or vouch for its content. */
const AUTHORING_ACTIONS: AuditAction[] = ["revision.started", "revision.saved", "revision.submitted", "revision.seeded"];

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

/**
 * Starts a new draft revision from the newest one (approved and released
 * revisions never change). Refused while a draft or a review is open.
 */
export async function startRevision(actor: Actor, formulationId: string) {
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
    const id = crypto.randomUUID();
    const number = latest.number + 1;
    const { result, computeError } = evaluate(latest.input);
    await tx.insert(revisions).values({
      id,
      teamId: actor.teamId,
      formulationId,
      number,
      input: latest.input,
      result,
      computeError,
      engineVersion: ENGINE_VERSION,
      authorId: actor.userId,
    });
    await touchFormulation(tx, formulationId, number, "draft");
    await recordEvent(tx, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "revision.started",
      entityType: "revision",
      entityId: id,
      summary: { before: { revision: latest.number }, after: { revision: number, state: "draft" } },
    });
    return { revisionId: id, number };
  });
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

/** Differences between two revisions (by number) of one formulation. */
export async function diffFormulationRevisions(teamId: string, formulationId: string, from: number, to: number) {
  const rows = await db
    .select({ number: revisions.number, input: revisions.input, result: revisions.result })
    .from(revisions)
    .where(and(eq(revisions.teamId, teamId), eq(revisions.formulationId, formulationId), inArray(revisions.number, [from, to])));
  const a = rows.find((r) => r.number === from);
  const b = rows.find((r) => r.number === to);
  if (!a || !b) return null;
  return { from, to, ...diffRevisions({ input: a.input, result: a.result ?? null }, { input: b.input, result: b.result ?? null }) };
}

export { REVISION_STATES };
