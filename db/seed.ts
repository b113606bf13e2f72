/**
 * Idempotent demo data: the Larkspur team, one account per role, its materials
 * library and formulations in each state. Running it again changes nothing.
 */
import { hashPassword } from "better-auth/crypto";
import { and, eq } from "drizzle-orm";
import { computeFormulation, ENGINE_VERSION, type FormulationInput, type Material } from "@/lib/formulation";
import { createDb, type Db } from "./client";
import { DEMO_FORMULATIONS, DEMO_PASSWORD, DEMO_PRICE_SOURCE, DEMO_PRICES, DEMO_TEAM, DEMO_USERS, demoMaterialRefs, type DemoInput } from "./demo";
import { copyReferenceMaterials } from "./queries/library";
import { seedExplorationDemo } from "./seed-exploration";
import { seedQualityDemo } from "./seed-quality";
import { account, auditEvents, formulations, materials, member, organization, reviews, revisions, user } from "./schema";

export interface SeedSummary {
  teamId: string;
  users: Record<string, string>;
  created: { users: number; formulations: number; qualityBatches: number };
}

async function ensureUser(db: Db, email: string, name: string): Promise<{ id: string; created: boolean }> {
  const [found] = await db.select({ id: user.id }).from(user).where(eq(user.email, email)).limit(1);
  if (found) return { id: found.id, created: false };
  const id = crypto.randomUUID();
  await db.transaction(async (tx) => {
    await tx.insert(user).values({ id, email, name, emailVerified: true });
    await tx.insert(account).values({
      id: crypto.randomUUID(),
      accountId: id,
      providerId: "credential",
      userId: id,
      password: await hashPassword(DEMO_PASSWORD),
    });
  });
  return { id, created: true };
}

async function ensureTeam(db: Db): Promise<string> {
  const [found] = await db.select({ id: organization.id }).from(organization).where(eq(organization.slug, DEMO_TEAM.slug)).limit(1);
  if (found) return found.id;
  const id = crypto.randomUUID();
  await db.insert(organization).values({ id, name: DEMO_TEAM.name, slug: DEMO_TEAM.slug, createdAt: new Date() });
  return id;
}

/** Maps a demo input's reference ids to the team's materials and inlines them. */
function materialise(input: DemoInput, library: Map<string, Material>): FormulationInput {
  const refs = demoMaterialRefs(input);
  const id = (ref: string) => {
    const m = library.get(ref);
    if (!m) throw new Error(`Demo data refers to "${ref}", which is not in data/materials.ts`);
    return m.id;
  };
  return {
    ...input,
    materials: refs.map((r) => library.get(r)!).filter(Boolean),
    components: input.components.map((c) => ({ ...c, materialId: id(c.materialId) })),
    modifiers: input.modifiers?.map((m) => ({ ...m, materialId: id(m.materialId), precursorId: id(m.precursorId) })),
    water: {
      ...input.water,
      materialId: id(input.water.materialId),
      ...(input.water.referenceId ? { referenceId: id(input.water.referenceId) } : {}),
    },
    solvent: input.solvent ? { ...input.solvent, materialId: id(input.solvent.materialId) } : undefined,
    catalyst: input.catalyst ? { ...input.catalyst, materialId: id(input.catalyst.materialId) } : undefined,
    substrateId: input.substrateId ? id(input.substrateId) : undefined,
  } as FormulationInput;
}

/** Puts the invented demo prices on the team's copies of those materials that have no price yet. */
async function setDemoPrices(db: Db, teamId: string): Promise<void> {
  const rows = await db.select().from(materials).where(eq(materials.teamId, teamId));
  for (const row of rows) {
    const price = row.referenceId ? DEMO_PRICES[row.referenceId] : undefined;
    if (price === undefined || row.data.pricePerKg !== undefined) continue;
    await db
      .update(materials)
      .set({ data: { ...row.data, pricePerKg: price, sources: { ...row.data.sources, pricePerKg: DEMO_PRICE_SOURCE } } })
      .where(eq(materials.id, row.id));
  }
}

