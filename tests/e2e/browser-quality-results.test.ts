/**
 * End to end, in Chromium (issue 17): a formulator adds the proposed tests
 * and limits to a draft; production enters test results on a batch record of
 * a released revision with specifications, a text in the numeric field is
 * named beside it, an out-of-specification value is marked at once; a
 * reviewer acknowledges it with a note.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { coatInput, library, type LibraryMaterial } from "./fixtures";
import { openSession, poll, screenshot, seriousViolations, signInAs, unique, type Session } from "./browser";
import { demo, signIn, type Client } from "./http";
import { releasedWithSpecs } from "./quality-fixtures";

let formulator: Client, reviewer: Client, production: Client;
let lib: Map<string, LibraryMaterial>;
let batchId: string;
const stamp = unique();

beforeAll(async () => {
  formulator = await signIn(demo.formulator);
  reviewer = await signIn(demo.reviewer);
  production = await signIn(demo.production);
  lib = await library(formulator);
  const released = await releasedWithSpecs(formulator, reviewer, lib, `Browser QC ${stamp}`);
  const started = await production.fetch("/api/batches", { method: "POST", json: { revisionId: released.revisionId } });
  batchId = ((await started.json()) as { id: string }).id;
});

describe("tests and limits on a draft", () => {
  let session: Session;
  beforeAll(async () => {
    session = await openSession();
    await signInAs(session.page, demo.formulator);
  });
  afterAll(async () => {
    await session?.close();
  });

  it("adds the proposed specifications with ±10 % limits and saves them", async () => {
    const created = await formulator.fetch("/api/formulations", { method: "POST", json: { name: `Browser specs ${stamp}`, project: "Quality", input: coatInput(lib) } });
    const { revisionId } = (await created.json()) as { revisionId: string };
    const page = session.page;
    await page.goto(`/revisions/${revisionId}`);
    await page.getByRole("button", { name: /Add proposed/ }).click();
    await page.getByRole("button", { name: "Save tests and limits" }).click();
    await poll(() => page.getByRole("status").filter({ hasText: "Saved." }).count()).toBe(1);
    const saved = (await (await formulator.fetch(`/api/revisions/${revisionId}/specifications`)).json()) as {
      specifications: { property: string; target: number; lower: number; upper: number }[];
    };
    const solids = saved.specifications.find((s) => s.property === "Solids content (gravimetric)")!;
    expect(solids).toBeDefined();
    // ±10 % of the target (common practice, no source), as shown to 6 significant figures in the form
    expect(solids.lower / solids.target).toBeCloseTo(0.9, 4);
    expect(solids.upper / solids.target).toBeCloseTo(1.1, 4);
  });
});

describe("test results on a batch record", () => {
  let prod: Session;
  let rev: Session;
  beforeAll(async () => {
    prod = await openSession();
    await signInAs(prod.page, demo.production);
    rev = await openSession();
    await signInAs(rev.page, demo.reviewer);
  });
  afterAll(async () => {
    await prod?.close();
    await rev?.close();
  });

  it("names a text in the numeric field, then marks an out-of-specification value at once", async () => {
    const page = prod.page;
    await page.goto(`/batches/${batchId}`);
    const table = page.getByTestId("results-Viscosity");
    await poll(() => table.textContent()).toMatch(/limits 4 – 6 mPa·s/);
    await page.locator("#result-spec").selectOption({ label: "Viscosity" });
    await page.locator("#result-value").fill("thick");
    await page.getByRole("button", { name: "Enter result" }).click();
    await poll(() => page.locator("#result-value-error").textContent()).toMatch(/Viscosity takes a number in mPa·s/);
    await page.locator("#result-value").fill("7.5");
    await page.locator("#result-instrument").fill("Brookfield DV2T");
    await page.getByRole("button", { name: "Enter result" }).click();
    await poll(() => table.textContent()).toMatch(/7\.5 mPa·s[\s\S]*Brookfield DV2T[\s\S]*Out of specification/);
    expect(await table.textContent()).toMatch(/Waiting for a reviewer/);
    await screenshot(page, "batch-results");
    const violations = await seriousViolations(page);
    expect(violations, JSON.stringify(violations, null, 2)).toEqual([]);
  });

  it("lets a reviewer acknowledge the out-of-specification result with a note", async () => {
    const page = rev.page;
    await page.goto(`/batches/${batchId}`);
    await page.getByRole("button", { name: "Acknowledge…" }).click();
    await page.getByLabel("Why is this result acceptable?").fill("Re-measured at 25.0 °C: 5.8 mPa·s.");
    await page.getByRole("button", { name: "Acknowledge", exact: true }).click();
    await poll(() => page.getByTestId("results-Viscosity").textContent()).toMatch(/Acknowledged by .*Re-measured at 25\.0 °C/);
    const list = (await (await production.fetch(`/api/batches/${batchId}/results`)).json()) as { results: { acknowledgedAt: string | null }[] };
    expect(list.results[0]!.acknowledgedAt).not.toBeNull();
  });
});
