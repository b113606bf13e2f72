/**
 * Stock adjustments of a material lot against a real MariaDB: down and up with
 * the version raised and the audit trail, a stale version (409, nothing
 * changed), no change (422), the cap, another team's lot (404), a lot emptied
 * by adjustment treated as used up, and two races fired together
 * (Promise.allSettled) several rounds: an adjustment and a release taking from
 * the same lot, and two adjustments of one version.
 */
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ConflictError, NotFoundError, RuleError } from "@/lib/errors";
import { seedDemo } from "@/db/seed";
import { auditEvents, batchLotUses, lotAdjustments, materialLots, member, organization, revisions, user } from "@/db/schema";
import { createTestDatabase, type TestDatabase } from "../helpers/db";

const ROUNDS = 4;

let t: TestDatabase;
let lq: typeof import("@/db/queries/lots");
let aq: typeof import("@/db/queries/lot-adjustments");
let dq: typeof import("@/db/queries/dispositions");
let bq: typeof import("@/db/queries/batches");
let teamId: string;
let releasedId: string;
let prod: { userId: string; teamId: string };
let reviewer: { userId: string; teamId: string };
let admin: { userId: string; teamId: string };

beforeAll(async () => {
  t = await createTestDatabase("lot_adjustments");
  process.env.DATABASE_URL = t.url;
  delete (globalThis as { gelwrightDb?: unknown }).gelwrightDb;
  lq = await import("@/db/queries/lots");
  aq = await import("@/db/queries/lot-adjustments");
  dq = await import("@/db/queries/dispositions");
  bq = await import("@/db/queries/batches");
  const seeded = await seedDemo(t.db);
  teamId = seeded.teamId;
  const users = seeded.users as Record<string, string>;
  prod = { userId: users.production!, teamId };
  reviewer = { userId: users.reviewer!, teamId };
  admin = { userId: users.admin!, teamId };
  const [released] = await t.db.select({ id: revisions.id }).from(revisions).where(and(eq(revisions.teamId, teamId), eq(revisions.state, "released")));
  releasedId = released!.id;
});

afterAll(async () => {
  const { pool } = await import("@/db");
  await pool.end();
  await t?.close();
});

const day = (offset: number) => new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10);
let lotSeq = 0;
const lotInput = (materialId: string, quantity: number) => ({
  materialId,
  supplier: "Acme Silanes",
  supplierLot: `A-${++lotSeq}-${crypto.randomUUID().slice(0, 6)}`,
  quantity,
  unit: "g" as const,
  receivedOn: day(-30),
  expiresOn: day(300),
});

/** The material of line 0 of the demo's released revision (not water). */
async function lineZeroMaterial(): Promise<string> {
  return (await bq.startBatch(prod, releasedId)).lines[0]!.materialId;
}

/** A closed batch whose every line is weighed at target; line 0 takes from `shared`, the others from fresh lots. */
async function closedBatch(shared: string) {
  const batch = await bq.startBatch(prod, releasedId);
  for (const line of batch.lines) {
    await bq.recordLine(prod, batch.id, line.index, { actualGrams: line.targetGrams ?? 0, lotNumber: null });
    if (line.role === "water") continue;
    const lotId = line.index === 0 ? shared : (await lq.receiveLot(prod, lotInput(line.materialId, 10_000))).id;
    await lq.chooseLot(prod, batch.id, line.index, lotId);
  }
  await bq.closeBatch(prod, batch.id);
  return batch;
}

const lotRow = async (id: string) => (await t.db.select().from(materialLots).where(eq(materialLots.id, id)))[0]!;
const adjustmentRows = (lotId: string) => t.db.select().from(lotAdjustments).where(eq(lotAdjustments.lotId, lotId));
const events = (lotId: string) =>
  t.db
    .select()
    .from(auditEvents)
    .where(and(eq(auditEvents.entityId, lotId), eq(auditEvents.action, "lot.adjusted")));

