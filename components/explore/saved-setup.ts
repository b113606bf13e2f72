import "server-only";
import { getExploration } from "@/db/queries/explorations";
import type { Grid, OutputKey, Search } from "@/lib/explore/spec";

/** A saved exploration as the explorer page pre-fills it. */
export interface SavedSetup {
  id: string;
  name: string;
  revisionId: string;
  grid: Grid;
  outputs: OutputKey[];
  search: Search | null;
}

/**
 * The saved exploration `explorationId` of this formulation and team, or null
 * (none asked for, not found, or of another formulation).
 *
 * @example
 * ```ts
 * const saved = await savedSetupOf(ctx.teamId, formulationId, searchParams.exploration);
 * ```
 */
export async function savedSetupOf(teamId: string, formulationId: string, explorationId: string | undefined): Promise<SavedSetup | null> {
  if (!explorationId || explorationId.length > 64) return null;
  const row = await getExploration(teamId, explorationId);
  if (!row || row.formulationId !== formulationId) return null;
  return { id: row.id, name: row.name, revisionId: row.revisionId, grid: row.grid as Grid, outputs: row.outputs as OutputKey[], search: (row.search as Search | null) ?? null };
}
