/**
 * Saved design explorations over HTTP (issue 16): who may save, read, export
 * and delete them (the same rules as unreleased revisions: production sees
 * none), save → list → read → export as CSV and .xlsx (parsed back: one row
 * per point, headings with units), opening a candidate as a new draft, and
 * bad input.
 */
import * as XLSX from "xlsx";
import { beforeAll, describe, expect, it } from "vitest";
import { parseCsv } from "@/lib/spreadsheet/csv";
import { coatInput, explorationBody, library, saveExploration, type LibraryMaterial } from "./fixtures";
import { demo, signIn, type Client } from "./http";

type Role = "admin" | "formulator" | "reviewer" | "production";
const clients = {} as Record<Role, Client>;
const stamp = Date.now().toString(36);
let lib: Map<string, LibraryMaterial>;
let hc3: { id: string; released: string; firstComponent: string };

interface ListAnswer {
  rows: { id: string; name: string; revisionId: string; revisionNumber: number; pointCount: number; createdByName: string | null; names: Record<string, string> }[];
}

beforeAll(async () => {
  for (const role of ["admin", "formulator", "reviewer", "production"] as Role[]) clients[role] = await signIn(demo[role]);
  lib = await library(clients.formulator);
  const list = (await (await clients.formulator.fetch("/api/formulations?pageSize=100")).json()) as { rows: { id: string; name: string }[] };
  const f = list.rows.find((r) => r.name === "Visor hard coat HC-3")!;
  const revs = (await (await clients.formulator.fetch(`/api/formulations/${f.id}`)).json()) as { revisions: { id: string; state: string }[] };
  const released = revs.revisions.find((r) => r.state === "released")!.id;
  const rev = (await (await clients.formulator.fetch(`/api/revisions/${released}`)).json()) as { input: { components: { materialId: string }[] } };
  hc3 = { id: f.id, released, firstComponent: rev.input.components[0]!.materialId };
});

/** A new formulation whose first revision is approved (no draft open), ready for a new draft. */
async function approvedFormulation(name: string): Promise<string> {
  const created = await clients.formulator.fetch("/api/formulations", { method: "POST", json: { name, input: coatInput(lib) } });
  expect(created.status).toBe(201);
  const { formulationId, revisionId } = (await created.json()) as { formulationId: string; revisionId: string };
  expect((await clients.formulator.fetch(`/api/revisions/${revisionId}/submit`, { method: "POST", json: {} })).status).toBe(200);
  const approved = await clients.reviewer.fetch(`/api/revisions/${revisionId}/approve`, { method: "POST", json: { comment: "Checked for the exploration test." } });
  expect(approved.status).toBe(200);
  return formulationId;
}

describe("saved explorations by role", () => {
  it("lets formulators and admins save, reviewers read, and production neither save nor see any", async () => {
    const body = explorationBody(hc3.released, hc3.firstComponent, `By role ${stamp}`);
    const url = `/api/formulations/${hc3.id}/explorations`;
    const saved: Record<string, number> = {};
    for (const role of ["admin", "formulator", "reviewer", "production"] as Role[]) saved[role] = (await clients[role].fetch(url, { method: "POST", json: body })).status;
    expect(saved).toEqual({ admin: 201, formulator: 201, reviewer: 403, production: 403 });
    const reviewerList = (await (await clients.reviewer.fetch(url)).json()) as ListAnswer;
    const mine = reviewerList.rows.filter((r) => r.name === `By role ${stamp}`);
    expect(mine).toHaveLength(2);
    const id = mine[0]!.id;
    for (const path of [url, `/api/explorations/${id}`, `/api/explorations/${id}/export?format=csv`, `/api/explorations/${id}/export?format=xlsx`]) {
      const res = await clients.production.fetch(path);
      expect(res.status, path).toBe(403);
      expect(((await res.json()) as { error: { code: string } }).error.code).toBe("forbidden");
    }
    expect((await clients.reviewer.fetch(`/api/explorations/${id}`)).status).toBe(200);
    expect((await clients.reviewer.fetch(`/api/explorations/${id}`, { method: "DELETE" })).status).toBe(403);
    expect((await clients.production.fetch(`/api/explorations/${id}`, { method: "DELETE" })).status).toBe(403);
    for (const row of mine) expect((await clients.admin.fetch(`/api/explorations/${row.id}`, { method: "DELETE" })).status).toBe(204);
    expect((await clients.admin.fetch(`/api/explorations/${id}`)).status).toBe(404);
  });
});

