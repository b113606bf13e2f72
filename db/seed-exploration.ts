/**
 * A demo saved exploration (demo data): a map of the visor hard coat's
 * titania share (0–20 wt% of the dry composite) against its cure temperature
 * (90–130 °C), the coat's refractive index against the polycarbonate's, with
 * a target search "thermal check clear, organic content ≥ 50 wt%, index
 * closest to 1.586" whose candidates are computed here by the full decimal
 * engine. (At the released 120 °C cure every point is a thermal caution, and
 * the burn-off organic content stays near 51 wt%: the map shows both.) Written directly through the schema;
 * skipped when the released revision already has an exploration of that name.
 */
import { and, eq } from "drizzle-orm";
import { planAndRun } from "@/lib/explore/run";
import type { Grid, Search } from "@/lib/explore/spec";
import { decimalModel } from "@/lib/formulation/numeric/figures";
import type { Db } from "./client";
import { auditEvents, explorations, formulations, materials, revisions } from "./schema";

/** The demo exploration's name, formulation and search (the example). */
export const DEMO_EXPLORATION = {
  formulation: "Visor hard coat HC-3",
  name: "Titania share and cure temperature for the polycarbonate's index (demo data)",
  /** Polycarbonate n_D ≈ 1.586 (the target; the substrate's index in data/materials.ts). */
  search: {
    constraints: [{ output: "organicContent", min: 0.5 }],
    thermal: "clear",
    objective: { goal: "closest", output: "refractiveIndex", value: 1.586 },
  } satisfies Search,
  outputs: ["refractiveIndex", "indexMismatch", "organicContent", "maxAllowedC"],
} as const;

/** Seeds the demo exploration; returns whether it wrote one. */
export async function seedExplorationDemo(db: Db, teamId: string, users: Record<string, string>): Promise<boolean> {
  const [rev] = await db
    .select({ id: revisions.id, formulationId: revisions.formulationId, input: revisions.input, number: revisions.number })
    .from(revisions)
    .innerJoin(formulations, eq(formulations.id, revisions.formulationId))
    .where(and(eq(revisions.teamId, teamId), eq(formulations.name, DEMO_EXPLORATION.formulation), eq(revisions.state, "released")))
    .limit(1);
  if (!rev) return false;
  const [existing] = await db
    .select({ id: explorations.id })
    .from(explorations)
    .where(and(eq(explorations.revisionId, rev.id), eq(explorations.name, DEMO_EXPLORATION.name)))
    .limit(1);
  if (existing) return false;
  const [titania] = await db
    .select({ id: materials.id })
    .from(materials)
    .where(and(eq(materials.teamId, teamId), eq(materials.referenceId, "ti-isopropoxide")))
    .limit(1);
  if (!titania || !rev.input.components.some((c) => c.materialId === titania.id)) return false;
  const cure = rev.input.steps.findIndex((step) => step.stage === "curing");
  if (cure < 0) return false;
  const grid: Grid = {
    kind: "sweep",
    variables: [
      { kind: "weightFraction", materialId: titania.id, from: 0, to: 0.2, step: 0.02 },
      { kind: "stepTemperature", index: cure, from: 90, to: 130, step: 10 },
    ],
  };
  const search: Search = { ...DEMO_EXPLORATION.search, constraints: [...DEMO_EXPLORATION.search.constraints] };
  const run = planAndRun({ base: rev.input, grid, outputs: [...DEMO_EXPLORATION.outputs], search, model: decimalModel(rev.input.materials) });
  if ("message" in run) throw new Error(`The demo exploration does not fit the visor hard coat: ${run.field}: ${run.message}`);
  const id = crypto.randomUUID();
  await db.transaction(async (tx) => {
    await tx.insert(explorations).values({
      id,
      teamId,
      formulationId: rev.formulationId,
      revisionId: rev.id,
      name: DEMO_EXPLORATION.name,
      grid,
      outputs: [...DEMO_EXPLORATION.outputs],
      search,
      candidates: run.candidates ?? [],
      pointCount: run.plan.count,
      createdBy: users.formulator ?? null,
    });
    await tx.insert(auditEvents).values({
      teamId,
      actorId: users.formulator ?? null,
      action: "exploration.saved",
      entityType: "exploration",
      entityId: id,
      summary: { after: { name: DEMO_EXPLORATION.name, revision: rev.number, points: run.plan.count }, note: "demo data" },
    });
  });
  return true;
}
