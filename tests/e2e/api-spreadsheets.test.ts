/**
 * Spreadsheet export and import over HTTP: who may export what, the
 * template download, upload → preview → confirm, nothing saved on error,
 * and clear 4xx answers for files that are not acceptable.
 */
import * as XLSX from "xlsx";
import { beforeAll, describe, expect, it } from "vitest";
import { bombSheet, workbookWith } from "../helpers/zip";
import { parseCsv } from "@/lib/spreadsheet/csv";
import { roundToResolution } from "@/lib/batches/resolution";
import { significantStep } from "@/lib/spreadsheet/coat-rows";
import { coatInput, library } from "./fixtures";
import { anonymous, demo, signIn, signUp, type Client } from "./http";

let formulator: Client, reviewer: Client, production: Client, other: Client;
let releasedId: string, draftId: string;
const stamp = Date.now().toString(36);

async function revisionIds(client: Client) {
  const list = (await (await client.fetch("/api/formulations?pageSize=100")).json()) as { rows: { id: string; name: string }[] };
  const ids: Record<string, string> = {};
  for (const f of list.rows) {
    const detail = (await (await client.fetch(`/api/formulations/${f.id}`)).json()) as { revisions: { id: string; state: string }[] };
    for (const r of detail.revisions) ids[`${f.name}|${r.state}`] ??= r.id;
  }
  return ids;
}

function upload(client: Client, bytes: Uint8Array | string, fileName: string, fields: Record<string, string>) {
  const form = new FormData();
  form.set("file", new Blob([typeof bytes === "string" ? bytes : new Uint8Array(bytes)]), fileName);
  for (const [k, v] of Object.entries(fields)) form.set(k, v);
  return client.fetch("/api/imports", { method: "POST", body: form });
}

interface Preview {
  id: string;
  problems: { level: string; sheet: string; row: number | null; column: string | null; message: string }[];
  counts: { errors: number; warnings: number; toCreate: number; toLink: number };
  formulation?: { name: string };
}

beforeAll(async () => {
  [formulator, reviewer, production] = await Promise.all([signIn(demo.formulator), signIn(demo.reviewer), signIn(demo.production)]);
  const ids = await revisionIds(formulator);
  releasedId = ids["Visor hard coat HC-3|released"]!;
  draftId = ids["Visor hard coat HC-5 fast cure|draft"]!;
  other = await signUp(`sheets-${stamp}@elsewhere.example`, "Sam Sheets");
  expect((await other.fetch("/api/teams", { method: "POST", json: { name: `Sheets Lab ${stamp}` } })).status).toBe(201);
});

describe("GET /api/revisions/:id/export", () => {
  it("returns the revision's workbook with its batch sheet to anyone who can read it", async () => {
    for (const client of [formulator, production]) {
      const res = await client.fetch(`/api/revisions/${releasedId}/export`);
      expect(res.status).toBe(200);
      expect(res.headers.get("content-type")).toContain("spreadsheetml");
      expect(res.headers.get("content-disposition")).toMatch(/attachment; filename="Visor-hard-coat-HC-3-r2\.xlsx"/);
      const wb = XLSX.read(Buffer.from(await res.arrayBuffer()), { type: "buffer" });
      expect(wb.SheetNames).toContain("Batch sheet");
      const batch = XLSX.utils.sheet_to_json<unknown[]>(wb.Sheets["Batch sheet"]!, { header: 1, raw: true });
      expect(typeof batch[1]![4]).toBe("number");
    }
  });

  it("returns the batch sheet as CSV", async () => {
    const res = await production.fetch(`/api/revisions/${releasedId}/export?format=csv`);
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("text/csv; charset=utf-8");
    const bytes = new Uint8Array(await res.arrayBuffer());
    expect([...bytes.slice(0, 3)]).toEqual([0xef, 0xbb, 0xbf]); // UTF-8 byte-order mark, so spreadsheet programs read "³" and "°" right
    expect(new TextDecoder().decode(bytes).split("\r\n")[0]).toBe(
      ["Order", "Material", "Role", "Lot number", "Target mass as supplied (g)", "Target volume as supplied (mL)", "Actual mass (g)", "Time (hh:mm)", "Initials"].map((h) => `"${h}"`).join(","),
    );
  });

  it("answers 404 to production for a draft, 404 to another team, 401 when signed out, 422 for an unknown format", async () => {
    expect((await production.fetch(`/api/revisions/${draftId}/export`)).status).toBe(404);
    expect((await other.fetch(`/api/revisions/${releasedId}/export`)).status).toBe(404);
    expect((await anonymous().fetch(`/api/revisions/${releasedId}/export`)).status).toBe(401);
    expect((await formulator.fetch(`/api/revisions/${releasedId}/export?format=pdf`)).status).toBe(422);
  });
});

