/**
 * Specifications and test results against a real MariaDB: replace a draft's
 * specifications (versioned, audited), immutable once the revision left
 * draft, copied into a new revision; results entered against them, out of
 * specification marked at once (limits inclusive), text in a numeric field
 * refused naming the field, acknowledgement, nothing more once disposed, and
 * two reviewers acknowledging at once (one wins, one 409).
 */
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { seedDemo } from "@/db/seed";
import { auditEvents, batchDispositions, batchResults, formulations, revisions } from "@/db/schema";
import { ConflictError, NotFoundError, RuleError } from "@/lib/errors";
import { proposedSpecifications } from "@/lib/quality/proposed-specs";
import { createTestDatabase, type TestDatabase } from "../helpers/db";
import { APPEARANCE_SPEC, VISCOSITY_SPEC } from "../helpers/specifications";

let t: TestDatabase;
let specsQ: typeof import("@/db/queries/specifications");
let resultsQ: typeof import("@/db/queries/results");
let batchesQ: typeof import("@/db/queries/batches");
let revisionsQ: typeof import("@/db/queries/revisions");
let formulator: { userId: string; teamId: string };
let production: { userId: string; teamId: string };
let reviewer: { userId: string; teamId: string };
let admin: { userId: string; teamId: string };
let draftId: string;
let releasedId: string;
let releasedFormulationId: string;

const viscosity = VISCOSITY_SPEC;
const appearance = APPEARANCE_SPEC;

beforeAll(async () => {
  t = await createTestDatabase("quality_results");
  process.env.DATABASE_URL = t.url;
  delete (globalThis as { gelwrightDb?: unknown }).gelwrightDb;
  specsQ = await import("@/db/queries/specifications");
  resultsQ = await import("@/db/queries/results");
  batchesQ = await import("@/db/queries/batches");
  revisionsQ = await import("@/db/queries/revisions");
  const seeded = await seedDemo(t.db);
  const as = (role: string) => ({ userId: seeded.users[role]!, teamId: seeded.teamId });
  formulator = as("formulator");
  production = as("production");
  reviewer = as("reviewer");
  admin = as("admin");
  const [draft] = await t.db
    .select({ id: revisions.id })
    .from(revisions)
    .where(and(eq(revisions.teamId, seeded.teamId), eq(revisions.state, "draft")))
    .limit(1);
  draftId = draft!.id;
  // A formulation whose newest revision is released (no draft open), so a new revision can start from it.
  const [f] = await t.db
    .select({ id: formulations.id, latest: formulations.latestRevision })
    .from(formulations)
    .where(and(eq(formulations.teamId, seeded.teamId), eq(formulations.latestState, "released")))
    .limit(1);
  releasedFormulationId = f!.id;
  const [rel] = await t.db
    .select({ id: revisions.id })
    .from(revisions)
    .where(and(eq(revisions.formulationId, f!.id), eq(revisions.number, f!.latest)))
    .limit(1);
  releasedId = rel!.id;
});

afterAll(async () => {
  const { pool } = await import("@/db");
  await pool.end();
  await t?.close();
});

describe("specifications of a revision", () => {
  it("replaces a draft's specifications with the proposed and entered ones, bumps the version and writes an audit event", async () => {
    const [rev] = await t.db.select().from(revisions).where(eq(revisions.id, draftId));
    const proposed = proposedSpecifications(rev!.result);
    expect(proposed.length).toBeGreaterThanOrEqual(2);
    const saved = await specsQ.replaceSpecifications(formulator, draftId, { specifications: [...proposed, viscosity, appearance], version: rev!.version });
    expect(saved.version).toBe(rev!.version + 1);
    const read = await specsQ.getSpecifications(formulator.teamId, draftId);
    expect(read!.specifications.map((s) => s.property)).toEqual([...proposed.map((s) => s.property), "Viscosity", "Appearance"]);
    const [event] = await t.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.entityId, draftId), eq(auditEvents.action, "revision.specifications_changed")));
    expect(event?.actorId).toBe(formulator.userId);
  });

  it("refuses a stale version (409) and writes nothing", async () => {
    const before = await specsQ.getSpecifications(formulator.teamId, draftId);
    await expect(specsQ.replaceSpecifications(formulator, draftId, { specifications: [], version: before!.version - 1 })).rejects.toBeInstanceOf(ConflictError);
    const after = await specsQ.getSpecifications(formulator.teamId, draftId);
    expect(after!.specifications.length).toBe(before!.specifications.length);
  });

  it("refuses a revision that left draft (409 naming its state) and another team's (404)", async () => {
    const [rel] = await t.db.select({ version: revisions.version }).from(revisions).where(eq(revisions.id, releasedId));
    const err = await specsQ.replaceSpecifications(formulator, releasedId, { specifications: [viscosity], version: rel!.version }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(ConflictError);
    expect((err as Error).message).toMatch(/released: its specifications can no longer change/);
    await expect(
      specsQ.replaceSpecifications({ ...formulator, teamId: crypto.randomUUID() }, draftId, { specifications: [], version: 1 }),
    ).rejects.toBeInstanceOf(NotFoundError);
  });

  it("copies the specifications into a new revision", async () => {
    // The released revision's approved specifications, as the reviewer approved them.
    await t.db.update(revisions).set({ specifications: [viscosity, appearance] }).where(eq(revisions.id, releasedId));
    const started = await revisionsQ.startRevision(formulator, releasedFormulationId);
    const copy = await specsQ.getSpecifications(formulator.teamId, started.revisionId);
    expect(copy!.specifications).toEqual([viscosity, appearance]);
    expect(copy!.state).toBe("draft");
  });
});

