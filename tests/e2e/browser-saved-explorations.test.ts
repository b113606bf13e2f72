/**
 * End to end, in Chromium: the saved explorations beside a revision. The
 * reviewer opens the visor hard coat's released revision and reads the demo
 * exploration (what varied, limits, aim, best candidate) with its Explore,
 * open and download links; a formulator deletes an exploration after the
 * confirmation; production sees neither the list nor an Explore link. No
 * serious accessibility violation.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_EXPLORATION } from "@/db/seed-exploration";
import { openSession, poll, screenshot, seriousViolations, signInAs, type Session } from "./browser";
import { explorationBody, saveExploration } from "./fixtures";
import { demo, signIn } from "./http";

let formulationId: string;
let releasedId: string;
let firstComponent: string;
const sessions: Session[] = [];

beforeAll(async () => {
  const api = await signIn(demo.formulator);
  const list = (await (await api.fetch("/api/formulations?pageSize=100")).json()) as { rows: { id: string; name: string }[] };
  formulationId = list.rows.find((r) => r.name === DEMO_EXPLORATION.formulation)!.id;
  const f = (await (await api.fetch(`/api/formulations/${formulationId}`)).json()) as { revisions: { id: string; state: string }[] };
  releasedId = f.revisions.find((r) => r.state === "released")!.id;
  const rev = (await (await api.fetch(`/api/revisions/${releasedId}`)).json()) as { input: { components: { materialId: string }[] } };
  firstComponent = rev.input.components[0]!.materialId;
});

afterAll(async () => {
  for (const s of sessions) await s.close();
});

async function session(email: string): Promise<Session> {
  const s = await openSession({ width: 1300, height: 1000 });
  sessions.push(s);
  await signInAs(s.page, email);
  return s;
}

describe("saved explorations on the revision page", () => {
  it("shows the reviewer the demo exploration beside the revision, with its words and links", async () => {
    const { page } = await session(demo.reviewer);
    await page.goto(`/revisions/${releasedId}`);
    const panel = page.locator("#explorations");
    const item = panel.getByTestId("saved-exploration").filter({ hasText: DEMO_EXPLORATION.name });
    await item.waitFor();
    const text = (await item.textContent()) ?? "";
    expect(text).toContain("weight fraction: 0 → 20 % in steps of 2 %");
    expect(text).toMatch(/temperature: 90 → 130 °C in steps of 10 °C/);
    expect(text).toContain("thermal check clear");
    expect(text).toMatch(/closest to 1\.586/);
    expect(text).toContain("55 points");
    const best = (await item.getByTestId("best-candidate").textContent()) ?? "";
    expect(best).toMatch(/^point \d+ \(\d+ %, (90|100|110) °C\), thermal clear/);
    expect(await item.getByRole("link", { name: "Open in explorer" }).getAttribute("href")).toMatch(new RegExp(`^/formulations/${formulationId}/explore\\?exploration=`));
    expect(await item.getByRole("link", { name: /Download \.xlsx/ }).getAttribute("href")).toMatch(/\/api\/explorations\/[^/]+\/export\?format=xlsx$/);
    expect(await item.getByRole("link", { name: /Download \.csv/ }).getAttribute("href")).toMatch(/format=csv$/);
    // A reviewer may not delete.
    expect(await item.getByRole("button", { name: /Delete/ }).count()).toBe(0);
    expect(await page.getByTestId("explore-link").getAttribute("href")).toBe(`/formulations/${formulationId}/explore?revision=${releasedId}`);
    await screenshot(page, "saved-explorations-revision");
    expect(await seriousViolations(page)).toEqual([]);
  });

  it("lets a formulator delete an exploration from the formulation page after confirming", async () => {
    const api = await signIn(demo.formulator);
    const name = `Browser delete ${Date.now().toString(36)}`;
    await saveExploration(api, formulationId, explorationBody(releasedId, firstComponent, name));
    const { page } = await session(demo.formulator);
    await page.goto(`/formulations/${formulationId}`);
    const item = page.getByTestId("saved-exploration").filter({ hasText: name });
    await item.waitFor();
    expect(await page.getByTestId("explore-link").getAttribute("href")).toMatch(new RegExp(`^/formulations/${formulationId}/explore\\?revision=`));
    await item.getByRole("button", { name: `Delete the exploration ${name}` }).click();
    await page.getByTestId("confirm-dialog").getByRole("button", { name: "Delete the exploration" }).click();
    await poll(() => page.getByTestId("saved-exploration").filter({ hasText: name }).count()).toBe(0);
    expect(await page.getByText(`The exploration “${name}” was deleted.`).count()).toBe(1);
    const list = (await (await api.fetch(`/api/formulations/${formulationId}/explorations`)).json()) as { rows: { name: string }[] };
    expect(list.rows.some((r) => r.name === name)).toBe(false);
  });

  it("shows production no explorations and no Explore link", async () => {
    const { page } = await session(demo.production);
    await page.goto(`/revisions/${releasedId}`);
    await page.getByRole("heading", { level: 1 }).waitFor();
    expect(await page.locator("#explorations").count()).toBe(0);
    expect(await page.getByTestId("explore-link").count()).toBe(0);
    await page.goto(`/formulations/${formulationId}`);
    await page.getByRole("heading", { level: 1 }).waitFor();
    expect(await page.locator("#explorations").count()).toBe(0);
    expect(await page.getByTestId("explore-link").count()).toBe(0);
  });
});
