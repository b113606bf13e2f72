import { and, count, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_FORMULATIONS, DEMO_PRICES, DEMO_QUALITY, DEMO_TEAM, DEMO_USERS } from "@/db/demo";
import { mulberry32 } from "@/db/seed-quality";
import { individualsChart } from "@/lib/quality/control-chart";
import { specificationsSchema } from "@/lib/quality/specification";
import { seedDemo } from "@/db/seed";
import { batchDispositions, batchLotUses, batchRecords, batchResults, formulations, materialLots, materials, member, organization, revisions, user } from "@/db/schema";
import { referenceMaterials } from "@/data/materials";
import { createTestDatabase, type TestDatabase } from "../helpers/db";

let t: TestDatabase;
beforeAll(async () => {
  t = await createTestDatabase("seed");
});
afterAll(async () => {
  await t?.close();
});

async function counts() {
  const n = async (q: PromiseLike<{ n: number }[]>) => Number((await q)[0]!.n);
  return {
    users: await n(t.db.select({ n: count() }).from(user)),
    teams: await n(t.db.select({ n: count() }).from(organization)),
    members: await n(t.db.select({ n: count() }).from(member)),
    materials: await n(t.db.select({ n: count() }).from(materials)),
    formulations: await n(t.db.select({ n: count() }).from(formulations)),
    revisions: await n(t.db.select({ n: count() }).from(revisions)),
    batches: await n(t.db.select({ n: count() }).from(batchRecords)),
    lots: await n(t.db.select({ n: count() }).from(materialLots)),
    results: await n(t.db.select({ n: count() }).from(batchResults)),
  };
}