describe("adjustLot", () => {
  it("returns the lot with the counted amount on hand and the next version, down and then up, each audited", async () => {
    const lot = await lq.receiveLot(prod, lotInput(await lineZeroMaterial(), 500));
    const down = await aq.adjustLot(prod, lot.id, { version: 1, quantityOnHand: 482.5, reason: "damaged", note: "bottle cracked in transit" });
    expect(down.lot).toMatchObject({ quantityOnHand: 482.5, quantityReceived: 500, version: 2 });
    expect(down.adjustment).toMatchObject({ quantityBefore: 500, quantityAfter: 482.5, reason: "damaged", note: "bottle cracked in transit", adjustedBy: prod.userId, lotVersion: 2 });
    const up = await aq.adjustLot(admin, lot.id, { version: 2, quantityOnHand: 490, reason: "recount" });
    expect(up.lot).toMatchObject({ quantityOnHand: 490, version: 3 });
    expect(up.adjustment).toMatchObject({ quantityBefore: 482.5, quantityAfter: 490, reason: "recount", note: null, adjustedBy: admin.userId });

    const list = (await aq.listLotAdjustments(teamId, lot.id))!;
    expect(list.unit).toBe("g");
    // Newest first.
    expect(list.rows.map((r) => [r.quantityBefore, r.quantityAfter])).toEqual([
      [482.5, 490],
      [500, 482.5],
    ]);
    expect(list.rows[0]!.adjustedByName).toBeTruthy();

    const evs = (await events(lot.id)).map((e) => e.summary);
    expect(evs).toContainEqual({
      before: { quantityOnHand: 500, version: 1 },
      after: { quantityOnHand: 482.5, version: 2, unit: "g", reason: "damaged" },
      note: "bottle cracked in transit",
    });
    expect(evs).toHaveLength(2);
  });

  it("empties a lot with 0 on hand, which then counts as used up: out of the in-stock list and refused by a batch line", async () => {
    const materialId = await lineZeroMaterial();
    const lot = await lq.receiveLot(prod, lotInput(materialId, 300));
    await aq.adjustLot(prod, lot.id, { version: 1, quantityOnHand: 0, reason: "disposed", note: "expired, sent to waste" });
    const inStock = await lq.listLots(teamId, { materialId, inStock: true });
    expect(inStock.rows.map((r) => r.id)).not.toContain(lot.id);
    expect((await lq.listLots(teamId, { materialId })).rows.find((r) => r.id === lot.id)!.quantityOnHand).toBe(0);
    expect((await lq.lotsOfMaterials(teamId, [materialId])).map((r) => r.id)).not.toContain(lot.id);
    const batch = await bq.startBatch(prod, releasedId);
    const err = await lq.chooseLot(prod, batch.id, 0, lot.id).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(RuleError);
    expect((err as RuleError).code).toBe("lot_used_up");
  });

  describe("edge cases", () => {
    it("refuses a stale version with a 409 that says to reload, and changes nothing", async () => {
      const lot = await lq.receiveLot(prod, lotInput(await lineZeroMaterial(), 100));
      await lq.correctLot(prod, lot.id, { version: 1, notes: "shelf B2" });
      const err = await aq.adjustLot(prod, lot.id, { version: 1, quantityOnHand: 90, reason: "recount" }).catch((e: unknown) => e);
      expect(err).toBeInstanceOf(ConflictError);
      expect((err as ConflictError).message).toMatch(/reload/);
      expect((err as ConflictError).fields).toHaveProperty("version");
      expect(await lotRow(lot.id)).toMatchObject({ quantityOnHand: 100, version: 2 });
      expect(await adjustmentRows(lot.id)).toHaveLength(0);
      expect(await events(lot.id)).toHaveLength(0);
    });

    it("refuses the amount already on hand with a 422 naming quantityOnHand, and keeps the version", async () => {
      const lot = await lq.receiveLot(prod, lotInput(await lineZeroMaterial(), 100));
      const err = await aq.adjustLot(prod, lot.id, { version: 1, quantityOnHand: 100, reason: "recount" }).catch((e: unknown) => e);
      expect(err).toBeInstanceOf(RuleError);
      expect((err as RuleError).code).toBe("no_change");
      expect((err as RuleError).fields).toHaveProperty("quantityOnHand");
      expect(await lotRow(lot.id)).toMatchObject({ quantityOnHand: 100, version: 1 });
      expect(await adjustmentRows(lot.id)).toHaveLength(0);
    });

    it("refuses more than 10 × the quantity received, naming quantityOnHand; exactly 10 × is allowed", async () => {
      const lot = await lq.receiveLot(prod, lotInput(await lineZeroMaterial(), 100));
      const err = await aq.adjustLot(prod, lot.id, { version: 1, quantityOnHand: 1000.001, reason: "recount" }).catch((e: unknown) => e);
      expect(err).toBeInstanceOf(RuleError);
      expect((err as RuleError).fields).toHaveProperty("quantityOnHand");
      expect((await aq.adjustLot(prod, lot.id, { version: 1, quantityOnHand: 1000, reason: "recount" })).lot.quantityOnHand).toBe(1000);
    });

    it("finds no lot of another team (404) to adjust or list, and leaves it unchanged", async () => {
      const otherTeam = crypto.randomUUID();
      await t.db.insert(organization).values({ id: otherTeam, name: "Elsewhere Lab", slug: `elsewhere-${otherTeam.slice(0, 8)}`, createdAt: new Date() });
      const outsider = crypto.randomUUID();
      await t.db.insert(user).values({ id: outsider, name: "Olive Other", email: `${outsider}@elsewhere.example` });
      await t.db.insert(member).values({ id: crypto.randomUUID(), organizationId: otherTeam, userId: outsider, role: "production", createdAt: new Date() });
      const lot = await lq.receiveLot(prod, lotInput(await lineZeroMaterial(), 100));
      const err = await aq.adjustLot({ userId: outsider, teamId: otherTeam }, lot.id, { version: 1, quantityOnHand: 1, reason: "recount" }).catch((e: unknown) => e);
      expect(err).toBeInstanceOf(NotFoundError);
      expect(await aq.listLotAdjustments(otherTeam, lot.id)).toBeNull();
      expect(await lotRow(lot.id)).toMatchObject({ quantityOnHand: 100, version: 1 });
    });
  });
});

