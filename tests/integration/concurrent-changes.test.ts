/**
 * State changes that two people can make at the same moment, fired together
 * (Promise.all) against a real MariaDB, several rounds each: two releases of
 * one formulation, two admins demoting or removing each other, two creates of
 * one name. Plus the rules that rest on who changed what: co-authors never
 * approve, and batch notes and initials are kept in the audit trail.
 */
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ConflictError } from "@/lib/errors";
import { seedDemo } from "@/db/seed";
import { auditEvents, member, organization, revisions, user } from "@/db/schema";
import type { FormulationInput, Material } from "@/lib/formulation";
import { createTestDatabase, type TestDatabase } from "../helpers/db";

const ROUNDS = 6;
/** The demo recipe needs thermal caution: an approval carries a comment. */
const OK = { comment: "Cure schedule checked." };

let t: TestDatabase;
let fq: typeof import("@/db/queries/formulations");
let rq: typeof import("@/db/queries/revisions");
let mq: typeof import("@/db/queries/members");
let matq: typeof import("@/db/queries/materials");
let bq: typeof import("@/db/queries/batches");
let tsq: typeof import("@/db/queries/team-settings");
let teamId: string;
let users: Record<string, string>;
let input: FormulationInput;

beforeAll(async () => {
  t = await createTestDatabase("concurrent");
  process.env.DATABASE_URL = t.url;
  delete (globalThis as { gelwrightDb?: unknown }).gelwrightDb;
  fq = await import("@/db/queries/formulations");
  rq = await import("@/db/queries/revisions");
  mq = await import("@/db/queries/members");
  matq = await import("@/db/queries/materials");
  bq = await import("@/db/queries/batches");
  tsq = await import("@/db/queries/team-settings");
  const seeded = await seedDemo(t.db);
  teamId = seeded.teamId;
  users = seeded.users as Record<string, string>;
  const [released] = await t.db.select().from(revisions).where(and(eq(revisions.teamId, teamId), eq(revisions.state, "released")));
  input = released!.input;
});

afterAll(async () => {
  const { pool } = await import("@/db");
  await pool.end();
  await t?.close();
});

/** A new user in the demo team with `role`; returns the user's and the membership's ids. */
async function addMember(role: string, team = teamId): Promise<{ userId: string; memberId: string }> {
  const userId = crypto.randomUUID();
  const memberId = crypto.randomUUID();
  await t.db.insert(user).values({ id: userId, name: `Member ${userId.slice(0, 6)}`, email: `${userId}@concurrent.example` });
  await t.db.insert(member).values({ id: memberId, organizationId: team, userId, role, createdAt: new Date() });
  return { userId, memberId };
}

/** A formulation with two approved revisions (1 and 2), written by the formulator, approved by the reviewer. */
async function twoApprovedRevisions(name: string): Promise<{ formulationId: string; ids: [string, string] }> {
  const author = { userId: users.formulator!, teamId };
  const reviewer = { userId: users.reviewer!, teamId };
  const { formulationId, revisionId: first } = await fq.createFormulation(author, { name, input });
  await rq.transition(author, first, "submit");
  await rq.transition(reviewer, first, "approve", OK);
  const { revisionId: second } = await rq.startRevision(author, formulationId);
  await rq.transition(author, second, "submit");
  await rq.transition(reviewer, second, "approve", OK);
  return { formulationId, ids: [first, second] };
}

describe("two releases of one formulation at the same moment", () => {
  it("returns exactly one released revision, every round", async () => {
    const reviewer = { userId: users.reviewer!, teamId };
    for (let round = 0; round < ROUNDS; round++) {
      const { formulationId, ids } = await twoApprovedRevisions(`Release race ${round}`);
      const outcomes = await Promise.allSettled(ids.map((id) => rq.transition(reviewer, id, "release")));
      for (const o of outcomes) if (o.status === "rejected") throw o.reason;
      const states = await t.db
        .select({ number: revisions.number, state: revisions.state })
        .from(revisions)
        .where(eq(revisions.formulationId, formulationId));
      expect(states.filter((s) => s.state === "released"), `round ${round}`).toHaveLength(1);
      expect(states.filter((s) => s.state === "archived"), `round ${round}`).toHaveLength(1);
    }
  });
});

