import { and, eq, lt } from "drizzle-orm";
import { db } from "@/db";
import { formulations, importPreviews, materials, type ImportPreviewRow } from "@/db/schema";
import { ConflictError, ExpiredError, NotFoundError, RuleError, type FieldProblem } from "@/lib/errors";
import type { Material } from "@/lib/formulation";
import type { FormulationPreview } from "@/lib/spreadsheet/import-formulation";
import type { LibraryEntry, MaterialsPreview } from "@/lib/spreadsheet/import-materials";
import type { ImportKind } from "@/lib/spreadsheet/types";
import { onDuplicate } from "../errors";
import { recordEvent } from "./audit";
import { insertFormulation } from "./formulations";

export interface Actor {
  userId: string;
  teamId: string;
}

/** How long a preview waits for confirmation. */
export const PREVIEW_TTL_MS = 60 * 60 * 1000;

export type ImportPreview = FormulationPreview | MaterialsPreview;

/** The team's library as the import compares against it. */
export async function loadLibrary(teamId: string): Promise<LibraryEntry[]> {
  const rows = await db.select().from(materials).where(eq(materials.teamId, teamId));
  return rows.map((row) => {
    const material: Material = { ...row.data, id: row.id, name: row.name, kind: row.kind };
    if (row.casNumber) material.casNumber = row.casNumber;
    return { id: row.id, name: row.name, casNumber: row.casNumber, material };
  });
}

/** Formulation names in use in the team, lower case. */
export async function takenFormulationNames(teamId: string): Promise<Set<string>> {
  const rows = await db.select({ name: formulations.name }).from(formulations).where(eq(formulations.teamId, teamId));
  return new Set(rows.map((r) => r.name.toLowerCase()));
}

function view(row: ImportPreviewRow) {
  return {
    id: row.id,
    fileName: row.fileName,
    state: row.state,
    expiresAt: row.expiresAt,
    createdAt: row.createdAt,
    outcome: row.outcome ?? null,
    ...(row.preview as unknown as ImportPreview),
  };
}

/** Keeps a preview on the server until it is confirmed or expires; old ones are removed on the way. */
export async function createImportPreview(actor: Actor, kind: ImportKind, fileName: string, preview: ImportPreview) {
  const id = crypto.randomUUID();
  const now = Date.now();
  await db.delete(importPreviews).where(lt(importPreviews.expiresAt, new Date(now - PREVIEW_TTL_MS)));
  await db.insert(importPreviews).values({
    id,
    teamId: actor.teamId,
    userId: actor.userId,
    kind,
    fileName: fileName.slice(0, 255),
    preview: preview as unknown as Record<string, unknown>,
    expiresAt: new Date(now + PREVIEW_TTL_MS),
  });
  return (await getImportPreview(actor, id))!;
}

/** A preview of this user in this team, or null. */
export async function getImportPreview(actor: Actor, id: string) {
  const [row] = await db
    .select()
    .from(importPreviews)
    .where(and(eq(importPreviews.teamId, actor.teamId), eq(importPreviews.userId, actor.userId), eq(importPreviews.id, id)))
    .limit(1);
  return row ? view(row) : null;
}

export async function discardImportPreview(actor: Actor, id: string): Promise<boolean> {
  const res = await db
    .delete(importPreviews)
    .where(and(eq(importPreviews.teamId, actor.teamId), eq(importPreviews.userId, actor.userId), eq(importPreviews.id, id), eq(importPreviews.state, "ready")));
  return res[0].affectedRows === 1;
}

/** The preview's problems of one level, each keyed by where it is ("Input row 2, Value"). */
function problemIssues(preview: ImportPreview, level: "error" | "warning"): FieldProblem[] {
  return preview.problems
    .filter((x) => x.level === level)
    .map((p) => ({ field: `${p.sheet}${p.row !== null ? ` row ${p.row}` : ""}${p.column ? `, ${p.column}` : ""}`, message: p.message }));
}

