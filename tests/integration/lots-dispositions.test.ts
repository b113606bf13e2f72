/**
 * Material lots, a batch line choosing a lot, and the disposition of a batch
 * against a real MariaDB: receiving (duplicate supplier lot → 409 naming the
 * field), stock order, expired / used-up / short lots refused, separation of
 * duties, the blocking items of a release, lot consumption at release, and
 * two releases of batches sharing one short lot at the same moment.
 */
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ConflictError, RuleError, SeparationError } from "@/lib/errors";
import { seedDemo } from "@/db/seed";
import { auditEvents, batchLotUses, batchResults, materialLots, member, revisions, user } from "@/db/schema";
import { createTestDatabase, type TestDatabase } from "../helpers/db";

const ROUNDS = 4;

let t: TestDatabase;
let lq: typeof import("@/db/queries/lots");
let dq: typeof import("@/db/queries/dispositions");
let bq: typeof import("@/db/queries/batches");
let teamId: string;
let users: Record<string, string>;
let releasedId: string;
let prod: { userId: string; teamId: string };
let reviewer: { userId: string; teamId: string };

beforeAll(async () => {
  t = await createTestDatabase("lots");
  process.env.DATABASE_URL = t.url;
  delete (globalThis as { gelwrightDb?: unknown }).gelwrightDb;
  lq = await import("@/db/queries/lots");
  dq = await import("@/db/queries/dispositions");
  bq = await import("@/db/queries/batches");
  const seeded = await seedDemo(t.db);
  teamId = seeded.teamId;
  users = seeded.users as Record<string, string>;
  prod = { userId: users.production!, teamId };
  reviewer = { userId: users.reviewer!, teamId };
  const [released] = await t.db.select({ id: revisions.id }).from(revisions).where(and(eq(revisions.teamId, teamId), eq(revisions.state, "released")));
  releasedId = released!.id;
});

afterAll(async () => {
  const { pool } = await import("@/db");
  await pool.end();
  await t?.close();
});

async function addMember(role: string): Promise<{ userId: string; teamId: string }> {
  const userId = crypto.randomUUID();
  await t.db.insert(user).values({ id: userId, name: `Member ${userId.slice(0, 6)}`, email: `${userId}@lots.example` });
  await t.db.insert(member).values({ id: crypto.randomUUID(), organizationId: teamId, userId, role, createdAt: new Date() });
  return { userId, teamId };
}

const day = (offset: number) => new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10);
let lotSeq = 0;
const lotInput = (materialId: string, quantity: number, extra: Partial<Parameters<typeof lq.receiveLot>[1]> = {}) => ({
  materialId,
  supplier: "Acme Silanes",
  supplierLot: `L-${++lotSeq}-${crypto.randomUUID().slice(0, 6)}`,
  quantity,
  unit: "g" as const,
  receivedOn: day(-30),
  expiresOn: day(300),
  ...extra,
});

/** A started batch whose every line is weighed at target, each line taking from a fresh lot of `stock` g (or from `shared` for line 0). */
async function weighedBatch(opts: { stock?: number; shared?: string; by?: typeof prod } = {}) {
  const by = opts.by ?? prod;
  const batch = await bq.startBatch(by, releasedId);
  for (const line of batch.lines) {
    await bq.recordLine(by, batch.id, line.index, { actualGrams: line.targetGrams ?? 0, lotNumber: line.role === "water" ? null : "x" });
    if (line.role === "water") continue;
    const lotId = line.index === 0 && opts.shared ? opts.shared : (await lq.receiveLot(by, lotInput(line.materialId, opts.stock ?? 10_000))).id;
    await lq.chooseLot(by, batch.id, line.index, lotId);
  }
  return batch;
}