describe("save, list, read, delete", () => {
  it("returns the saved exploration in the revision's list with who saved it and the names of what varied, and audits save and delete", async () => {
    const name = `Listed ${stamp}`;
    const id = await saveExploration(clients.formulator, hc3.id, explorationBody(hc3.released, hc3.firstComponent, name));
    const list = (await (await clients.formulator.fetch(`/api/formulations/${hc3.id}/explorations?revision=${hc3.released}`)).json()) as ListAnswer;
    const row = list.rows.find((r) => r.id === id)!;
    expect(row).toMatchObject({ name, revisionId: hc3.released, pointCount: 5 });
    expect(row.createdByName).toBeTruthy();
    expect(row.names[hc3.firstComponent]).toBe(lib.get("gptms")!.name);
    const one = (await (await clients.formulator.fetch(`/api/explorations/${id}`)).json()) as { formulationName: string; search: { objective: unknown } };
    expect(one.formulationName).toBe("Visor hard coat HC-3");
    expect(one.search.objective).toEqual({ goal: "closest", output: "refractiveIndex", value: 1.5 });
    // Another revision's list does not hold it.
    const other = (await (await clients.formulator.fetch(`/api/formulations/${hc3.id}/explorations?revision=missing`)).json()) as ListAnswer;
    expect(other.rows.find((r) => r.id === id)).toBeUndefined();
    expect((await clients.formulator.fetch(`/api/explorations/${id}`, { method: "DELETE" })).status).toBe(204);
    const audit = (await (await clients.admin.fetch(`/api/audit?entityId=${id}`)).json()) as { rows: { action: string }[] };
    expect(audit.rows.map((r) => r.action).sort()).toEqual(["exploration.deleted", "exploration.saved"]);
  });
});