describe("demo seed", () => {
  it("migrates a fresh database and seeds it twice with the same result", async () => {
    const first = await seedDemo(t.db);
    const afterFirst = await counts();
    const second = await seedDemo(t.db);
    const afterSecond = await counts();
    expect(first.created.users).toBe(DEMO_USERS.length);
    expect(second.created).toEqual({ users: 0, formulations: 0, qualityBatches: 0 });
    expect(first.created.qualityBatches).toBe(DEMO_QUALITY.batches);
    expect(second.teamId).toBe(first.teamId);
    expect(afterSecond).toEqual(afterFirst);
    expect(afterFirst.teams).toBe(1);
    expect(afterFirst.formulations).toBe(DEMO_FORMULATIONS.length);
    expect(afterFirst.materials).toBe(referenceMaterials.length);
  });

  it("reads back the demo team, one account per role and formulations in each state", async () => {
    const [team] = await t.db.select().from(organization).where(eq(organization.slug, DEMO_TEAM.slug));
    expect(team?.name).toBe(DEMO_TEAM.name);
    const roles = await t.db
      .select({ email: user.email, role: member.role })
      .from(member)
      .innerJoin(user, eq(user.id, member.userId))
      .where(eq(member.organizationId, team!.id));
    expect(roles.map((r) => r.role).sort()).toEqual(["admin", "formulator", "production", "reviewer"]);
    expect(roles.every((r) => r.email.endsWith("@larkspur.example"))).toBe(true);
    const states = new Set((await t.db.select({ s: revisions.state }).from(revisions)).map((r) => r.s));
    expect([...states].sort()).toEqual(["approved", "archived", "draft", "in_review", "released"]);
    const [released] = await t.db
      .select()
      .from(revisions)
      .where(and(eq(revisions.teamId, team!.id), eq(revisions.state, "released")));
    // The stored result is the engine's, with a recipe line per dispensed material.
    expect(released?.result?.lines.length).toBeGreaterThan(3);
    expect(released?.result?.composite.massGrams).toBeCloseTo(100, 6); // 500 g sol × 0.20 solids
  });

  it("puts the invented demo prices on the team's materials once, so every demo formulation shows its cost", async () => {
    const [team] = await t.db.select().from(organization).where(eq(organization.slug, DEMO_TEAM.slug));
    const rows = await t.db.select().from(materials).where(eq(materials.teamId, team!.id));
    for (const [referenceId, price] of Object.entries(DEMO_PRICES)) {
      const row = rows.find((r) => r.referenceId === referenceId);
      expect(row?.data.pricePerKg, referenceId).toBe(price);
      expect(row?.data.sources?.pricePerKg, referenceId).toMatch(/demo data/);
    }
    // Expected: the engine's own figure (identity) — each stored result has a cost, and the VOC the engine always sets now.
    const stored = await t.db.select().from(revisions).where(eq(revisions.teamId, team!.id));
    for (const revision of stored) {
      expect(revision.result?.cost?.total, revision.id).toBeGreaterThan(0);
      expect(revision.result?.voc?.gramsPerLitre, revision.id).toBeGreaterThan(0);
    }
  });

  it("gives the same numbers from the same seed (mulberry32), different ones from another", () => {
    const a = mulberry32(42), b = mulberry32(42), c = mulberry32(43);
    const xs = [a(), a(), a()];
    expect([b(), b(), b()]).toEqual(xs);
    expect(c()).not.toBe(xs[0]);
    expect(xs.every((x) => x >= 0 && x < 1)).toBe(true);
  });

  it("seeds the visor hard coat's quality history: lots, specifications, released batches with results showing a shift", async () => {
    const [team] = await t.db.select().from(organization).where(eq(organization.slug, DEMO_TEAM.slug));
    const teamId = team!.id;
    const users = Object.fromEntries(
      (await t.db.select({ id: user.id, role: member.role }).from(member).innerJoin(user, eq(user.id, member.userId)).where(eq(member.organizationId, teamId))).map(
        (r) => [r.role, r.id],
      ),
    );
    const [rev] = await t.db
      .select({ id: revisions.id, specifications: revisions.specifications })
      .from(revisions)
      .innerJoin(formulations, eq(formulations.id, revisions.formulationId))
      .where(and(eq(formulations.name, DEMO_QUALITY.formulation), eq(revisions.state, "released")));
    // Specifications: valid against the shared schema, solids content computed, viscosity entered.
    const specs = specificationsSchema.parse(rev!.specifications);
    expect(specs.find((s) => s.property === "Solids content")?.origin).toBe("computed");
    expect(specs.find((s) => s.property === "Viscosity")?.origin).toBe("entered");

    const batches = await t.db.select().from(batchRecords).where(eq(batchRecords.revisionId, rev!.id));
    expect(batches.length).toBeGreaterThanOrEqual(25);
    expect(batches.every((b) => b.state === "closed" && b.startedBy === users.production && /demo data/i.test(b.notes ?? ""))).toBe(true);
    const dispositions = await t.db.select().from(batchDispositions).where(eq(batchDispositions.teamId, teamId));
    expect(dispositions.length).toBe(batches.length);
    // Separation of duties: the reviewer disposes, never the maker.
    expect(dispositions.every((d) => d.disposedBy === users.reviewer)).toBe(true);
    const deviated = dispositions.filter((d) => d.disposition === "released_under_deviation");
    expect(deviated.length).toBe(1);
    expect(deviated[0]!.justification).toMatch(/\S{10,}/);
    expect(dispositions.filter((d) => d.disposition === "released").length).toBe(batches.length - 1);

    const results = await t.db.select().from(batchResults).where(eq(batchResults.teamId, teamId));
    const oos = results.filter((r) => r.outOfSpec);
    expect(oos.length).toBe(1);
    expect(oos[0]!.batchId).toBe(deviated[0]!.batchId);
    expect(oos[0]!.acknowledgedBy).toBe(users.reviewer);
    expect(oos[0]!.acknowledgement).toBeTruthy();

    // The solids content in time order breaks the 8-in-a-row rule (the shift), by our own chart code.
    const order = new Map(batches.sort((a, b) => a.createdAt.getTime() - b.createdAt.getTime()).map((b, i) => [b.id, i]));
    const solidsId = specs.find((s) => s.property === "Solids content")!.id;
    const solids = results.filter((r) => r.specId === solidsId).sort((a, b) => order.get(a.batchId)! - order.get(b.batchId)!);
    expect(solids.length).toBe(batches.length);
    const chart = individualsChart(solids.map((r) => r.valueNumber!))!;
    expect(chart.points.some((p) => p.rules.includes("eight-on-one-side"))).toBe(true);

    // Lots: some expire within 30 days; none below zero on hand; every lot use points at a batch of the history.
    const lots = await t.db.select().from(materialLots).where(eq(materialLots.teamId, teamId));
    expect(lots.length).toBe(DEMO_QUALITY.lots.length * 2);
    const in30 = new Date(Date.now() + 30 * 86_400_000).toISOString().slice(0, 10);
    const today = new Date().toISOString().slice(0, 10);
    expect(lots.filter((l) => l.expiresOn !== null && l.expiresOn >= today && l.expiresOn <= in30).length).toBeGreaterThanOrEqual(2);
    expect(lots.every((l) => l.quantityOnHand >= 0 && l.quantityOnHand < l.quantityReceived)).toBe(true);
    const uses = await t.db.select().from(batchLotUses).where(eq(batchLotUses.teamId, teamId));
    expect(uses.length).toBeGreaterThan(batches.length);
    expect(uses.every((u) => order.has(u.batchId) && (u.quantityUsed ?? 0) > 0)).toBe(true);
  });
});
