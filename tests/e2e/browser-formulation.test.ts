/**
 * End to end, in Chromium: a new formulation greets its author with the first
 * steps and words engine messages for the form; a formulator creates a formulation from the demo
 * materials, watches the recipe follow the weight fractions, fixes a
 * fractions-do-not-sum message and submits; a reviewer sends it back, the
 * formulator edits and resubmits, the reviewer approves; the formulator can
 * never approve their own revision.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { openSession, pickOption, poll, revisionIdOf, screenshot, setNumber, signInAs, unique, type Session } from "./browser";
import { demo } from "./http";

describe("formulation workflow in the browser", () => {
  let formulator: Session;
  let reviewer: Session;
  let revisionUrl = "";
  const name = `E2E hard coat ${unique()}`;

  beforeAll(async () => {
    formulator = await openSession();
    reviewer = await openSession();
    await signInAs(formulator.page, demo.formulator);
    await signInAs(reviewer.page, demo.reviewer);
  });

  afterAll(async () => {
    await formulator?.close();
    await reviewer?.close();
  });

  it("greets a new formulation with its first steps, and words every engine message for the form row it points at", async () => {
    const page = formulator.page;
    await page.goto("/formulations/new");
    // An empty draft: a guide to the first steps, no engine refusal and no error styling.
    await poll(() => page.getByTestId("first-steps").count()).toBe(1);
    await poll(() => page.getByTestId("first-steps").textContent()).toMatch(/precursors .* organic phases/);
    expect(await page.getByTestId("engine-error").count()).toBe(0);
    expect(await page.locator('main [role="alert"]').count()).toBe(0);
    const internal = /material id|materialId|weightFraction|leavingAlcohol|components\.\d/i;
    expect(await page.locator("main").innerText()).not.toMatch(internal);

    // A second component without a material, and one with a fraction over 100 %: messages in words, at their rows.
    await pickOption(page, "#f-components-0-materialId", /Tetraethoxysilane/);
    await poll(() => page.getByTestId("first-steps").count()).toBe(0);
    await page.getByRole("button", { name: "Add component" }).click();
    await poll(() => page.locator("#f-components-1-materialId-error").textContent()).toBe("Component 2: choose a material");
    await setNumber(page, "#f-components-0-weightPercent", 150);
    await poll(() => page.locator("#f-components-0-weightPercent-error").textContent()).toBe("Component 1: enter a weight fraction from 0 to 100 %");
    await poll(() => page.getByTestId("engine-error").textContent()).toMatch(/^The recipe cannot be computed yet\. Component \d: /);
    expect(await page.locator("main").innerText()).not.toMatch(internal);
  });

  it("lets a formulator create a formulation whose numbers follow the weight fractions, fix a sum message and submit it", async () => {
    const page = formulator.page;
    await page.goto("/formulations/new");
    await page.getByLabel("Name", { exact: true }).fill(name);
    await page.getByLabel("Project").fill("End-to-end checks");
    await pickOption(page, "#f-components-0-materialId", /Tetraethoxysilane/);
    await setNumber(page, "#f-components-0-weightPercent", 70);
    await page.getByRole("button", { name: "Add component" }).click();
    await pickOption(page, "#f-components-1-materialId", /Glycidoxypropyl/);
    await poll(() => page.locator("#f-components-1-weightPercent").inputValue()).toBe("30");

    const teosMass = page.getByTestId("mass-0");
    await poll(() => teosMass.textContent()).toMatch(/\d+\.\d{2}\s*g/);
    const before = await teosMass.textContent();

    // 60 + 30 = 90 %: the engine refuses it and says so beside the components.
    await setNumber(page, "#f-components-0-weightPercent", 60);
    await poll(() => page.locator("#f-components-error").textContent()).toMatch(/must sum to 1/);
    await poll(() => page.getByTestId("fraction-sum").textContent()).toMatch(/90\.00 %/);
    await screenshot(page, "editor-fractions-do-not-sum");

    // One click scales to 100 %; the message goes and the TEOS mass follows its new fraction.
    await page.getByRole("button", { name: "Scale to 100 %" }).click();
    await poll(() => page.locator("#f-components-error").textContent()).toBe("");
    await poll(() => page.getByTestId("fraction-sum").textContent()).toMatch(/100\.00 %/);
    await poll(() => teosMass.textContent()).not.toBe(before);

    // The page reports its own recompute time (a figure for people; timing is measured by benchmarks, not asserted).
    await poll(() => page.getByTestId("compute-time").textContent()).toMatch(/[\d.]+ ms/);
    await screenshot(page, "editor");

    await page.getByRole("button", { name: "Create formulation" }).click();
    await page.waitForURL(/\/revisions\/[0-9a-f-]{36}\/edit/);
    revisionUrl = `/revisions/${revisionIdOf(page.url())}`;
    await page.getByRole("button", { name: "Submit for review" }).click();
    await page.waitForURL(/\/revisions\/[0-9a-f-]{36}\?submitted=1/);
    await poll(() => page.locator("h1").first().textContent()).toMatch(/Waiting for review/);
  });

  it("lets a reviewer send it back with a comment, the formulator resubmit, and the reviewer approve", async () => {
    expect(revisionUrl).not.toBe("");
    const r = reviewer.page;
    await r.goto(revisionUrl);
    await r.getByRole("button", { name: "Send back with comment" }).click();
    await poll(() => r.getByText(/a comment is required/i).count()).toBeGreaterThan(0);
    await r.getByLabel(/^Comment/).fill("Lower the drying temperature to 50 °C, please.");
    await r.getByRole("button", { name: "Send back with comment" }).click();
    await poll(() => r.locator("h1").first().textContent()).toMatch(/Draft/);

    const f = formulator.page;
    await f.goto(revisionUrl);
    await poll(() => f.getByText("Lower the drying temperature to 50 °C, please.").count()).toBeGreaterThan(0);
    await f.getByRole("link", { name: "Edit draft" }).click();
    await f.waitForURL(/\/edit$/);
    await setNumber(f, "#f-steps-1-temperatureC", 50);
    await f.getByRole("button", { name: "Save draft" }).click();
    await poll(() => f.getByText(/Saved as version/).count()).toBeGreaterThan(0);
    await f.getByRole("button", { name: "Submit for review" }).click();
    await f.waitForURL(/\?submitted=1/);

    // The author cannot approve: no button, and the server refuses a direct request.
    await poll(() => f.getByTestId("review-not-allowed").count()).toBe(1);
    expect(await f.getByRole("button", { name: "Approve" }).count()).toBe(0);
    const status = await f.evaluate(async (url) => {
      const res = await fetch(`/api${url}/approve`, { method: "POST", headers: { "content-type": "application/json" }, body: "{}" });
      return res.status;
    }, revisionUrl);
    expect(status).toBe(403);

    await r.goto(revisionUrl);
    await poll(() => r.getByTestId("diff").count()).toBe(0); // revision 1: nothing to compare
    await r.getByRole("button", { name: "Approve" }).click();
    await poll(() => r.locator("h1").first().textContent()).toMatch(/Approved/);
    await screenshot(r, "review-approved");
  });
});
