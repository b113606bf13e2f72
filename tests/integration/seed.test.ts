import { and, count, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_FORMULATIONS, DEMO_PRICES, DEMO_TEAM, DEMO_USERS } from "@/db/demo";
import { seedDemo } from "@/db/seed";
import { formulations, materials, member, organization, revisions, user } from "@/db/schema";
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
  };
}

describe("demo seed", () => {
  it("migrates a fresh database and seeds it twice with the same result", async () => {
    const first = await seedDemo(t.db);
    const afterFirst = await counts();
    const second = await seedDemo(t.db);
    const afterSecond = await counts();
    expect(first.created.users).toBe(DEMO_USERS.length);
    expect(second.created).toEqual({ users: 0, formulations: 0 });
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
});
