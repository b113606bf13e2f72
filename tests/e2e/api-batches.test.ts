/**
 * Batch records over HTTP: production starts a batch from a released
 * revision, records lines, closes it; other roles read only; closed records
 * never change; another team sees nothing.
 */
import * as XLSX from "xlsx";
import { beforeAll, describe, expect, it } from "vitest";
import { anonymous, demo, signIn, signUp, type Client } from "./http";

let production: Client, formulator: Client, admin: Client, other: Client;
let releasedId: string, formulationId: string, draftId: string;
const stamp = Date.now().toString(36);

interface Batch {
  id: string;
  state: string;
  lines: { index: number; role: string; targetGrams: number; actualGrams: number | null; deviation: { relative: number; outside: boolean } | null }[];
  summary: { lines: number; weighed: number; outside: number };
  composition: { effectiveR: { actual: number } } | null;
}

beforeAll(async () => {
  [production, formulator, admin] = await Promise.all([signIn(demo.production), signIn(demo.formulator), signIn(demo.admin)]);
  const list = (await (await formulator.fetch("/api/formulations?pageSize=100")).json()) as { rows: { id: string; name: string }[] };
  formulationId = list.rows.find((f) => f.name === "Visor hard coat HC-3")!.id;
  const detail = (await (await formulator.fetch(`/api/formulations/${formulationId}`)).json()) as { revisions: { id: string; state: string }[] };
  releasedId = detail.revisions.find((r) => r.state === "released")!.id;
  const draftF = list.rows.find((f) => f.name === "Visor hard coat HC-5 fast cure")!.id;
  draftId = ((await (await formulator.fetch(`/api/formulations/${draftF}`)).json()) as { revisions: { id: string }[] }).revisions[0]!.id;
  other = await signUp(`batches-${stamp}@elsewhere.example`, "Bo Batches");
  expect((await other.fetch("/api/teams", { method: "POST", json: { name: `Batch Lab ${stamp}` } })).status).toBe(201);
});

describe("batch records over HTTP", () => {
  it("lets production start, record line by line, close and export a batch, and lists it per formulation", async () => {
    const start = await production.fetch("/api/batches", { method: "POST", json: { revisionId: releasedId, notes: `E2E ${stamp}` } });
    expect(start.status).toBe(201);
    let batch = (await start.json()) as Batch;
    expect(batch.state).toBe("open");
    for (const line of batch.lines) {
      const actual = line.index === 0 ? line.targetGrams * 1.05 : line.targetGrams;
      const res = await production.fetch(`/api/batches/${batch.id}/lines/${line.index}`, {
        method: "PATCH",
        json: { actualGrams: actual, lotNumber: line.role === "water" ? null : `L-${stamp}-${line.index}`, initials: "PP" },
      });
      expect(res.status).toBe(200);
      batch = (await res.json()) as Batch;
    }
    // Line 1 weighed 5 % over target: relative deviation 0.05, beyond ±1 %.
    expect(batch.lines[0]!.deviation).toMatchObject({ outside: true });
    expect(batch.lines[0]!.deviation!.relative).toBeCloseTo(0.05, 10);
    expect(batch.summary).toMatchObject({ weighed: batch.lines.length, outside: 1 });
    expect(batch.composition?.effectiveR.actual).toBeGreaterThan(0);

    const close = await production.fetch(`/api/batches/${batch.id}/close`, { method: "POST" });
    expect(close.status).toBe(200);
    expect(((await close.json()) as Batch).state).toBe("closed");
    expect((await production.fetch(`/api/batches/${batch.id}/lines/0`, { method: "PATCH", json: { actualGrams: 1 } })).status).toBe(409);
    expect((await production.fetch(`/api/batches/${batch.id}`, { method: "PATCH", json: { notes: "late edit" } })).status).toBe(409);

    const exported = await formulator.fetch(`/api/batches/${batch.id}/export`);
    expect(exported.status).toBe(200);
    const wb = XLSX.read(Buffer.from(await exported.arrayBuffer()), { type: "buffer" });
    expect(wb.SheetNames).toEqual(["Overview", "Batch record", "Composition made"]);

    const list = (await (await formulator.fetch(`/api/batches?formulationId=${formulationId}`)).json()) as { rows: { id: string }[] };
    expect(list.rows.map((r) => r.id)).toContain(batch.id);
  });

  it("refuses line entry without a number, closing an incomplete batch, and a draft revision", async () => {
    const batch = (await (await production.fetch("/api/batches", { method: "POST", json: { revisionId: releasedId } })).json()) as Batch;
    const bad = await production.fetch(`/api/batches/${batch.id}/lines/0`, { method: "PATCH", json: { actualGrams: "12 g" } });
    expect(bad.status).toBe(422);
    expect(((await bad.json()) as { error: { fields: Record<string, string> } }).error.fields.actualGrams).toMatch(/number/);
    expect((await production.fetch(`/api/batches/${batch.id}/lines/99`, { method: "PATCH", json: { actualGrams: 1 } })).status).toBe(404);
    const incomplete = await production.fetch(`/api/batches/${batch.id}/close`, { method: "POST" });
    expect(incomplete.status).toBe(422);
    expect((await production.fetch("/api/batches", { method: "POST", json: { revisionId: draftId } })).status).toBe(404);
  });

  it("lets other roles read but not write, hides batches from other teams and signed-out users", async () => {
    const batch = (await (await production.fetch("/api/batches", { method: "POST", json: { revisionId: releasedId } })).json()) as Batch;
    expect((await formulator.fetch(`/api/batches/${batch.id}`)).status).toBe(200);
    expect((await formulator.fetch("/api/batches", { method: "POST", json: { revisionId: releasedId } })).status).toBe(403);
    expect((await formulator.fetch(`/api/batches/${batch.id}/lines/0`, { method: "PATCH", json: { actualGrams: 1 } })).status).toBe(403);
    expect((await other.fetch(`/api/batches/${batch.id}`)).status).toBe(404);
    expect((await other.fetch(`/api/batches/${batch.id}/export`)).status).toBe(404);
    expect((await other.fetch("/api/batches", { method: "POST", json: { revisionId: releasedId } })).status).toBe(403);
    expect((await anonymous().fetch(`/api/batches/${batch.id}`)).status).toBe(401);
  });

  it("lets the admin set the team's tolerance; production may not", async () => {
    expect((await production.fetch("/api/batches/settings", { method: "PUT", json: { toleranceFraction: 0.02, balanceResolutionGrams: 0.01 } })).status).toBe(403);
    const res = await admin.fetch("/api/batches/settings", { method: "PUT", json: { toleranceFraction: 0.01, balanceResolutionGrams: 0.01 } });
    expect(res.status).toBe(200);
    expect(await (await production.fetch("/api/batches/settings")).json()).toEqual({ toleranceFraction: 0.01, balanceResolutionGrams: 0.01, isDefault: false });
    expect((await admin.fetch("/api/batches/settings", { method: "PUT", json: { toleranceFraction: 0, balanceResolutionGrams: 0.01 } })).status).toBe(422);
  });
});
