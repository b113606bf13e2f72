/**
 * Import confirmation against a real MariaDB: nothing is saved while an error
 * remains or warnings are not accepted; a confirmed import is saved in one
 * transaction (a failure half-way leaves nothing behind).
 */
import { count, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ConflictError } from "@/lib/errors";
import { seedDemo } from "@/db/seed";
import { formulations, materials, revisions } from "@/db/schema";
import { demoInputs } from "@/lib/spreadsheet/example";
import { inputSheets, materialSheets } from "@/lib/spreadsheet/input-sheets";
import { previewFormulationImport } from "@/lib/spreadsheet/import-formulation";
import { previewMaterialsImport } from "@/lib/spreadsheet/import-materials";
import type { SheetGrid } from "@/lib/spreadsheet/types";
import type { SheetSpec } from "@/lib/spreadsheet/write";
import { createTestDatabase, type TestDatabase } from "../helpers/db";

let t: TestDatabase;
let q: typeof import("@/db/queries/imports");
let actor: { userId: string; teamId: string };

beforeAll(async () => {
  t = await createTestDatabase("imports");
  process.env.DATABASE_URL = t.url;
  delete (globalThis as { gelwrightDb?: unknown }).gelwrightDb;
  q = await import("@/db/queries/imports");
  const seeded = await seedDemo(t.db);
  actor = { userId: seeded.users.formulator!, teamId: seeded.teamId };
});

afterAll(async () => {
  const { pool } = await import("@/db");
  await pool.end();
  await t?.close();
});

const grids = (specs: SheetSpec[]): SheetGrid[] => specs.map((s) => ({ name: s.name, rows: [...s.header, ...s.rows] }));
const n = async (table: typeof materials | typeof formulations) => Number((await t.db.select({ n: count() }).from(table))[0]!.n);

async function formulationPreview(name: string, edit: (specs: SheetSpec[]) => void = () => undefined) {
  const demo = demoInputs().find((d) => d.name === "Visor hard coat HC-3" && d.revision === 2)!;
  const input = structuredClone(demo.input);
  input.materials.push({ id: "epoxy", name: `Epoxy resin for ${name}`, kind: "organic", density: 1.15, phaseDensity: 1.18 });
  const specs = inputSheets(input, { name });
  edit(specs);
  return previewFormulationImport(grids(specs), await q.loadLibrary(actor.teamId), await q.takenFormulationNames(actor.teamId), () => crypto.randomUUID());
}

describe("confirmImport", () => {
  it("saves nothing while an error remains (422) and keeps the preview for a corrected upload", async () => {
    const before = [await n(materials), await n(formulations)];
    const preview = await formulationPreview("Broken import", (specs) => {
      specs.find((s) => s.name === "Components")!.rows[0]![1] = 0.5;
    });
    expect(preview.counts.errors).toBe(1);
    const saved = await q.createImportPreview(actor, "formulation", "broken.xlsx", preview);
    await expect(q.confirmImport(actor, saved.id, { acceptWarnings: true })).rejects.toThrow(expect.objectContaining({ name: "RuleError", code: "import_has_errors" }));
    expect([await n(materials), await n(formulations)]).toEqual(before);
    expect((await q.getImportPreview(actor, saved.id))!.state).toBe("ready");
  });

  it("asks for warnings to be accepted, then saves the new material and the formulation together", async () => {
    const preview = await formulationPreview("Imported visor coat", (specs) => {
      specs.find((s) => s.name === "Input")!.rows.push(["Colour", "blue", ""]); // an unknown setting: a warning
    });
    expect(preview.counts).toMatchObject({ errors: 0, toCreate: 1 });
    expect(preview.counts.warnings).toBeGreaterThan(0);
    const saved = await q.createImportPreview(actor, "formulation", "visor.xlsx", preview);
    await expect(q.confirmImport(actor, saved.id, { acceptWarnings: false })).rejects.toThrow(expect.objectContaining({ name: "RuleError", code: "warnings_not_accepted" }));
    const done = await q.confirmImport(actor, saved.id, { acceptWarnings: true });
    const [rev] = await t.db.select().from(revisions).where(eq(revisions.id, done.outcome.revisionId as string));
    expect(rev!.state).toBe("draft");
    expect(rev!.input).toEqual(JSON.parse(JSON.stringify(preview.input)));
    const created = preview.materials.find((m) => m.action === "create")!;
    const [row] = await t.db.select().from(materials).where(eq(materials.id, created.id));
    expect(row!.name).toBe("Epoxy resin for Imported visor coat");
    expect(rev!.input.materials.some((m) => m.id === created.id)).toBe(true);
    await expect(q.confirmImport(actor, saved.id, { acceptWarnings: true })).rejects.toBeInstanceOf(ConflictError);
  });

  it("rolls back the new materials when the formulation cannot be saved (one transaction)", async () => {
    const preview = await formulationPreview("Raced import");
    const saved = await q.createImportPreview(actor, "formulation", "race.xlsx", preview);
    // Someone else takes the name between preview and confirmation.
    await t.db.insert(formulations).values({ teamId: actor.teamId, name: "Raced import" });
    const before = await n(materials);
    await expect(q.confirmImport(actor, saved.id, { acceptWarnings: true })).rejects.toThrow(expect.objectContaining({ code: "duplicate", fields: { name: expect.stringContaining("Raced import") } }));
    expect(await n(materials)).toBe(before);
    const epoxy = await t.db.select().from(materials).where(eq(materials.name, "Epoxy resin for Raced import"));
    expect(epoxy).toEqual([]);
  });

  it("imports a materials library file: creates the new ones, links the known ones, and never shows another user's preview", async () => {
    const library = await q.loadLibrary(actor.teamId);
    const teos = library.find((m) => m.name.startsWith("Tetraethoxysilane"))!.material;
    const specs = materialSheets([teos, { id: "x", name: "Zirconium(IV) acetylacetonate", kind: "precursor", density: 1.4, casNumber: "17501-44-9" }]);
    const preview = previewMaterialsImport(grids(specs), library, () => crypto.randomUUID());
    expect(preview.counts).toMatchObject({ toLink: 1, toCreate: 1, errors: 0 });
    const saved = await q.createImportPreview(actor, "materials", "library.csv", preview);
    expect(await q.getImportPreview({ ...actor, userId: crypto.randomUUID() }, saved.id)).toBeNull();
    expect(await q.getImportPreview({ ...actor, teamId: crypto.randomUUID() }, saved.id)).toBeNull();
    const before = await n(materials);
    await q.confirmImport(actor, saved.id, { acceptWarnings: true });
    expect(await n(materials)).toBe(before + 1);
  });
});
