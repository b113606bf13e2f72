/**
 * Demo quality records (demo data, invented): supplier lots of the visor hard
 * coat's materials (some expiring within 30 days), specifications on its
 * released revision, and a history of released batches with test results
 * drifting to show a shift on the control chart — generated with a seeded
 * random generator so every run writes the same figures. Written directly
 * through the schema; skipped when the released revision already has batches.
 *
 * Separation of duties: batches are made by the production account, dispositions
 * by the reviewer account, results acknowledged by the reviewer.
 */
import { and, eq } from "drizzle-orm";
import { batchLinesFrom } from "@/lib/batches";
import type { Specification } from "@/lib/quality/specification";
import type { Db } from "./client";
import { DEMO_QUALITY } from "./demo";
import { auditEvents, batchDispositions, batchLotUses, batchRecords, batchResults, formulations, materialLots, materials, revisions } from "./schema";

/** mulberry32: a small seeded generator of uniform numbers in [0, 1) (public-domain algorithm by Tommy Ettinger). */
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** A standard normal number from two uniform ones (Box–Muller). */
function normal(random: () => number): number {
  const u = 1 - random();
  const v = random();
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
}

const DAY_MS = 86_400_000;
const isoDate = (d: Date) => d.toISOString().slice(0, 10);
const round = (x: number, places: number) => Number(x.toFixed(places));

export interface QualitySeedSummary {
  created: boolean;
  batches: number;
  lots: number;
}

