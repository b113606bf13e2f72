/**
 * Correcting a material lot over HTTP (PATCH /api/lots/:id): production
 * corrects a lot and the audit trail keeps `lot.updated` with the changed
 * fields only; a stale version and a supplier lot number the material
 * already has are 409s that change nothing; a reviewer is refused (403).
 */
import { beforeAll, describe, expect, it } from "vitest";
import { demo, signIn, type Client } from "./http";

interface Lot {
  id: string;
  materialId: string;
  supplier: string;
  supplierLot: string;
  expiresOn: string | null;
  measuredAssay: number | null;
  notes: string | null;
  quantityOnHand: number;
  version: number;
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
    json: { materialId, supplier: "Correction Supplies", supplierLot, quantity: 250, unit: "g", receivedOn: "2026-01-10", expiresOn: "2027-01-10" },
  });
  expect(res.status).toBe(201);
  return (await res.json()) as Lot;
}

describe("PATCH /api/lots/:id", () => {
  it("returns the corrected lot and audits lot.updated with the changed fields only", async () => {
    const lot = await receive(`CORR-${stamp}-1`);
    const res = await production.fetch(`/api/lots/${lot.id}`, {
      method: "PATCH",
      json: { version: lot.version, expiresOn: "2026-12-01", measuredAssay: 0.962, supplier: "Correction Supplies" },
    });
    expect(res.status).toBe(200);
    const after = (await res.json()) as Lot;
    expect(after).toMatchObject({ expiresOn: "2026-12-01", measuredAssay: 0.962, supplier: "Correction Supplies", quantityOnHand: 250, version: lot.version + 1 });

    const audit = (await (await admin.fetch(`/api/audit?entityId=${lot.id}&action=lot.updated`)).json()) as {
      rows: { action: string; summary: { before: Record<string, unknown>; after: Record<string, unknown> } }[];
    };
    expect(audit.rows).toHaveLength(1);
    // The supplier was sent unchanged: not in the event.
    expect(audit.rows[0]!.summary).toEqual({
      before: { expiresOn: "2027-01-10", measuredAssay: null, version: 1 },
      after: { expiresOn: "2026-12-01", measuredAssay: 0.962, version: 2 },
    });

    // The assay cleared again with null.
    const cleared = await production.fetch(`/api/lots/${lot.id}`, { method: "PATCH", json: { version: 2, measuredAssay: null } });
    expect(cleared.status).toBe(200);
    expect(((await cleared.json()) as Lot).measuredAssay).toBeNull();
  });

  it("answers a stale version with 409 telling to reload, and keeps the saved correction", async () => {
    const lot = await receive(`CORR-${stamp}-2`);
    expect((await production.fetch(`/api/lots/${lot.id}`, { method: "PATCH", json: { version: 1, notes: "first" } })).status).toBe(200);
    const res = await admin.fetch(`/api/lots/${lot.id}`, { method: "PATCH", json: { version: 1, notes: "second" } });
    expect(res.status).toBe(409);
    const body = (await res.json()) as ErrorBody;
    expect(body.error.message).toMatch(/reload/);
    const now = (await (await production.fetch(`/api/lots/${lot.id}`)).json()) as Lot;
    expect(now).toMatchObject({ notes: "first", version: 2 });
  });

  it("answers a supplier lot number the material already has with 409 naming supplierLot", async () => {
    const taken = await receive(`CORR-${stamp}-3`);
    const lot = await receive(`CORR-${stamp}-4`);
    const res = await production.fetch(`/api/lots/${lot.id}`, { method: "PATCH", json: { version: 1, supplierLot: taken.supplierLot } });
    expect(res.status).toBe(409);
    expect(Object.keys((await res.json() as ErrorBody).error.fields ?? {})).toEqual(["supplierLot"]);
    expect(((await (await production.fetch(`/api/lots/${lot.id}`)).json()) as Lot).supplierLot).toBe(lot.supplierLot);
  });

  it("refuses a reviewer (403) and changes nothing", async () => {
    const lot = await receive(`CORR-${stamp}-5`);
    const res = await reviewer.fetch(`/api/lots/${lot.id}`, { method: "PATCH", json: { version: 1, measuredAssay: 0.5 } });
    expect(res.status).toBe(403);
    expect(((await (await production.fetch(`/api/lots/${lot.id}`)).json()) as Lot).measuredAssay).toBeNull();
  });
});
