/**
 * Names and notes people type, over HTTP: too long, a lone UTF-16
 * surrogate, invisible, bidirectional overrides and control characters are
 * 422 naming the field; two creates of one name at the same moment are one
 * 201 and one 409 naming the field, never a 500. Batch notes and initials
 * changes show up in the audit trail.
 */
import { beforeAll, describe, expect, it } from "vitest";
import { coatInput, library, type LibraryMaterial } from "./fixtures";
import { anonymous, demo, signIn, type Client } from "./http";

let formulator: Client, admin: Client, production: Client;
let lib: Map<string, LibraryMaterial>;
let ethanol: Record<string, unknown>;
const stamp = Date.now().toString(36);

interface ErrorBody {
  error: { code: string; message: string; fields?: Record<string, string> };
}

/** Names no one can read or that read differently than they are stored. */
const HOSTILE_NAMES: [string, string][] = [
  ["a zero-width space only", "\u200B"],
  ["a word joiner only", "\u2060"],
  ["a byte-order mark only", "\uFEFF"],
  ["a soft hyphen only", "\u00AD"],
  ["white space only", "   \u3000 "],
  ["a right-to-left override", `Ethanol\u202Elonahte ${stamp}`],
  ["a left-to-right isolate", `Ethanol \u2066x\u2069 ${stamp}`],
  ["a right-to-left mark", `Ethanol\u200F ${stamp}`],
  ["a NUL character", `Ethanol\u0000 ${stamp}`],
  ["an escape character", `Ethanol\u001B[31m ${stamp}`],
  ["a lone high surrogate", `Ethanol \uD83D ${stamp}`],
  ["a lone low surrogate", `Ethanol \uDE00 ${stamp}`],
];

beforeAll(async () => {
  [formulator, admin, production] = await Promise.all([signIn(demo.formulator), signIn(demo.admin), signIn(demo.production)]);
  lib = await library(formulator);
  const { referenceId: _r, updatedAt: _u, id: _i, ...material } = lib.get("ethanol")!;
  void _r; void _u; void _i;
  ethanol = material;
});

/** Sends `body` as JSON text (JSON.stringify writes a lone surrogate as a \u escape, as a hostile client would). */
function send(client: Client, method: string, path: string, body: unknown) {
  return client.fetch(path, { method, body: JSON.stringify(body), headers: { "content-type": "application/json" } });
}

async function expect422(res: Response, field: string): Promise<void> {
  const text = await res.text();
  expect(res.status, text).toBe(422);
  const body = JSON.parse(text) as ErrorBody;
  expect(Object.keys(body.error.fields ?? {}), text).toContain(field);
}

describe("material names", () => {
  it("returns 201 for a 200-character name and 422 naming material.name for 201 characters", async () => {
    const ok = await send(formulator, "POST", "/api/materials", { material: { ...ethanol, id: "x", name: `${stamp}-`.padEnd(200, "x") } });
    expect(ok.status).toBe(201);
    const id = ((await ok.json()) as { id: string }).id;
    const long = `${stamp}-`.padEnd(201, "y");
    await expect422(await send(formulator, "POST", "/api/materials", { material: { ...ethanol, id: "x", name: long } }), "material.name");
    await expect422(await send(formulator, "PUT", `/api/materials/${id}`, { material: { ...ethanol, id, name: long } }), "material.name");
    expect((await admin.fetch(`/api/materials/${id}`, { method: "DELETE" })).status).toBe(204);
  });

  for (const [label, name] of HOSTILE_NAMES) {
    it(`returns 422 naming material.name for ${label}`, async () => {
      await expect422(await send(formulator, "POST", "/api/materials", { material: { ...ethanol, id: "x", name } }), "material.name");
    });
  }

  it("returns one 201 and one 409 naming material.name for two creates of one name at the same moment", async () => {
    for (let round = 0; round < 4; round++) {
      const name = `Isopropanol ${stamp} ${round}`;
      const [a, b] = await Promise.all([
        send(formulator, "POST", "/api/materials", { material: { ...ethanol, id: "x", name } }),
        send(admin, "POST", "/api/materials", { material: { ...ethanol, id: "x", name } }),
      ]);
      expect([a.status, b.status].sort()).toEqual([201, 409]);
      const refused = (await (a.status === 409 ? a : b).json()) as ErrorBody;
      expect(Object.keys(refused.error.fields ?? {})).toEqual(["material.name"]);
      expect(refused.error.message).toContain(name);
      const created = (await (a.status === 201 ? a : b).json()) as { id: string };
      expect((await admin.fetch(`/api/materials/${created.id}`, { method: "DELETE" })).status).toBe(204);
    }
  });
});

