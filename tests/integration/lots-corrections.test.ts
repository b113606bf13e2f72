/**
 * Correcting a received material lot against a real MariaDB: the fields that
 * may change, clearing the assay, the duplicate supplier lot number (409
 * naming supplierLot), a stale version (409, nothing lost), another team's
 * lot, a released batch keeping the assay it was released with, and two
 * races fired together (Promise.all) several rounds: a correction and a
 * release taking from the same lot, and two corrections of one version.
 */
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ConflictError, NotFoundError, RuleError } from "@/lib/errors";
import { seedDemo } from "@/db/seed";
import { auditEvents, batchLotUses, materialLots, member, organization, revisions, user } from "@/db/schema";
import { createTestDatabase, type TestDatabase } from "../helpers/db";

const ROUNDS = 4;

let t: TestDatabase;
let lq: typeof import("@/db/queries/lots");
let dq: typeof import("@/db/queries/dispositions");
let bq: typeof import("@/db/queries/batches");
let teamId: string;
let releasedId: string;
let prod: { userId: string; teamId: string };
let reviewer: { userId: string; teamId: string };
let admin: { userId: string; teamId: string };

beforeAll(async () => {
  t = await createTestDatabase("lot_corrections");
  process.env.DATABASE_URL = t.url;
  delete (globalThis as { gelwrightDb?: unknown }).gelwrightDb;
  lq = await import("@/db/queries/lots");
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
const lotInput = (materialId: string, quantity: number, extra: Partial<Parameters<typeof lq.receiveLot>[1]> = {}) => ({
  materialId,
  supplier: "Acme Silanes",
  supplierLot: `C-${++lotSeq}-${crypto.randomUUID().slice(0, 6)}`,
  quantity,
  unit: "g" as const,
  receivedOn: day(-30),
  expiresOn: day(300),
  ...extra,
});

/** The first non-water material of the demo's released revision. */
async function someMaterial(): Promise<string> {
  const batch = await bq.startBatch(prod, releasedId);
  return batch.lines.find((l) => l.role !== "water")!.materialId;
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

const events = (lotId: string) =>
  t.db
    .select()
    .from(auditEvents)
    .where(and(eq(auditEvents.entityId, lotId), eq(auditEvents.action, "lot.updated")));

describe("correctLot", () => {
  it("returns the lot with the corrected fields and the next version, and audits the changed fields only", async () => {
    const lot = await lq.receiveLot(prod, lotInput(await someMaterial(), 500, { notes: "first delivery" }));
    expect(lot.version).toBe(1);
    const done = await lq.correctLot(prod, lot.id, {
      version: 1,
      supplier: "Acme Silanes GmbH",
      supplierLot: `${lot.supplierLot}-R`,
      expiresOn: day(200),
      measuredAssay: 0.97,
      // Unchanged: sent again, it is no change and stays out of the audit event.
      notes: "first delivery",
    });
    expect(done).toMatchObject({ supplier: "Acme Silanes GmbH", supplierLot: `${lot.supplierLot}-R`, expiresOn: day(200), measuredAssay: 0.97, notes: "first delivery", version: 2 });
    // The quantities and the received date are not the correction's to change.
    expect(done).toMatchObject({ quantityReceived: 500, quantityOnHand: 500, receivedOn: lot.receivedOn });
    const [ev] = await events(lot.id);
    expect(ev!.summary).toEqual({
      before: { supplier: "Acme Silanes", supplierLot: lot.supplierLot, expiresOn: day(300), measuredAssay: null, version: 1 },
      after: { supplier: "Acme Silanes GmbH", supplierLot: `${lot.supplierLot}-R`, expiresOn: day(200), measuredAssay: 0.97, version: 2 },
    });
  });

  it("clears the measured assay, the expiry date and the notes with null", async () => {
    const lot = await lq.receiveLot(prod, lotInput(await someMaterial(), 100, { measuredAssay: 0.9, notes: "n" }));
    const done = await lq.correctLot(prod, lot.id, { version: 1, measuredAssay: null, expiresOn: null, notes: null });
    expect(done).toMatchObject({ measuredAssay: null, expiresOn: null, notes: null, version: 2 });
    const [row] = await t.db.select().from(materialLots).where(eq(materialLots.id, lot.id));
    expect(row!.measuredAssay).toBeNull();
    const [ev] = await events(lot.id);
    expect(ev!.summary).toMatchObject({ before: { measuredAssay: 0.9, notes: "n" }, after: { measuredAssay: null, notes: null } });
  });

  it("writes nothing, not even a version, when every field sent is unchanged", async () => {
    const lot = await lq.receiveLot(prod, lotInput(await someMaterial(), 100));
    const done = await lq.correctLot(prod, lot.id, { version: 1, supplier: lot.supplier });
    expect(done.version).toBe(1);
    expect(await events(lot.id)).toHaveLength(0);
  });

  describe("edge cases", () => {
    it("refuses a supplier lot number the material already has with a 409 naming supplierLot, changing nothing", async () => {
      const materialId = await someMaterial();
      const taken = await lq.receiveLot(prod, lotInput(materialId, 100));
      const lot = await lq.receiveLot(prod, lotInput(materialId, 100));
      const err = await lq.correctLot(prod, lot.id, { version: 1, supplierLot: taken.supplierLot, measuredAssay: 0.5 }).catch((e: unknown) => e);
      expect(err).toBeInstanceOf(ConflictError);
      expect((err as ConflictError).code).toBe("duplicate");
      expect((err as ConflictError).fields).toHaveProperty("supplierLot");
      const after = (await lq.getLot(teamId, lot.id))!;
      expect(after).toMatchObject({ supplierLot: lot.supplierLot, measuredAssay: null, version: 1 });
      expect(await events(lot.id)).toHaveLength(0);
    });

    it("refuses a stale version with a 409 that says to reload, and keeps the change that won", async () => {
      const lot = await lq.receiveLot(prod, lotInput(await someMaterial(), 100));
      await lq.correctLot(prod, lot.id, { version: 1, measuredAssay: 0.8 });
      const err = await lq.correctLot(prod, lot.id, { version: 1, expiresOn: day(10) }).catch((e: unknown) => e);
      expect(err).toBeInstanceOf(ConflictError);
      expect((err as ConflictError).message).toMatch(/reload/);
      expect((err as ConflictError).fields).toHaveProperty("version");
      const after = (await lq.getLot(teamId, lot.id))!;
      expect(after).toMatchObject({ measuredAssay: 0.8, expiresOn: day(300), version: 2 });
      expect(await events(lot.id)).toHaveLength(1);
    });

    it("refuses an expiry date before the stored received date, naming expiresOn", async () => {
      const lot = await lq.receiveLot(prod, lotInput(await someMaterial(), 100, { receivedOn: day(-30) }));
      const err = await lq.correctLot(prod, lot.id, { version: 1, expiresOn: day(-31) }).catch((e: unknown) => e);
      expect(err).toBeInstanceOf(RuleError);
      expect((err as RuleError).fields).toHaveProperty("expiresOn");
    });

    it("finds no lot of another team (404), and leaves it unchanged", async () => {
      const otherTeam = crypto.randomUUID();
      await t.db.insert(organization).values({ id: otherTeam, name: "Elsewhere Lab", slug: `elsewhere-${otherTeam.slice(0, 8)}`, createdAt: new Date() });
      const outsider = crypto.randomUUID();
      await t.db.insert(user).values({ id: outsider, name: "Olive Other", email: `${outsider}@elsewhere.example` });
      await t.db.insert(member).values({ id: crypto.randomUUID(), organizationId: otherTeam, userId: outsider, role: "production", createdAt: new Date() });
      const lot = await lq.receiveLot(prod, lotInput(await someMaterial(), 100));
      const err = await lq.correctLot({ userId: outsider, teamId: otherTeam }, lot.id, { version: 1, supplier: "Mine now" }).catch((e: unknown) => e);
      expect(err).toBeInstanceOf(NotFoundError);
      expect((await lq.getLot(teamId, lot.id))!.supplier).toBe("Acme Silanes");
    });

    it("corrects a lot a released batch used; the released batch keeps the assay it was released with, an open one shows the new one", async () => {
      const materialId = (await bq.startBatch(prod, releasedId)).lines[0]!.materialId;
      const lot = await lq.receiveLot(prod, lotInput(materialId, 10_000, { measuredAssay: 0.9 }));
      const released = await closedBatch(lot.id);
      await dq.disposeBatch(reviewer, released.id, { disposition: "released" });
      const open = await bq.startBatch(prod, releasedId);
      await lq.chooseLot(prod, open.id, 0, lot.id);

      await lq.correctLot(prod, lot.id, { version: 1, measuredAssay: 0.5 });
      const past = (await lq.batchLots(teamId, released.id))!.rows.find((r) => r.lineIndex === 0)!;
      expect(past.measuredAssay).toBe(0.9);
      // Arithmetic by hand: corrected mass = target × nominal ÷ measured, with the assay at release (0.9).
      const target = released.lines[0]!.targetGrams!;
      expect(past.correctedGrams).toBeCloseTo((target * past.nominalAssay) / 0.9, 9);
      const now = (await lq.batchLots(teamId, open.id))!.rows.find((r) => r.lineIndex === 0)!;
      expect(now.measuredAssay).toBe(0.5);
      // Traceability reads lot ids: the lot still lists the released batch.
      expect((await lq.getLot(teamId, lot.id))!.uses.map((u) => u.batchId)).toContain(released.id);
    });
  });
});

describe("a batch line's lot number once a lot is picked", () => {
  it("comes from the lot: typing another is refused naming lotNumber, and a corrected lot number follows until the batch closes", async () => {
    const batch = await bq.startBatch(prod, releasedId);
    const line = batch.lines.find((l) => l.role !== "water")!;
    await bq.recordLine(prod, batch.id, line.index, { actualGrams: line.targetGrams!, lotNumber: "typed before" });
    const lot = await lq.receiveLot(prod, lotInput(line.materialId, 10_000));
    await lq.chooseLot(prod, batch.id, line.index, lot.id);
    const picked = (await bq.getBatch(teamId, batch.id))!.lines[line.index]!;
    expect(picked).toMatchObject({ lotId: lot.id, lotNumber: lot.supplierLot });

    const err = await bq.recordLine(prod, batch.id, line.index, { lotNumber: "overwritten by hand" }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(RuleError);
    expect((err as RuleError).code).toBe("lot_picked");
    expect((err as RuleError).fields).toHaveProperty("lotNumber");
    // The same number as the lot's, or a mass alone, still saves.
    await bq.recordLine(prod, batch.id, line.index, { actualGrams: line.targetGrams! + 0.01, lotNumber: lot.supplierLot });

    await lq.correctLot(prod, lot.id, { version: 1, supplierLot: `${lot.supplierLot}-FIXED` });
    expect((await bq.getBatch(teamId, batch.id))!.lines[line.index]!.lotNumber).toBe(`${lot.supplierLot}-FIXED`);

    // Cleared, the line takes typed text again.
    await lq.chooseLot(prod, batch.id, line.index, null);
    const typed = await bq.recordLine(prod, batch.id, line.index, { lotNumber: "by hand" });
    expect(typed.lines[line.index]).toMatchObject({ lotId: null, lotNumber: "by hand" });
  });

  it("says in the batch.closed event which lot numbers the record took from lots corrected after they were picked", async () => {
    const batch = await bq.startBatch(prod, releasedId);
    const line = batch.lines.find((l) => l.role !== "water")!;
    const lot = await lq.receiveLot(prod, lotInput(line.materialId, 10_000));
    await lq.chooseLot(prod, batch.id, line.index, lot.id);
    for (const l of batch.lines) {
      await bq.recordLine(prod, batch.id, l.index, l.index === line.index ? { actualGrams: l.targetGrams! } : { actualGrams: l.targetGrams ?? 0, lotNumber: l.role === "water" ? null : `L-${l.index}` });
    }
    await lq.correctLot(prod, lot.id, { version: 1, supplierLot: `${lot.supplierLot}-R` });
    await bq.closeBatch(prod, batch.id);
    const [closed] = await t.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.entityId, batch.id), eq(auditEvents.action, "batch.closed")));
    expect((closed!.summary as { note?: string }).note).toBe(
      `lot numbers as their lots were corrected: line ${line.index + 1} ${lot.supplierLot} → ${lot.supplierLot}-R`,
    );
    // a batch closed with its lots as picked says nothing of the kind
    const plain = await closedBatch((await lq.receiveLot(prod, lotInput(line.materialId, 10_000))).id);
    const [event] = await t.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.entityId, plain.id), eq(auditEvents.action, "batch.closed")));
    expect(event!.summary).toEqual({ before: { state: "open" }, after: { state: "closed" } });
  });

  it("closes with the picked lot's number as corrected, and keeps it after the lot changes again", async () => {
    const materialId = (await bq.startBatch(prod, releasedId)).lines[0]!.materialId;
    const lot = await lq.receiveLot(prod, lotInput(materialId, 10_000));
    const batch = await closedBatch(lot.id);
    const closed = (await bq.getBatch(teamId, batch.id))!;
    expect(closed.lines[0]!.lotNumber).toBe(lot.supplierLot);
    await lq.correctLot(prod, lot.id, { version: 1, supplierLot: `${lot.supplierLot}-LATER` });
    // A closed record does not change; traceability follows the lot id.
    expect((await bq.getBatch(teamId, batch.id))!.lines[0]!.lotNumber).toBe(lot.supplierLot);
  });
});