describe("GET /api/revisions/:id/export with a coating", () => {
  interface CoatResult {
    coating?: { dryThicknessNm: number; wetThicknessUm: number; withdrawalMmPerSForTarget?: number; solMlForArea?: number };
    voc?: { gramsPerLitre: number; gramsPerLitreLessWater: number };
    cost?: { total: number };
  }

  it("carries the withdrawal speed, the expected thickness, the area's sol and the VOC figure in the batch sheet CSV and workbook", async () => {
    const lib = await library(formulator);
    const coating = { method: "dip", withdrawalMmPerS: 2, viscosityMPaS: 3, surfaceTensionMNPerM: 24, targetDryThicknessNm: 1500, areaM2: 0.5 };
    const created = await formulator.fetch("/api/formulations", { method: "POST", json: { name: `Dip-coated ${stamp}`, project: "Sheets", input: { ...coatInput(lib), coating } } });
    expect(created.status).toBe(201);
    const { revisionId } = (await created.json()) as { revisionId: string };
    const { result } = (await (await formulator.fetch(`/api/revisions/${revisionId}`)).json()) as { result: CoatResult };
    expect(result.coating).toBeDefined();
    expect(result.voc).toBeDefined();
    // Shown to three significant figures (the export's rule), so compare with the stored figure rounded the same way.
    const three = (value: number) => roundToResolution(value, significantStep(value, 3)!);

    const csv = await formulator.fetch(`/api/revisions/${revisionId}/export?format=csv`);
    expect(csv.status).toBe(200);
    const rows = parseCsv(await csv.text()).rows;
    const start = rows.findIndex((r) => r[0] === "[Coating and VOC]");
    expect(start).toBeGreaterThan(1);
    const table = rows.slice(start + 1);
    expect(table[0]).toEqual(["Setting", "Value", "Unit"]);
    expect(table).toContainEqual(["Coating method", "dip coating", ""]);
    expect(table).toContainEqual(["Withdrawal speed", "2.00", "mm/s"]);
    expect(table).toContainEqual(["Withdrawal speed for the target", three(result.coating!.withdrawalMmPerSForTarget!), "mm/s"]);
    expect(table).toContainEqual(["Expected dry film thickness", three(result.coating!.dryThicknessNm), "nm"]);
    expect(table).toContainEqual(["Sol needed for the area (no losses)", three(result.coating!.solMlForArea!), "mL"]);
    expect(table).toContainEqual(["VOC", three(result.voc!.gramsPerLitre), "g/L of sol"]);
    expect(table).toContainEqual(["VOC less water", three(result.voc!.gramsPerLitreLessWater), "g/L of sol less water"]);

    const xlsx = await formulator.fetch(`/api/revisions/${revisionId}/export`);
    const wb = XLSX.read(Buffer.from(await xlsx.arrayBuffer()), { type: "buffer" });
    const sheet = XLSX.utils.sheet_to_json<unknown[]>(wb.Sheets["Coating and VOC"]!, { header: 1, raw: true });
    expect(sheet.find((r) => r[0] === "Withdrawal speed")).toEqual(["Withdrawal speed", 2, "mm/s"]);
    expect(sheet.find((r) => r[0] === "VOC")?.[1]).toBe(result.voc!.gramsPerLitre);
    const overview = XLSX.utils.sheet_to_json<unknown[]>(wb.Sheets.Overview!, { header: 1, raw: true });
    expect(overview.find((r) => r[0] === "Coat: dry film thickness")?.[1]).toBe(result.coating!.dryThicknessNm);
    // Every line of this coat has a demo price, so the batch has a cost, in the team's currency.
    const { currency } = (await (await formulator.fetch("/api/team/settings")).json()) as { currency: string };
    expect(overview.find((r) => r[0] === "Cost of the batch")).toEqual(["Cost of the batch", result.cost!.total, currency]);
    const coatingSheet = XLSX.utils.sheet_to_json<unknown[]>(wb.Sheets.Coating!, { header: 1, raw: true });
    expect(coatingSheet.find((r) => r[0] === "Withdrawal speed")?.[1]).toBe(2);
  });

  it("says nothing about a coating for a revision without one: the VOC rows alone", async () => {
    const rows = parseCsv(await (await production.fetch(`/api/revisions/${releasedId}/export?format=csv`)).text()).rows;
    const start = rows.findIndex((r) => r[0] === "[Coating and VOC]");
    expect(rows.slice(start + 2).map((r) => r[0])).toEqual(["VOC", "VOC less water", "VOC in the batch (hydrolysis alcohol included)"]);
  });
});