describe("formulation and team names", () => {
  for (const [label, name] of HOSTILE_NAMES) {
    it(`returns 422 naming name for a formulation or a team with ${label}`, async () => {
      await expect422(await send(formulator, "POST", "/api/formulations", { name, input: coatInput(lib) }), "name");
      await expect422(await send(admin, "POST", "/api/teams", { name }), "name");
    });
  }

  it("returns one 201 and one 409 naming name for two creates of one formulation name at the same moment", async () => {
    const name = `Same name race ${stamp}`;
    const [a, b] = await Promise.all([
      send(formulator, "POST", "/api/formulations", { name, input: coatInput(lib) }),
      send(admin, "POST", "/api/formulations", { name, input: coatInput(lib) }),
    ]);
    expect([a.status, b.status].sort()).toEqual([201, 409]);
    const refused = (await (a.status === 409 ? a : b).json()) as ErrorBody;
    expect(Object.keys(refused.error.fields ?? {})).toEqual(["name"]);
  });
});

describe("display names at sign-up", () => {
  it.each(HOSTILE_NAMES)("returns 422 in our error shape for %s, and no account is made", async (_label, name) => {
    const email = `name-${stamp}-${Math.random().toString(36).slice(2, 8)}@names.example`;
    const res = await anonymous().fetch("/api/auth/sign-up/email", { method: "POST", json: { email, password: "a-test-password-1", name } });
    expect(res.status).toBe(422);
    const body = (await res.json()) as ErrorBody;
    expect(body.error.message).toMatch(/^Name must /);
    // The same address can still sign up with a readable name: nothing was kept of the refused try.
    const ok = await anonymous().fetch("/api/auth/sign-up/email", { method: "POST", json: { email, password: "a-test-password-1", name: "Ada Readable" } });
    expect(ok.status).toBe(200);
  });
});

describe("batch notes and initials", () => {
  let batchId = "";

  beforeAll(async () => {
    const list = (await (await formulator.fetch("/api/formulations?pageSize=100")).json()) as { rows: { id: string; name: string }[] };
    const hc3 = list.rows.find((r) => r.name === "Visor hard coat HC-3")!;
    const revs = (await (await formulator.fetch(`/api/formulations/${hc3.id}`)).json()) as { revisions: { id: string; state: string }[] };
    const released = revs.revisions.find((r) => r.state === "released")!.id;
    const res = await production.fetch("/api/batches", { method: "POST", json: { revisionId: released, notes: "Names test" } });
    expect(res.status).toBe(201);
    batchId = ((await res.json()) as { id: string }).id;
  });

  it("returns 422 naming notes or initials for invisible, bidi and control characters", async () => {
    await expect422(await send(production, "PATCH", `/api/batches/${batchId}`, { notes: "\u200B\u200B" }), "notes");
    await expect422(await send(production, "PATCH", `/api/batches/${batchId}`, { notes: "ok \u202E" }), "notes");
    await expect422(await send(production, "PATCH", `/api/batches/${batchId}/lines/0`, { initials: "A\u202EB" }), "initials");
    await expect422(await send(production, "PATCH", `/api/batches/${batchId}/lines/0`, { lotNumber: "L\u0000" }), "lotNumber");
  });

  it("returns the notes and initials changes in the batch's audit trail, before and after", async () => {
    expect((await send(production, "PATCH", `/api/batches/${batchId}`, { notes: "Line 1\nline 2" })).status).toBe(200);
    expect((await send(production, "PATCH", `/api/batches/${batchId}/lines/0`, { initials: "PP" })).status).toBe(200);
    const audit = (await (await admin.fetch(`/api/audit?entityId=${batchId}`)).json()) as { rows: { action: string; summary: unknown }[] };
    const notes = audit.rows.find((r) => r.action === "batch.notes_changed");
    expect(notes?.summary).toEqual({ before: { notes: "Names test" }, after: { notes: "Line 1\nline 2" } });
    const line = audit.rows.find((r) => r.action === "batch.line_recorded");
    expect(line?.summary).toMatchObject({ before: { initials: null }, after: { initials: "PP" } });
  });
});
