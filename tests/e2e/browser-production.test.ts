/**
 * End to end, in Chromium: production sees released work only, opens and
 * prints the batch sheet (also at 390 px wide), and cannot reach the editor or
 * a draft by URL.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { openSession, poll, screenshot, signInAs, type Session } from "./browser";
import { demo, signIn } from "./http";

interface Ids {
  draftRevision: string;
  draftFormulation: string;
  inReviewRevision: string;
}

async function demoIds(): Promise<Ids> {
  const api = await signIn(demo.formulator);
  const find = async (q: string) => {
    const list = (await (await api.fetch(`/api/formulations?q=${encodeURIComponent(q)}&pageSize=100`)).json()) as {
      rows: { id: string; name: string }[];
    };
    // Exact name: the search also matches copies made by imports.
    const id = list.rows.find((r) => r.name === q)!.id;
    const f = (await (await api.fetch(`/api/formulations/${id}`)).json()) as { revisions: { id: string; state: string }[] };
    return { id, revisions: f.revisions };
  };
  const hc5 = await find("Visor hard coat HC-5 fast cure");
  const hc4 = await find("Visor hard coat HC-4");
  return {
    draftFormulation: hc5.id,
    draftRevision: hc5.revisions.find((r) => r.state === "draft")!.id,
    inReviewRevision: hc4.revisions[0]!.id,
  };
}

describe("production in the browser", () => {
  let production: Session;
  let ids: Ids;

  beforeAll(async () => {
    ids = await demoIds();
    production = await openSession();
    await signInAs(production.page, demo.production);
  });

  afterAll(async () => {
    await production?.close();
  });

  it("lists only released formulations and opens the batch sheet with lot, actual-mass and initials columns and the safety cautions", async () => {
    const page = production.page;
    expect(await page.getByRole("navigation", { name: "Sections" }).getByRole("link", { name: "Formulations" }).count()).toBe(0);
    await page.getByRole("link", { name: "Batch sheets" }).click();
    await page.waitForURL(/\/production$/);
    const list = page.getByTestId("released-list");
    await poll(() => list.textContent()).toMatch(/Visor hard coat HC-3/);
    const text = (await list.textContent()) ?? "";
    expect(text).not.toMatch(/HC-4|HC-5|monolith M-1/);
    await screenshot(page, "production-list");

    await list.getByRole("link", { name: /Batch sheet of Visor hard coat HC-3/ }).click();
    const sheet = page.getByTestId("batch-sheet");
    await poll(() => sheet.count()).toBe(1);
    const headers = await sheet.locator("thead th").allTextContents();
    expect(headers).toEqual(expect.arrayContaining(["Lot number", "Target mass", "Target volume", "Actual mass (g)", "Time", "Initials"]));
    expect(await sheet.textContent()).toMatch(/Safety cautions[\s\S]*H314[\s\S]*safety data sheet/);
    expect(await sheet.textContent()).not.toMatch(/Preview only/);
    // HC-3 has no coating: the sheet gives its VOC and says nothing of a coat.
    expect(await sheet.getByTestId("batch-voc").textContent()).toMatch(/VOC[\s\S]*g\/L of sol[\s\S]*VOC less water/);
    expect(await sheet.getByTestId("batch-coating").count()).toBe(0);
    expect(await sheet.textContent()).not.toMatch(/Coating method|Withdrawal speed/);
    await screenshot(page, "batch-sheet");
    await page.emulateMedia({ media: "print" });
    expect(await page.getByRole("button", { name: "Print batch sheet" }).isVisible()).toBe(false);
    await screenshot(page, "batch-sheet-print");
    await page.emulateMedia({ media: "screen" });
  });

  it("fits the production view into 390 px without sideways scrolling of the page", async () => {
    const narrow = await openSession({ width: 390, height: 844 });
    try {
      await signInAs(narrow.page, demo.production);
      await narrow.page.goto("/production");
      await poll(() => narrow.page.getByTestId("released-list").count()).toBe(1);
      const overflow = await narrow.page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
      expect(overflow).toBeLessThanOrEqual(1);
      await screenshot(narrow.page, "production-list-390");
      await narrow.page.getByRole("link", { name: /Batch sheet of Visor hard coat HC-3/ }).click();
      await poll(() => narrow.page.getByTestId("batch-sheet").count()).toBe(1);
      const sheetOverflow = await narrow.page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
      expect(sheetOverflow).toBeLessThanOrEqual(1);
      await screenshot(narrow.page, "batch-sheet-390");
    } finally {
      await narrow.close();
    }
  });

  it("keeps a production user out of the editor and away from drafts, even by URL", async () => {
    const page = production.page;
    await page.goto("/formulations/new");
    await poll(() => page.getByRole("heading", { name: "Not allowed" }).count()).toBe(1);
    await page.goto(`/revisions/${ids.draftRevision}/edit`);
    await poll(() => page.getByRole("heading", { name: "Not allowed" }).count()).toBe(1);
    expect(await page.locator("form[aria-label='Formulation editor']").count()).toBe(0);
    for (const path of [`/revisions/${ids.draftRevision}`, `/revisions/${ids.inReviewRevision}`, `/formulations/${ids.draftFormulation}`, `/revisions/${ids.draftRevision}/batch-sheet`]) {
      const res = await page.goto(path);
      expect(res?.status(), path).toBe(404);
      await poll(() => page.getByRole("heading", { name: "Not found" }).count()).toBe(1);
    }
  });
});
