/**
 * Who may call what: every API route against every role (a table whose
 * expected refusals come from each route's declaration, lib/http/route.ts,
 * and the roles in lib/permissions.ts), signed-out callers (401), and
 * another team's ids (404, nothing changed).
 */
import { existsSync, readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { coatInput, explorationBody, library, saveExploration, type LibraryMaterial } from "./fixtures";
import { AUTH_ALLOWED } from "@/lib/auth-http";
import { can, type Permission } from "@/lib/permissions";
import { LIBRARY_ROUTES, routeDeclarations, type Method } from "../helpers/route-declarations";
import { anonymous, demo, signIn, signUp, type Client } from "./http";

type Role = "admin" | "formulator" | "reviewer" | "production";
const clients = {} as Record<Role, Client>;
let lib: Map<string, LibraryMaterial>;
let ids: { formulation: string; draft: string; released: string; material: string; member: string; exploration: string; lot: string };
const stamp = Date.now().toString(36);

beforeAll(async () => {
  for (const role of ["admin", "formulator", "reviewer", "production"] as Role[]) clients[role] = await signIn(demo[role]);
  lib = await library(clients.formulator);
  const list = (await (await clients.formulator.fetch("/api/formulations?pageSize=100")).json()) as {
    rows: { id: string; name: string }[];
  };
  const hc3 = list.rows.find((r) => r.name === "Visor hard coat HC-3")!;
  const f = (await (await clients.formulator.fetch(`/api/formulations/${hc3.id}`)).json()) as {
    revisions: { id: string; state: string }[];
  };
  const monolith = list.rows.find((r) => r.name === "Silica–PDMS monolith M-1")!;
  const m = (await (await clients.formulator.fetch(`/api/formulations/${monolith.id}`)).json()) as { revisions: { id: string }[] };
  const members = (await (await clients.admin.fetch("/api/members")).json()) as { rows: { id: string; email: string }[] };
  ids = {
    formulation: hc3.id,
    released: f.revisions.find((r) => r.state === "released")!.id,
    draft: m.revisions[0]!.id,
    material: lib.get("ethanol")!.id,
    member: members.rows.find((x) => x.email === demo.production)!.id,
    exploration: "",
    lot: "",
  };
  // A lot of the demo data: the table only reads it or sends corrections that are refused.
  ids.lot = ((await (await clients.production.fetch("/api/lots")).json()) as { rows: { id: string }[] }).rows[0]!.id;
  // A saved exploration of the released revision (issue 16): the table only reads it.
  const firstComponent = ((await (await clients.formulator.fetch(`/api/revisions/${ids.released}`)).json()) as { input: { components: { materialId: string }[] } }).input.components[0]!.materialId;
  ids.exploration = await saveExploration(clients.formulator, hc3.id, explorationBody(ids.released, firstComponent, `Access table ${stamp}`));
});

type Expectation = Record<Role, number>;

interface Case {
  /** The route file's pattern under app/, e.g. "/api/revisions/[id]". */
  route: string;
  name: string;
  method: Method;
  path: () => string;
  body?: () => unknown;
  /** The status of a role the route's declaration lets through. The others get 403, derived from can(role, permission). */
  allowed: number;
  /** For a permission that depends on what the request is about: the kind this call is about (e.g. "material"); none when it is refused before that (unknown action, missing record). */
  kind?: string;
  /** The record is unreleased work: roles that see released work only (no formulation:readUnreleased) get 404, as for a missing record. */
  unreleased?: boolean;
}

const ROLES: Role[] = ["admin", "formulator", "reviewer", "production"];

/** What each route declares (lib/http/route.ts), read from the route files: "METHOD /api/…" → declaration. */
const declared = new Map(routeDeclarations().map((h) => [`${h.method} ${h.route}`, h]));

/** The status each role should get for a call, from the route's declaration and the roles' permissions. */
function expected(c: Case): Expectation {
  const entry = declared.get(`${c.method} ${c.route}`);
  if (!entry?.declared) throw new Error(`${c.method} ${c.route} declares nothing (${entry?.problem ?? "no such handler"})`);
  const d = entry.declared;
  const permission: Permission | null =
    d.kind === "permission" ? d.permission : d.kind === "by-kind" && c.kind !== undefined ? (d.permissions[c.kind] ?? null) : null;
  if (d.kind === "by-kind" && c.kind !== undefined && !permission) throw new Error(`${c.method} ${c.route}: ${d.mapName} has no "${c.kind}"`);
  const out = {} as Expectation;
  for (const role of ROLES) {
    if (permission && !can(role, permission)) out[role] = 403;
    else if (c.unreleased && !can(role, "formulation:readUnreleased")) out[role] = 404;
    else out[role] = c.allowed;
  }
  return out;
}

// Calls that read, or that fail validation after the permission check, so the table can run in any order.
const cases: Case[] = [
  { route: "/api/formulations", name: "list formulations", method: "GET", path: () => "/api/formulations", allowed: 200 },
  { route: "/api/formulations", name: "create formulation (invalid body)", method: "POST", path: () => "/api/formulations", body: () => ({}), allowed: 422 },
  { route: "/api/formulations/[id]", name: "get formulation", method: "GET", path: () => `/api/formulations/${ids.formulation}`, allowed: 200 },
  { route: "/api/formulations/[id]/diff", name: "diff revisions", method: "GET", path: () => `/api/formulations/${ids.formulation}/diff?from=1&to=2`, allowed: 200 },
  { route: "/api/formulations/[id]/charts", name: "control charts of a formulation", method: "GET", path: () => `/api/formulations/${ids.formulation}/charts`, allowed: 200 },
  { route: "/api/formulations/[id]/charts", name: "control charts (missing formulation)", method: "GET", path: () => "/api/formulations/missing/charts", allowed: 404 },
  { route: "/api/revisions/[id]", name: "get released revision", method: "GET", path: () => `/api/revisions/${ids.released}`, allowed: 200 },
  { route: "/api/revisions/[id]", name: "get draft revision", method: "GET", path: () => `/api/revisions/${ids.draft}`, allowed: 200, unreleased: true },
  { route: "/api/revisions/[id]", name: "save draft (invalid body)", method: "PUT", path: () => `/api/revisions/${ids.draft}`, body: () => ({ version: "x" }), allowed: 422 },
  { route: "/api/revisions/[id]/[action]", name: "approve a draft (wrong state)", method: "POST", path: () => `/api/revisions/${ids.draft}/approve`, body: () => ({}), kind: "approve", allowed: 409 },
  { route: "/api/revisions/[id]/[action]", name: "release a draft (wrong state)", method: "POST", path: () => `/api/revisions/${ids.draft}/release`, body: () => ({}), kind: "release", allowed: 409 },
  { route: "/api/revisions/[id]/[action]", name: "unknown action", method: "POST", path: () => `/api/revisions/${ids.draft}/explode`, body: () => ({}), allowed: 404 },
  { route: "/api/materials", name: "list materials", method: "GET", path: () => "/api/materials", allowed: 200 },
  { route: "/api/materials", name: "create material (invalid body)", method: "POST", path: () => "/api/materials", body: () => ({ material: {} }), allowed: 422 },
  { route: "/api/materials/[id]", name: "get material", method: "GET", path: () => `/api/materials/${ids.material}`, allowed: 200 },
  { route: "/api/materials/[id]", name: "update material (invalid body)", method: "PUT", path: () => `/api/materials/${ids.material}`, body: () => ({ material: { name: "" } }), allowed: 422 },
  { route: "/api/materials/[id]", name: "delete material (missing id)", method: "DELETE", path: () => "/api/materials/00000000-0000-0000-0000-000000000000", allowed: 404 },
  { route: "/api/members", name: "list members", method: "GET", path: () => "/api/members", allowed: 200 },
  { route: "/api/members/[id]", name: "change role (invalid role)", method: "PATCH", path: () => `/api/members/${ids.member}`, body: () => ({ role: "owner" }), allowed: 422 },
  { route: "/api/members/[id]", name: "remove member (missing id)", method: "DELETE", path: () => "/api/members/nobody", allowed: 404 },
  { route: "/api/invitations", name: "list invitations", method: "GET", path: () => "/api/invitations", allowed: 200 },
  { route: "/api/invitations", name: "invite (invalid e-mail)", method: "POST", path: () => "/api/invitations", body: () => ({ email: "nope", role: "formulator" }), allowed: 422 },
  { route: "/api/audit", name: "audit log", method: "GET", path: () => "/api/audit", allowed: 200 },
  { route: "/api/mailbox", name: "captured mail", method: "GET", path: () => "/api/mailbox", allowed: 200 },
  { route: "/api/compute", name: "compute", method: "POST", path: () => "/api/compute", body: () => coatInput(lib), allowed: 200 },
  { route: "/api/formulations/[id]/revisions", name: "start a new revision (missing formulation)", method: "POST", path: () => "/api/formulations/missing/revisions", body: () => ({}), allowed: 404 },
  { route: "/api/revisions/[id]/export", name: "export released revision", method: "GET", path: () => `/api/revisions/${ids.released}/export`, allowed: 200 },
  { route: "/api/materials/export", name: "export materials library", method: "GET", path: () => "/api/materials/export?format=csv", allowed: 200 },
  { route: "/api/templates/[kind]", name: "download formulation template", method: "GET", path: () => "/api/templates/formulation", allowed: 200 },
  { route: "/api/imports", name: "import materials (not multipart)", method: "POST", path: () => "/api/imports?kind=materials", body: () => ({}), kind: "materials", allowed: 400 },
  { route: "/api/imports/[id]", name: "get import preview (missing)", method: "GET", path: () => "/api/imports/missing", allowed: 404 },
  { route: "/api/imports/[id]", name: "discard import preview (missing)", method: "DELETE", path: () => "/api/imports/missing", allowed: 404 },
  { route: "/api/imports/[id]/confirm", name: "confirm import (missing)", method: "POST", path: () => "/api/imports/missing/confirm", body: () => ({}), allowed: 404 },
  { route: "/api/batches", name: "list batch records", method: "GET", path: () => "/api/batches", allowed: 200 },
  { route: "/api/batches", name: "start batch (invalid body)", method: "POST", path: () => "/api/batches", body: () => ({}), allowed: 422 },
  { route: "/api/batches/[id]", name: "get batch record (missing)", method: "GET", path: () => "/api/batches/missing", allowed: 404 },
  { route: "/api/batches/[id]", name: "batch notes (missing)", method: "PATCH", path: () => "/api/batches/missing", body: () => ({ notes: "x" }), allowed: 404 },
  { route: "/api/batches/[id]/lines/[index]", name: "record batch line (missing)", method: "PATCH", path: () => "/api/batches/missing/lines/0", body: () => ({ actualGrams: 1 }), allowed: 404 },
  { route: "/api/batches/[id]/close", name: "close batch (missing)", method: "POST", path: () => "/api/batches/missing/close", body: () => ({}), allowed: 404 },
  { route: "/api/batches/[id]/export", name: "export batch record (missing)", method: "GET", path: () => "/api/batches/missing/export", allowed: 404 },
  { route: "/api/batches/settings", name: "batch settings", method: "GET", path: () => "/api/batches/settings", allowed: 200 },
  { route: "/api/batches/settings", name: "change batch settings (invalid body)", method: "PUT", path: () => "/api/batches/settings", body: () => ({ toleranceFraction: 0 }), allowed: 422 },
  { route: "/api/team/settings", name: "team settings (currency)", method: "GET", path: () => "/api/team/settings", allowed: 200 },
  { route: "/api/team/settings", name: "change team currency (invalid body)", method: "PUT", path: () => "/api/team/settings", body: () => ({ currency: "EURO" }), allowed: 422 },
  { route: "/api/attachments", name: "list a material's attachments", method: "GET", path: () => `/api/attachments?ownerType=material&ownerId=${ids.material}`, kind: "material", allowed: 200 },
  { route: "/api/attachments", name: "attach to a material (not multipart)", method: "POST", path: () => "/api/attachments?ownerType=material", body: () => ({}), kind: "material", allowed: 400 },
  { route: "/api/attachments/[id]", name: "attachment link (missing)", method: "GET", path: () => "/api/attachments/missing", allowed: 404 },
  { route: "/api/attachments/[id]", name: "remove attachment (missing)", method: "DELETE", path: () => "/api/attachments/missing", allowed: 404 },
  // Issue 17, specifications and test results.
  { route: "/api/revisions/[id]/specifications", name: "released revision's specifications", method: "GET", path: () => `/api/revisions/${ids.released}/specifications`, allowed: 200 },
  { route: "/api/revisions/[id]/specifications", name: "draft's specifications", method: "GET", path: () => `/api/revisions/${ids.draft}/specifications`, allowed: 200, unreleased: true },
  { route: "/api/revisions/[id]/specifications", name: "replace specifications (invalid body)", method: "PUT", path: () => `/api/revisions/${ids.draft}/specifications`, body: () => ({ specifications: "x", version: 1 }), allowed: 422 },
  { route: "/api/batches/[id]/results", name: "batch test results (missing)", method: "GET", path: () => "/api/batches/missing/results", allowed: 404 },
  { route: "/api/batches/[id]/results", name: "enter a test result (invalid body)", method: "POST", path: () => "/api/batches/missing/results", body: () => ({}), allowed: 422 },
  { route: "/api/batches/[id]/results/[resultId]/acknowledge", name: "acknowledge a result (invalid body)", method: "POST", path: () => "/api/batches/missing/results/missing/acknowledge", body: () => ({}), allowed: 422 },
  // Creating a team needs only a signed-in person (a new account starts its own team).
  { route: "/api/teams", name: "create team (invalid body)", method: "POST", path: () => "/api/teams", body: () => ({ name: "" }), allowed: 422 },
  // Issue 17, lots, disposition and traceability.
  { route: "/api/lots", name: "list lots", method: "GET", path: () => "/api/lots", allowed: 200 },
  { route: "/api/lots", name: "receive lot (invalid body)", method: "POST", path: () => "/api/lots", body: () => ({ quantity: -1 }), allowed: 422 },
  { route: "/api/lots/[id]", name: "get lot (missing)", method: "GET", path: () => "/api/lots/missing", allowed: 404 },
  { route: "/api/lots/[id]", name: "correct lot (invalid body)", method: "PATCH", path: () => `/api/lots/${ids.lot}`, body: () => ({ version: 1 }), allowed: 422 },
  { route: "/api/lots/[id]", name: "correct lot (missing)", method: "PATCH", path: () => "/api/lots/missing", body: () => ({ version: 1, notes: "x" }), allowed: 404 },
  { route: "/api/lots/[id]", name: "correct lot (stale version)", method: "PATCH", path: () => `/api/lots/${ids.lot}`, body: () => ({ version: 999_999, notes: "never saved" }), allowed: 409 },
  { route: "/api/lots/[id]/adjustments", name: "list stock adjustments", method: "GET", path: () => `/api/lots/${ids.lot}/adjustments`, allowed: 200 },
  { route: "/api/lots/[id]/adjustments", name: "list stock adjustments (missing lot)", method: "GET", path: () => "/api/lots/missing/adjustments", allowed: 404 },
  { route: "/api/lots/[id]/adjustments", name: "adjust stock (invalid body)", method: "POST", path: () => `/api/lots/${ids.lot}/adjustments`, body: () => ({ version: 1, quantityOnHand: -1, reason: "recount" }), allowed: 422 },
  { route: "/api/lots/[id]/adjustments", name: "adjust stock (missing lot)", method: "POST", path: () => "/api/lots/missing/adjustments", body: () => ({ version: 1, quantityOnHand: 1, reason: "recount" }), allowed: 404 },
  { route: "/api/lots/[id]/adjustments", name: "adjust stock (stale version)", method: "POST", path: () => `/api/lots/${ids.lot}/adjustments`, body: () => ({ version: 999_999, quantityOnHand: 1, reason: "recount" }), allowed: 409 },
  { route: "/api/lots/[id]/export", name: "export lot trace (missing)", method: "GET", path: () => "/api/lots/missing/export?format=csv", allowed: 404 },
  { route: "/api/attachments", name: "list a lot's attachments (missing lot)", method: "GET", path: () => "/api/attachments?ownerType=lot&ownerId=missing", kind: "lot", allowed: 404 },
  { route: "/api/batches/[id]/lots", name: "lots of a batch (missing)", method: "GET", path: () => "/api/batches/missing/lots", allowed: 404 },
  { route: "/api/batches/[id]/lines/[index]/lot", name: "choose a lot for a line (missing)", method: "PUT", path: () => "/api/batches/missing/lines/0/lot", body: () => ({ lotId: "missing" }), allowed: 404 },
  { route: "/api/batches/[id]/disposition", name: "disposition status (missing)", method: "GET", path: () => "/api/batches/missing/disposition", allowed: 404 },
  { route: "/api/batches/[id]/disposition", name: "dispose batch (missing)", method: "POST", path: () => "/api/batches/missing/disposition", body: () => ({ disposition: "rejected" }), allowed: 404 },
  // Issue 16, saved design explorations: the same role rules as unreleased revisions (production sees none).
  { route: "/api/formulations/[id]/explorations", name: "list a formulation's explorations", method: "GET", path: () => `/api/formulations/${ids.formulation}/explorations`, allowed: 200 },
  { route: "/api/formulations/[id]/explorations", name: "save an exploration (invalid body)", method: "POST", path: () => `/api/formulations/${ids.formulation}/explorations`, body: () => ({ name: "" }), allowed: 422 },
  { route: "/api/explorations/[id]", name: "get a saved exploration", method: "GET", path: () => `/api/explorations/${ids.exploration}`, allowed: 200 },
  { route: "/api/explorations/[id]", name: "delete an exploration (missing)", method: "DELETE", path: () => "/api/explorations/00000000-0000-0000-0000-000000000000", allowed: 404 },
  { route: "/api/explorations/[id]/export", name: "export an exploration's points", method: "GET", path: () => `/api/explorations/${ids.exploration}/export?format=csv`, allowed: 200 },
  { route: "/api/formulations/[id]/revisions", name: "open a candidate as a draft (invalid input)", method: "POST", path: () => `/api/formulations/${ids.formulation}/revisions`, body: () => ({ input: { components: [] } }), allowed: 422 },
];

function call(client: Client, c: Case) {
  return client.fetch(c.path(), { method: c.method, json: c.body ? c.body() : undefined });
}

describe("role × route", () => {
  it("has a case for every handler that every route file under app/api declares", () => {
    const covered = new Set(cases.map((c) => `${c.method} ${c.route}`));
    const handlers = [...declared.values()].filter((h) => !LIBRARY_ROUTES.has(h.route));
    expect(handlers.length).toBeGreaterThan(40);
    expect(handlers.filter((h) => !h.declared).map((h) => `${h.method} ${h.route}: ${h.problem}`), "make these with route()").toEqual([]);
    const missing = handlers.filter((h) => !(h.declared?.kind === "access" && h.declared.access === "public") && !covered.has(`${h.method} ${h.route}`));
    expect(missing.map((h) => `${h.method} ${h.route}`), "add these to the table in this file").toEqual([]);
  });

  it("derives a refusal for some role from the declarations, and a pass for another (the table tests something)", () => {
    const all = cases.map(expected);
    expect(all.some((e) => Object.values(e).includes(403))).toBe(true);
    expect(all.filter((e) => ROLES.every((r) => e[r] !== 403)).length).toBeGreaterThan(10);
    // production lacks formulation:create (lib/permissions.ts), so it is refused a new formulation.
    expect(expected(cases[1]!)).toEqual({ admin: 422, formulator: 422, reviewer: 403, production: 403 });
    // lot:update is production's and admins' (lib/permissions.ts): a lot correction refuses formulators and reviewers.
    expect(expected(cases.find((c) => c.name === "correct lot (stale version)")!)).toEqual({ admin: 409, formulator: 403, reviewer: 403, production: 409 });
  });

  for (const c of cases) {
    it(`${c.method} ${c.name}: ${JSON.stringify(expected(c))}`, async () => {
      const got: Record<string, number> = {};
      for (const role of ROLES) got[role] = (await call(clients[role], c)).status;
      expect(got).toEqual(expected(c));
    });
  }

  it("answers 401 with the one error shape to a caller who is not signed in, on every route but the public ones", async () => {
    const anon = anonymous();
    for (const c of cases) {
      const res = await call(anon, c);
      expect(res.status, `${c.method} ${c.path()}`).toBe(401);
      const body = (await res.json()) as { error: { code: string; message: string } };
      expect(body.error.code).toBe("unauthorized");
    }
  });
});

describe("another team's records", () => {
  let other: Client;
  beforeAll(async () => {
    other = await signUp(`owner-${stamp}@elsewhere.example`, "Olive Other");
    const res = await other.fetch("/api/teams", { method: "POST", json: { name: `Other Lab ${stamp}` } });
    expect(res.status).toBe(201);
  });

  it("gives the other team its own library, seeded from the reference materials", async () => {
    const own = await library(other);
    expect(own.get("teos")?.id).toBeDefined();
    expect(own.get("teos")!.id).not.toBe(lib.get("teos")!.id);
  });

  it("answers 404 on every route given Larkspur's ids, and changes nothing", async () => {
    const before = await (await clients.admin.fetch(`/api/revisions/${ids.draft}`)).json();
    const beforeMaterial = await (await clients.admin.fetch(`/api/materials/${ids.material}`)).json();
    const beforeLot = await (await clients.admin.fetch(`/api/lots/${ids.lot}`)).json();
    const otherLib = await library(other);
    const probes: [Case["method"], string, unknown?][] = [
      ["GET", `/api/formulations/${ids.formulation}`],
      ["GET", `/api/formulations/${ids.formulation}/diff?from=1&to=2`],
      ["GET", `/api/formulations/${ids.formulation}/charts`],
      ["POST", `/api/formulations/${ids.formulation}/revisions`, {}],
      ["GET", `/api/revisions/${ids.draft}`],
      ["PUT", `/api/revisions/${ids.draft}`, { version: 1, input: coatInput(otherLib) }],
      ["POST", `/api/revisions/${ids.draft}/submit`, {}],
      ["POST", `/api/revisions/${ids.released}/archive`, {}],
      ["GET", `/api/materials/${ids.material}`],
      ["GET", `/api/revisions/${ids.released}/export`],
      ["GET", `/api/attachments?ownerType=material&ownerId=${ids.material}`],
      ["PUT", `/api/materials/${ids.material}`, { material: { ...otherLib.get("ethanol"), referenceId: undefined, updatedAt: undefined } }],
      ["DELETE", `/api/materials/${ids.material}`],
      ["PATCH", `/api/members/${ids.member}`, { role: "admin" }],
      ["DELETE", `/api/members/${ids.member}`],
      ["GET", `/api/revisions/${ids.draft}/specifications`],
      ["PUT", `/api/revisions/${ids.draft}/specifications`, { specifications: [], version: 1 }],
      ["GET", `/api/formulations/${ids.formulation}/explorations`],
      ["POST", `/api/formulations/${ids.formulation}/explorations`, explorationBody(ids.released, otherLib.get("teos")!.id)],
      ["GET", `/api/explorations/${ids.exploration}`],
      ["GET", `/api/explorations/${ids.exploration}/export?format=xlsx`],
      ["DELETE", `/api/explorations/${ids.exploration}`],
      ["POST", `/api/formulations/${ids.formulation}/revisions`, { input: coatInput(otherLib) }],
      ["GET", `/api/lots/${ids.lot}`],
      ["PATCH", `/api/lots/${ids.lot}`, { version: (beforeLot as { version: number }).version, supplier: "Taken over", measuredAssay: 0.5 }],
      ["GET", `/api/lots/${ids.lot}/adjustments`],
      ["POST", `/api/lots/${ids.lot}/adjustments`, { version: (beforeLot as { version: number }).version, quantityOnHand: 0, reason: "other", note: "taken over" }],
    ];
    for (const [method, path, json] of probes) {
      const res = await other.fetch(path, { method, json });
      expect(res.status, `${method} ${path}`).toBe(404);
    }
    const list = (await (await other.fetch("/api/formulations")).json()) as { total: number };
    expect(list.total).toBe(0);
    expect(await (await clients.admin.fetch(`/api/revisions/${ids.draft}`)).json()).toEqual(before);
    expect(await (await clients.admin.fetch(`/api/materials/${ids.material}`)).json()).toEqual(beforeMaterial);
    expect(await (await clients.admin.fetch(`/api/lots/${ids.lot}`)).json()).toEqual(beforeLot);
    const members = (await (await clients.admin.fetch("/api/members")).json()) as { rows: { id: string; role: string }[] };
    expect(members.rows.find((m) => m.id === ids.member)?.role).toBe("production");
    expect((await clients.admin.fetch(`/api/explorations/${ids.exploration}`)).status).toBe(200);
  });

  it("keeps the other team's saved exploration from Larkspur's members (404), and out of their lists", async () => {
    const otherLib = await library(other);
    const created = await other.fetch("/api/formulations", { method: "POST", json: { name: `Elsewhere coat ${stamp}`, input: coatInput(otherLib) } });
    expect(created.status).toBe(201);
    const { formulationId, revisionId } = (await created.json()) as { formulationId: string; revisionId: string };
    const theirs = await saveExploration(other, formulationId, explorationBody(revisionId, otherLib.get("teos")!.id, "Theirs"));
    for (const role of ["admin", "formulator"] as Role[]) {
      for (const [method, path] of [
        ["GET", `/api/explorations/${theirs}`],
        ["GET", `/api/explorations/${theirs}/export?format=csv`],
        ["DELETE", `/api/explorations/${theirs}`],
        ["GET", `/api/formulations/${formulationId}/explorations`],
        ["POST", `/api/formulations/${formulationId}/explorations`],
      ] as const) {
        const res = await clients[role].fetch(path, { method, json: method === "POST" ? explorationBody(revisionId, otherLib.get("teos")!.id) : undefined });
        expect(res.status, `${role} ${method} ${path}`).toBe(404);
      }
      // Their revision id in a body sent to Larkspur's formulation: not a revision of it (422 naming revisionId).
      const res = await clients[role].fetch(`/api/formulations/${ids.formulation}/explorations`, { method: "POST", json: explorationBody(revisionId, otherLib.get("teos")!.id) });
      expect(res.status, role).toBe(422);
      expect(Object.keys(((await res.json()) as { error: { fields: Record<string, string> } }).error.fields)).toContain("revisionId");
    }
    expect((await other.fetch(`/api/explorations/${theirs}`)).status).toBe(200);
  });
});

type Caller = Role | "anonymous";

interface AuthCase {
  method: "GET" | "POST";
  /** The path under /api/auth, e.g. "/sign-in/email". */
  path: string;
  name: string;
  query?: string;
  body?: unknown;
  /** Expected status per caller; every answer of 400 or more is in our error shape. */
  expect: Record<Caller, number>;
}

const everyone = (status: number): Record<Caller, number> => ({ anonymous: status, admin: status, formulator: status, reviewer: status, production: status });
const signedIn = (status: number): Record<Caller, number> => ({ ...everyone(status), anonymous: 401 });

// The sign-in library's endpoints we keep, called so that nothing changes (bad input, unknown ids).
const authCases: AuthCase[] = [
  { method: "GET", path: "/get-session", name: "own session", expect: everyone(200) },
  { method: "POST", path: "/sign-in/email", name: "sign in (invalid body)", body: {}, expect: everyone(422) },
  { method: "POST", path: "/sign-up/email", name: "sign up (invalid body)", body: {}, expect: everyone(422) },
  { method: "POST", path: "/sign-out", name: "sign out (no session cookie sent)", body: {}, expect: everyone(200) },
  { method: "POST", path: "/request-password-reset", name: "ask for a reset link (invalid body)", body: {}, expect: everyone(422) },
  { method: "POST", path: "/reset-password", name: "set a new password (invalid body)", body: {}, expect: everyone(422) },
  { method: "GET", path: "/reset-password/:token", name: "open a reset link (unknown token)", query: "?callbackURL=%2Freset-password", expect: everyone(302) },
  { method: "GET", path: "/verify-email", name: "open a confirmation link (bad token)", query: "?token=not-a-token", expect: everyone(401) },
  { method: "POST", path: "/send-verification-email", name: "mail a confirmation link (invalid body)", body: {}, expect: everyone(422) },
  { method: "GET", path: "/organization/get-invitation", name: "see an invitation (unknown id)", query: "?id=missing", expect: signedIn(422) },
  { method: "POST", path: "/organization/accept-invitation", name: "accept an invitation (unknown id)", body: { invitationId: "missing" }, expect: signedIn(422) },
];

/** Every endpoint path the sign-in library and its organization plugin define, read from the installed package. */
function libraryAuthPaths(): string[] {
  const roots = ["node_modules/better-auth/dist/api/routes", "node_modules/better-auth/dist/plugins/organization/routes"].map((r) => join(process.cwd(), r));
  const out = new Set<string>();
  for (const root of roots) {
    if (!existsSync(root)) continue;
    for (const f of readdirSync(root).filter((n) => n.endsWith(".mjs"))) {
      for (const m of readFileSync(join(root, f), "utf8").matchAll(/createAuthEndpoint\("([^"]+)"/g)) out.add(m[1]!);
    }
  }
  return [...out].sort();
}

describe("the sign-in library's routes (/api/auth/*)", () => {
  let callers: Record<Caller, Client>;
  beforeAll(() => {
    callers = { ...clients, anonymous: anonymous() };
  });

  it("has a row for every endpoint we keep open, and the library defines each of them", () => {
    const kept = Object.entries(AUTH_ALLOWED).flatMap(([method, patterns]) =>
      patterns.map((p) => `${method} ${p.source.replace(/^\^|\$$/g, "").replace(/\\\//g, "/").replace("[^/]+", ":token")}`),
    );
    expect(new Set(authCases.map((c) => `${c.method} ${c.path}`))).toEqual(new Set(kept));
    const defined = libraryAuthPaths();
    expect(defined.length).toBeGreaterThan(40);
    for (const c of authCases) expect(defined, c.path).toContain(c.path);
  });

  for (const c of authCases) {
    it(`${c.method} ${c.path} ${c.name}: ${JSON.stringify(c.expect)}`, async () => {
      const got: Record<string, number> = {};
      for (const who of Object.keys(c.expect) as Caller[]) {
        // Signing out is called without the session cookie, so the table's sessions stay valid.
        const client = c.path === "/sign-out" ? anonymous() : callers[who];
        const res = await client.fetch(`/api/auth${c.path.replace(":token", "no-such-token")}${c.query ?? ""}`, { method: c.method, json: c.body });
        got[who] = res.status;
        if (res.status >= 400) {
          const body = (await res.json()) as { error?: { code?: unknown; message?: unknown } };
          expect(typeof body.error?.code, `${who} ${c.path}`).toBe("string");
          expect(typeof body.error?.message, `${who} ${c.path}`).toBe("string");
        }
      }
      expect(got).toEqual(c.expect);
    });
  }

  it("answers 404 in our error shape to every other endpoint of the library, for every caller and method", async () => {
    const kept = new Set(authCases.map((c) => c.path));
    const closed = libraryAuthPaths().filter((p) => !kept.has(p));
    expect(closed).toEqual(expect.arrayContaining(["/organization/update-member-role", "/organization/remove-member", "/organization/invite-member", "/update-user", "/change-email", "/delete-user"]));
    for (const path of closed) {
      for (const who of ["anonymous", "admin", "production"] as Caller[]) {
        for (const method of ["GET", "POST"] as const) {
          const res = await callers[who].fetch(`/api/auth${path.replace(/:\w+/g, "x")}`, { method, json: method === "POST" ? {} : undefined });
          expect(res.status, `${who} ${method} ${path}`).toBe(404);
          const body = (await res.json()) as { error: { code: string; message: string } };
          expect(body.error.code, `${who} ${method} ${path}`).toBe("not_found");
        }
      }
    }
  });

  it("refuses the kept endpoints under another method, and paths the library does not have", async () => {
    for (const [method, path] of [
      ["GET", "/sign-in/email"],
      ["POST", "/get-session"],
      ["PUT", "/sign-in/email"],
      ["POST", "/Organization/Accept-Invitation"],
      ["POST", "/no-such-endpoint"],
    ] as const) {
      const res = await callers.admin.fetch(`/api/auth${path}`, { method, json: method === "GET" ? undefined : {} });
      expect(res.status, `${method} ${path}`).toBe(method === "PUT" ? 405 : 404);
    }
  });
});