describe("a correction and a release taking from the same lot at the same moment", () => {
  it("keeps both: the corrected fields and the amount taken, every round", async () => {
    for (let round = 0; round < ROUNDS; round++) {
      const materialId = (await bq.startBatch(prod, releasedId)).lines[0]!.materialId;
      const lot = await lq.receiveLot(prod, lotInput(materialId, 10_000, { measuredAssay: 0.9 }));
      const batch = await closedBatch(lot.id);
      const target = batch.lines[0]!.targetGrams!;
      const [corrected, disposed] = await Promise.allSettled([
        lq.correctLot(prod, lot.id, { version: 1, expiresOn: day(100 + round), measuredAssay: 0.8, notes: `round ${round}` }),
        dq.disposeBatch(reviewer, batch.id, { disposition: "released" }),
      ]);
      expect(corrected.status).toBe("fulfilled");
      expect(disposed.status).toBe("fulfilled");
      const [row] = await t.db.select().from(materialLots).where(eq(materialLots.id, lot.id));
      expect(row).toMatchObject({ expiresOn: day(100 + round), measuredAssay: 0.8, notes: `round ${round}`, version: 2 });
      expect(row!.quantityOnHand).toBeCloseTo(10_000 - target, 9);
      const [use] = await t.db.select().from(batchLotUses).where(and(eq(batchLotUses.batchId, batch.id), eq(batchLotUses.lineIndex, 0)));
      expect(use!.quantityUsed).toBeCloseTo(target, 9);
      // Whichever went first, the release kept the assay the lot had when it took from it.
      expect([0.9, 0.8]).toContain(use!.measuredAssayUsed);
    }
  });
});

