/**
 * Chart data of a formulation against a real MariaDB with the demo seed: the
 * visor hard coat's results per specification in time order, the I-MR chart
 * with the shift flagged, Cpk from 25 results, weighing deviations per line,
 * and production's released-only view.
 */
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_QUALITY } from "@/db/demo";
import { seedDemo } from "@/db/seed";
import { batchRecords, formulations, revisions } from "@/db/schema";
import { D2 } from "@/lib/quality/control-chart";
import { createTestDatabase, type TestDatabase } from "../helpers/db";

let t: TestDatabase;
let q: typeof import("@/db/queries/charts");
let teamId: string;
let hc3: string;
let draftOnly: string;

beforeAll(async () => {
  t = await createTestDatabase("charts");
  process.env.DATABASE_URL = t.url;
  delete (globalThis as { gelwrightDb?: unknown }).gelwrightDb;
  q = await import("@/db/queries/charts");
  const seeded = await seedDemo(t.db);
  teamId = seeded.teamId;
  const [f] = await t.db.select({ id: formulations.id }).from(formulations).where(and(eq(formulations.teamId, teamId), eq(formulations.name, DEMO_QUALITY.formulation)));
  hc3 = f!.id;
  const [m] = await t.db.select({ id: formulations.id }).from(formulations).where(eq(formulations.name, "Silica–PDMS monolith M-1"));
  draftOnly = m!.id;
});

afterAll(async () => {
  const { pool } = await import("@/db");
  await pool.end();
  await t?.close();
});

describe("formulation charts", () => {
  it("gives one chart per numeric specification, results in batch order, limits from the data, the shift flagged", async () => {
    const charts = (await q.formulationCharts(teamId, hc3))!;
    expect(charts.formulationName).toBe(DEMO_QUALITY.formulation);
    // Appearance is not numeric: no chart.
    expect(charts.specifications.map((s) => s.property).sort()).toEqual(["Solids content", "Viscosity"]);
    const solids = charts.specifications.find((s) => s.property === "Solids content")!;
    expect(solids.samples.length).toBe(DEMO_QUALITY.batches);
    const times = solids.samples.map((s) => s.at);
    expect([...times].sort()).toEqual(times);
    const c = solids.chart!;
    // x̄ and σ = MR̄/d2 recomputed here from the samples (NIST/SEMATECH 6.3.2).
    const values = solids.samples.map((s) => s.value);
    const mean = values.reduce((a, b) => a + b, 0) / values.length;
    const mr = values.slice(1).reduce((a, v, i) => a + Math.abs(v - values[i]!), 0) / (values.length - 1);
    expect(c.mean).toBeCloseTo(mean, 10);
    expect(c.upperControlLimit).toBeCloseTo(mean + (3 * mr) / D2, 10);
    // Limits from the data, not the specification (19–21 % w/w).
    expect(c.upperControlLimit).not.toBe(solids.upper);
    expect(c.points.some((p) => p.rules.includes("eight-on-one-side"))).toBe(true);
    expect(solids.capability?.count).toBe(DEMO_QUALITY.batches);
    expect(solids.capability?.caution).toMatch(/stable process/);

    const viscosity = charts.specifications.find((s) => s.property === "Viscosity")!;
    expect(viscosity.samples.filter((s) => s.outOfSpec).length).toBe(1);
    expect(viscosity.samples.find((s) => s.outOfSpec)!.disposition).toBe("released_under_deviation");
  });

  it("charts the weighing deviation (actual − target)/target in % per material line", async () => {
    const charts = (await q.formulationCharts(teamId, hc3))!;
    expect(charts.weighing.length).toBeGreaterThan(3);
    const [batch] = await t.db.select().from(batchRecords).where(eq(batchRecords.teamId, teamId)).orderBy(batchRecords.createdAt).limit(1);
    const line = batch!.lines[0]!;
    const series = charts.weighing.find((w) => w.materialId === line.materialId)!;
    const first = series.samples.find((s) => s.batchId === batch!.id)!;
    expect(first.value).toBeCloseTo(((line.actualGrams! - line.targetGrams!) / line.targetGrams!) * 100, 10);
    // Generated within ±0.9 % (db/seed-quality.ts).
    expect(series.samples.every((s) => Math.abs(s.value) <= 0.91)).toBe(true);
    expect(q.weighingDeviationPercent(50, 50.5)).toBeCloseTo(1, 12);
    expect(q.weighingDeviationPercent(0, 1)).toBeNull();
  });

  it("hides a formulation without a released revision from production, and another team's", async () => {
    expect(await q.formulationCharts(teamId, draftOnly, { releasedOnly: true })).toBeNull();
    const own = await q.formulationCharts(teamId, draftOnly);
    expect(own?.specifications).toEqual([]);
    expect(await q.formulationCharts(crypto.randomUUID(), hc3)).toBeNull();
    const released = (await q.formulationCharts(teamId, hc3, { releasedOnly: true }))!;
    const [rel] = await t.db.select({ n: revisions.number }).from(revisions).where(and(eq(revisions.formulationId, hc3), eq(revisions.state, "released")));
    expect(released.specifications[0]!.samples.every((s) => s.revisionNumber === rel!.n)).toBe(true);
  });
});
