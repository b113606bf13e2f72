/**
 * A corpus of bad input against every write route: wrong types, missing and
 * extra fields, huge numbers, NaN and Infinity strings, unicode, oversized and
 * malformed bodies. Every case must get a 4xx in the one error shape, naming
 * the field, never a 500 or a stack trace, and the database must not change.
 */
import { beforeAll, describe, expect, it } from "vitest";
import { formulationInputSchema, materialSchema } from "@/lib/formulation";
import { coatInput, explorationBody, library } from "./fixtures";
import { saveExplorationSchema } from "@/lib/validations/explorations";
import { demo, signIn, type Client } from "./http";
import { APPEARANCE_SPEC, releasedWithSpecs, VISCOSITY_SPEC } from "./quality-fixtures";

type Json = null | boolean | number | string | Json[] | { [k: string]: Json };

interface BadCase {
  label: string;
  client: () => Client;
  method: string;
  path: () => string;
  body: string | (() => FormData);
  /** Dotted path the error should name (its first two segments are checked). */
  field?: string;
}

const NUMBER_BAD: Json[] = ["abc", null, true, [], {}, "NaN", "Infinity", "1e999"];
/** Names that cannot be read, read differently than stored, or break the text: refused with 422 naming the field. */
const NAME_BAD: string[] = [
  "\u200B",
  "\u2060\u2060",
  "\uFEFF",
  "\u00AD",
  " \t ",
  "\u3164",
  "Resin\u202Etxt.exe",
  "Resin \u2066isolate\u2069",
  "Resin\u200E",
  "Resin\u061C",
  "Resin\u0000",
  "Resin\u0007",
  "Resin \uD800",
  "Resin \uDFFF",
  "x".repeat(201),
];
const STRING_BAD: Json[] = [12345, null, false, [], { x: 1 }];

/** Every leaf of a JSON value with its dotted path. */
function leaves(value: Json, prefix = ""): { path: string; value: Json }[] {
  if (value === null || typeof value !== "object") return [{ path: prefix, value }];
  const entries = Array.isArray(value) ? value.map((v, i) => [String(i), v] as const) : Object.entries(value);
  return entries.flatMap(([k, v]) => leaves(v, prefix ? `${prefix}.${k}` : k));
}

function setAt(root: Json, path: string, value: Json | undefined): Json {
  const copy = structuredClone(root) as Record<string, Json>;
  const keys = path.split(".");
  let node = copy as Record<string, Json>;
  for (const k of keys.slice(0, -1)) node = node[k] as Record<string, Json>;
  const last = keys[keys.length - 1]!;
  if (value === undefined) {
    if (Array.isArray(node)) node.splice(Number(last), 1);
    else delete node[last];
  } else node[last] = value;
  return copy;
}

/** Mutations of a valid body that must each be refused. */
function mutations(
  valid: Json,
  skip: (path: string) => boolean,
  accepts: (body: Json) => boolean,
): { label: string; body: Json; field: string }[] {
  const out: { label: string; body: Json; field: string }[] = [];
  for (const { path, value } of leaves(valid)) {
    if (skip(path)) continue;
    const bad = typeof value === "number" ? NUMBER_BAD : typeof value === "string" ? STRING_BAD : [];
    for (const b of bad) out.push({ label: `${path} = ${JSON.stringify(b)}`, body: setAt(valid, path, b), field: path });
    // Negative temperatures are real (a glass transition of −125 °C); every other number here must be ≥ 0.
    if (typeof value === "number" && !/C$/.test(path)) {
      out.push({ label: `${path} = -1`, body: setAt(valid, path, -1), field: path });
    }
  }
  // A value the shared schema accepts (null for a nullable CAS number) is not bad input.
  return out.filter((m) => !accepts(m.body));
}

let formulator: Client, admin: Client, production: Client;
let batchId = "";
let draftId = "";
let materialId = "";
let memberId = "";
/** A lot the correction cases aim at (received 2020-01-01); the snapshot checks it never changes. */
let correctedLotId = "";
let validInput: Json;
let validMaterial: Json;
const cases: BadCase[] = [];

async function snapshot() {
  const f = (await (await admin.fetch("/api/formulations?pageSize=200&sort=name")).json()) as { total: number; rows: unknown[] };
  const m = (await (await admin.fetch("/api/materials?pageSize=500")).json()) as { total: number; rows: unknown[] };
  const d = await (await admin.fetch(`/api/revisions/${draftId}`)).json();
  const mem = await (await admin.fetch("/api/members")).json();
  const a = (await (await admin.fetch("/api/audit?pageSize=1")).json()) as { total: number };
  const batches = await (await admin.fetch("/api/batches")).json();
  const batch = await (await admin.fetch(`/api/batches/${batchId}`)).json();
  const attachments = await (await admin.fetch(`/api/attachments?ownerType=material&ownerId=${materialId}`)).json();
  const teamSettings = await (await admin.fetch("/api/team/settings")).json();
  const lot = await (await admin.fetch(`/api/lots/${correctedLotId}`)).json();
  const adjustments = await (await admin.fetch(`/api/lots/${correctedLotId}/adjustments`)).json();
  return { f, m, d, mem, audit: a.total, batches, batch, attachments, teamSettings, lot, adjustments };
}

