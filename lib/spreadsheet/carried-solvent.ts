/**
 * The Materials sheet names the solvent a material carries ("Carried
 * solvent"); the material itself stores that solvent's id. After the import
 * has decided each material's id, the names become ids: a material on the
 * same sheet first, then the team's library.
 */
import type { Material } from "@/lib/formulation";
import type { SheetProblems } from "./cells";
import type { LibraryEntry, MaterialDraft } from "./import-materials";

interface Matched {
  draft: MaterialDraft;
  id: string;
}

/** Replaces each draft's carried-solvent name by the id of that solvent; an unknown name or a non-solvent is an error on its cell. */
export function resolveCarriedSolvents(matched: readonly Matched[], library: readonly LibraryEntry[], p: SheetProblems | undefined): void {
  const onSheet = new Map(matched.map((m) => [m.draft.material.name.toLowerCase(), { id: m.id, material: m.draft.material }]));
  const inLibrary = new Map(library.map((entry) => [entry.name.toLowerCase(), { id: entry.id, material: entry.material }]));
  const libraryIds = new Map(library.map((entry) => [entry.id, entry.material]));
  for (const m of matched) {
    const named = m.draft.material.solventId;
    if (named === undefined) continue;
    const hit: { id: string; material: Material } | undefined =
      onSheet.get(named.toLowerCase()) ?? inLibrary.get(named.toLowerCase()) ?? (libraryIds.has(named) ? { id: named, material: libraryIds.get(named)! } : undefined);
    const at = m.draft.solventAt ?? null;
    if (!hit) {
      p?.error(m.draft.rowIndex, at, `“${m.draft.material.name}”: carried solvent “${named}” is neither on the Materials sheet nor in your team's library.`);
      continue;
    }
    if (hit.material.kind !== "solvent") {
      p?.error(m.draft.rowIndex, at, `“${m.draft.material.name}”: carried solvent “${hit.material.name}” is ${hit.material.kind}, not a solvent.`);
      continue;
    }
    m.draft.material = { ...m.draft.material, solventId: hit.id };
  }
}
