/**
 * Safety data sheets and certificates of analysis over HTTP, stored through
 * the S3 API on the local fake server: type checked by content, size limit,
 * only the owning team gets a signed, short-lived link.
 */
import { beforeAll, describe, expect, it } from "vitest";
import { library } from "./fixtures";
import { anonymous, demo, signIn, signUp, type Client } from "./http";

let formulator: Client, production: Client, reviewer: Client, other: Client;
let teosId: string, releasedId: string;
const stamp = Date.now().toString(36);
const PDF = `%PDF-1.4\n1 0 obj <<>> endobj\ntrailer <<>>\n%% safety data sheet ${stamp}\n%%EOF\n`;

function send(client: Client, body: string | Uint8Array, fileName: string, fields: Record<string, string>) {
  const form = new FormData();
  form.set("file", new Blob([typeof body === "string" ? body : new Uint8Array(body)], { type: "application/pdf" }), fileName);
  for (const [k, v] of Object.entries(fields)) form.set(k, v);
  return client.fetch("/api/attachments", { method: "POST", body: form });
}

beforeAll(async () => {
  [formulator, production, reviewer] = await Promise.all([signIn(demo.formulator), signIn(demo.production), signIn(demo.reviewer)]);
  teosId = (await library(formulator)).get("teos")!.id;
  const list = (await (await formulator.fetch("/api/formulations?pageSize=100")).json()) as { rows: { id: string; name: string }[] };
  const f = list.rows.find((r) => r.name === "Visor hard coat HC-3")!.id;
  releasedId = ((await (await formulator.fetch(`/api/formulations/${f}`)).json()) as { revisions: { id: string; state: string }[] }).revisions.find((r) => r.state === "released")!.id;
  other = await signUp(`files-${stamp}@elsewhere.example`, "Fay Files");
  expect((await other.fetch("/api/teams", { method: "POST", json: { name: `Files Lab ${stamp}` } })).status).toBe(201);
});

describe("attachments", () => {
  it("stores a safety data sheet for a material and hands the team a signed, short-lived link to it", async () => {
    const res = await send(formulator, PDF, "TEOS SDS.pdf", { ownerType: "material", ownerId: teosId, kind: "sds" });
    expect(res.status).toBe(201);
    const created = (await res.json()) as { id: string; sizeBytes: number; kind: string; contentType: string };
    expect(created).toMatchObject({ kind: "sds", contentType: "application/pdf", sizeBytes: PDF.length });

    const list = (await (await reviewer.fetch(`/api/attachments?ownerType=material&ownerId=${teosId}`)).json()) as { rows: { id: string }[] };
    expect(list.rows.map((r) => r.id)).toContain(created.id);

    const link = (await (await production.fetch(`/api/attachments/${created.id}`)).json()) as { url: string; expiresInSeconds: number };
    expect(link.expiresInSeconds).toBe(300);
    expect(link.url).toContain("X-Amz-Expires=300");
    expect(link.url).toContain("X-Amz-Signature=");
    const file = await fetch(link.url);
    expect(file.status).toBe(200);
    expect(file.headers.get("content-disposition")).toContain('filename="TEOS SDS.pdf"');
    expect(await file.text()).toBe(PDF);

    const redirect = await production.fetch(`/api/attachments/${created.id}?download=1`);
    expect(redirect.status).toBe(303);
    expect(redirect.headers.get("location")).toContain("X-Amz-Signature=");
  });

  it("refuses other teams (404), signed-out users (401) and roles that may not upload (403)", async () => {
    const created = (await (await send(formulator, PDF, "coa.pdf", { ownerType: "material", ownerId: teosId, kind: "coa" })).json()) as { id: string };
    expect((await other.fetch(`/api/attachments/${created.id}`)).status).toBe(404);
    expect((await other.fetch(`/api/attachments?ownerType=material&ownerId=${teosId}`)).status).toBe(404);
    expect((await send(other, PDF, "x.pdf", { ownerType: "material", ownerId: teosId })).status).toBe(404);
    expect((await anonymous().fetch(`/api/attachments/${created.id}`)).status).toBe(401);
    expect((await send(production, PDF, "x.pdf", { ownerType: "material", ownerId: teosId })).status).toBe(403);
    expect((await production.fetch(`/api/attachments/${created.id}`, { method: "DELETE" })).status).toBe(403);
    expect((await formulator.fetch(`/api/attachments/${created.id}`, { method: "DELETE" })).status).toBe(204);
    expect((await formulator.fetch(`/api/attachments/${created.id}`)).status).toBe(404);
  });

  it("checks the type by content and the size, whatever the file is called", async () => {
    const notPdf = await send(formulator, "Name,Kind\r\n", "sds.pdf", { ownerType: "material", ownerId: teosId });
    expect(notPdf.status).toBe(415);
    expect(((await notPdf.json()) as { error: { message: string } }).error.message).toMatch(/not a PDF/);
    const truncated = await send(formulator, "%PDF-1.4\n1 0 obj", "cut.pdf", { ownerType: "material", ownerId: teosId });
    expect(truncated.status).toBe(415);
    const big = new Uint8Array(11 * 1024 * 1024).fill(32);
    big.set(new TextEncoder().encode("%PDF-1.4"), 0);
    expect((await send(formulator, big, "big.pdf", { ownerType: "material", ownerId: teosId })).status).toBe(413);
    expect((await send(formulator, PDF, "x.pdf", { ownerType: "nothing", ownerId: teosId })).status).toBe(422);
  });

  it("attaches a certificate of analysis to an open batch record, and refuses once the record is closed", async () => {
    const batch = (await (await production.fetch("/api/batches", { method: "POST", json: { revisionId: releasedId } })).json()) as {
      id: string;
      lines: { index: number; role: string; targetGrams: number }[];
    };
    expect((await send(production, PDF, "coa-lot-1.pdf", { ownerType: "batch", ownerId: batch.id, kind: "coa" })).status).toBe(201);
    expect((await send(formulator, PDF, "coa.pdf", { ownerType: "batch", ownerId: batch.id, kind: "coa" })).status).toBe(403);
    for (const line of batch.lines) {
      await production.fetch(`/api/batches/${batch.id}/lines/${line.index}`, { method: "PATCH", json: { actualGrams: line.targetGrams, lotNumber: "L1" } });
    }
    expect((await production.fetch(`/api/batches/${batch.id}/close`, { method: "POST" })).status).toBe(200);
    expect((await send(production, PDF, "late.pdf", { ownerType: "batch", ownerId: batch.id, kind: "coa" })).status).toBe(409);
    const list = (await (await formulator.fetch(`/api/attachments?ownerType=batch&ownerId=${batch.id}`)).json()) as { rows: unknown[] };
    expect(list.rows.length).toBe(1);
  });
});