beforeAll(async () => {
  formulator = await signIn(demo.formulator);
  admin = await signIn(demo.admin);
  production = await signIn(demo.production);
  const lib = await library(formulator);
  validInput = coatInput(lib) as unknown as Json;
  const list = (await (await formulator.fetch("/api/formulations?pageSize=100")).json()) as { rows: { id: string; name: string }[] };
  const monolith = list.rows.find((r) => r.name === "Silica–PDMS monolith M-1")!;
  const f = (await (await formulator.fetch(`/api/formulations/${monolith.id}`)).json()) as { revisions: { id: string }[] };
  draftId = f.revisions[0]!.id;
  const ethanol = lib.get("ethanol")!;
  materialId = ethanol.id;
  const { referenceId: _r, updatedAt: _u, ...material } = ethanol;
  void _r; void _u;
  validMaterial = material as Json;
  const members = (await (await admin.fetch("/api/members")).json()) as { rows: { id: string; email: string }[] };
  memberId = members.rows.find((m) => m.email === demo.production)!.id;

  // Material ids are referenced by the rest of the input; changing them is a different test.
  const skipInput = (p: string) => /(^|\.)id$|sources|hazards|formula$|name$/.test(p);
  const skipMaterial = (p: string) => /sources|hazards|^formula$|^id$/.test(p);
  const f2 = () => formulator;
  const a = () => admin;
  for (const m of mutations(validInput, skipInput, (b) => formulationInputSchema.safeParse(b).success)) {
    cases.push({ label: `compute ${m.label}`, client: f2, method: "POST", path: () => "/api/compute", body: JSON.stringify(m.body), field: m.field });
    cases.push({
      label: `create formulation input.${m.label}`,
      client: f2,
      method: "POST",
      path: () => "/api/formulations",
      body: JSON.stringify({ name: "Bad input probe", input: m.body }),
      field: `input.${m.field}`,
    });
    cases.push({
      label: `save draft input.${m.label}`,
      client: f2,
      method: "PUT",
      path: () => `/api/revisions/${draftId}`,
      body: JSON.stringify({ version: 1, input: m.body }),
      field: `input.${m.field}`,
    });
  }
  for (const m of mutations(validMaterial, skipMaterial, (b) => materialSchema.safeParse(b).success)) {
    const renamesIt = m.field === "name";
    cases.push({
      label: `update material ${m.label}`,
      client: f2,
      method: "PUT",
      path: () => `/api/materials/${materialId}`,
      body: JSON.stringify({ material: m.body }),
      field: `material.${m.field}`,
    });
    if (renamesIt) continue;
    cases.push({
      label: `create material ${m.label}`,
      client: f2,
      method: "POST",
      path: () => "/api/materials",
      body: JSON.stringify({ material: setAt(m.body, "name", "Bad input probe material") }),
      field: `material.${m.field}`,
    });
  }
  const simple: [string, () => Client, string, () => string, Json, string][] = [
    ["invite", a, "POST", () => "/api/invitations", { email: "not-an-address", role: "formulator" }, "email"],
    ["invite", a, "POST", () => "/api/invitations", { email: "x@y.example", role: "owner" }, "role"],
    ["invite", a, "POST", () => "/api/invitations", { email: "x@y.example" }, "role"],
    ["invite", a, "POST", () => "/api/invitations", { email: "é@☃.example", role: 7 }, "role"],
    ["invite", a, "POST", () => "/api/invitations", { email: "x@y.example", role: "formulator", extra: true }, "body"],
    ["change role", a, "PATCH", () => `/api/members/${memberId}`, { role: "" }, "role"],
    ["change role", a, "PATCH", () => `/api/members/${memberId}`, { role: null }, "role"],
    ["change role", a, "PATCH", () => `/api/members/${memberId}`, {}, "role"],
    ["change role", a, "PATCH", () => `/api/members/${memberId}`, { role: ["admin"] }, "role"],
    ["create team", a, "POST", () => "/api/teams", { name: "" }, "name"],
    ["create team", a, "POST", () => "/api/teams", { name: "x".repeat(500) }, "name"],
    ["create team", a, "POST", () => "/api/teams", { name: 42 }, "name"],
    ["return", () => formulator, "POST", () => `/api/revisions/${draftId}/submit`, { comment: 5 }, "comment"],
    ["create formulation", f2, "POST", () => "/api/formulations", { name: "", input: validInput }, "name"],
    ["create formulation", f2, "POST", () => "/api/formulations", { name: "ok", input: validInput, surprise: 1 }, "body"],
    ["create formulation", f2, "POST", () => "/api/formulations", { input: validInput }, "name"],
    ["create formulation", f2, "POST", () => "/api/formulations", { name: "x" }, "input"],
    ["save draft", f2, "PUT", () => `/api/revisions/${draftId}`, { input: validInput }, "version"],
    ["save draft", f2, "PUT", () => `/api/revisions/${draftId}`, { version: -3, input: validInput }, "version"],
    ["save draft", f2, "PUT", () => `/api/revisions/${draftId}`, { version: "1", input: validInput }, "version"],
    ["compute", f2, "POST", () => "/api/compute", [], "body"],
    ["compute", f2, "POST", () => "/api/compute", "just a string", "body"],
    ["compute", f2, "POST", () => "/api/compute", { ...(validInput as object), components: [] }, "components"],
  ];
  for (const name of NAME_BAD) {
    simple.push(["create formulation", f2, "POST", () => "/api/formulations", { name, input: validInput }, "name"]);
    simple.push(["create team", a, "POST", () => "/api/teams", { name }, "name"]);
    simple.push(["create material", f2, "POST", () => "/api/materials", { material: setAt(validMaterial, "name", name) }, "material.name"]);
    simple.push(["update material", f2, "PUT", () => `/api/materials/${materialId}`, { material: setAt(validMaterial, "name", name) }, "material.name"]);
  }
  for (const [label, client, method, path, body, field] of simple) {
    cases.push({ label: `${label} ${JSON.stringify(body).slice(0, 60)}`, client, method, path, body: JSON.stringify(body), field });
  }
  // Batch records: production's write routes.
  const hc3 = list.rows.find((r) => r.name === "Visor hard coat HC-3")!;
  const hc3Revs = (await (await formulator.fetch(`/api/formulations/${hc3.id}`)).json()) as { revisions: { id: string; state: string }[] };
  const released = hc3Revs.revisions.find((r) => r.state === "released")!.id;
  const started = await production.fetch("/api/batches", { method: "POST", json: { revisionId: released, notes: "bad-input corpus" } });
  batchId = ((await started.json()) as { id: string }).id;
  const p = () => production;
  const batchBad: [string, () => string, Json, string][] = [];
  // null is allowed here: it clears a line's mass.
  for (const v of NUMBER_BAD.filter((x) => x !== null).concat([-1, 1e12])) {
    batchBad.push(["PATCH", () => `/api/batches/${batchId}/lines/0`, { actualGrams: v }, "actualGrams"]);
  }
  for (const v of STRING_BAD.filter((x) => x !== null)) batchBad.push(["PATCH", () => `/api/batches/${batchId}/lines/0`, { lotNumber: v }, "lotNumber"]);
  batchBad.push(["PATCH", () => `/api/batches/${batchId}/lines/0`, { lotNumber: "L".repeat(101) }, "lotNumber"]);
  batchBad.push(["PATCH", () => `/api/batches/${batchId}/lines/0`, { initials: "ABCDEFGHIJKL" }, "initials"]);
  batchBad.push(["PATCH", () => `/api/batches/${batchId}/lines/0`, { actualGrams: 1, extra: 1 }, "body"]);
  for (const v of STRING_BAD.filter((x) => x !== null)) batchBad.push(["PATCH", () => `/api/batches/${batchId}`, { notes: v }, "notes"]);
  for (const v of NUMBER_BAD.concat([-1, 0, 11])) batchBad.push(["POST", () => "/api/batches", { revisionId: released, balanceResolutionGrams: v }, "balanceResolutionGrams"]);
  for (const v of STRING_BAD) batchBad.push(["POST", () => "/api/batches", { revisionId: v }, "revisionId"]);
  // Short forms that fit initials (10 characters); text that trims to nothing clears a field and is not bad input.
  const shortBad = NAME_BAD.map((n) => n.replace("Resin", "R").replace("isolate", "i")).filter((n) => n.length <= 10 && n.trim() !== "");
  for (const name of shortBad) {
    batchBad.push(["PATCH", () => `/api/batches/${batchId}/lines/0`, { initials: name }, "initials"]);
    batchBad.push(["PATCH", () => `/api/batches/${batchId}/lines/0`, { lotNumber: name }, "lotNumber"]);
    batchBad.push(["PATCH", () => `/api/batches/${batchId}`, { notes: name }, "notes"]);
    batchBad.push(["POST", () => "/api/batches", { revisionId: released, notes: name }, "notes"]);
  }
  for (const [method, path, body, field] of batchBad) {
    cases.push({ label: `batch ${method} ${JSON.stringify(body).slice(0, 50)}`, client: p, method, path, body: JSON.stringify(body), field });
  }
  // Issue 17, lots: receiving a lot, a line choosing one, disposing a batch.
  const startedBatch = (await (await production.fetch(`/api/batches/${batchId}`)).json()) as { lines: { materialId: string }[] };
  const lineMaterial = startedBatch.lines[0]!.materialId;
  const goodLot = { materialId: lineMaterial, supplier: "Bad-input Supplies", supplierLot: "BI-1", quantity: 100, unit: "g", receivedOn: "2026-01-10", expiresOn: "2027-01-10" };
  // An expired lot of line 0's material: choosing it is refused (expiry before today).
  const expiredRes = await production.fetch("/api/lots", {
    method: "POST",
    json: { ...goodLot, supplierLot: `BI-EXPIRED-${Date.now()}`, quantity: 1e6, receivedOn: "2020-01-01", expiresOn: "2020-06-01" },
  });
  const expiredLotId = ((await expiredRes.json()) as { id: string }).id;
  const lotBad: [string, () => string, Json, string][] = [];
  for (const v of NUMBER_BAD.concat([-1, 0, -0.001, 1e12])) lotBad.push(["POST", () => "/api/lots", { ...goodLot, quantity: v }, "quantity"]);
  for (const v of ["lb", "", "G", 5, null]) lotBad.push(["POST", () => "/api/lots", { ...goodLot, unit: v }, "unit"]);
  for (const v of ["2026-13-40", "2026-02-30", "yesterday", "10/01/2026", 20260110, null, ""]) lotBad.push(["POST", () => "/api/lots", { ...goodLot, receivedOn: v }, "receivedOn"]);
  for (const v of ["2026-01-09", "2025-12-31", "2027-02-29"]) lotBad.push(["POST", () => "/api/lots", { ...goodLot, expiresOn: v }, "expiresOn"]);
  for (const v of [0, -0.5, 1.01, 98, "0.9", "abc"]) lotBad.push(["POST", () => "/api/lots", { ...goodLot, measuredAssay: v }, "measuredAssay"]);
  for (const v of STRING_BAD) lotBad.push(["POST", () => "/api/lots", { ...goodLot, supplier: v }, "supplier"]);
  for (const name of NAME_BAD) lotBad.push(["POST", () => "/api/lots", { ...goodLot, supplierLot: name.slice(0, 101) }, "supplierLot"]);
  lotBad.push(["POST", () => "/api/lots", { ...goodLot, materialId: "00000000-0000-0000-0000-000000000000" }, "materialId"]);
  lotBad.push(["POST", () => "/api/lots", { ...goodLot, materialId: undefined as unknown as Json }, "materialId"]);
  lotBad.push(["POST", () => "/api/lots", { ...goodLot, extra: 1 }, "body"]);
  lotBad.push(["PUT", () => `/api/batches/${batchId}/lines/0/lot`, { lotId: expiredLotId }, "lotId"]);
  lotBad.push(["PUT", () => `/api/batches/${batchId}/lines/0/lot`, { lotId: "00000000-0000-0000-0000-000000000000" }, "lotId"]);
  for (const v of [12, [], {}, ""]) lotBad.push(["PUT", () => `/api/batches/${batchId}/lines/0/lot`, { lotId: v }, "lotId"]);
  lotBad.push(["PUT", () => `/api/batches/${batchId}/lines/0/lot`, { lotId: null, extra: 1 }, "body"]);
  for (const [method, path, body, field] of lotBad) {
    cases.push({ label: `lot ${method} ${JSON.stringify(body).slice(0, 70)}`, client: p, method, path, body: JSON.stringify(body), field });
  }
  // Correcting a lot (PATCH /api/lots/:id): the receiving rules, a version, at least one field, no quantities.
  correctedLotId = expiredLotId;
  const corrected = () => `/api/lots/${correctedLotId}`;
  const fix: [Json, string][] = [];
  for (const v of NUMBER_BAD.concat([0, -1, 1.5, "1"])) fix.push([{ version: v, notes: "x" }, "version"]);
  fix.push([{ notes: "x" }, "version"]);
  fix.push([{}, "version"]);
  fix.push([{ version: 1 }, "body"]);
  for (const extra of [{ quantity: 5 }, { quantityOnHand: 0 }, { quantityReceived: 5 }, { unit: "kg" }, { receivedOn: "2020-01-02" }, { materialId: lineMaterial }, { extra: 1 }] as Record<string, Json>[]) {
    fix.push([{ version: 1, notes: "x", ...extra }, "body"]);
  }
  for (const v of ["2026-13-40", "2026-02-30", "yesterday", "10/01/2026", 20260110, "", true, []]) fix.push([{ version: 1, expiresOn: v }, "expiresOn"]);
  // Before the lot's received date (2020-01-01): checked against the stored lot.
  for (const v of ["2019-12-31", "2000-01-01"]) fix.push([{ version: 1, expiresOn: v }, "expiresOn"]);
  for (const v of NUMBER_BAD.filter((x) => x !== null).concat([0, -0.5, 1.01, 98, "0.9"])) fix.push([{ version: 1, measuredAssay: v }, "measuredAssay"]);
  for (const v of STRING_BAD) fix.push([{ version: 1, supplier: v }, "supplier"]);
  for (const name of NAME_BAD) fix.push([{ version: 1, supplierLot: name.slice(0, 101) }, "supplierLot"]);
  fix.push([{ version: 1, supplierLot: "x".repeat(101) }, "supplierLot"]);
  for (const v of [5, true, [], { x: 1 }, "Resin\u202Etxt", "x".repeat(5001)]) fix.push([{ version: 1, notes: v }, "notes"]);
  for (const [body, field] of fix) {
    cases.push({ label: `lot PATCH ${JSON.stringify(body).slice(0, 70)}`, client: p, method: "PATCH", path: corrected, body: JSON.stringify(body), field });
  }
  for (const [label, body] of [
    ["empty body", ""],
    ["malformed JSON", "{\"version\": "],
    ["a JSON array", "[1]"],
    ["oversized body", JSON.stringify({ version: 1, notes: "☃".repeat(700_000) })],
  ] as [string, string][]) {
    cases.push({ label: `lot PATCH ${label}`, client: p, method: "PATCH", path: corrected, body });
  }
  // Adjusting a lot's stock (POST /api/lots/:id/adjustments) on the same lot: 1,000,000 g on hand, version 1, never changed.
  const adjusted = () => `/api/lots/${correctedLotId}/adjustments`;
  const goodAdjust = { version: 1, quantityOnHand: 999_000, reason: "recount" };
  const adjust: [Json, string][] = [];
  for (const v of NUMBER_BAD.concat([0, -1, 1.5, "1"])) adjust.push([{ ...goodAdjust, version: v }, "version"]);
  // Negative, too large for any lot, over 10 × the 1,000,000 g received, and exactly what is on hand (no change).
  for (const v of NUMBER_BAD.concat([-1, -0.001, 1e12, "12", 10_000_001, 1_000_000])) adjust.push([{ ...goodAdjust, quantityOnHand: v }, "quantityOnHand"]);
  adjust.push([{ version: 1, reason: "recount" }, "quantityOnHand"]);
  for (const v of ["lost", "", "Recount", 5, null, [], { x: 1 }]) adjust.push([{ ...goodAdjust, reason: v }, "reason"]);
  adjust.push([{ version: 1, quantityOnHand: 5 }, "reason"]);
  // A note is required for "other", optional otherwise, and held to the one text rule and its length.
  for (const note of [undefined, null, "", "  \n "]) adjust.push([{ ...goodAdjust, reason: "other", ...(note === undefined ? {} : { note }) }, "note"]);
  for (const v of [5, true, [], { x: 1 }, "Spill\u202Etxt", "Spill\u0007", "x".repeat(2001)]) adjust.push([{ ...goodAdjust, note: v }, "note"]);
  for (const extra of [{ delta: -5 }, { unit: "kg" }, { quantityReceived: 5 }, { adjustedBy: "someone" }, { extra: 1 }] as Record<string, Json>[]) {
    adjust.push([{ ...goodAdjust, ...extra }, "body"]);
  }
  adjust.push([{}, "version"]);
  for (const [body, field] of adjust) {
    cases.push({ label: `lot adjust ${JSON.stringify(body).slice(0, 70)}`, client: p, method: "POST", path: adjusted, body: JSON.stringify(body), field });
  }
  for (const [label, body] of [
    ["empty body", ""],
    ["malformed JSON", "{\"version\": "],
    ["a JSON array", "[1]"],
    ["a JSON string", "\"recount\""],
    ["oversized body", JSON.stringify({ ...goodAdjust, note: "☃".repeat(700_000) })],
  ] as [string, string][]) {
    cases.push({ label: `lot adjust ${label}`, client: p, method: "POST", path: adjusted, body });
  }
  const disposeBad: [Json, string][] = [
    [{ disposition: "approved" }, "disposition"],
    [{ disposition: null }, "disposition"],
    [{}, "disposition"],
    [{ disposition: "released", acknowledgedDeviations: [{ lineIndex: -1, note: "x" }] }, "acknowledgedDeviations"],
    [{ disposition: "released", acknowledgedDeviations: [{ lineIndex: 0, note: "\u200B" }] }, "acknowledgedDeviations"],
    [{ disposition: "released", acknowledgedDeviations: "all" }, "acknowledgedDeviations"],
    [{ disposition: "released_under_deviation", justification: 5 }, "justification"],
    [{ disposition: "rejected", extra: 1 }, "body"],
  ];
  for (const [body, field] of disposeBad) {
    cases.push({ label: `dispose ${JSON.stringify(body).slice(0, 70)}`, client: a, method: "POST", path: () => `/api/batches/${batchId}/disposition`, body: JSON.stringify(body), field });
  }
  // The team's currency: an ISO 4217 code of three letters (ISO 4217, the alphabetic code), nothing else.
  const currencyBad: Json[] = ["EURO", "", "   ", "E1R", "€", "eu", 5, null, true, [], {}, "E\u202eUR", "ÉUR"];
  for (const v of currencyBad) {
    cases.push({
      label: `team settings currency ${JSON.stringify(v)}`,
      client: a,
      method: "PUT",
      path: () => "/api/team/settings",
      body: JSON.stringify({ currency: v }),
      field: "currency",
    });
  }
  cases.push({ label: "team settings without currency", client: a, method: "PUT", path: () => "/api/team/settings", body: JSON.stringify({}), field: "currency" });
  cases.push({ label: "team settings unknown key", client: a, method: "PUT", path: () => "/api/team/settings", body: JSON.stringify({ currency: "USD", rate: 1 }), field: "body" });
  for (const v of NUMBER_BAD.concat([-1, 0, 0.9])) {
    cases.push({
      label: `batch settings toleranceFraction ${JSON.stringify(v)}`,
      client: a,
      method: "PUT",
      path: () => "/api/batches/settings",
      body: JSON.stringify({ toleranceFraction: v, balanceResolutionGrams: 0.01 }),
      field: "toleranceFraction",
    });
  }

  // Issue 17, specifications and test results: a released revision with a numeric and a text specification, a batch of it.
  {
    const reviewerClient = await signIn(demo.reviewer);
    const lib = await library(formulator);
    const q = await releasedWithSpecs(formulator, reviewerClient, lib, `Bad-input QC ${Date.now().toString(36)}`);
    const qcBatch = (await (await production.fetch("/api/batches", { method: "POST", json: { revisionId: q.revisionId } })).json()) as { id: string };
    const quality: [() => Client, string, () => string, Json, string][] = [];
    const results = () => `/api/batches/${qcBatch.id}/results`;
    // A text (or anything but a number) in the numeric field: 422 naming value.
    for (const v of NUMBER_BAD.concat(["5 mPa·s", "", "1,5"])) quality.push([p, "POST", results, { specId: VISCOSITY_SPEC.id, value: v }, "value"]);
    for (const v of STRING_BAD.concat(["not-a-uuid"])) quality.push([p, "POST", results, { specId: v, value: 5 }, "specId"]);
    quality.push([p, "POST", results, { specId: crypto.randomUUID(), value: 5 }, "specId"]);
    for (const v of [12345, [], { x: 1 }, "i".repeat(201)]) quality.push([p, "POST", results, { specId: VISCOSITY_SPEC.id, value: 5, instrument: v }, "instrument"]);
    quality.push([p, "POST", results, { specId: VISCOSITY_SPEC.id, value: 5, extra: 1 }, "body"]);
    quality.push([p, "POST", results, { specId: APPEARANCE_SPEC.id, value: "x".repeat(501) }, "value"]);
    const ack = () => `/api/batches/${qcBatch.id}/results/${crypto.randomUUID()}/acknowledge`;
    for (const v of STRING_BAD.concat(["", "  ", "n".repeat(2001)])) quality.push([a, "POST", ack, { note: v }, "note"]);
    const specs = () => `/api/revisions/${draftId}/specifications`;
    for (const v of NUMBER_BAD.concat([0, -1, 1.5])) quality.push([f2, "PUT", specs, { specifications: [], version: v }, "version"]);
    for (const v of ["x", 5, null, {}]) quality.push([f2, "PUT", specs, { specifications: v, version: 1 }, "specifications"]);
    const bad = (patch: Record<string, Json>) => ({ specifications: [{ ...VISCOSITY_SPEC, ...patch }], version: 1 });
    quality.push([f2, "PUT", specs, bad({ lower: 7, upper: 6, target: null }), "specifications.0"]);
    quality.push([f2, "PUT", specs, bad({ target: 9 }), "specifications.0"]);
    quality.push([f2, "PUT", specs, bad({ lower: null, upper: null }), "specifications.0"]);
    quality.push([f2, "PUT", specs, bad({ property: "" }), "specifications.0"]);
    quality.push([f2, "PUT", specs, bad({ id: "nope" }), "specifications.0"]);
    for (const v of NUMBER_BAD.filter((x) => x !== null)) quality.push([f2, "PUT", specs, bad({ upper: v }), "specifications.0"]);
    quality.push([f2, "PUT", specs, { specifications: [VISCOSITY_SPEC, VISCOSITY_SPEC], version: 1 }, "specifications.1"]);
    quality.push([f2, "PUT", specs, { specifications: [], version: 1, extra: true }, "body"]);
    for (const [client, method, path, body, field] of quality) {
      cases.push({ label: `quality ${method} ${path().split("/").slice(-1)[0]} ${JSON.stringify(body).slice(0, 50)}`, client, method, path, body: JSON.stringify(body), field });
    }
    for (const [client, method, path] of [
      [p, "POST", results],
      [a, "POST", ack],
      [f2, "PUT", specs],
    ] as [() => Client, string, () => string][]) {
      for (const [label, body] of [
        ["malformed JSON", "{\"value\": "],
        ["oversized body", JSON.stringify({ pad: "☃".repeat(700_000) })],
      ] as [string, string][]) {
        cases.push({ label: `quality ${method} ${label}`, client, method, path, body });
      }
    }
  }

  // Issue 16, saved design explorations and opening a candidate as a new draft (the monolith has an open draft,
  // so even an input the schema took would be refused with 409 and start nothing).
  {
    const hc3Released = hc3Revs.revisions.find((r) => r.state === "released")!.id;
    const firstComponent = ((await (await formulator.fetch(`/api/revisions/${hc3Released}`)).json()) as { input: { components: { materialId: string }[] } }).input.components[0]!.materialId;
    const validExploration = explorationBody(hc3Released, firstComponent) as unknown as Json;
    const saveUrl = () => `/api/formulations/${hc3.id}/explorations`;
    const explorationCases: [string, () => string, Json, string | undefined][] = [];
    for (const m of mutations(validExploration, () => false, (b) => saveExplorationSchema.safeParse(b).success)) {
      explorationCases.push(["POST", saveUrl, m.body, m.field]);
    }
    for (const name of NAME_BAD) explorationCases.push(["POST", saveUrl, { ...(validExploration as object), name: name.slice(0, 121) }, "name"]);
    const ex = validExploration as Record<string, Json>;
    explorationCases.push(
      ["POST", saveUrl, { ...ex, revisionId: draftId }, "revisionId"],
      ["POST", saveUrl, { ...ex, revisionId: "00000000-0000-0000-0000-000000000000" }, "revisionId"],
      ["POST", saveUrl, { ...ex, pointCount: 20_001 }, "pointCount"],
      ["POST", saveUrl, { ...ex, pointCount: 0 }, "pointCount"],
      ["POST", saveUrl, { ...ex, outputs: [] }, "outputs"],
      ["POST", saveUrl, { ...ex, grid: { kind: "sweep", variables: [] } }, "grid.variables"],
      ["POST", saveUrl, { ...ex, grid: { kind: "cube", variables: [] } }, "grid"],
      ["POST", saveUrl, { ...ex, grid: { kind: "sweep", variables: [{ kind: "weightFraction", materialId: firstComponent, from: 0, to: 1, step: 0 }] } }, "grid.variables"],
      ["POST", saveUrl, { ...ex, grid: { kind: "ternary", materialIds: ["a", "b"], step: 0.1 } }, "grid.materialIds"],
      ["POST", saveUrl, { ...ex, search: { constraints: [{ output: "refractiveIndex" }], thermal: "clear", objective: { goal: "min", output: "refractiveIndex" } } }, "search.constraints"],
      ["POST", saveUrl, { ...ex, search: { constraints: [{ output: "refractiveIndex", min: 2, max: 1 }], thermal: "clear", objective: { goal: "min", output: "refractiveIndex" } } }, "search.constraints"],
      ["POST", saveUrl, { ...ex, search: { constraints: [], thermal: "clear", objective: { goal: "closest", output: "refractiveIndex" } } }, "search.objective"],
      ["POST", saveUrl, { ...ex, candidates: Array.from({ length: 11 }, () => (ex.candidates as Json[])[0]!) }, "candidates"],
      ["POST", saveUrl, { ...ex, extra: 1 }, "body"],
      ["POST", saveUrl, [], "body"],
    );
    const startUrl = () => `/api/formulations/${monolith.id}/revisions`;
    for (const m of mutations(validInput, skipInput, (b) => formulationInputSchema.safeParse(b).success).filter((_, i) => i % 3 === 0)) {
      explorationCases.push(["POST", startUrl, { input: m.body }, `input.${m.field}`]);
    }
    explorationCases.push(
      ["POST", startUrl, { input: validInput, fromExploration: { point: -1 } }, "fromExploration.point"],
      ["POST", startUrl, { input: validInput, fromExploration: { point: 1.5 } }, "fromExploration.point"],
      ["POST", startUrl, { input: validInput, fromExploration: { point: 20_000 } }, "fromExploration.point"],
      ["POST", startUrl, { input: validInput, fromExploration: { point: 0, explorationId: 7 } }, "fromExploration.explorationId"],
      ["POST", startUrl, { fromExploration: { point: 0 } }, "input"],
      ["POST", startUrl, { input: "recipe" }, "input"],
      ["POST", startUrl, { input: validInput, surprise: true }, "body"],
    );
    for (const [method, path, body, field] of explorationCases) {
      cases.push({ label: `exploration ${method} ${path().split("/").slice(-1)[0]} ${JSON.stringify(body).slice(0, 60)}`, client: f2, method, path, body: JSON.stringify(body), field });
    }
    for (const [path, label, body] of [
      [saveUrl, "malformed JSON", "{\"name\": "],
      [saveUrl, "truncated unicode", "{\"name\": \"\uD83D"],
      // Over the route's own 256 kB limit, well under the 1 MB every JSON route has.
      [saveUrl, "body over 256 kB", JSON.stringify({ ...ex, pad: "x".repeat(300_000) })],
      [startUrl, "malformed JSON", "{\"input\": "],
      [startUrl, "oversized body", JSON.stringify({ pad: "☃".repeat(700_000) })],
    ] as [() => string, string, string][]) {
      cases.push({ label: `exploration POST ${path().split("/").slice(-1)[0]} ${label}`, client: f2, method: "POST", path, body });
    }
  }

  // Malformed and hostile files on the upload routes.
  const file = (bytes: Uint8Array | string, name: string, extra: Record<string, string>) => () => {
    const form = new FormData();
    form.set("file", new Blob([bytes as BlobPart]), name);
    for (const [k, v] of Object.entries(extra)) form.set(k, v);
    return form;
  };
  const random = new Uint8Array(4096).map((_, i) => (i * 7919) % 256);
  const zipNotXlsx = new Uint8Array([0x50, 0x4b, 0x03, 0x04, ...new Array(200).fill(0)]);
  const exe = new Uint8Array([0x4d, 0x5a, 0x90, 0x00, ...new Array(500).fill(1)]);
  const png = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, ...new Array(100).fill(2)]);
  const big = new Uint8Array(6 * 1024 * 1024);
  const pdfNoEnd = "%PDF-1.4\n1 0 obj << >> endobj\n";
  const imports: [string, () => FormData][] = [
    ["random bytes as .xlsx", file(random, "recipe.xlsx", { kind: "formulation" })],
    ["a zip that is not a workbook", file(zipNotXlsx, "recipe.xlsx", { kind: "formulation" })],
    ["a program named .xlsx", file(exe, "recipe.xlsx", { kind: "materials" })],
    ["a PDF as a workbook", file("%PDF-1.4\n%%EOF", "recipe.xlsx", { kind: "materials" })],
    ["an empty file", file("", "recipe.xlsx", { kind: "formulation" })],
    ["6 MB of zeros", file(big, "recipe.xlsx", { kind: "formulation" })],
    ["an unknown kind", file("name,kind\nx,precursor\n", "m.csv", { kind: "recipes" })],
    ["no kind", file("name,kind\nx,precursor\n", "m.csv", {})],
  ];
  for (const [label, body] of imports) {
    cases.push({ label: `import ${label}`, client: f2, method: "POST", path: () => "/api/imports", body });
  }
  const uploads: [string, () => FormData][] = [
    ["a PNG named .pdf", file(png, "sds.pdf", { ownerType: "material", ownerId: materialId, kind: "sds" })],
    ["a PDF without its end marker", file(pdfNoEnd, "sds.pdf", { ownerType: "material", ownerId: materialId, kind: "sds" })],
    ["random bytes", file(random, "sds.pdf", { ownerType: "material", ownerId: materialId, kind: "coa" })],
    ["an empty file", file("", "sds.pdf", { ownerType: "material", ownerId: materialId, kind: "sds" })],
    ["an unknown owner type", file("%PDF-1.4\n%%EOF", "sds.pdf", { ownerType: "formulation", ownerId: materialId, kind: "sds" })],
    ["an unknown kind", file("%PDF-1.4\n%%EOF", "sds.pdf", { ownerType: "material", ownerId: materialId, kind: "photo" })],
    ["another team's or no owner", file("%PDF-1.4\n%%EOF", "sds.pdf", { ownerType: "material", ownerId: "00000000-0000-0000-0000-000000000000", kind: "sds" })],
  ];
  for (const [label, body] of uploads) {
    cases.push({ label: `upload ${label}`, client: f2, method: "POST", path: () => "/api/attachments", body });
  }

  for (const [method, path] of [
    ["POST", () => "/api/compute"],
    ["POST", () => "/api/formulations"],
    ["PUT", () => `/api/revisions/${draftId}`],
    ["POST", () => "/api/materials"],
    ["PUT", () => `/api/materials/${materialId}`],
    ["POST", () => "/api/invitations"],
    ["PATCH", () => `/api/members/${memberId}`],
    ["POST", () => "/api/teams"],
    ["POST", () => `/api/revisions/${draftId}/return`],
    ["PUT", () => "/api/team/settings"],
  ] as [string, () => string][]) {
    for (const [label, body] of [
      ["malformed JSON", "{\"name\": "],
      ["truncated unicode", "{\"name\": \"\uD83D"],
      ["oversized body", JSON.stringify({ pad: "☃".repeat(700_000) })],
    ] as [string, string][]) {
      cases.push({ label: `${method} ${path()} ${label}`, client: /members|invitations|teams|team\/settings/.test(path()) ? a : f2, method, path, body });
    }
  }
});

