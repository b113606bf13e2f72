/**
 * Batch records against a real MariaDB: start from a released revision only,
 * record lines, tolerance from the team setting, close, immutability, audit.
 */
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ConflictError, NotFoundError, RuleError } from "@/lib/errors";
import { seedDemo } from "@/db/seed";
import { auditEvents, formulations, revisions } from "@/db/schema";
import { createTestDatabase, type TestDatabase } from "../helpers/db";

let t: TestDatabase;
let q: typeof import("@/db/queries/batches");
let actor: { userId: string; teamId: string };
let releasedId: string;
let draftId: string;
let formulationId: string;
/** Batches the demo seed writes (the quality history of the released revision). */
let seededBatches: number;
let seededClosed: number;

beforeAll(async () => {
  t = await createTestDatabase("batches");
  process.env.DATABASE_URL = t.url;
  delete (globalThis as { gelwrightDb?: unknown }).gelwrightDb;
  q = await import("@/db/queries/batches");
  const seeded = await seedDemo(t.db);
  actor = { userId: seeded.users.production!, teamId: seeded.teamId };
  const [released] = await t.db
    .select({ id: revisions.id, formulationId: revisions.formulationId })
    .from(revisions)
    .where(and(eq(revisions.teamId, seeded.teamId), eq(revisions.state, "released")));
  releasedId = released!.id;
  formulationId = released!.formulationId;
  const [draft] = await t.db.select({ id: revisions.id }).from(revisions).where(eq(revisions.state, "draft")).limit(1);
  draftId = draft!.id;
  seededBatches = (await q.listBatches(actor.teamId, { formulationId })).rows.length;
  seededClosed = (await q.listBatches(actor.teamId, { state: "closed" })).rows.length;
});

afterAll(async () => {
  const { pool } = await import("@/db");
  await pool.end();
  await t?.close();
});

describe("batch records", () => {
  it("starts a batch from the released revision with the recipe's lines and the default ±1 % tolerance", async () => {
    const batch = await q.startBatch(actor, releasedId);
    const [rev] = await t.db.select().from(revisions).where(eq(revisions.id, releasedId));
    const lines = rev!.result!.lines.filter((l) => l.massGrams > 0);
    expect(batch.state).toBe("open");
    expect(batch.lines.map((l) => [l.materialId, l.targetGrams])).toEqual(lines.map((l) => [l.materialId, l.massGrams]));
    expect([batch.toleranceFraction, batch.balanceResolutionGrams]).toEqual([0.01, 0.01]);
    expect(batch.summary).toEqual({ lines: lines.length, weighed: 0, outside: 0 });
    expect(batch.composition).toBeNull();
  });

  it("refuses a draft revision (409) and another team's or an unknown revision (404)", async () => {
    await expect(q.startBatch(actor, draftId)).rejects.toBeInstanceOf(ConflictError);
    await expect(q.startBatch({ ...actor, teamId: crypto.randomUUID() }, releasedId)).rejects.toBeInstanceOf(NotFoundError);
  });

  it("records lines one after another, flags a line beyond tolerance, closes, and then refuses every change", async () => {
    const batch = await q.startBatch(actor, releasedId, { notes: "Morning batch" });
    let view = batch;
    for (const line of batch.lines) {
      // The first line is weighed 2 % over its target (beyond ±1 %), the rest exactly.
      const actual = line.index === 0 ? line.targetGrams! * 1.02 : line.targetGrams!;
      view = await q.recordLine(actor, batch.id, line.index, { actualGrams: actual, lotNumber: line.role === "water" ? null : `LOT-${line.index}`, initials: "PP" });
    }
    expect(view.summary.weighed).toBe(batch.lines.length);
    expect(view.summary.outside).toBe(1);
    expect(view.lines[0]!.deviation!.relative).toBeCloseTo(0.02, 12);
    expect(view.lines[0]!.at).toMatch(/^\d{4}-\d\d-\d\dT/);
    expect(view.composition!.effectiveR.actual).toBeGreaterThan(0);

    const closed = await q.closeBatch(actor, batch.id);
    expect(closed.state).toBe("closed");
    expect(closed.closedBy).toBe(actor.userId);
    await expect(q.recordLine(actor, batch.id, 0, { actualGrams: 1 })).rejects.toBeInstanceOf(ConflictError);
    await expect(q.saveBatchNotes(actor, batch.id, "changed")).rejects.toBeInstanceOf(ConflictError);
    await expect(q.closeBatch(actor, batch.id)).rejects.toBeInstanceOf(ConflictError);
    expect((await q.getBatch(actor.teamId, batch.id))!.lines[0]!.actualGrams).toBe(view.lines[0]!.actualGrams);

    const events = await t.db.select({ action: auditEvents.action }).from(auditEvents).where(eq(auditEvents.entityId, batch.id));
    expect(events.map((e) => e.action).sort()).toEqual(["batch.closed", "batch.started", ...batch.lines.map(() => "batch.line_recorded")].sort());
  });

  it("refuses to close while a line has no actual mass or lot number, naming the lines, and changes nothing", async () => {
    const batch = await q.startBatch(actor, releasedId);
    await q.recordLine(actor, batch.id, 0, { actualGrams: batch.lines[0]!.targetGrams! });
    const err = await q.closeBatch(actor, batch.id).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(RuleError);
    expect(err).toMatchObject({ code: "incomplete" });
    expect((err as { fields: Record<string, string> }).fields["lines.0.lotNumber"]).toMatch(/no lot number/);
    expect((err as { fields: Record<string, string> }).fields["lines.1.actualGrams"]).toMatch(/no actual mass/);
    expect((await q.getBatch(actor.teamId, batch.id))!.state).toBe("open");
  });

  it("uses the team's tolerance setting for batches started after it changes, and lists batches per formulation", async () => {
    await q.saveBatchSettings(actor, { toleranceFraction: 0.02, balanceResolutionGrams: 0.001 });
    expect(await q.getBatchSettings(actor.teamId)).toEqual({ toleranceFraction: 0.02, balanceResolutionGrams: 0.001, isDefault: false });
    const batch = await q.startBatch(actor, releasedId);
    expect([batch.toleranceFraction, batch.balanceResolutionGrams]).toEqual([0.02, 0.001]);
    const list = await q.listBatches(actor.teamId, { formulationId });
    expect(list.rows.length).toBe(seededBatches + 4);
    expect(list.rows.every((r) => r.formulationId === formulationId)).toBe(true);
    const [f] = await t.db.select({ name: formulations.name }).from(formulations).where(eq(formulations.id, formulationId));
    expect(list.rows[0]!.formulationName).toBe(f!.name);
    expect((await q.listBatches(actor.teamId, { state: "closed" })).rows.length).toBe(seededClosed + 1);
    expect((await q.listBatches(crypto.randomUUID())).rows).toEqual([]);
  });
});
