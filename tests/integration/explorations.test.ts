/**
 * Saved design explorations on a real MariaDB: save, list, read and delete,
 * scoped by team; a revision of another formulation is refused naming
 * `revisionId`; every change leaves its audit row; opening a candidate as a
 * new draft computes it with the full engine and notes the exploration, and
 * two such requests at once give one draft and one refusal.
 */
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { seedDemo } from "@/db/seed";
import { auditEvents, formulations, member, organization, revisions, user } from "@/db/schema";
import { ConflictError, NotFoundError, RuleError } from "@/lib/errors";
import type { ExplorationBody } from "@/lib/explore/spec";
import type { FormulationInput } from "@/lib/formulation";
import { createTestDatabase, type TestDatabase } from "../helpers/db";

let t: TestDatabase;
let eq_: typeof import("@/db/queries/explorations");
let rq: typeof import("@/db/queries/revisions");
let fq: typeof import("@/db/queries/formulations");
let teamId: string;
let users: Record<string, string>;
let hc3: { formulationId: string; releasedId: string; input: FormulationInput };
let monolithId: string;
let monolithRevisionId: string;

function body(revisionId: string, patch: Partial<ExplorationBody> = {}): ExplorationBody {
  const titania = hc3.input.components[hc3.input.components.length - 1]!.materialId;
  return {
    revisionId,
    name: "Titania sweep",
    grid: { kind: "sweep", variables: [{ kind: "weightFraction", materialId: titania, from: 0, to: 0.2, step: 0.05 }] },
    outputs: ["refractiveIndex", "theoreticalDensity"],
    search: { constraints: [{ output: "organicWeightFraction", min: 0.6 }], thermal: "clear", objective: { goal: "closest", output: "refractiveIndex", value: 1.586 } },
    pointCount: 5,
    candidates: [{ point: 2, values: [0.1], score: 0.004, figures: { refractiveIndex: 1.582 }, thermalStatus: "clear" }],
    ...patch,
  };
}

beforeAll(async () => {
  t = await createTestDatabase("explorations");
  process.env.DATABASE_URL = t.url;
  delete (globalThis as { gelwrightDb?: unknown }).gelwrightDb;
  eq_ = await import("@/db/queries/explorations");
  rq = await import("@/db/queries/revisions");
  fq = await import("@/db/queries/formulations");
  const seeded = await seedDemo(t.db);
  teamId = seeded.teamId;
  users = seeded.users as Record<string, string>;
  const [f] = await t.db.select().from(formulations).where(and(eq(formulations.teamId, teamId), eq(formulations.name, "Visor hard coat HC-3")));
  const [rel] = await t.db.select().from(revisions).where(and(eq(revisions.formulationId, f!.id), eq(revisions.state, "released")));
  hc3 = { formulationId: f!.id, releasedId: rel!.id, input: rel!.input };
  const [m] = await t.db.select().from(formulations).where(and(eq(formulations.teamId, teamId), eq(formulations.name, "Silica–PDMS monolith M-1")));
  monolithId = m!.id;
  const [mr] = await t.db.select().from(revisions).where(eq(revisions.formulationId, monolithId));
  monolithRevisionId = mr!.id;
});

afterAll(async () => {
  const { pool } = await import("@/db");
  await pool.end();
  await t?.close();
});

async function auditOf(entityId: string) {
  return t.db.select().from(auditEvents).where(eq(auditEvents.entityId, entityId));
}

