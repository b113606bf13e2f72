/**
 * Specifications and test results over HTTP (issue 17): specifications set on
 * a draft and approved with it, refused once it left draft, copied into the
 * next revision; results entered by production, out of specification marked
 * at once and mailed to the team's reviewers, a text in a numeric field
 * refused naming the field, acknowledgement by a reviewer only.
 */
import { beforeAll, describe, expect, it } from "vitest";
import { coatInput, library, type LibraryMaterial } from "./fixtures";
import { demo, signIn, type Client } from "./http";
import { waitForMail } from "./mailbox";
import { releasedWithSpecs, VISCOSITY_SPEC, APPEARANCE_SPEC } from "./quality-fixtures";

let formulator: Client, reviewer: Client, production: Client;
let lib: Map<string, LibraryMaterial>;
let released: { formulationId: string; revisionId: string };
let batchId: string;
const stamp = Date.now().toString(36);

beforeAll(async () => {
  formulator = await signIn(demo.formulator);
  reviewer = await signIn(demo.reviewer);
  production = await signIn(demo.production);
  lib = await library(formulator);
  released = await releasedWithSpecs(formulator, reviewer, lib, `QC coat ${stamp}`);
  const started = await production.fetch("/api/batches", { method: "POST", json: { revisionId: released.revisionId } });
  expect(started.status).toBe(201);
  batchId = ((await started.json()) as { id: string }).id;
});

describe("specifications over HTTP", () => {
  it("keeps the approved specifications: production reads them, a change is 409", async () => {
    const read = await production.fetch(`/api/revisions/${released.revisionId}/specifications`);
    expect(read.status).toBe(200);
    const body = (await read.json()) as { specifications: { property: string }[]; version: number };
    expect(body.specifications.map((s) => s.property)).toEqual(["Viscosity", "Appearance"]);
    const put = await formulator.fetch(`/api/revisions/${released.revisionId}/specifications`, {
      method: "PUT",
      json: { specifications: [], version: body.version },
    });
    expect(put.status).toBe(409);
    expect(((await put.json()) as { error: { message: string } }).error.message).toMatch(/can no longer change/);
  });

  it("refuses limits the wrong way round with a 422 naming the field", async () => {
    const created = await formulator.fetch("/api/formulations", { method: "POST", json: { name: `QC limits ${stamp}`, project: "Quality", input: coatInput(lib) } });
    const { revisionId } = (await created.json()) as { revisionId: string };
    const res = await formulator.fetch(`/api/revisions/${revisionId}/specifications`, {
      method: "PUT",
      json: { specifications: [{ ...VISCOSITY_SPEC, lower: 7, upper: 6, target: null }], version: 1 },
    });
    expect(res.status).toBe(422);
    const err = (await res.json()) as { error: { fields: Record<string, string> } };
    expect(Object.keys(err.error.fields)).toContain("specifications.0.upper");
  });
});

describe("test results over HTTP", () => {
  it("marks an out-of-specification result at once and mails the team's reviewers", async () => {
    const since = Date.now();
    const ok = await production.fetch(`/api/batches/${batchId}/results`, { method: "POST", json: { specId: VISCOSITY_SPEC.id, value: 6, instrument: "Brookfield DV2T" } });
    expect(ok.status).toBe(201);
    expect(((await ok.json()) as { outOfSpec: boolean }).outOfSpec).toBe(false);
    const bad = await production.fetch(`/api/batches/${batchId}/results`, { method: "POST", json: { specId: VISCOSITY_SPEC.id, value: 7.5 } });
    expect(bad.status).toBe(201);
    expect(((await bad.json()) as { outOfSpec: boolean }).outOfSpec).toBe(true);
    const mail = await waitForMail(demo.reviewer, /Out of specification: Viscosity/, 5_000, since - 1000);
    expect(mail.text).toContain("7.5 mPa·s");
    expect(mail.text).toContain(`/batches/${batchId}`);
  });

  it("refuses a text in a numeric field with a 422 naming value", async () => {
    const res = await production.fetch(`/api/batches/${batchId}/results`, { method: "POST", json: { specId: VISCOSITY_SPEC.id, value: "thick" } });
    expect(res.status).toBe(422);
    const err = (await res.json()) as { error: { fields: Record<string, string> } };
    expect(Object.keys(err.error.fields)).toEqual(["value"]);
    expect(err.error.fields.value).toMatch(/takes a number in mPa·s/);
  });

  it("stores a text result and lets a reviewer, not production, acknowledge the out-of-spec one", async () => {
    const text = await production.fetch(`/api/batches/${batchId}/results`, { method: "POST", json: { specId: APPEARANCE_SPEC.id, value: "clear" } });
    expect(text.status).toBe(201);
    const list = (await (await production.fetch(`/api/batches/${batchId}/results`)).json()) as {
      results: { id: string; outOfSpec: boolean; valueText: string | null; enteredByName: string | null }[];
    };
    expect(list.results.map((r) => r.outOfSpec)).toEqual([false, true, false]);
    expect(list.results[2]!.valueText).toBe("clear");
    const oos = list.results[1]!;
    const refused = await production.fetch(`/api/batches/${batchId}/results/${oos.id}/acknowledge`, { method: "POST", json: { note: "fine by me" } });
    expect(refused.status).toBe(403);
    const ack = await reviewer.fetch(`/api/batches/${batchId}/results/${oos.id}/acknowledge`, { method: "POST", json: { note: "Re-measured at 25 °C: 5.8 mPa·s." } });
    expect(ack.status).toBe(200);
    const again = await reviewer.fetch(`/api/batches/${batchId}/results/${oos.id}/acknowledge`, { method: "POST", json: { note: "twice" } });
    expect(again.status).toBe(409);
  });

  it("copies the specifications into the next revision", async () => {
    const next = await formulator.fetch(`/api/formulations/${released.formulationId}/revisions`, { method: "POST", json: {} });
    expect(next.status).toBe(201);
    const { revisionId } = (await next.json()) as { revisionId: string };
    const specs = (await (await formulator.fetch(`/api/revisions/${revisionId}/specifications`)).json()) as { specifications: unknown[] };
    expect(specs.specifications).toEqual([VISCOSITY_SPEC, APPEARANCE_SPEC]);
  });
});