describe("two corrections of the same version at the same moment", () => {
  it("lets exactly one through; the other gets a 409 and the winner's change stands, every round", async () => {
    for (let round = 0; round < ROUNDS; round++) {
      const lot = await lq.receiveLot(prod, lotInput(await someMaterial(), 100));
      const outcomes = await Promise.allSettled([
        lq.correctLot(prod, lot.id, { version: 1, notes: "from A", measuredAssay: 0.7 }),
        lq.correctLot(admin, lot.id, { version: 1, notes: "from B", expiresOn: day(50) }),
      ]);
      const ok = outcomes.filter((o) => o.status === "fulfilled");
      const failed = outcomes.filter((o): o is PromiseRejectedResult => o.status === "rejected");
      expect(ok).toHaveLength(1);
      expect(failed).toHaveLength(1);
      expect(failed[0]!.reason).toBeInstanceOf(ConflictError);
      const [row] = await t.db.select().from(materialLots).where(eq(materialLots.id, lot.id));
      expect(row!.version).toBe(2);
      if (ok[0] === outcomes[0]) expect(row).toMatchObject({ notes: "from A", measuredAssay: 0.7, expiresOn: day(300) });
      else expect(row).toMatchObject({ notes: "from B", measuredAssay: null, expiresOn: day(50) });
      expect(await events(lot.id)).toHaveLength(1);
    }
  });
});