describe("export of a saved exploration", () => {
  it("returns the points as CSV and .xlsx, one row per point, headings with units, with a proper type and file name", async () => {
    const id = await saveExploration(clients.formulator, hc3.id, explorationBody(hc3.released, hc3.firstComponent, `Export ${stamp}`));
    const csv = await clients.reviewer.fetch(`/api/explorations/${id}/export?format=csv`);
    expect(csv.status).toBe(200);
    expect(csv.headers.get("content-type")).toBe("text/csv; charset=utf-8");
    expect(csv.headers.get("content-disposition")).toMatch(/^attachment; filename=".*Export.*\.csv"$/);
    const { rows } = parseCsv(await csv.text());
    const start = rows.findIndex((r) => r[0] === "[Points]");
    expect(start).toBeGreaterThan(0);
    const header = rows[start + 1]!.map(String);
    // The swept component's weight fraction in wt% (stored 0–1), the figures with their units.
    expect(header[0]).toMatch(/weight fraction.*\(wt%\)$/);
    expect(header).toContain("Theoretical density of the dry composite (g/cm³)");
    expect(header).toContain("Thermal check");
    const points = rows.slice(start + 2).filter((r) => r.some((c) => c !== null && c !== ""));
    expect(points).toHaveLength(5);
    expect(points.map((r) => Number(r[0]))).toEqual([20, 30, 40, 50, 60]);

    const xlsx = await clients.formulator.fetch(`/api/explorations/${id}/export?format=xlsx`);
    expect(xlsx.status).toBe(200);
    expect(xlsx.headers.get("content-type")).toBe("application/vnd.openxmlformats-officedocument.spreadsheetml.sheet");
    expect(xlsx.headers.get("content-disposition")).toMatch(/\.xlsx"$/);
    const wb = XLSX.read(Buffer.from(await xlsx.arrayBuffer()), { type: "buffer" });
    const sheet = XLSX.utils.sheet_to_json<unknown[]>(wb.Sheets.Points!, { header: 1 });
    expect(sheet).toHaveLength(1 + 5);
    expect(sheet[0]).toEqual(header);
    const density = header.indexOf("Theoretical density of the dry composite (g/cm³)");
    // The same numbers in both files (CSV rounds nothing away that matters at 1e-9).
    for (let p = 0; p < 5; p++) {
      expect(sheet[p + 1]![0]).toBe(20 + 10 * p);
      expect(Number(sheet[p + 1]![density])).toBeCloseTo(Number(points[p]![density]), 6);
    }
    // GPTMS's residue, (C6H11O2)SiO1.5, is less dense than silica and titania (residue densities in data/materials.ts), so the composite's density falls as its share rises.
    expect(Number(sheet[5]![density])).toBeLessThan(Number(sheet[1]![density]));
  });
});

describe("opening a candidate as a new draft", () => {
  it("starts a draft with the candidate's input, computed by the full engine, and refuses a second while it is open", async () => {
    const formulationId = await approvedFormulation(`Candidate draft ${stamp}`);
    const revs = (await (await clients.formulator.fetch(`/api/formulations/${formulationId}`)).json()) as { revisions: { id: string }[] };
    const explorationId = await saveExploration(clients.formulator, formulationId, explorationBody(revs.revisions[0]!.id, lib.get("teos")!.id, "Candidates"));
    const input = coatInput(lib, { teos: 0.3, cureC: 90 });
    const res = await clients.formulator.fetch(`/api/formulations/${formulationId}/revisions`, { method: "POST", json: { input, fromExploration: { explorationId, point: 1 } } });
    expect(res.status).toBe(201);
    const { revisionId, number } = (await res.json()) as { revisionId: string; number: number };
    expect(number).toBe(2);
    const draft = (await (await clients.formulator.fetch(`/api/revisions/${revisionId}`)).json()) as {
      state: string;
      input: { components: { weightFraction: number }[]; steps: { temperatureC: number }[] };
      result: unknown;
      computeError: string | null;
    };
    expect(draft.state).toBe("draft");
    expect(draft.input.components[0]!.weightFraction).toBe(0.3);
    expect(draft.input.steps[1]!.temperatureC).toBe(90);
    expect(draft.computeError).toBeNull();
    // The same engine over /api/compute gives the stored result.
    expect(draft.result).toEqual(await (await clients.formulator.fetch("/api/compute", { method: "POST", json: input })).json());
    const audit = (await (await clients.admin.fetch(`/api/audit?entityId=${revisionId}`)).json()) as { rows: { action: string; summary: { note?: string } }[] };
    expect(audit.rows[0]).toMatchObject({ action: "revision.started", summary: { note: "from the exploration “Candidates”, point 2" } });
    const again = await clients.formulator.fetch(`/api/formulations/${formulationId}/revisions`, { method: "POST", json: { input } });
    expect(again.status).toBe(409);
    expect(((await again.json()) as { error: { message: string } }).error.message).toMatch(/Revision 2 is still a draft/);
  });

  it("gives one 201 and one 409 to two requests sent at once", async () => {
    const formulationId = await approvedFormulation(`Candidate race ${stamp}`);
    const url = `/api/formulations/${formulationId}/revisions`;
    const [a, b] = await Promise.all([
      clients.formulator.fetch(url, { method: "POST", json: { input: coatInput(lib, { teos: 0.35 }), fromExploration: { point: 3 } } }),
      clients.admin.fetch(url, { method: "POST", json: { input: coatInput(lib, { teos: 0.45 }), fromExploration: { point: 4 } } }),
    ]);
    expect([a.status, b.status].sort()).toEqual([201, 409]);
    const f = (await (await clients.formulator.fetch(`/api/formulations/${formulationId}`)).json()) as { revisions: unknown[] };
    expect(f.revisions).toHaveLength(2);
  });

  it("keeps today's behaviour without a body: the new draft copies the newest revision", async () => {
    const formulationId = await approvedFormulation(`Plain new draft ${stamp}`);
    const res = await clients.formulator.fetch(`/api/formulations/${formulationId}/revisions`, { method: "POST" });
    expect(res.status).toBe(201);
    const { revisionId } = (await res.json()) as { revisionId: string };
    const draft = (await (await clients.formulator.fetch(`/api/revisions/${revisionId}`)).json()) as { input: { components: { weightFraction: number }[] } };
    expect(draft.input.components[0]!.weightFraction).toBe(0.4);
  });
});

describe("edge cases", () => {
  it("answers 422 naming the field for a bad input, a revision of another formulation, and a bad export format", async () => {
    const formulationId = await approvedFormulation(`Bad candidate ${stamp}`);
    const bad = coatInput(lib) as { components: { weightFraction: unknown }[] };
    bad.components[0]!.weightFraction = "lots";
    const res = await clients.formulator.fetch(`/api/formulations/${formulationId}/revisions`, { method: "POST", json: { input: bad } });
    expect(res.status).toBe(422);
    expect(Object.keys(((await res.json()) as { error: { fields: Record<string, string> } }).error.fields)).toContain("input.components.0.weightFraction");
    const wrongRevision = await clients.formulator.fetch(`/api/formulations/${formulationId}/explorations`, { method: "POST", json: explorationBody(hc3.released, hc3.firstComponent) });
    expect(wrongRevision.status).toBe(422);
    expect(Object.keys(((await wrongRevision.json()) as { error: { fields: Record<string, string> } }).error.fields)).toContain("revisionId");
    const id = await saveExploration(clients.formulator, hc3.id, explorationBody(hc3.released, hc3.firstComponent, `Format ${stamp}`));
    const pdf = await clients.formulator.fetch(`/api/explorations/${id}/export?format=pdf`);
    expect(pdf.status).toBe(422);
    expect(Object.keys(((await pdf.json()) as { error: { fields: Record<string, string> } }).error.fields)).toEqual(["format"]);
    const f = (await (await clients.formulator.fetch(`/api/formulations/${formulationId}`)).json()) as { revisions: unknown[] };
    expect(f.revisions).toHaveLength(1);
  });
});
