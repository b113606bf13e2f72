/**
 * End to end, in Chromium: the batch sheet of a spin-coated revision shows
 * production what to set (the spin speed, and the speed for the target) and
 * what to expect (the dry thickness), the area and the VOC figures, each with
 * its unit; no serious accessibility violation.
 *
 * Expected figures worked by hand from chemistry.md's spin rule (Meyerhofer,
 * J. Appl. Phys. 49 (1978) 3993, calibrated on one measured film):
 *   h_dry = h_cal · (ω_cal / ω)^(1/2) = 800 nm · (2000 / 3000)^(1/2)
 *         = 800 · 0.8164966 = 653.197 nm → "653 nm" (three significant figures);
 *   ω_t = ω_cal · (h_cal / h_t)² = 2000 · (800 / 500)² = 2000 · 2.56 = 5120 rpm.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { openSession, poll, screenshot, seriousViolations, signInAs, unique, type Session } from "./browser";
import { coatInput, library } from "./fixtures";
import { demo, signIn } from "./http";

let revisionId: string;
let session: Session;

beforeAll(async () => {
  const api = await signIn(demo.formulator);
  const lib = await library(api);
  const coating = { method: "spin", rpm: 3000, calibration: { rpm: 2000, dryThicknessNm: 800 }, targetDryThicknessNm: 500, areaM2: 0.2 };
  const res = await api.fetch("/api/formulations", { method: "POST", json: { name: `Spun coat ${unique()}`, project: "Batch sheet", input: { ...coatInput(lib), coating } } });
  expect(res.status).toBe(201);
  revisionId = ((await res.json()) as { revisionId: string }).revisionId;
  session = await openSession();
  await signInAs(session.page, demo.formulator);
});

afterAll(async () => {
  await session?.close();
});

describe("the batch sheet of a coated revision", () => {
  it("shows the spin speed to set, the speed for the target, the expected dry thickness, the area and VOC with units", async () => {
    const page = session.page;
    await page.goto(`/revisions/${revisionId}/batch-sheet`);
    const coating = page.getByTestId("batch-coating");
    await poll(() => coating.count()).toBe(1);
    const row = async (item: string) => (await coating.getByRole("row", { name: item, exact: false }).first().innerText())?.replace(/\s+/g, " ");
    expect(await row("Coating method")).toContain("spin coating");
    expect(await row("Spin speed for the target")).toMatch(/5120 rpm/);
    expect(await row("Expected dry film thickness")).toMatch(/653 nm/);
    expect(await row("Area to coat")).toMatch(/0\.200 m²/);
    expect((await coating.innerText())?.replace(/\s+/g, " ")).toMatch(/Spin speed 3000 rpm/);
    expect((await page.getByTestId("batch-voc").innerText())?.replace(/\s+/g, " ")).toMatch(/VOC \d+ g\/L of sol.*VOC less water \d+ g\/L of sol less water/);
    await screenshot(page, "batch-sheet-coated");
    const violations = await seriousViolations(page);
    expect(violations, JSON.stringify(violations, null, 2)).toEqual([]);
  });
});
