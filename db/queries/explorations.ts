/**
 * Saved design explorations (issue 16): a revision's grid, the figures shown,
 * the target search and its best candidates. Scoped by team; saving one never
 * changes the revision. Saving and deleting write an audit event in the same
 * transaction.
 */
import { and, desc, eq } from "drizzle-orm";
import { db } from "@/db";
import { explorations, formulations, revisions, user } from "@/db/schema";
import { NotFoundError, RuleError } from "@/lib/errors";
import { outputInfo } from "@/lib/explore/outputs";
import type { Candidate, ExplorationBody, Grid, OutputKey, Search } from "@/lib/explore/spec";
import type { OutputInfo } from "@/lib/explore/types";
import type { FormulationInput } from "@/lib/formulation";
import { recordEvent } from "./audit";
import type { Actor } from "./formulations";

/** Most explorations one list returns (newest first). */
export const EXPLORATION_LIST_MAX = 200;

const listColumns = {
  id: explorations.id,
  formulationId: explorations.formulationId,
  revisionId: explorations.revisionId,
  revisionNumber: revisions.number,
  revisionState: revisions.state,
  name: explorations.name,
  grid: explorations.grid,
  outputs: explorations.outputs,
  search: explorations.search,
  candidates: explorations.candidates,
  pointCount: explorations.pointCount,
  createdBy: explorations.createdBy,
  createdByName: user.name,
  createdAt: explorations.createdAt,
  input: revisions.input,
};

/**
 * Names of what the grid varies, read from the revision's input, so a list
 * can say "Titanium isopropoxide, weight fraction" without the whole input:
 * a material id → its name, "step:<i>" → the step's name, "modifier:<i>" →
 * the modifier material's name.
 */
export function gridNames(grid: Grid, input: FormulationInput): Record<string, string> {
  const names: Record<string, string> = {};
  const material = (id: string) => input.materials.find((m) => m.id === id)?.name ?? id;
  const ids = grid.kind === "ternary" ? [...grid.materialIds] : grid.variables.flatMap((v) => (v.kind === "weightFraction" ? [v.materialId] : []));
  for (const id of ids) names[id] = material(id);
  if (grid.kind === "sweep") {
    for (const v of grid.variables) {
      if (v.kind === "stepTemperature") names[`step:${v.index}`] = input.steps[v.index]?.name ?? `step ${v.index + 1}`;
      if (v.kind === "modifierRatio") {
        const m = input.modifiers?.[v.index];
        names[`modifier:${v.index}`] = m ? material(m.materialId) : `modifier ${v.index + 1}`;
      }
    }
  }
  return names;
}

/**
 * Words and unit of every figure an exploration names (shown, limited, aimed
 * at, or in a candidate), from the output catalogue over the revision's input;
 * a key the catalogue does not know keeps the key as its words.
 */
export function outputWordsOf(
  row: { outputs: OutputKey[]; search: Search | null; candidates: Candidate[] | null },
  input: FormulationInput,
): Record<string, OutputInfo> {
  const keys = new Set<string>(row.outputs);
  for (const c of row.search?.constraints ?? []) keys.add(c.output);
  if (row.search) keys.add(row.search.objective.output);
  for (const c of row.candidates ?? []) for (const k of Object.keys(c.figures)) keys.add(k);
  const out: Record<string, OutputInfo> = {};
  for (const key of keys) out[key] = outputInfo(key, input) ?? { key, label: key, unit: "" };
  return out;
}

/** A row with the names and figure words it needs in place of the revision's input. */
function withNames<T extends { grid: Grid; input: FormulationInput; outputs: OutputKey[]; search: Search | null; candidates: Candidate[] | null }>(
  row: T,
): Omit<T, "input"> & { names: Record<string, string>; outputWords: Record<string, OutputInfo> } {
  const { input, ...rest } = row;
  return { ...rest, names: gridNames(row.grid, input), outputWords: outputWordsOf(row, input) };
}

/**
 * A formulation's saved explorations, newest first, optionally of one
 * revision; `releasedOnly` keeps those of released revisions (for a role that
 * sees released work only).
 *
 * @example
 * ```ts
 * const rows = await listExplorations(team.id, formulationId, { revisionId });
 * ```
 */