export async function seedDemo(db: Db): Promise<SeedSummary> {
  const teamId = await ensureTeam(db);
  const users: Record<string, string> = {};
  let createdUsers = 0;
  for (const u of DEMO_USERS) {
    const { id, created } = await ensureUser(db, u.email, u.name);
    users[u.role] = id;
    if (created) createdUsers++;
    const [m] = await db
      .select({ id: member.id })
      .from(member)
      .where(and(eq(member.organizationId, teamId), eq(member.userId, id)))
      .limit(1);
    if (!m) await db.insert(member).values({ id: crypto.randomUUID(), organizationId: teamId, userId: id, role: u.role, createdAt: new Date() });
  }

  await copyReferenceMaterials(db, teamId, users.admin ?? null);
  await setDemoPrices(db, teamId);
  const rows = await db.select().from(materials).where(eq(materials.teamId, teamId));
  const library = new Map<string, Material>();
  for (const r of rows) if (r.referenceId) library.set(r.referenceId, { ...r.data, id: r.id });

  let createdFormulations = 0;
  for (const demo of DEMO_FORMULATIONS) {
    const [exists] = await db
      .select({ id: formulations.id })
      .from(formulations)
      .where(and(eq(formulations.teamId, teamId), eq(formulations.name, demo.name)))
      .limit(1);
    if (exists) continue;
    createdFormulations++;
    const formulationId = crypto.randomUUID();
    const last = demo.revisions[demo.revisions.length - 1]!;
    await db.transaction(async (tx) => {
      await tx.insert(formulations).values({
        id: formulationId,
        teamId,
        name: demo.name,
        project: demo.project,
        description: demo.description,
        latestState: last.state,
        latestRevision: demo.revisions.length,
        createdBy: users.formulator,
      });
      await tx.insert(auditEvents).values({
        teamId,
        actorId: users.formulator,
        action: "formulation.created",
        entityType: "formulation",
        entityId: formulationId,
        summary: { after: { name: demo.name }, note: "demo data" },
      });
      let number = 0;
      for (const rev of demo.revisions) {
        number++;
        const input = materialise(rev.input, library);
        const result = computeFormulation(input);
        const revisionId = crypto.randomUUID();
        const reviewed = ["approved", "released", "archived"].includes(rev.state);
        const now = new Date();
        await tx.insert(revisions).values({
          id: revisionId,
          teamId,
          formulationId,
          number,
          state: rev.state,
          input,
          result,
          engineVersion: ENGINE_VERSION,
          authorId: users.formulator,
          submittedAt: rev.state === "draft" ? null : now,
          approvedAt: reviewed ? now : null,
          approvedBy: reviewed ? users.reviewer : null,
          releasedAt: rev.state === "released" || rev.state === "archived" ? now : null,
        });
        if (reviewed) {
          await tx.insert(reviews).values({
            teamId,
            revisionId,
            reviewerId: users.reviewer,
            decision: "approved",
            comment: rev.comment ?? (result.thermal.status === "caution" ? "Thermal caution accepted for the demo." : null),
          });
        }
        await tx.insert(auditEvents).values({
          teamId,
          actorId: users.formulator,
          action: "revision.seeded",
          entityType: "revision",
          entityId: revisionId,
          summary: { after: { revision: number, state: rev.state }, note: "demo data" },
        });
      }
    });
  }
  const quality = await seedQualityDemo(db, teamId, users);
  await seedExplorationDemo(db, teamId, users);
  return { teamId, users, created: { users: createdUsers, formulations: createdFormulations, qualityBatches: quality.batches } };
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const { db, pool } = createDb(undefined, 2);
  seedDemo(db)
    .then((s) => {
      console.log(
        `[gelwright] demo data ready: ${DEMO_TEAM.name}, ${DEMO_USERS.length} accounts (${s.created.users} new), ${DEMO_FORMULATIONS.length} formulations (${s.created.formulations} new)`,
      );
    })
    .catch((err: unknown) => {
      console.error("[gelwright] seeding failed:", err instanceof Error ? err.message : err);
      process.exitCode = 1;
    })
    .finally(() => pool.end());
}