describe("receiving lots", () => {
  it("refuses a second lot with the same supplier lot number for one material, naming the field", async () => {
    const batch = await bq.startBatch(prod, releasedId);
    const materialId = batch.lines[0]!.materialId;
    const first = await lq.receiveLot(prod, lotInput(materialId, 500, { supplierLot: "DUP-1" }));
    expect(first.quantityOnHand).toBe(500);
    const err = await lq.receiveLot(prod, lotInput(materialId, 100, { supplierLot: "DUP-1" })).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(ConflictError);
    expect((err as ConflictError).fields).toHaveProperty("supplierLot");
    const [ev] = await t.db.select().from(auditEvents).where(and(eq(auditEvents.entityId, first.id), eq(auditEvents.action, "lot.received")));
    expect(ev).toBeDefined();
  });

  it("lists lots in stock with the earliest expiry first, leaving out expired and used-up ones", async () => {
    const batch = await bq.startBatch(prod, releasedId);
    const materialId = batch.lines[1]!.materialId;
    const late = await lq.receiveLot(prod, lotInput(materialId, 100, { expiresOn: day(200) }));
    const early = await lq.receiveLot(prod, lotInput(materialId, 100, { expiresOn: day(20) }));
    const expired = await lq.receiveLot(prod, lotInput(materialId, 100, { receivedOn: day(-100), expiresOn: day(-1) }));
    const empty = await lq.receiveLot(prod, lotInput(materialId, 100));
    await t.db.update(materialLots).set({ quantityOnHand: 0 }).where(eq(materialLots.id, empty.id));
    const ids = (await lq.listLots(teamId, { materialId, inStock: true })).rows.map((r) => r.id);
    expect(ids.indexOf(early.id)).toBeGreaterThanOrEqual(0);
    expect(ids.indexOf(early.id)).toBeLessThan(ids.indexOf(late.id));
    expect(ids).not.toContain(expired.id);
    expect(ids).not.toContain(empty.id);
  });
});

describe("a batch line choosing a lot", () => {
  it("refuses an expired, a used-up and a too small lot with a clear message, and keeps the lot number in sync", async () => {
    const batch = await bq.startBatch(prod, releasedId);
    const line = batch.lines.find((l) => l.role !== "water")!;
    const need = line.targetGrams!;
    const expired = await lq.receiveLot(prod, lotInput(line.materialId, need * 10, { receivedOn: day(-400), expiresOn: day(-2) }));
    const usedUp = await lq.receiveLot(prod, lotInput(line.materialId, need * 10));
    await t.db.update(materialLots).set({ quantityOnHand: 0 }).where(eq(materialLots.id, usedUp.id));
    const small = await lq.receiveLot(prod, lotInput(line.materialId, need / 2));
    const good = await lq.receiveLot(prod, lotInput(line.materialId, need * 2, { unit: "kg", quantity: (need * 2) / 1000 }));

    const e1 = await lq.chooseLot(prod, batch.id, line.index, expired.id).catch((e: unknown) => e);
    expect(e1).toBeInstanceOf(RuleError);
    expect((e1 as RuleError).code).toBe("lot_expired");
    expect((e1 as RuleError).message).toMatch(/expired on/);
    const e2 = await lq.chooseLot(prod, batch.id, line.index, usedUp.id).catch((e: unknown) => e);
    expect((e2 as RuleError).code).toBe("lot_used_up");
    const e3 = await lq.chooseLot(prod, batch.id, line.index, small.id).catch((e: unknown) => e);
    expect((e3 as RuleError).code).toBe("lot_short");
    expect((e3 as RuleError).fields).toHaveProperty("lotId");

    const chosen = await lq.chooseLot(prod, batch.id, line.index, good.id);
    expect(chosen!.rows.map((r) => r.lotId)).toEqual([good.id]);
    const after = await bq.getBatch(teamId, batch.id);
    expect(after!.lines[line.index]!.lotNumber).toBe(good.supplierLot);
  });

  it("shows the corrected mass for a lot with a measured assay: mass × nominal / measured", async () => {
    const batch = await bq.startBatch(prod, releasedId);
    const line = batch.lines.find((l) => l.role !== "water")!;
    const lot = await lq.receiveLot(prod, lotInput(line.materialId, line.targetGrams! * 3, { measuredAssay: 0.5 }));
    const lots = await lq.chooseLot(prod, batch.id, line.index, lot.id);
    const row = lots!.rows[0]!;
    // Arithmetic by hand: the corrected mass keeps the active mass, target × nominal / 0.5.
    expect(row.correctedGrams).toBeCloseTo((line.targetGrams! * row.nominalAssay) / 0.5, 9);
  });
});