export async function listExplorations(teamId: string, formulationId: string, opts: { revisionId?: string; releasedOnly?: boolean } = {}) {
  const rows = await db
    .select(listColumns)
    .from(explorations)
    .innerJoin(revisions, eq(revisions.id, explorations.revisionId))
    .leftJoin(user, eq(user.id, explorations.createdBy))
    .where(
      and(
        eq(explorations.teamId, teamId),
        eq(explorations.formulationId, formulationId),
        opts.revisionId ? eq(explorations.revisionId, opts.revisionId) : undefined,
        opts.releasedOnly ? eq(revisions.state, "released") : undefined,
      ),
    )
    .orderBy(desc(explorations.createdAt), desc(explorations.id))
    .limit(EXPLORATION_LIST_MAX);
  return rows.map(withNames);
}

/** The team's exploration `id` with its formulation's name and its revision's number and input, or undefined. */
async function findExploration(teamId: string, id: string) {
  const [row] = await db
    .select({ ...listColumns, formulationName: formulations.name })
    .from(explorations)
    .innerJoin(revisions, eq(revisions.id, explorations.revisionId))
    .innerJoin(formulations, eq(formulations.id, explorations.formulationId))
    .leftJoin(user, eq(user.id, explorations.createdBy))
    .where(and(eq(explorations.teamId, teamId), eq(explorations.id, id)))
    .limit(1);
  return row;
}

/** One exploration with its formulation's name and its revision's number; null when not in this team. */
export async function getExploration(teamId: string, id: string, opts: { releasedOnly?: boolean } = {}) {
  const row = await findExploration(teamId, id);
  if (!row) return null;
  if (opts.releasedOnly && row.revisionState !== "released") return null;
  return withNames(row);
}

/**
 * One exploration with its revision's stored input (for the export, which
 * computes the points again); null when not in this team.
 */
export async function getExplorationWithInput(teamId: string, id: string) {
  return (await findExploration(teamId, id)) ?? null;
}

/**
 * Saves an exploration of a revision of `formulationId`. The formulation must
 * be the team's (404 otherwise); the revision must be one of its revisions
 * (a RuleError naming `revisionId` otherwise).
 *
 * @example
 * ```ts
 * const { id } = await createExploration(actor, formulationId, body);
 * ```
 */
export async function createExploration(actor: Actor, formulationId: string, body: ExplorationBody): Promise<{ id: string }> {
  return db.transaction(async (tx) => {
    const [f] = await tx
      .select({ id: formulations.id })
      .from(formulations)
      .where(and(eq(formulations.teamId, actor.teamId), eq(formulations.id, formulationId)))
      .limit(1);
    if (!f) throw new NotFoundError("formulation");
    const [rev] = await tx
      .select({ id: revisions.id, number: revisions.number })
      .from(revisions)
      .where(and(eq(revisions.teamId, actor.teamId), eq(revisions.formulationId, formulationId), eq(revisions.id, body.revisionId)))
      .limit(1);
    if (!rev) throw new RuleError("unknown_revision", "There is no such revision of this formulation.", "revisionId");
    const id = crypto.randomUUID();
    await tx.insert(explorations).values({
      id,
      teamId: actor.teamId,
      formulationId,
      revisionId: rev.id,
      name: body.name,
      grid: body.grid,
      outputs: body.outputs,
      search: body.search ?? null,
      candidates: body.candidates ?? null,
      pointCount: body.pointCount,
      createdBy: actor.userId,
    });
    await recordEvent(tx, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "exploration.saved",
      entityType: "exploration",
      entityId: id,
      summary: { after: { name: body.name, revision: rev.number, points: body.pointCount, formulationId, revisionId: rev.id } },
    });
    return { id };
  });
}

/** Deletes a saved exploration of the team (404 when there is none); the revision is untouched. */
export async function deleteExploration(actor: Actor, id: string): Promise<void> {
  await db.transaction(async (tx) => {
    const [row] = await tx
      .select({ id: explorations.id, name: explorations.name, formulationId: explorations.formulationId, revisionId: explorations.revisionId })
      .from(explorations)
      .where(and(eq(explorations.teamId, actor.teamId), eq(explorations.id, id)))
      .for("update")
      .limit(1);
    if (!row) throw new NotFoundError("exploration");
    await tx.delete(explorations).where(eq(explorations.id, id));
    await recordEvent(tx, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "exploration.deleted",
      entityType: "exploration",
      entityId: id,
      summary: { before: { name: row.name, formulationId: row.formulationId, revisionId: row.revisionId } },
    });
  });
}
