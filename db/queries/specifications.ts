/**
 * A revision's test specifications (lib/quality/specification.ts): read
 * them, and replace them while the revision is a draft. Part of what the
 * reviewer approves: once the revision leaves draft they never change; a new
 * revision starts with a copy (startRevision in revisions.ts).
 */
import { and, eq } from "drizzle-orm";
import { db } from "@/db";
import { revisions } from "@/db/schema";
import { ConflictError } from "@/lib/errors";
import type { Specification } from "@/lib/quality/specification";
import { recordEvent } from "./audit";
import type { Actor } from "./formulations";
import { formulationOfRevision, lockRevision } from "./revisions";

/** The specifications of a revision (an empty list when none were set); `null` when the team has no such revision. */
export async function getSpecifications(teamId: string, revisionId: string, opts: { releasedOnly?: boolean } = {}) {
  const [row] = await db
    .select({ specifications: revisions.specifications, state: revisions.state, version: revisions.version, number: revisions.number })
    .from(revisions)
    .where(and(eq(revisions.teamId, teamId), eq(revisions.id, revisionId)))
    .limit(1);
  if (!row) return null;
  if (opts.releasedOnly && row.state !== "released") return null;
  return { specifications: row.specifications ?? [], state: row.state, version: row.version };
}

/**
 * Replaces a draft's specifications. `version` is the revision's counter the
 * client read (the same one draft saves use): when someone saved in between,
 * nothing is written (409). A revision that is no longer a draft refuses (409).
 */
export async function replaceSpecifications(actor: Actor, revisionId: string, data: { specifications: Specification[]; version: number }) {
  const formulationId = await formulationOfRevision(actor.teamId, revisionId);
  return db.transaction(async (tx) => {
    const current = await lockRevision(tx, actor.teamId, revisionId, formulationId);
    if (current.state !== "draft") {
      throw new ConflictError(
        "conflict",
        `Revision ${current.number} is ${current.state.replace("_", " ")}: its specifications can no longer change. Start a new revision to change them.`,
      );
    }
    if (current.version !== data.version) {
      throw new ConflictError(
        "conflict",
        `Someone saved this revision after you opened it (your copy is version ${data.version}, the saved one is ${current.version}). Nothing was overwritten: reload, then apply your changes again.`,
      );
    }
    const res = await tx
      .update(revisions)
      .set({ specifications: data.specifications, version: current.version + 1 })
      .where(and(eq(revisions.id, revisionId), eq(revisions.version, data.version), eq(revisions.state, "draft")));
    if (res[0].affectedRows !== 1) throw new ConflictError("conflict", "This draft changed while saving; reload and try again.");
    const before = current.specifications ?? [];
    await recordEvent(tx, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "revision.specifications_changed",
      entityType: "revision",
      entityId: revisionId,
      summary: {
        before: { version: current.version, properties: before.map((s) => s.property) },
        after: { version: current.version + 1, properties: data.specifications.map((s) => s.property) },
      },
    });
    return { version: current.version + 1, specifications: data.specifications };
  });
}