/**
 * Saves a confirmed import in one transaction: the materials to create, and
 * for a formulation its first draft revision. Nothing is saved while any
 * error remains, nor while warnings are not accepted (RuleError); a name
 * taken since the preview was made is refused by the unique keys (ConflictError).
 */
export async function confirmImport(actor: Actor, id: string, opts: { acceptWarnings: boolean }) {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .select()
      .from(importPreviews)
      .where(and(eq(importPreviews.teamId, actor.teamId), eq(importPreviews.userId, actor.userId), eq(importPreviews.id, id)))
      .for("update")
      .limit(1);
    if (!row) throw new NotFoundError("import");
    if (row.state === "confirmed") throw new ConflictError("conflict", "This import was already saved.");
    if (row.expiresAt.getTime() < Date.now()) throw new ExpiredError("This preview has expired; upload the file again.");
    const preview = row.preview as unknown as ImportPreview;
    const errors = preview.problems.filter((p) => p.level === "error");
    if (errors.length > 0) {
      throw new RuleError(
        "import_has_errors",
        `Nothing was saved: the file still has ${errors.length} error${errors.length === 1 ? "" : "s"}. Fix ${errors.length === 1 ? "it" : "them"} and upload the file again.`,
        undefined,
        problemIssues(preview, "error"),
      );
    }
    const warnings = preview.problems.filter((p) => p.level === "warning");
    if (warnings.length > 0 && !opts.acceptWarnings) {
      throw new RuleError(
        "warnings_not_accepted",
        `The file has ${warnings.length} warning${warnings.length === 1 ? "" : "s"}; accept ${warnings.length === 1 ? "it" : "them"} to save.`,
        undefined,
        problemIssues(preview, "warning"),
      );
    }

    const toCreate = preview.materials.filter((m) => m.action === "create");
    if (toCreate.length > 0) {
      // A name added to the library since the preview was made is refused by the unique key.
      const taken = onDuplicate(
        "materials_team_name_uq",
        "A material of this file was added to the library after this preview was made. Upload the file again to link to it.",
      );
      for (let i = 0; i < toCreate.length; i += 200) {
        await tx
          .insert(materials)
          .values(
            toCreate.slice(i, i + 200).map((m) => ({
              id: m.id,
              teamId: actor.teamId,
              name: m.material.name,
              kind: m.material.kind,
              casNumber: m.material.casNumber ?? null,
              data: { ...m.material, id: m.id },
              createdBy: actor.userId,
            })),
          )
          .catch(taken);
      }
      for (const m of toCreate) {
        await recordEvent(tx, {
          teamId: actor.teamId,
          actorId: actor.userId,
          action: "material.created",
          entityType: "material",
          entityId: m.id,
          summary: { after: { name: m.name, kind: m.kind }, note: `imported from ${row.fileName}` },
        });
      }
    }

    const outcome: Record<string, unknown> = {
      createdMaterials: toCreate.map((m) => ({ id: m.id, name: m.name })),
      linkedMaterials: preview.materials.filter((m) => m.action === "link").map((m) => ({ id: m.id, name: m.name })),
    };

    if (preview.kind === "formulation") {
      const { input, formulation } = preview;
      if (!input || !formulation.name) throw new RuleError("import_has_errors", "Nothing was saved: the file has no complete formulation.");
      const { formulationId, revisionId } = await insertFormulation(
        tx,
        actor,
        { name: formulation.name, project: formulation.project, description: formulation.description, input },
        {
          duplicateMessage: `A formulation named “${formulation.name}” was created after this preview was made. Rename it in the file and upload it again.`,
          note: `imported from ${row.fileName}`,
        },
      );
      outcome.formulationId = formulationId;
      outcome.revisionId = revisionId;
    }
    await tx.update(importPreviews).set({ state: "confirmed", confirmedAt: new Date(), outcome }).where(eq(importPreviews.id, id));
    return { id, kind: preview.kind, state: "confirmed" as const, outcome };
  });
}