describe("saving, listing, reading and deleting explorations", () => {
  it("returns the saved exploration in the list and by id, with who saved it and the revision's number", async () => {
    const actor = { userId: users.formulator!, teamId };
    const { id } = await eq_.createExploration(actor, hc3.formulationId, body(hc3.releasedId));
    const list = await eq_.listExplorations(teamId, hc3.formulationId);
    const row = list.find((r) => r.id === id);
    expect(row).toBeDefined();
    expect(row!.name).toBe("Titania sweep");
    expect(row!.pointCount).toBe(5);
    expect(row!.grid.kind).toBe("sweep");
    expect(row!.search?.objective).toEqual({ goal: "closest", output: "refractiveIndex", value: 1.586 });
    expect(row!.candidates?.[0]?.figures.refractiveIndex).toBe(1.582);
    expect(typeof row!.createdByName).toBe("string");
    // Words from the output catalogue over the revision's input, and the name of what varied.
    expect(row!.outputWords.organicWeightFraction).toMatchObject({ unit: "wt%", percent: true });
    expect(row!.outputWords.refractiveIndex!.label).toMatch(/refractive index/i);
    const titania = hc3.input.components[hc3.input.components.length - 1]!.materialId;
    expect(row!.names[titania]).toBe(hc3.input.materials.find((m) => m.id === titania)!.name);
    expect(row!.createdBy).toBe(users.formulator);
    const got = await eq_.getExploration(teamId, id);
    expect(got?.formulationName).toBe("Visor hard coat HC-3");
    expect(got?.revisionState).toBe("released");
    expect(typeof got?.revisionNumber).toBe("number");
    const audit = await auditOf(id);
    expect(audit.map((a) => a.action)).toEqual(["exploration.saved"]);
    expect(audit[0]!.actorId).toBe(users.formulator);
    expect((audit[0]!.summary as { after: { name: string } }).after.name).toBe("Titania sweep");
  });

  it("narrows the list to one revision, and keeps a search-less exploration's search and candidates null", async () => {
    const actor = { userId: users.formulator!, teamId };
    const { id } = await eq_.createExploration(actor, monolithId, body(monolithRevisionId, { name: "Monolith map", search: undefined, candidates: undefined }));
    const mine = await eq_.listExplorations(teamId, monolithId, { revisionId: monolithRevisionId });
    expect(mine.map((r) => r.id)).toEqual([id]);
    expect(mine[0]!.search).toBeNull();
    expect(mine[0]!.candidates).toBeNull();
    expect(await eq_.listExplorations(teamId, monolithId, { revisionId: hc3.releasedId })).toEqual([]);
    // The monolith's revision is a draft: a role that sees released work only sees none of it.
    expect(await eq_.listExplorations(teamId, monolithId, { releasedOnly: true })).toEqual([]);
    expect(await eq_.getExploration(teamId, id, { releasedOnly: true })).toBeNull();
  });

  it("deletes an exploration, records who did, and then answers not found", async () => {
    const actor = { userId: users.admin!, teamId };
    const { id } = await eq_.createExploration(actor, hc3.formulationId, body(hc3.releasedId, { name: "To delete" }));
    await eq_.deleteExploration(actor, id);
    expect(await eq_.getExploration(teamId, id)).toBeNull();
    await expect(eq_.deleteExploration(actor, id)).rejects.toBeInstanceOf(NotFoundError);
    const audit = await auditOf(id);
    expect(audit.map((a) => a.action).sort()).toEqual(["exploration.deleted", "exploration.saved"]);
    expect(audit.find((a) => a.action === "exploration.deleted")!.actorId).toBe(users.admin);
  });

  it("never changes the revision it explores", async () => {
    const [before] = await t.db.select().from(revisions).where(eq(revisions.id, hc3.releasedId));
    await eq_.createExploration({ userId: users.formulator!, teamId }, hc3.formulationId, body(hc3.releasedId, { name: "Hands off" }));
    const [after] = await t.db.select().from(revisions).where(eq(revisions.id, hc3.releasedId));
    expect(after).toEqual(before);
  });
});

describe("the demo exploration", () => {
  it("is seeded once for the visor hard coat's released revision, its candidates meeting the search's limits", async () => {
    const { DEMO_EXPLORATION, seedExplorationDemo } = await import("@/db/seed-exploration");
    const rows = (await eq_.listExplorations(teamId, hc3.formulationId, { revisionId: hc3.releasedId })).filter((r) => r.name === DEMO_EXPLORATION.name);
    expect(rows).toHaveLength(1);
    const demo = rows[0]!;
    expect(demo.pointCount).toBe(11 * 5);
    expect(demo.candidates!.length).toBeGreaterThan(0);
    for (const c of demo.candidates!) {
      expect(c.thermalStatus).toBe("clear");
      expect(c.figures.organicContent).toBeGreaterThanOrEqual(0.5);
      // Clear means below the highest allowed step temperature: the cure (second value) at 90–110 °C.
      expect(c.values[1]).toBeLessThanOrEqual(110);
    }
    // Best first: the first candidate's index is the closest of them to the polycarbonate's 1.586.
    const distances = demo.candidates!.map((c) => Math.abs(c.figures.refractiveIndex! - 1.586));
    expect(distances[0]).toBe(Math.min(...distances));
    expect(await seedExplorationDemo(t.db, teamId, users)).toBe(false);
  });
});

describe("edge cases", () => {
  it("refuses a revision of another formulation with a RuleError naming revisionId, and saves nothing", async () => {
    const actor = { userId: users.formulator!, teamId };
    const before = (await eq_.listExplorations(teamId, hc3.formulationId)).length;
    const err = await eq_.createExploration(actor, hc3.formulationId, body(monolithRevisionId)).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(RuleError);
    expect((err as RuleError).fields).toHaveProperty("revisionId");
    await expect(eq_.createExploration(actor, hc3.formulationId, body("no-such-revision"))).rejects.toBeInstanceOf(RuleError);
    expect((await eq_.listExplorations(teamId, hc3.formulationId)).length).toBe(before);
  });

  it("keeps explorations to their team: another team's ids are not found and its list is empty", async () => {
    const otherTeam = crypto.randomUUID();
    await t.db.insert(organization).values({ id: otherTeam, name: "Elsewhere Lab", slug: `elsewhere-${otherTeam.slice(0, 8)}`, createdAt: new Date() });
    const outsider = crypto.randomUUID();
    await t.db.insert(user).values({ id: outsider, name: "Olive Other", email: `${outsider}@elsewhere.example` });
    await t.db.insert(member).values({ id: crypto.randomUUID(), organizationId: otherTeam, userId: outsider, role: "admin", createdAt: new Date() });
    const { id } = await eq_.createExploration({ userId: users.formulator!, teamId }, hc3.formulationId, body(hc3.releasedId, { name: "Ours" }));
    const other = { userId: outsider, teamId: otherTeam };
    expect(await eq_.getExploration(otherTeam, id)).toBeNull();
    expect(await eq_.listExplorations(otherTeam, hc3.formulationId)).toEqual([]);
    await expect(eq_.deleteExploration(other, id)).rejects.toBeInstanceOf(NotFoundError);
    await expect(eq_.createExploration(other, hc3.formulationId, body(hc3.releasedId))).rejects.toBeInstanceOf(NotFoundError);
    expect(await eq_.getExploration(teamId, id)).not.toBeNull();
  });
});