/** Seeds the quality demo for the team; does nothing when the visor hard coat's released revision already has batches. */
export async function seedQualityDemo(db: Db, teamId: string, users: Record<string, string>, now = new Date()): Promise<QualitySeedSummary> {
  const [rev] = await db
    .select({ id: revisions.id, input: revisions.input, result: revisions.result, specifications: revisions.specifications })
    .from(revisions)
    .innerJoin(formulations, eq(formulations.id, revisions.formulationId))
    .where(and(eq(revisions.teamId, teamId), eq(formulations.name, DEMO_QUALITY.formulation), eq(revisions.state, "released")))
    .limit(1);
  if (!rev?.result) return { created: false, batches: 0, lots: 0 };
  const [existing] = await db.select({ id: batchRecords.id }).from(batchRecords).where(eq(batchRecords.revisionId, rev.id)).limit(1);
  if (existing) return { created: false, batches: 0, lots: 0 };

  const random = mulberry32(DEMO_QUALITY.seed);
  const production = users.production ?? null;
  const reviewer = users.reviewer ?? null;
  const team = await db.select({ id: materials.id, referenceId: materials.referenceId }).from(materials).where(eq(materials.teamId, teamId));
  const byRef = new Map(team.map((m) => [m.referenceId, m.id]));

  const specs: Specification[] = DEMO_QUALITY.specifications.map((s) => ({ ...s, id: crypto.randomUUID() }));
  const specId = (property: string) => specs.find((s) => s.property === property)!.id;
  const lines = batchLinesFrom(rev.input, rev.result);
  const count = DEMO_QUALITY.batches;
  const firstDay = now.getTime() - (count + 2) * DAY_MS;

  await db.transaction(async (tx) => {
    await tx.update(revisions).set({ specifications: specs }).where(eq(revisions.id, rev.id));

    // Lots: an older one (used by the first half of the batches, nearly used up)
    // and a newer one per material; the newer lots of two materials expire within 30 days.
    const lotOf = new Map<string, { id: string; supplierLot: string }[]>();
    const lotUse = new Map<string, number>();
    let lotCount = 0;
    for (const lot of DEMO_QUALITY.lots) {
      const materialId = byRef.get(lot.material);
      if (!materialId) throw new Error(`Demo lots refer to "${lot.material}", which is not in the team's library`);
      const list: { id: string; supplierLot: string }[] = [];
      for (const [i, part] of (["old", "new"] as const).entries()) {
        const id = crypto.randomUUID();
        const receivedOn = new Date(firstDay - (part === "old" ? 20 : -count / 2) * DAY_MS);
        const expiresDays = part === "old" ? lot.shelfLifeDays : lot.newExpiresInDays;
        const expiresOn = part === "old" ? new Date(receivedOn.getTime() + expiresDays * DAY_MS) : new Date(now.getTime() + expiresDays * DAY_MS);
        const supplierLot = `${lot.lotPrefix}-${i === 0 ? "0417" : "0522"}`;
        await tx.insert(materialLots).values({
          id,
          teamId,
          materialId,
          supplier: lot.supplier,
          supplierLot,
          unit: "kg",
          quantityReceived: lot.kilograms,
          quantityOnHand: lot.kilograms,
          receivedOn: isoDate(receivedOn),
          expiresOn: isoDate(expiresOn),
          measuredAssay: null,
          notes: "Demo data: invented supplier lot.",
          receivedBy: production,
        });
        await tx.insert(auditEvents).values({
          teamId,
          actorId: production,
          action: "lot.received",
          entityType: "lot",
          entityId: id,
          summary: { after: { supplier: lot.supplier, supplierLot, quantity: lot.kilograms, unit: "kg" }, note: "demo data" },
          createdAt: receivedOn,
        });
        lotUse.set(id, 0);
        list.push({ id, supplierLot });
        lotCount++;
      }
      lotOf.set(materialId, list);
    }

    for (let n = 0; n < count; n++) {
      const batchId = crypto.randomUUID();
      const startedAt = new Date(firstDay + n * DAY_MS + 8 * 3_600_000);
      const closedAt = new Date(startedAt.getTime() + 5 * 3_600_000);
      const disposedAt = new Date(closedAt.getTime() + 20 * 3_600_000);
      const half = n < count / 2 ? 0 : 1;
      const batchLines = lines.map((line) => {
        // Weighing within ±0.9 % of the target (inside the ±1 % tolerance).
        const rel = Math.max(-0.009, Math.min(0.009, 0.003 * normal(random)));
        const lot = lotOf.get(line.materialId)?.[half];
        return {
          ...line,
          actualGrams: round((line.targetGrams ?? 0) * (1 + rel), 2),
          lotNumber: lot?.supplierLot ?? "in-house",
          at: new Date(startedAt.getTime() + 30 * 60_000).toISOString(),
          initials: "PL",
        };
      });
      await tx.insert(batchRecords).values({
        id: batchId,
        teamId,
        revisionId: rev.id,
        state: "closed",
        lines: batchLines,
        notes: `Demo data: generated batch ${n + 1} of ${count} (seeded random figures).`,
        toleranceFraction: 0.01,
        balanceResolutionGrams: 0.01,
        startedBy: production,
        closedBy: production,
        closedAt,
        createdAt: startedAt,
        updatedAt: closedAt,
      });
      for (const [lineIndex, line] of batchLines.entries()) {
        const lot = lotOf.get(line.materialId)?.[half];
        if (!lot) continue;
        const kg = round(line.actualGrams / 1000, 6);
        lotUse.set(lot.id, lotUse.get(lot.id)! + kg);
        await tx.insert(batchLotUses).values({ teamId, batchId, lineIndex, lotId: lot.id, quantityUsed: kg, createdAt: startedAt });
      }

      // Solids content: on target for the first batches, then a shift upwards (8 or more in a row above the centre line).
      const solids = round(DEMO_QUALITY.solids.mean + (n >= DEMO_QUALITY.solids.shiftFrom ? DEMO_QUALITY.solids.shift : 0) + DEMO_QUALITY.solids.sd * normal(random), 2);
      let viscosity = round(DEMO_QUALITY.viscosity.mean + DEMO_QUALITY.viscosity.sd * normal(random), 2);
      const deviated = n === DEMO_QUALITY.outOfSpecBatch;
      if (deviated) viscosity = DEMO_QUALITY.viscosity.outOfSpecValue;
      const viscositySpec = specs.find((s) => s.property === "Viscosity")!;
      const solidsSpec = specs.find((s) => s.property === "Solids content")!;
      const outside = (v: number, s: Specification) => (s.lower !== null && v < s.lower) || (s.upper !== null && v > s.upper);
      const enteredAt = new Date(closedAt.getTime() + 2 * 3_600_000);
      for (const [property, value, instrument] of [
        ["Solids content", solids, "Moisture balance MB-2 (demo)"],
        ["Viscosity", viscosity, "Rotational viscometer V-1 (demo)"],
      ] as const) {
        const oos = outside(value, property === "Viscosity" ? viscositySpec : solidsSpec);
        const resultId = crypto.randomUUID();
        await tx.insert(batchResults).values({
          id: resultId,
          teamId,
          batchId,
          specId: specId(property),
          valueNumber: value,
          outOfSpec: oos,
          instrument,
          enteredBy: production,
          enteredAt,
          acknowledgedBy: oos ? reviewer : null,
          acknowledgedAt: oos ? new Date(enteredAt.getTime() + 3_600_000) : null,
          acknowledgement: oos ? DEMO_QUALITY.acknowledgement : null,
        });
        await tx.insert(auditEvents).values({
          teamId,
          actorId: production,
          action: "batch.result_entered",
          entityType: "batch",
          entityId: batchId,
          summary: { after: { property, value, outOfSpec: oos }, note: "demo data" },
          createdAt: enteredAt,
        });
      }
      const disposition = deviated ? "released_under_deviation" : "released";
      await tx.insert(batchDispositions).values({
        batchId,
        teamId,
        disposition,
        justification: deviated ? DEMO_QUALITY.deviationJustification : null,
        acknowledgedDeviations: [],
        disposedBy: reviewer,
        disposedAt,
      });
      await tx.insert(auditEvents).values({
        teamId,
        actorId: reviewer,
        action: "batch.disposed",
        entityType: "batch",
        entityId: batchId,
        summary: { after: { disposition }, note: "demo data" },
        createdAt: disposedAt,
      });
    }

    for (const [lotId, used] of lotUse) {
      const [lot] = await tx.select({ received: materialLots.quantityReceived }).from(materialLots).where(eq(materialLots.id, lotId));
      await tx.update(materialLots).set({ quantityOnHand: round(Math.max(0, lot!.received - used), 6) }).where(eq(materialLots.id, lotId));
    }
    void lotCount;
  });
  return { created: true, batches: count, lots: DEMO_QUALITY.lots.length * 2 };
}