describe("bad input on every write route", () => {
  it("is a corpus of at least 300 cases", () => {
    expect(cases.length).toBeGreaterThanOrEqual(300);
  });

  it("answers every case with a 4xx naming the field, never a 500 or a stack trace, and changes nothing", async () => {
    const before = await snapshot();
    const problems: string[] = [];
    for (const c of cases) {
      const res =
        typeof c.body === "string"
          ? await c.client().fetch(c.path(), { method: c.method, body: c.body, headers: { "content-type": "application/json" } })
          : await c.client().fetch(c.path(), { method: c.method, body: c.body() });
      const text = await res.text();
      let body: { error?: { code?: string; message?: string; fields?: Record<string, string> } } = {};
      try {
        body = JSON.parse(text);
      } catch {
        problems.push(`${c.label}: not JSON (${res.status})`);
        continue;
      }
      if (res.status < 400 || res.status >= 500) problems.push(`${c.label}: status ${res.status}`);
      if (!body.error?.message) problems.push(`${c.label}: no error message`);
      if (/node_modules|\n\s+at |stack/i.test(text)) problems.push(`${c.label}: leaks internals`);
      if (c.field && res.status === 422) {
        const want = c.field.split(".").slice(0, 2).join(".");
        const keys = Object.keys(body.error?.fields ?? {});
        const named = keys.some((k) => k.startsWith(want) || want.startsWith(k) || (k === "body" && c.field === "body"));
        if (!named) problems.push(`${c.label}: fields ${JSON.stringify(keys)} do not name ${want}`);
      }
    }
    expect(problems).toEqual([]);
    expect(await snapshot()).toEqual(before);
    // Over 400 requests one after another: room for a busy machine (a limit on the run, not an assertion on its time).
  }, 240_000);
});
