import type { AuditAction } from "@/lib/enums";
import { and, asc, desc, eq, exists, inArray, like, or, sql, type SQL } from "drizzle-orm";
import { db } from "@/db";
import type { DbOrTx } from "@/db/client";
import { auditEvents, formulations, reviews, revisions, user, REVISION_STATES, type RevisionRow } from "@/db/schema";
import { diffRevisions } from "@/lib/diff";
import { computeFormulation, ENGINE_VERSION, type FormulationInput, type FormulationResult } from "@/lib/formulation";
import { FormulationError } from "@/lib/formulation/errors";
import type { RevisionState } from "@/lib/workflow";
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
 * Everyone who authored a revision's content: its creator, and whoever saved,
 * started or submitted it (from the audit trail, written in the same
 * transaction as each change). None of them may review it.
 */
export async function authorsOf(tx: DbOrTx, teamId: string, rev: RevisionRow): Promise<string[]> {
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

/** Differences between two revisions (by number) of one formulation. */
export async function diffFormulationRevisions(teamId: string, formulationId: string, from: number, to: number) {
  const rows = await db
    .select({ number: revisions.number, input: revisions.input, result: revisions.result, specifications: revisions.specifications })
    .from(revisions)
    .where(and(eq(revisions.teamId, teamId), eq(revisions.formulationId, formulationId), inArray(revisions.number, [from, to])));
  const a = rows.find((r) => r.number === from);
  const b = rows.find((r) => r.number === to);
  if (!a || !b) return null;
  return {
    from,
    to,
    ...diffRevisions(
      { input: a.input, result: a.result ?? null, specifications: a.specifications },
      { input: b.input, result: b.result ?? null, specifications: b.specifications },
    ),
  };
}

export { REVISION_STATES };