describe("disposition", () => {
  it("is refused for an open batch and for anyone who made the batch", async () => {
    const admin = { userId: users.admin!, teamId };
    const batch = await weighedBatch();
    const open = await dq.disposeBatch(reviewer, batch.id, { disposition: "released" }).catch((e: unknown) => e);
    expect(open).toBeInstanceOf(ConflictError);
    // The admin records a line: from then on the admin made part of the batch.
    await bq.recordLine(admin, batch.id, 0, { initials: "AD" });
    await bq.closeBatch(prod, batch.id);
    const own = await dq.disposeBatch(admin, batch.id, { disposition: "rejected" }).catch((e: unknown) => e);
    expect(own).toBeInstanceOf(SeparationError);
    expect((own as Error).message).toMatch(/another reviewer/);
  });

  it("blocks a release on an unacknowledged out-of-specification result and on an unacknowledged weighing deviation", async () => {
    const batch = await bq.startBatch(prod, releasedId);
    for (const line of batch.lines) {
      // Line 0 weighed 10 % over its target: outside the ±1 % tolerance.
      const grams = line.index === 0 ? line.targetGrams! * 1.1 : line.targetGrams!;
      await bq.recordLine(prod, batch.id, line.index, { actualGrams: grams, lotNumber: line.role === "water" ? null : `F-${line.index}` });
    }
    await bq.closeBatch(prod, batch.id);
    const [res] = await t.db
      .insert(batchResults)
      .values({ id: crypto.randomUUID(), teamId, batchId: batch.id, specId: crypto.randomUUID(), valueNumber: 99, outOfSpec: true, enteredBy: prod.userId })
      .$returningId();
    const status = await dq.dispositionStatus(teamId, batch.id, reviewer.userId);
    expect(status!.deviations.map((d) => d.lineIndex)).toEqual([0]);
    expect(status!.outOfSpecResults).toHaveLength(1);

    const e = await dq.disposeBatch(reviewer, batch.id, { disposition: "released" }).catch((x: unknown) => x);
    expect(e).toBeInstanceOf(RuleError);
    expect((e as RuleError).fields).toHaveProperty("results");
    expect((e as RuleError).fields).toHaveProperty("acknowledgedDeviations.0");

    await t.db.update(batchResults).set({ acknowledgedAt: new Date(), acknowledgedBy: reviewer.userId, acknowledgement: "Re-measured" }).where(eq(batchResults.id, res!.id));
    const noJustification = await dq
      .disposeBatch(reviewer, batch.id, { disposition: "released_under_deviation", acknowledgedDeviations: [{ lineIndex: 0, note: "Within the resin's range" }] })
      .catch((x: unknown) => x);
    expect((noJustification as RuleError).fields).toHaveProperty("justification");

    const done = await dq.disposeBatch(reviewer, batch.id, {
      disposition: "released_under_deviation",
      justification: "Solids checked, in range.",
      acknowledgedDeviations: [{ lineIndex: 0, note: "Within the resin's range" }],
    });
    expect(done.disposition?.disposition).toBe("released_under_deviation");
    expect(done.disposition?.acknowledgedDeviations).toEqual([{ lineIndex: 0, note: "Within the resin's range" }]);
    const again = await dq.disposeBatch({ userId: users.admin!, teamId }, batch.id, { disposition: "rejected" }).catch((x: unknown) => x);
    expect(again).toBeInstanceOf(ConflictError);
  });

  it("takes each line's amount off its lot at release and nothing at rejection", async () => {
    const released = await weighedBatch({ stock: 10_000 });
    await bq.closeBatch(prod, released.id);
    await dq.disposeBatch(reviewer, released.id, { disposition: "released" });
    const uses = await t.db.select().from(batchLotUses).where(eq(batchLotUses.batchId, released.id));
    expect(uses.length).toBeGreaterThan(0);
    for (const u of uses) {
      const line = released.lines[u.lineIndex]!;
      expect(u.quantityUsed).toBeCloseTo(line.targetGrams!, 9);
      const [lot] = await t.db.select().from(materialLots).where(eq(materialLots.id, u.lotId));
      expect(lot!.quantityOnHand).toBeCloseTo(10_000 - line.targetGrams!, 9);
    }
    const [ev] = await t.db.select().from(auditEvents).where(and(eq(auditEvents.entityId, released.id), eq(auditEvents.action, "batch.disposed")));
    expect(ev).toBeDefined();

    const rejected = await weighedBatch({ stock: 5_000 });
    await bq.closeBatch(prod, rejected.id);
    await dq.disposeBatch(reviewer, rejected.id, { disposition: "rejected" });
    const ruses = await t.db.select().from(batchLotUses).where(eq(batchLotUses.batchId, rejected.id));
    for (const u of ruses) {
      expect(u.quantityUsed).toBeNull();
      const [lot] = await t.db.select().from(materialLots).where(eq(materialLots.id, u.lotId));
      expect(lot!.quantityOnHand).toBe(5_000);
    }
  });
});