describe("two admins demoting or removing each other at the same moment", () => {
  async function adminsOf(team: string): Promise<number> {
    const rows = await t.db.select({ id: member.id }).from(member).where(and(eq(member.organizationId, team), eq(member.role, "admin")));
    return rows.length;
  }

  /** A team of its own with exactly two admins. */
  async function teamWithTwoAdmins(round: number) {
    const id = crypto.randomUUID();
    await t.db.insert(organization).values({ id, name: `Race team ${round}`, slug: `race-team-${id.slice(0, 8)}`, createdAt: new Date() });
    return { team: id, a: await addMember("admin", id), b: await addMember("admin", id) };
  }

  it("leaves at least one admin when each demotes the other, every round; one of the two gets 409", async () => {
    for (let round = 0; round < ROUNDS; round++) {
      const { team, a, b } = await teamWithTwoAdmins(round);
      const outcomes = await Promise.allSettled([
        mq.changeRole(team, a.userId, b.memberId, "formulator"),
        mq.changeRole(team, b.userId, a.memberId, "formulator"),
      ]);
      expect(await adminsOf(team), `round ${round}`).toBe(1);
      const refused = outcomes.filter((o) => o.status === "rejected");
      expect(refused, `round ${round}`).toHaveLength(1);
      expect((refused[0] as PromiseRejectedResult).reason).toBeInstanceOf(ConflictError);
    }
  });

  it("leaves at least one admin when each removes the other, every round", async () => {
    for (let round = 0; round < ROUNDS; round++) {
      const { team, a, b } = await teamWithTwoAdmins(100 + round);
      const outcomes = await Promise.allSettled([mq.removeMember(team, a.userId, b.memberId), mq.removeMember(team, b.userId, a.memberId)]);
      expect(await adminsOf(team), `round ${round}`).toBe(1);
      expect(outcomes.filter((o) => o.status === "rejected"), `round ${round}`).toHaveLength(1);
    }
  });

  it("leaves at least one admin when one demotes while the other removes, every round", async () => {
    for (let round = 0; round < ROUNDS; round++) {
      const { team, a, b } = await teamWithTwoAdmins(200 + round);
      await Promise.allSettled([mq.changeRole(team, a.userId, b.memberId, "reviewer"), mq.removeMember(team, b.userId, a.memberId)]);
      expect(await adminsOf(team), `round ${round}`).toBe(1);
    }
  });
});

describe("two creates of one name at the same moment", () => {
  const material = (name: string): Material => ({ id: "", name, kind: "solvent", formula: "C3H8O", molarMass: 60.096, density: 0.786 });

  it("returns one material and a 409 naming material.name for the other, every round", async () => {
    for (let round = 0; round < ROUNDS; round++) {
      const name = `Isopropanol race ${round}`;
      const outcomes = await Promise.allSettled([
        matq.createMaterial(teamId, users.admin!, material(name)),
        matq.createMaterial(teamId, users.formulator!, material(name)),
      ]);
      const refused = outcomes.filter((o) => o.status === "rejected") as PromiseRejectedResult[];
      expect(refused, `round ${round}`).toHaveLength(1);
      expect(refused[0]!.reason).toBeInstanceOf(ConflictError);
      expect(refused[0]!.reason).toMatchObject({ code: "duplicate", fields: { "material.name": expect.stringContaining(name) } });
    }
  });

  it("returns one formulation and a 409 naming name for the other, every round", async () => {
    for (let round = 0; round < ROUNDS; round++) {
      const name = `Formulation race ${round}`;
      const outcomes = await Promise.allSettled([
        fq.createFormulation({ userId: users.formulator!, teamId }, { name, input }),
        fq.createFormulation({ userId: users.admin!, teamId }, { name, input }),
      ]);
      const refused = outcomes.filter((o) => o.status === "rejected") as PromiseRejectedResult[];
      expect(refused, `round ${round}`).toHaveLength(1);
      expect(refused[0]!.reason).toBeInstanceOf(ConflictError);
      expect(refused[0]!.reason).toMatchObject({ code: "duplicate", fields: { name: expect.stringContaining(name) } });
    }
  });

  it("returns 409 when a material is renamed to a name the library has", async () => {
    const a = await matq.createMaterial(teamId, users.admin!, material("Rename race A"));
    await matq.createMaterial(teamId, users.admin!, material("Rename race B"));
    await expect(matq.updateMaterial(teamId, users.admin!, a.id, material("Rename race B"))).rejects.toBeInstanceOf(ConflictError);
  });
});

