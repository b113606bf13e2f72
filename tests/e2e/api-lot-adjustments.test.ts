/**
 * Adjusting a lot's stock over HTTP (POST|GET /api/lots/:id/adjustments):
 * production sets the counted amount, the lot's version goes up, the audit
 * trail keeps `lot.adjusted` with before, after, unit and reason, the list is
 * newest first; a stale version (409) and no change (422) write nothing; a
 * reviewer reads the history but may not adjust (403); the lot correction
 * route still refuses quantities; the lot's traceability export lists the
 * adjustments.
 */
import * as XLSX from "xlsx";
import { beforeAll, describe, expect, it } from "vitest";
import { demo, signIn, type Client } from "./http";

interface Lot {
  id: string;
  materialId: string;
  quantityReceived: number;
  quantityOnHand: number;
  version: number;
}
interface Adjustment {
  quantityBefore: number;
  quantityAfter: number;
  reason: string;
  note: string | null;
  adjustedByName: string | null;
  adjustedAt: string;
}
interface ErrorBody {
  error: { code: string; message: string; fields?: Record<string, string> };
}

let production: Client;
let admin: Client;
let reviewer: Client;
let materialId: string;
const stamp = Date.now().toString(36);

beforeAll(async () => {
  production = await signIn(demo.production);
  admin = await signIn(demo.admin);
  reviewer = await signIn(demo.reviewer);
  const lots = (await (await production.fetch("/api/lots")).json()) as { rows: Lot[] };
  materialId = lots.rows[0]!.materialId;
});

async function receive(supplierLot: string): Promise<Lot> {
  const res = await production.fetch("/api/lots", {
    method: "POST",
    json: { materialId, supplier: "Stock Supplies", supplierLot, quantity: 2.5, unit: "kg", receivedOn: "2026-01-10", expiresOn: "2027-01-10" },
  });
  expect(res.status).toBe(201);
  return (await res.json()) as Lot;
}

const adjust = (client: Client, lotId: string, json: unknown) => client.fetch(`/api/lots/${lotId}/adjustments`, { method: "POST", json });
const history = async (client: Client, lotId: string) => {
  const res = await client.fetch(`/api/lots/${lotId}/adjustments`);
  expect(res.status).toBe(200);
  return (await res.json()) as { unit: string; rows: Adjustment[] };
};