describe("test results of a batch", () => {
  let batchId: string;

  beforeAll(async () => {
    await t.db.update(revisions).set({ specifications: [viscosity, appearance] }).where(eq(revisions.id, releasedId));
    batchId = (await batchesQ.startBatch(production, releasedId)).id;
  });

  it("marks a value outside the limits out of specification at once, and keeps the limits inclusive", async () => {
    const inside = await resultsQ.enterResult(production, batchId, { specId: viscosity.id, value: 5.2, instrument: "Brookfield DV2T #3" });
    const atUpper = await resultsQ.enterResult(production, batchId, { specId: viscosity.id, value: 6 });
    const above = await resultsQ.enterResult(reviewer, batchId, { specId: viscosity.id, value: 6.01 });
    expect([inside.outOfSpec, atUpper.outOfSpec, above.outOfSpec]).toEqual([false, false, true]);
    const listed = await resultsQ.listResults(production.teamId, batchId);
    expect(listed!.results.map((r) => [r.valueNumber, r.outOfSpec])).toEqual([
      [5.2, false],
      [6, false],
      [6.01, true],
    ]);
    expect(listed!.results[0]!.instrument).toBe("Brookfield DV2T #3");
    expect(listed!.results[0]!.enteredBy).toBe(production.userId);
    const events = await t.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.entityId, batchId), eq(auditEvents.action, "batch.result_entered")));
    expect(events).toHaveLength(3);
  });

  it("refuses a text in a numeric field (422 naming value) and an unknown specification (422 naming specId)", async () => {
    const err = await resultsQ.enterResult(production, batchId, { specId: viscosity.id, value: "about 5" }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(RuleError);
    expect(Object.keys((err as RuleError).fields ?? {})).toEqual(["value"]);
    const unknown = await resultsQ.enterResult(production, batchId, { specId: crypto.randomUUID(), value: 5 }).catch((e: unknown) => e);
    expect(unknown).toBeInstanceOf(RuleError);
    expect(Object.keys((unknown as RuleError).fields ?? {})).toEqual(["specId"]);
  });

  it("stores a text result of a non-numeric specification, never out of specification by rule", async () => {
    const r = await resultsQ.enterResult(production, batchId, { specId: appearance.id, value: "clear, no haze" });
    expect(r.outOfSpec).toBe(false);
    const [row] = await t.db.select().from(batchResults).where(eq(batchResults.id, r.id));
    expect([row!.valueText, row!.valueNumber]).toEqual(["clear, no haze", null]);
  });

  it("acknowledges an out-of-specification result once; two reviewers at once: one wins, one 409", async () => {
    const oos = await resultsQ.enterResult(production, batchId, { specId: viscosity.id, value: 3.5 });
    expect(oos.outOfSpec).toBe(true);
    const outcomes = await Promise.allSettled([
      resultsQ.acknowledgeResult(reviewer, batchId, oos.id, "Re-measured at 25.0 °C: 4.1 mPa·s; first reading at 22 °C."),
      resultsQ.acknowledgeResult(admin, batchId, oos.id, "Accepted for this batch."),
    ]);
    expect(outcomes.filter((o) => o.status === "fulfilled")).toHaveLength(1);
    const rejected = outcomes.filter((o): o is PromiseRejectedResult => o.status === "rejected");
    expect(rejected).toHaveLength(1);
    expect(rejected[0]!.reason).toBeInstanceOf(ConflictError);
    const [row] = await t.db.select().from(batchResults).where(eq(batchResults.id, oos.id));
    expect(row!.acknowledgedAt).not.toBeNull();
    expect(row!.acknowledgement).toMatch(/Re-measured|Accepted/);
  });

  it("refuses to acknowledge a result within its specification (409) and an unknown result (404)", async () => {
    const listed = await resultsQ.listResults(production.teamId, batchId);
    const inSpec = listed!.results.find((r) => !r.outOfSpec)!;
    await expect(resultsQ.acknowledgeResult(reviewer, batchId, inSpec.id, "fine")).rejects.toBeInstanceOf(ConflictError);
    await expect(resultsQ.acknowledgeResult(reviewer, batchId, crypto.randomUUID(), "fine")).rejects.toBeInstanceOf(NotFoundError);
  });

  it("takes no result and no acknowledgement once the batch is disposed (409), and another team's batch is 404", async () => {
    const pending = await resultsQ.enterResult(production, batchId, { specId: viscosity.id, value: 9 });
    await t.db.insert(batchDispositions).values({ batchId, teamId: production.teamId, disposition: "rejected", disposedBy: reviewer.userId });
    const err = await resultsQ.enterResult(production, batchId, { specId: viscosity.id, value: 5 }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(ConflictError);
    expect((err as Error).message).toMatch(/already rejected/);
    await expect(resultsQ.acknowledgeResult(reviewer, batchId, pending.id, "late note")).rejects.toBeInstanceOf(ConflictError);
    const listed = await resultsQ.listResults(production.teamId, batchId);
    expect(listed!.disposition).toBe("rejected");
    await expect(resultsQ.enterResult({ ...production, teamId: crypto.randomUUID() }, batchId, { specId: viscosity.id, value: 5 })).rejects.toBeInstanceOf(NotFoundError);
    expect(await resultsQ.listResults(crypto.randomUUID(), batchId)).toBeNull();
  });
});

