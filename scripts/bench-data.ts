/** Adds N formulations (default 10,000) with one revision each to the demo team, for list benchmarks. */
import { eq, sql } from "drizzle-orm";
import { createDb } from "../db/client";
import { DEMO_TEAM } from "../db/demo";
import { formulations, organization, revisions } from "../db/schema";

async function main() {
  const n = Number(process.argv[2] ?? 10_000);
  const { db, pool } = createDb(undefined, 2);
  try {
    const [team] = await db.select().from(organization).where(eq(organization.slug, DEMO_TEAM.slug));
    if (!team) throw new Error("seed the demo team first");
    const [have] = await db.select({ n: sql<number>`count(*)` }).from(formulations).where(eq(formulations.teamId, team.id));
    const [template] = await db.select().from(revisions).where(eq(revisions.teamId, team.id)).limit(1);
    if (!template) throw new Error("no revision to copy");
    const missing = n - Number(have?.n ?? 0);
    const states = ["draft", "in_review", "approved", "released", "archived"] as const;
    for (let done = 0; done < missing; done += 500) {
      const batch = Math.min(500, missing - done);
      const fs = Array.from({ length: batch }, (_, i) => ({
        id: crypto.randomUUID(),
        teamId: team.id,
        name: `Bench formulation ${String(done + i).padStart(6, "0")}-${Math.random().toString(36).slice(2, 6)}`,
        project: `Bench project ${(done + i) % 20}`,
        latestState: states[(done + i) % states.length]!,
      }));
      await db.insert(formulations).values(fs);
      await db.insert(revisions).values(
        fs.map((f) => ({
          teamId: team.id,
          formulationId: f.id,
          number: 1,
          state: f.latestState,
          input: template.input,
          result: template.result,
          engineVersion: template.engineVersion,
        })),
      );
    }
    console.log(`[bench] ${Math.max(missing, 0)} formulations added (team has ${n} or more)`);
  } finally {
    await pool.end();
  }
}

main().catch((err: unknown) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