describe("POST /api/lots/:id/adjustments", () => {
  it("returns 201 with the lot at the counted amount and the next version, and audits lot.adjusted", async () => {
    const lot = await receive(`ADJ-${stamp}-1`);
    const res = await adjust(production, lot.id, { version: 1, quantityOnHand: 2.35, reason: "damaged", note: "one tin dented and leaking" });
    expect(res.status).toBe(201);
    const body = (await res.json()) as { lot: Lot; adjustment: Adjustment };
    expect(body.lot).toMatchObject({ quantityReceived: 2.5, quantityOnHand: 2.35, version: 2 });
    expect(body.adjustment).toMatchObject({ quantityBefore: 2.5, quantityAfter: 2.35, reason: "damaged", note: "one tin dented and leaking" });

    const second = await adjust(admin, lot.id, { version: 2, quantityOnHand: 2.4, reason: "recount" });
    expect(second.status).toBe(201);
    expect(((await (await production.fetch(`/api/lots/${lot.id}`)).json()) as Lot).quantityOnHand).toBe(2.4);

    const list = await history(reviewer, lot.id);
    expect(list.unit).toBe("kg");
    expect(list.rows.map((r) => [r.quantityBefore, r.quantityAfter, r.reason])).toEqual([
      [2.35, 2.4, "recount"],
      [2.5, 2.35, "damaged"],
    ]);

    const audit = (await (await admin.fetch(`/api/audit?entityId=${lot.id}&action=lot.adjusted`)).json()) as {
      rows: { action: string; summary: unknown }[];
    };
    expect(audit.rows).toHaveLength(2);
    expect(audit.rows.map((r) => r.summary)).toContainEqual({
      before: { quantityOnHand: 2.5, version: 1 },
      after: { quantityOnHand: 2.35, version: 2, unit: "kg", reason: "damaged" },
      note: "one tin dented and leaking",
    });
  });

  it("answers a stale version with 409 telling to reload, and keeps the saved amount", async () => {
    const lot = await receive(`ADJ-${stamp}-2`);
    expect((await adjust(production, lot.id, { version: 1, quantityOnHand: 2, reason: "sample", note: "to the customer" })).status).toBe(201);
    const res = await admin.fetch(`/api/lots/${lot.id}/adjustments`, { method: "POST", json: { version: 1, quantityOnHand: 1, reason: "recount" } });
    expect(res.status).toBe(409);
    const body = (await res.json()) as ErrorBody;
    expect(body.error.message).toMatch(/reload/);
    expect(Object.keys(body.error.fields ?? {})).toEqual(["version"]);
    expect(((await (await production.fetch(`/api/lots/${lot.id}`)).json()) as Lot)).toMatchObject({ quantityOnHand: 2, version: 2 });
    expect((await history(production, lot.id)).rows).toHaveLength(1);
  });

  it("answers the amount already on hand with 422 naming quantityOnHand, and writes nothing", async () => {
    const lot = await receive(`ADJ-${stamp}-3`);
    const res = await adjust(production, lot.id, { version: 1, quantityOnHand: 2.5, reason: "recount" });
    expect(res.status).toBe(422);
    expect(Object.keys(((await res.json()) as ErrorBody).error.fields ?? {})).toEqual(["quantityOnHand"]);
    expect(((await (await production.fetch(`/api/lots/${lot.id}`)).json()) as Lot).version).toBe(1);
    const audit = (await (await admin.fetch(`/api/audit?entityId=${lot.id}&action=lot.adjusted`)).json()) as { rows: unknown[] };
    expect(audit.rows).toHaveLength(0);
  });

  it("refuses a reviewer (403), who still reads the history", async () => {
    const lot = await receive(`ADJ-${stamp}-4`);
    const res = await adjust(reviewer, lot.id, { version: 1, quantityOnHand: 0, reason: "disposed" });
    expect(res.status).toBe(403);
    expect(((await (await production.fetch(`/api/lots/${lot.id}`)).json()) as Lot).quantityOnHand).toBe(2.5);
    expect((await history(reviewer, lot.id)).rows).toEqual([]);
  });

  it("puts the adjustments in the lot's traceability export (.xlsx and CSV), newest first", async () => {
    const lot = await receive(`ADJ-${stamp}-6`);
    expect((await adjust(production, lot.id, { version: 1, quantityOnHand: 2.2, reason: "recount" })).status).toBe(201);
    expect((await adjust(production, lot.id, { version: 2, quantityOnHand: 2.0, reason: "sample", note: "to the customer's lab" })).status).toBe(201);
    const xlsx = await reviewer.fetch(`/api/lots/${lot.id}/export?format=xlsx`);
    expect(xlsx.status).toBe(200);
    const wb = XLSX.read(Buffer.from(await xlsx.arrayBuffer()), { type: "buffer" });
    const rows = XLSX.utils.sheet_to_json<unknown[]>(wb.Sheets["Stock adjustments"]!, { header: 1, defval: null });
    expect(rows[0]!.slice(2, 5)).toEqual(["Before (kg)", "After (kg)", "Change (kg)"]);
    expect(rows.slice(1).map((r) => [r[2], r[3], r[5], r[6]])).toEqual([
      [2.2, 2.0, "Sample sent out", "to the customer's lab"],
      [2.5, 2.2, "Recount", null],
    ]);
    const csv = await (await production.fetch(`/api/lots/${lot.id}/export?format=csv`)).text();
    expect(csv).toContain("[Stock adjustments]");
    expect(csv).toContain('"Sample sent out"');
  });

  it("leaves the lot correction route refusing quantities (422 on the body)", async () => {
    const lot = await receive(`ADJ-${stamp}-5`);
    const res = await production.fetch(`/api/lots/${lot.id}`, { method: "PATCH", json: { version: 1, quantityOnHand: 1 } });
    expect(res.status).toBe(422);
    expect(((await (await production.fetch(`/api/lots/${lot.id}`)).json()) as Lot).quantityOnHand).toBe(2.5);
  });
});
