import { and, eq } from "drizzle-orm";
import type { DbOrTx } from "@/db/client";
import { materials } from "@/db/schema";
import { referenceMaterials } from "@/data/materials";

/**
 * Copies the reference materials (data/materials.ts) into a team's library,
 * skipping names the team already has and references it already copied
 * (under another name). Copies keep their sources. Teams created before a
 * reference material existed get it from a data migration
 * (db/migrations/0003_add_reference_materials.sql), once.
 * Returns a map from reference id to the team's material id.
 */
export async function copyReferenceMaterials(dbx: DbOrTx, teamId: string, userId: string | null): Promise<Map<string, string>> {
  const existing = await dbx
    .select({ id: materials.id, name: materials.name, referenceId: materials.referenceId })
    .from(materials)
    .where(eq(materials.teamId, teamId));
  const byName = new Map(existing.map((e) => [e.name, e.id]));
  const byReference = new Map(existing.filter((e) => e.referenceId).map((e) => [e.referenceId!, e.id]));
  const ids = new Map<string, string>();
  const added = referenceMaterials.filter((ref) => {
    const found = byName.get(ref.name) ?? byReference.get(ref.id);
    ids.set(ref.id, found ?? crypto.randomUUID());
    return !found;
  });
  const rows = [];
  for (const ref of added) {
    const id = ids.get(ref.id)!;
    // A carried solvent names another material: point it at the team's copy.
    const solventId = ref.solventId === undefined ? undefined : ids.get(ref.solventId);
    rows.push({
      id,
      teamId,
      referenceId: ref.id,
      name: ref.name,
      kind: ref.kind,
      casNumber: ref.casNumber ?? null,
      data: { ...ref, id, ...(solventId ? { solventId } : {}) },
      createdBy: userId,
    });
  }
  if (rows.length) await dbx.insert(materials).values(rows);
  return ids;
}

/** The team's copy of a reference material, by reference id. */
export async function teamMaterialByReference(dbx: DbOrTx, teamId: string, referenceId: string) {
  const [row] = await dbx
    .select()
    .from(materials)
    .where(and(eq(materials.teamId, teamId), eq(materials.referenceId, referenceId)))
    .limit(1);
  return row ?? null;
}