describe("two releases of batches sharing a lot that covers only one, at the same moment", () => {
  it("releases exactly one; the other gets a 409 and the lot never goes below zero, every round", async () => {
    const second = await addMember("reviewer");
    for (let round = 0; round < ROUNDS; round++) {
      const probe = await bq.startBatch(prod, releasedId);
      const line0 = probe.lines[0]!;
      // Enough for one batch's line 0 and not for two.
      const shared = await lq.receiveLot(prod, lotInput(line0.materialId, line0.targetGrams! * 1.5));
      const a = await weighedBatch({ shared: shared.id });
      const b = await weighedBatch({ shared: shared.id });
      await bq.closeBatch(prod, a.id);
      await bq.closeBatch(prod, b.id);
      const outcomes = await Promise.allSettled([
        dq.disposeBatch(reviewer, a.id, { disposition: "released" }),
        dq.disposeBatch(second, b.id, { disposition: "released" }),
      ]);
      const ok = outcomes.filter((o) => o.status === "fulfilled");
      const failed = outcomes.filter((o): o is PromiseRejectedResult => o.status === "rejected");
      expect(ok).toHaveLength(1);
      expect(failed).toHaveLength(1);
      expect(failed[0]!.reason).toBeInstanceOf(ConflictError);
      expect((failed[0]!.reason as ConflictError).code).toBe("lot_short");
      const [lot] = await t.db.select().from(materialLots).where(eq(materialLots.id, shared.id));
      expect(lot!.quantityOnHand).toBeGreaterThanOrEqual(0);
      expect(lot!.quantityOnHand).toBeCloseTo(line0.targetGrams! * 0.5, 9);
      // The loser changed nothing: no disposition, no amount taken from its other lots.
      const loser = ok[0] === outcomes[0] ? b : a;
      const status = await dq.dispositionStatus(teamId, loser.id, reviewer.userId);
      expect(status!.disposition).toBeNull();
      const loserUses = await t.db.select().from(batchLotUses).where(eq(batchLotUses.batchId, loser.id));
      expect(loserUses.every((u) => u.quantityUsed === null)).toBe(true);
    }
  });
});

describe("two reviewers deciding the same batch at the same moment", () => {
  it("lets exactly one decide; the other gets a 409 and the lots are taken from once, every round", async () => {
    const second = await addMember("reviewer");
    for (let round = 0; round < ROUNDS; round++) {
      const batch = await weighedBatch({ stock: 10_000 });
      await bq.closeBatch(prod, batch.id);
      const outcomes = await Promise.allSettled([
        dq.disposeBatch(reviewer, batch.id, { disposition: "released" }),
        dq.disposeBatch(second, batch.id, { disposition: round % 2 === 0 ? "released" : "rejected" }),
      ]);
      const failed = outcomes.filter((o): o is PromiseRejectedResult => o.status === "rejected");
      expect(outcomes.filter((o) => o.status === "fulfilled")).toHaveLength(1);
      expect(failed).toHaveLength(1);
      expect(failed[0]!.reason).toBeInstanceOf(ConflictError);
      // Whichever won, no lot was taken from twice.
      const uses = await t.db.select().from(batchLotUses).where(eq(batchLotUses.batchId, batch.id));
      for (const u of uses) {
        const [lot] = await t.db.select().from(materialLots).where(eq(materialLots.id, u.lotId));
        const line = batch.lines[u.lineIndex]!;
        expect([10_000, 10_000 - line.targetGrams!].some((q) => Math.abs(q - lot!.quantityOnHand) < 1e-9)).toBe(true);
      }
    }
  });
});

describe("an out-of-specification result entered while the batch is being released", () => {
  it("never lets both through: either the result lands and blocks the release, or the release lands and the result gets a 409", async () => {
    const rq = await import("@/db/queries/results");
    const [rev] = await t.db.select({ specifications: revisions.specifications }).from(revisions).where(eq(revisions.id, releasedId));
    const spec = (rev!.specifications ?? []).find((s) => s.numeric && s.upper !== null);
    expect(spec, "the demo's released revision carries a numeric specification with an upper limit").toBeDefined();
    for (let round = 0; round < ROUNDS; round++) {
      const batch = await weighedBatch({ stock: 10_000 });
      await bq.closeBatch(prod, batch.id);
      const [entered, disposed] = await Promise.allSettled([
        rq.enterResult(prod, batch.id, { specId: spec!.id, value: spec!.upper! + 1000 }),
        dq.disposeBatch(reviewer, batch.id, { disposition: "released" }),
      ]);
      const both = entered.status === "fulfilled" && disposed.status === "fulfilled";
      expect(both).toBe(false);
      if (entered.status === "rejected") expect(entered.reason).toBeInstanceOf(ConflictError);
      if (disposed.status === "rejected") expect(disposed.reason).toBeInstanceOf(RuleError);
    }
  });
});