describe("an adjustment and a release taking from the same lot at the same moment", () => {
  it("keeps both, every round: the amount taken and the count, in whichever order the lock gave them", async () => {
    for (let round = 0; round < ROUNDS; round++) {
      const lot = await lq.receiveLot(prod, lotInput(await lineZeroMaterial(), 10_000));
      const batch = await closedBatch(lot.id);
      const take = batch.lines[0]!.targetGrams!;
      const counted = 9_000 - round;
      const [adjusted, disposed] = await Promise.allSettled([
        aq.adjustLot(prod, lot.id, { version: 1, quantityOnHand: counted, reason: "recount" }),
        dq.disposeBatch(reviewer, batch.id, { disposition: "released" }),
      ]);
      expect(adjusted.status).toBe("fulfilled");
      expect(disposed.status).toBe("fulfilled");
      const row = await lotRow(lot.id);
      const [use] = await t.db.select().from(batchLotUses).where(and(eq(batchLotUses.batchId, batch.id), eq(batchLotUses.lineIndex, 0)));
      expect(use!.quantityUsed).toBeCloseTo(take, 9);
      const [adj] = await adjustmentRows(lot.id);
      // The adjustment row says which went first: before = 10 000 g (the count first, the release takes from it)
      // or 10 000 − take (the release first, the count replaces what it left).
      if (adj!.quantityBefore === 10_000) expect(row.quantityOnHand).toBeCloseTo(counted - take, 9);
      else {
        expect(adj!.quantityBefore).toBeCloseTo(10_000 - take, 9);
        expect(row.quantityOnHand).toBe(counted);
      }
      // Either way the ledger adds up: received − taken by the release + (after − before) of the adjustment.
      expect(row.quantityOnHand).toBeCloseTo(10_000 - take + (adj!.quantityAfter - adj!.quantityBefore), 9);
      expect(row.version).toBe(2);
    }
  });
});

describe("two adjustments of the same version at the same moment", () => {
  it("lets exactly one through; the other gets a 409 and the winner's count stands, every round", async () => {
    for (let round = 0; round < ROUNDS; round++) {
      const lot = await lq.receiveLot(prod, lotInput(await lineZeroMaterial(), 100));
      const outcomes = await Promise.allSettled([
        aq.adjustLot(prod, lot.id, { version: 1, quantityOnHand: 95, reason: "recount" }),
        aq.adjustLot(admin, lot.id, { version: 1, quantityOnHand: 80, reason: "sample", note: `to the customer, round ${round}` }),
      ]);
      const ok = outcomes.filter((o) => o.status === "fulfilled");
      const failed = outcomes.filter((o): o is PromiseRejectedResult => o.status === "rejected");
      expect(ok).toHaveLength(1);
      expect(failed).toHaveLength(1);
      expect(failed[0]!.reason).toBeInstanceOf(ConflictError);
      const row = await lotRow(lot.id);
      expect(row.version).toBe(2);
      expect(row.quantityOnHand).toBe(ok[0] === outcomes[0] ? 95 : 80);
      expect(await adjustmentRows(lot.id)).toHaveLength(1);
      expect(await events(lot.id)).toHaveLength(1);
    }
  });
});