describe("opening a candidate as a new draft", () => {
  it("starts a draft with the given input, computed by the full engine, and notes the exploration in the audit event", async () => {
    const author = { userId: users.formulator!, teamId };
    const { formulationId } = await fq.createFormulation(author, { name: "Candidate target", input: hc3.input });
    const [first] = await t.db.select().from(revisions).where(eq(revisions.formulationId, formulationId));
    await rq.transition(author, first!.id, "submit");
    await rq.transition({ userId: users.reviewer!, teamId }, first!.id, "approve", { comment: "Cure schedule checked." });
    const { id: explorationId } = await eq_.createExploration(author, formulationId, body(first!.id, { name: "Index search" }));
    // The candidate: the first component's weight fraction moved by 0.02 to the second's.
    const candidate = structuredClone(hc3.input);
    candidate.components[0]!.weightFraction = Number((Number(candidate.components[0]!.weightFraction) - 0.02).toFixed(4));
    candidate.components[1]!.weightFraction = Number((Number(candidate.components[1]!.weightFraction) + 0.02).toFixed(4));
    const { revisionId, number } = await rq.startRevision(author, formulationId, { input: candidate, fromExploration: { explorationId, point: 2 } });
    expect(number).toBe(2);
    const [draft] = await t.db.select().from(revisions).where(eq(revisions.id, revisionId));
    expect(draft!.state).toBe("draft");
    expect(draft!.input.components[0]!.weightFraction).toBe(candidate.components[0]!.weightFraction);
    expect(draft!.computeError).toBeNull();
    expect(draft!.result).not.toBeNull();
    expect(draft!.result).toEqual(JSON.parse(JSON.stringify(fq.evaluate(candidate).result)));
    const [event] = await auditOf(revisionId);
    expect(event!.action).toBe("revision.started");
    expect(event!.summary?.note).toBe("from the exploration “Index search”, point 3");
    expect(event!.summary?.after).toMatchObject({ revision: 2, fromExploration: { explorationId, point: 2 } });
  });

  it("refuses an exploration of another formulation naming fromExploration.explorationId, and starts nothing", async () => {
    const author = { userId: users.formulator!, teamId };
    const { formulationId } = await fq.createFormulation(author, { name: "Candidate elsewhere", input: hc3.input });
    const [first] = await t.db.select().from(revisions).where(eq(revisions.formulationId, formulationId));
    await rq.transition(author, first!.id, "submit");
    await rq.transition({ userId: users.reviewer!, teamId }, first!.id, "approve", { comment: "Cure schedule checked." });
    const { id: foreign } = await eq_.createExploration(author, hc3.formulationId, body(hc3.releasedId, { name: "Foreign" }));
    const err = await rq.startRevision(author, formulationId, { input: hc3.input, fromExploration: { explorationId: foreign, point: 0 } }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(RuleError);
    expect((err as RuleError).fields).toHaveProperty(["fromExploration.explorationId"]);
    expect(await t.db.select().from(revisions).where(eq(revisions.formulationId, formulationId))).toHaveLength(1);
  });

  it("gives one new draft and one 409-style conflict to two requests at the same moment, every round", async () => {
    const author = { userId: users.formulator!, teamId };
    for (let round = 0; round < 4; round++) {
      const { formulationId } = await fq.createFormulation(author, { name: `Candidate race ${round}`, input: hc3.input });
      const [first] = await t.db.select().from(revisions).where(eq(revisions.formulationId, formulationId));
      await rq.transition(author, first!.id, "submit");
      await rq.transition({ userId: users.reviewer!, teamId }, first!.id, "approve", { comment: "Cure schedule checked." });
      const outcomes = await Promise.allSettled([
        rq.startRevision(author, formulationId, { input: hc3.input, fromExploration: { point: 1 } }),
        rq.startRevision(author, formulationId, { input: hc3.input, fromExploration: { point: 2 } }),
      ]);
      expect(outcomes.filter((o) => o.status === "fulfilled")).toHaveLength(1);
      const refused = outcomes.find((o) => o.status === "rejected") as PromiseRejectedResult;
      expect(refused.reason).toBeInstanceOf(ConflictError);
      expect(String(refused.reason.message)).toMatch(/still a draft/);
      expect(await t.db.select().from(revisions).where(eq(revisions.formulationId, formulationId))).toHaveLength(2);
    }
  });
});
