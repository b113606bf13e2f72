/**
 * Data of a formulation's control charts: for each numeric specification, the
 * batch results in time order with the I-MR chart and Cpk; for each material
 * line, the weighing deviation of every weighed batch.
 *
 * A specification is followed across revisions by its property and unit
 * (compared trimmed and case-blind): a new revision copies the specification
 * with a new id, and the process is the same one. The specification limits
 * drawn are those of the newest revision that carries the property.
 */
import Decimal from "decimal.js";
import { and, asc, eq, inArray } from "drizzle-orm";
import { db } from "@/db";
import { batchDispositions, batchRecords, batchResults, formulations, revisions } from "@/db/schema";
import { capability, individualsChart, type Capability, type IMRChart } from "@/lib/quality/control-chart";
import type { Specification } from "@/lib/quality/specification";

export interface ChartSample {
  batchId: string;
  revisionNumber: number;
  /** When the batch started (ISO 8601). */
  at: string;
  value: number;
  outOfSpec: boolean;
  disposition: string | null;
}

export interface SpecificationChart {
  /** Key: property and unit, lower case. */
  key: string;
  property: string;
  unit: string;
  method: string;
  target: number | null;
  lower: number | null;
  upper: number | null;
  samples: ChartSample[];
  chart: IMRChart | null;
  capability: Capability | null;
}

export interface DeviationChart {
  /** Material id of the line. */
  materialId: string;
  name: string;
  samples: (ChartSample & { targetGrams: number; actualGrams: number })[];
  /** I-MR chart of the deviations (%). */
  chart: IMRChart | null;
}

function specKey(s: Pick<Specification, "property" | "unit">): string {
  return `${s.property.trim().toLowerCase()}|${s.unit.trim().toLowerCase()}`;
}

/** (actual − target)/target in %, computed with decimal.js; null without a positive target. */
export function weighingDeviationPercent(targetGrams: number, actualGrams: number): number | null {
  if (!(targetGrams > 0) || !Number.isFinite(actualGrams)) return null;
  return new Decimal(actualGrams).minus(targetGrams).div(targetGrams).times(100).toNumber();
}

/**
 * Chart data of a formulation of the team; null when it does not exist (or,
 * with `releasedOnly`, has no released revision — production's view).
 */
export async function formulationCharts(teamId: string, formulationId: string, opts: { releasedOnly?: boolean } = {}) {
  const [f] = await db
    .select({ id: formulations.id, name: formulations.name })
    .from(formulations)
    .where(and(eq(formulations.teamId, teamId), eq(formulations.id, formulationId)))
    .limit(1);
  if (!f) return null;
  const revs = await db
    .select({ id: revisions.id, number: revisions.number, state: revisions.state, specifications: revisions.specifications })
    .from(revisions)
    .where(and(eq(revisions.teamId, teamId), eq(revisions.formulationId, formulationId)))
    .orderBy(asc(revisions.number));
  const visible = opts.releasedOnly ? revs.filter((r) => r.state === "released") : revs;
  if (opts.releasedOnly && visible.length === 0) return null;

  // Specifications by key, newest revision's limits winning; spec id → key.
  const specs = new Map<string, SpecificationChart>();
  const keyOfSpec = new Map<string, string>();
  for (const rev of visible) {
    for (const s of rev.specifications ?? []) {
      if (!s.numeric) continue;
      const key = specKey(s);
      keyOfSpec.set(s.id, key);
      const prev = specs.get(key);
      specs.set(key, {
        key,
        property: s.property,
        unit: s.unit,
        method: s.method,
        target: s.target,
        lower: s.lower,
        upper: s.upper,
        samples: prev?.samples ?? [],
        chart: null,
        capability: null,
      });
    }
  }

  const revIds = visible.map((r) => r.id);
  const numberOf = new Map(visible.map((r) => [r.id, r.number]));
  const batches = revIds.length
    ? await db
        .select({
          id: batchRecords.id,
          revisionId: batchRecords.revisionId,
          lines: batchRecords.lines,
          createdAt: batchRecords.createdAt,
          disposition: batchDispositions.disposition,
        })
        .from(batchRecords)
        .leftJoin(batchDispositions, eq(batchDispositions.batchId, batchRecords.id))
        .where(and(eq(batchRecords.teamId, teamId), inArray(batchRecords.revisionId, revIds)))
        .orderBy(asc(batchRecords.createdAt), asc(batchRecords.id))
    : [];
  const batchById = new Map(batches.map((b) => [b.id, b]));

  const results = batches.length
    ? await db
        .select({
          batchId: batchResults.batchId,
          specId: batchResults.specId,
          valueNumber: batchResults.valueNumber,
          outOfSpec: batchResults.outOfSpec,
          enteredAt: batchResults.enteredAt,
        })
        .from(batchResults)
        .where(and(eq(batchResults.teamId, teamId), inArray(batchResults.batchId, batches.map((b) => b.id))))
        .orderBy(asc(batchResults.enteredAt))
    : [];
  for (const r of results) {
    const key = keyOfSpec.get(r.specId);
    const b = batchById.get(r.batchId);
    if (!key || !b || r.valueNumber === null || !Number.isFinite(r.valueNumber)) continue;
    specs.get(key)!.samples.push({
      batchId: b.id,
      revisionNumber: numberOf.get(b.revisionId) ?? 0,
      at: b.createdAt.toISOString(),
      value: r.valueNumber,
      outOfSpec: r.outOfSpec,
      disposition: b.disposition ?? null,
    });
  }
  const order = new Map(batches.map((b, i) => [b.id, i]));
  const specifications = [...specs.values()].map((s) => {
    s.samples.sort((a, b) => (order.get(a.batchId) ?? 0) - (order.get(b.batchId) ?? 0));
    s.chart = individualsChart(s.samples.map((x) => x.value));
    s.capability = s.chart ? capability(s.chart, s.lower, s.upper) : null;
    return s;
  });

  const deviations = new Map<string, DeviationChart>();
  for (const b of batches) {
    for (const line of b.lines) {
      if (line.actualGrams === null || line.targetGrams === undefined) continue;
      const value = weighingDeviationPercent(line.targetGrams, line.actualGrams);
      if (value === null) continue;
      const d = deviations.get(line.materialId) ?? { materialId: line.materialId, name: line.name ?? line.materialId, samples: [], chart: null };
      d.samples.push({
        batchId: b.id,
        revisionNumber: numberOf.get(b.revisionId) ?? 0,
        at: b.createdAt.toISOString(),
        value,
        outOfSpec: false,
        disposition: b.disposition ?? null,
        targetGrams: line.targetGrams,
        actualGrams: line.actualGrams,
      });
      deviations.set(line.materialId, d);
    }
  }
  const weighing = [...deviations.values()].map((d) => ({ ...d, chart: individualsChart(d.samples.map((x) => x.value)) }));

  return { formulationId: f.id, formulationName: f.name, specifications, weighing };
}

export type FormulationCharts = NonNullable<Awaited<ReturnType<typeof formulationCharts>>>;
