/**
 * Teams whose library was copied before engine v2 get the new reference
 * materials (acac, ethyl acetoacetate, methacrylic acid, colloidal silica,
 * ethyl silicate 40, 1-methoxy-2-propanol) from migration
 * 0003_add_reference_materials, and the amine curing agent of engine 2.1
 * from 0004_add_curing_agent, once; a team's own material of the same name
 * is kept. Expected values: data/materials.ts itself (identity).
 */
import { readFileSync } from "node:fs";
import { and, eq, inArray } from "drizzle-orm";
import mysql from "mysql2/promise";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { referenceMaterial } from "@/data/materials";
import { copyReferenceMaterials } from "@/db/queries/library";
import { materials, organization } from "@/db/schema";
import { materialSchema, type Material } from "@/lib/formulation";
import { createTestDatabase, type TestDatabase } from "../helpers/db";

const NEW_IDS = [
  "acac",
  "ethyl-acetoacetate",
  "methacrylic-acid",
  "colloidal-silica-30",
  "ethyl-silicate-40",
  "1-methoxy-2-propanol",
  "polyetheramine-230",
];
const statements = ["0003_add_reference_materials.sql", "0004_add_curing_agent.sql"].flatMap((file) =>
  readFileSync(new URL(`../../db/migrations/${file}`, import.meta.url), "utf8")
    .split("--> statement-breakpoint")
    .map((s) => s.trim())
    .filter(Boolean),
);

/** Properties added to the reference data with the coat predictions (engine 2.1). */
const COAT_FIELDS = ["refractiveIndex", "boilingPointC", "epoxyEquivalentWeight", "amineHydrogenEquivalentWeight", "pricePerKg"] as const;

/** A reference material as it was before engine 2.1 added the coat fields (and their sources). */
function beforeCoatFields(material: Material): Material {
  const out: Material = { ...material };
  for (const key of COAT_FIELDS) delete out[key];
  const sources = { ...material.sources };
  for (const key of [...COAT_FIELDS, "precursor.residueRefractiveIndex"]) delete sources[key];
  out.sources = sources;
  if (material.precursor) {
    const { residueRefractiveIndex: _dropped, ...precursor } = material.precursor;
    void _dropped;
    out.precursor = precursor;
  }
  return out;
}

let t: TestDatabase;
beforeAll(async () => {
  t = await createTestDatabase("refadd");
});
afterAll(async () => {
  await t?.close();
});

async function runMigrationAgain() {
  const c = await mysql.createConnection({ uri: t.url });
  try {
    for (const s of statements) await c.query(s);
  } finally {
    await c.end();
  }
}

async function oldTeam(slug: string): Promise<string> {
  const id = crypto.randomUUID();
  await t.db.insert(organization).values({ id, name: slug, slug, createdAt: new Date() });
  await copyReferenceMaterials(t.db, id, null);
  // The library as it was copied before the new reference materials existed.
  await t.db.delete(materials).where(and(eq(materials.teamId, id), inArray(materials.referenceId, NEW_IDS)));
  return id;
}

describe("new reference materials for existing teams", () => {
  it("adds each new reference material once, with its data and its own id, and keeps a team's own material of the same name", async () => {
    const plain = await oldTeam("old-team");
    const own = await oldTeam("own-acac");
    const acac = referenceMaterial("acac");
    const ownId = crypto.randomUUID();
    await t.db.insert(materials).values({ id: ownId, teamId: own, name: acac.name, kind: "modifier", data: { ...acac, id: ownId, density: 0.98 } });

    await runMigrationAgain();
    await runMigrationAgain();

    const rows = await t.db.select().from(materials).where(and(eq(materials.teamId, plain), inArray(materials.referenceId, NEW_IDS)));
    expect(rows.map((r) => r.referenceId).sort()).toEqual([...NEW_IDS].sort());
    for (const row of rows) {
      expect(row.data.id).toBe(row.id);
      expect(materialSchema.safeParse(row.data).success).toBe(true);
      const reference = referenceMaterial(row.referenceId!);
      // 0003 wrote the materials as they were before engine 2.1; the coat fields added since reach new teams only.
      const expected = row.referenceId === "polyetheramine-230" ? reference : beforeCoatFields(reference);
      expect({ ...row.data, id: undefined }).toEqual({ ...expected, id: undefined });
    }
    const ownRows = await t.db.select().from(materials).where(and(eq(materials.teamId, own), eq(materials.name, acac.name)));
    expect(ownRows).toHaveLength(1);
    expect(ownRows[0]!.data.density).toBe(0.98);
  });

  it("leaves a new team's library as copied (nothing twice)", async () => {
    const id = crypto.randomUUID();
    await t.db.insert(organization).values({ id, name: "new", slug: "new-team", createdAt: new Date() });
    await copyReferenceMaterials(t.db, id, null);
    const before = (await t.db.select().from(materials).where(eq(materials.teamId, id))).length;
    await runMigrationAgain();
    expect((await t.db.select().from(materials).where(eq(materials.teamId, id))).length).toBe(before);
  });
});