describe("GET /api/materials/export and /api/templates/:kind", () => {
  it("returns the team's library as .xlsx and CSV", async () => {
    const xlsx = await reviewer.fetch("/api/materials/export");
    expect(xlsx.status).toBe(200);
    const wb = XLSX.read(Buffer.from(await xlsx.arrayBuffer()), { type: "buffer" });
    const rows = XLSX.utils.sheet_to_json<unknown[]>(wb.Sheets.Materials!, { header: 1, raw: true });
    expect(rows.length).toBeGreaterThan(30);
    const csv = await reviewer.fetch("/api/materials/export?format=csv");
    expect((await csv.text())).toContain("[Material sources]");
    expect((await anonymous().fetch("/api/materials/export")).status).toBe(401);
  });

  it("returns the filled templates, and 404 for an unknown kind", async () => {
    expect((await formulator.fetch("/api/templates/formulation")).status).toBe(200);
    expect((await formulator.fetch("/api/templates/formulation?format=csv")).status).toBe(200);
    expect((await formulator.fetch("/api/templates/materials?format=csv")).status).toBe(200);
    expect((await formulator.fetch("/api/templates/other")).status).toBe(404);
  });
});

describe("POST /api/imports → preview → confirm", () => {
  it("imports the filled template: preview with every material linked, then one confirmed save", async () => {
    const template = Buffer.from(await (await formulator.fetch("/api/templates/formulation")).arrayBuffer());
    const res = await upload(formulator, template, "template.xlsx", { kind: "formulation" });
    expect(res.status).toBe(201);
    const preview = (await res.json()) as Preview;
    expect(preview.counts.errors).toBe(0);
    expect(preview.counts.toCreate).toBe(0);
    expect(preview.formulation?.name).toBe("Visor hard coat HC-3 (example)");
    expect((await formulator.fetch(`/api/imports/${preview.id}`)).status).toBe(200);
    expect((await reviewer.fetch(`/api/imports/${preview.id}`)).status).toBe(404);
    const confirm = await formulator.fetch(`/api/imports/${preview.id}/confirm`, { method: "POST", json: { acceptWarnings: true } });
    expect(confirm.status).toBe(200);
    const outcome = ((await confirm.json()) as { outcome: { revisionId: string } }).outcome;
    const rev = (await (await formulator.fetch(`/api/revisions/${outcome.revisionId}`)).json()) as { state: string; formulationName: string };
    expect(rev).toMatchObject({ state: "draft", formulationName: "Visor hard coat HC-3 (example)" });
    expect((await formulator.fetch(`/api/imports/${preview.id}/confirm`, { method: "POST", json: { acceptWarnings: true } })).status).toBe(409);
  });

  it("previews an exported revision with only the name clash as error, and saves nothing on confirm", async () => {
    const exported = Buffer.from(await (await formulator.fetch(`/api/revisions/${releasedId}/export`)).arrayBuffer());
    const before = ((await (await formulator.fetch("/api/formulations?pageSize=1")).json()) as { total: number }).total;
    const preview = (await (await upload(formulator, exported, "hc3.xlsx", { kind: "formulation" })).json()) as Preview;
    expect(preview.problems.filter((p) => p.level === "error")).toEqual([
      { level: "error", sheet: "Input", row: 2, column: "Value", columnLetter: "B", message: "A formulation named “Visor hard coat HC-3” already exists in this team: choose another name." },
    ]);
    const confirm = await formulator.fetch(`/api/imports/${preview.id}/confirm`, { method: "POST", json: { acceptWarnings: true } });
    expect(confirm.status).toBe(422);
    const body = (await confirm.json()) as { error: { code: string; fields: Record<string, string> } };
    expect(body.error.code).toBe("import_has_errors");
    expect(body.error.fields["Input row 2, Value"]).toMatch(/already exists/);
    expect(((await (await formulator.fetch("/api/formulations?pageSize=1")).json()) as { total: number }).total).toBe(before);
  });

  it("imports a materials CSV: creates the new material and links the known one", async () => {
    const csv = [
      "Name,Kind,CAS number,Density as supplied (g/cm³),Molar mass (g/mol)",
      "Ethanol,solvent,64-17-5,0.7893,46.069",
      `Test solvent ${stamp},solvent,,0.8,60`,
    ].join("\r\n");
    const res = await upload(formulator, csv, "library.csv", { kind: "materials" });
    expect(res.status).toBe(201);
    const preview = (await res.json()) as Preview;
    expect(preview.counts).toMatchObject({ errors: 0, toCreate: 1, toLink: 1 });
    expect((await formulator.fetch(`/api/imports/${preview.id}/confirm`, { method: "POST", json: { acceptWarnings: true } })).status).toBe(200);
    const list = (await (await formulator.fetch(`/api/materials?q=${encodeURIComponent(`Test solvent ${stamp}`)}`)).json()) as { total: number };
    expect(list.total).toBe(1);
  });

  describe("edge cases", () => {
    it("answers 403 to roles that may not create, 401 when signed out, 422 for a missing kind", async () => {
      const csv = "Name,Kind\r\nX,solvent";
      expect((await upload(reviewer, csv, "m.csv", { kind: "formulation" })).status).toBe(403);
      expect((await upload(production, csv, "m.csv", { kind: "materials" })).status).toBe(403);
      expect((await upload(anonymous(), csv, "m.csv", { kind: "materials" })).status).toBe(401);
      expect((await upload(formulator, csv, "m.csv", {})).status).toBe(422);
    });

    it("answers 415 for a PDF, 422 for a corrupt archive and 413 above 5 MB, each with a plain message", async () => {
      const pdf = await upload(formulator, "%PDF-1.7\n%%EOF\n", "library.xlsx", { kind: "materials" });
      expect(pdf.status).toBe(415);
      expect(((await pdf.json()) as { error: { message: string } }).error.message).toMatch(/PDF document, not a spreadsheet/);
      const corrupt = await upload(formulator, new Uint8Array([0x50, 0x4b, 0x03, 0x04, 1, 2, 3, 4, 5]), "x.xlsx", { kind: "materials" });
      expect(corrupt.status).toBe(422);
      const big = await upload(formulator, new Uint8Array(6 * 1024 * 1024).fill(65), "big.csv", { kind: "materials" });
      expect(big.status).toBe(413);
    });

    it("answers a zip bomb with 413 and a lying-size sheet with 422, in the error shape, and the app keeps answering", async () => {
      // A 2 MB workbook whose sheet unpacks to 2,000 MiB of one repeated byte; then a sheet that claims 1,000 bytes and inflates to 300 MiB.
      const bomb = await upload(formulator, workbookWith(bombSheet(2000)), "bomb.xlsx", { kind: "materials" });
      expect(bomb.status).toBe(413);
      const bombBody = (await bomb.json()) as { error: { code: string; message: string; fields: Record<string, string> } };
      expect(bombBody.error.code).toBe("unpacks_too_large");
      expect(bombBody.error.message).toMatch(/xl\/worksheets\/sheet1\.xml" declares [\d,]+ MB when unpacked; at most 64 MB per part/);
      expect(bombBody.error.fields.file).toBe(bombBody.error.message);
      const lying = await upload(formulator, workbookWith({ ...bombSheet(300), centralSize: 1000, localSize: 1000 }), "lying.xlsx", { kind: "materials" });
      expect(lying.status).toBe(422);
      expect(((await lying.json()) as { error: { code: string } }).error.code).toBe("size_mismatch");
      expect((await formulator.fetch("/api/health")).status).toBe(200);
    });
  });
});