describe("a second person approves", () => {
  it("refuses approval by someone who saved and submitted the revision and was then made reviewer", async () => {
    const creator = { userId: users.formulator!, teamId };
    const editor = await addMember("formulator");
    const asEditor = { userId: editor.userId, teamId };
    const { revisionId } = await fq.createFormulation(creator, { name: "Co-author approval", input });
    const saved = await rq.saveDraft(asEditor, revisionId, { input, version: 1 });
    expect(saved.version).toBe(2);
    await rq.transition(asEditor, revisionId, "submit");
    await mq.changeRole(teamId, users.admin!, editor.memberId, "reviewer");
    await expect(rq.transition(asEditor, revisionId, "approve", OK)).rejects.toMatchObject({ name: "WorkflowError", code: "own_revision" });
    await expect(rq.transition(creator, revisionId, "approve", OK)).rejects.toMatchObject({ code: "own_revision" });
    const done = await rq.transition({ userId: users.reviewer!, teamId }, revisionId, "approve", OK);
    expect(done.to).toBe("approved");
  });

  it("never lets the submitter approve, also when submit and approve are sent at the same moment, every round", async () => {
    const creator = { userId: users.formulator!, teamId };
    const submitter = { userId: (await addMember("reviewer")).userId, teamId };
    for (let round = 0; round < ROUNDS; round++) {
      const { revisionId } = await fq.createFormulation(creator, { name: `Submit and approve race ${round}`, input });
      const [submit, approve] = await Promise.allSettled([
        rq.transition(submitter, revisionId, "submit"),
        rq.transition(submitter, revisionId, "approve", OK),
      ]);
      expect(submit.status, `round ${round}`).toBe("fulfilled");
      expect(approve.status, `round ${round}`).toBe("rejected");
      const [rev] = await t.db.select({ state: revisions.state }).from(revisions).where(eq(revisions.id, revisionId));
      expect(rev!.state).toBe("in_review");
    }
  });

  it("refuses approval by someone who only submitted it", async () => {
    const creator = { userId: users.formulator!, teamId };
    const submitter = await addMember("formulator");
    const { revisionId } = await fq.createFormulation(creator, { name: "Submitter approval", input });
    await rq.transition({ userId: submitter.userId, teamId }, revisionId, "submit");
    await expect(rq.transition({ userId: submitter.userId, teamId }, revisionId, "approve", OK)).rejects.toMatchObject({ code: "own_revision" });
  });
});

describe("batch notes and weighing initials", () => {
  it("returns an audit event with the notes and the initials before and after each change", async () => {
    const production = { userId: users.production!, teamId };
    const [released] = await t.db.select({ id: revisions.id }).from(revisions).where(and(eq(revisions.teamId, teamId), eq(revisions.state, "released")));
    const batch = await bq.startBatch(production, released!.id, { notes: "First notes" });
    await bq.saveBatchNotes(production, batch.id, "Second notes");
    await bq.saveBatchNotes(production, batch.id, "Second notes");
    await bq.recordLine(production, batch.id, 0, { initials: "AB" });
    await bq.recordLine(production, batch.id, 0, { initials: "CD" });
    const events = await t.db
      .select({ action: auditEvents.action, summary: auditEvents.summary })
      .from(auditEvents)
      .where(eq(auditEvents.entityId, batch.id));
    const notes = events.filter((e) => e.action === "batch.notes_changed");
    expect(notes.map((e) => e.summary)).toEqual([{ before: { notes: "First notes" }, after: { notes: "Second notes" } }]);
    const lines = events.filter((e) => e.action === "batch.line_recorded").map((e) => e.summary as { before: { initials: unknown }; after: { initials: unknown } });
    // Two events may share a millisecond: compare them as a set.
    expect(lines.map((s) => [s.before.initials, s.after.initials]).sort()).toEqual([
      [null, "AB"],
      ["AB", "CD"],
    ]);
  });
});

describe("two admins setting the team's currency at the same moment", () => {
  it("returns one of the two codes, and audit events whose before/after chain without a gap, every round", async () => {
    const second = await addMember("admin");
    const first = { userId: users.admin!, teamId };
    const other = { userId: second.userId, teamId };
    const start = (await tsq.getTeamSettings(teamId)).currency;
    const since = new Date(Date.now() - 1000);
    let last = start;
    for (let round = 0; round < ROUNDS; round++) {
      const codes = round % 2 === 0 ? ["USD", "GBP"] : ["CHF", "JPY"];
      await Promise.all([tsq.saveTeamSettings(first, { currency: codes[0]! }), tsq.saveTeamSettings(other, { currency: codes[1]! })]);
      const now = (await tsq.getTeamSettings(teamId)).currency;
      expect(codes).toContain(now);
      last = now;
    }
    // Serialised on the team row: each event's "before" is the previous event's "after" (no lost update in the trail).
    const events = await t.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.teamId, teamId), eq(auditEvents.action, "team.currency_changed")));
    const ordered = events.filter((e) => e.createdAt >= since).sort((a, b) => a.createdAt.getTime() - b.createdAt.getTime());
    expect(ordered).toHaveLength(ROUNDS * 2);
    const chain = ordered.map((e) => e.summary as { before: { currency: string }; after: { currency: string } });
    // Two events may share a millisecond: check the chain as a multiset of links ending at the stored code.
    const befores = chain.map((c) => c.before.currency).sort();
    const afters = [start, ...chain.map((c) => c.after.currency)].sort();
    afters.splice(afters.indexOf(last), 1);
    expect(befores).toEqual(afters);
  });
});
