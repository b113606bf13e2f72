/**
 * The team page's weighing tolerance: an admin changes it and a bad value is
 * refused beside its field; other roles see it read-only. Removing a
 * material asks first, in the page, and keeps it unless confirmed.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { openSession, poll, screenshot, seriousViolations, setNumber, signInAs, unique, type Session } from "./browser";
import { demo, signIn } from "./http";

let admin: Session;
let production: Session;

beforeAll(async () => {
  admin = await openSession();
  production = await openSession();
  await signInAs(admin.page, demo.admin);
  await signInAs(production.page, demo.production);
});

afterAll(async () => {
  // Put the team default back for the other tests.
  const api = await signIn(demo.admin);
  await api.fetch("/api/batches/settings", { method: "PUT", json: { toleranceFraction: 0.01, balanceResolutionGrams: 0.01 } });
  await admin?.close();
  await production?.close();
});

describe("weighing tolerance on the team page", () => {
  it("lets an admin save a new tolerance and refuses a bad one beside its field", async () => {
    const page = admin.page;
    await page.goto("/team");
    await poll(() => page.locator("#tolerance-percent").inputValue()).toBe("1");
    await setNumber(page, "#tolerance-percent", 80);
    await page.getByRole("button", { name: "Save tolerance" }).click();
    await poll(() => page.locator("#tolerance-percent-error").textContent()).toMatch(/At most 50 %/);
    await setNumber(page, "#tolerance-percent", 2.5);
    await page.getByRole("button", { name: "Save tolerance" }).click();
    await poll(() => page.getByText("Saved. Batches started from now on use these values.").count()).toBe(1);
    const api = await signIn(demo.production);
    const saved = (await (await api.fetch("/api/batches/settings")).json()) as { toleranceFraction: number };
    expect(saved.toleranceFraction).toBeCloseTo(0.025, 10);
    expect(await seriousViolations(page)).toEqual([]);
    await screenshot(page, "team-tolerance");
  });

  it("shows the tolerance read-only to production", async () => {
    const page = production.page;
    await page.goto("/team");
    await poll(() => page.locator("#tolerance-percent").count()).toBe(1);
    expect(await page.locator("#tolerance-percent").isDisabled()).toBe(true);
    expect(await page.getByRole("button", { name: "Save tolerance" }).count()).toBe(0);
  });
});

describe("removing a material", () => {
  it("asks in the page first: Escape and Keep leave it, the named button removes it", async () => {
    const api = await signIn(demo.admin);
    const name = `Spare glycol ${unique()}`;
    const created = await api.fetch("/api/materials", {
      method: "POST",
      json: { material: { id: "spare", name, kind: "solvent", formula: "C2H6O2", molarMass: 62.068, density: 1.113 } },
    });
    expect(created.status).toBe(201);
    const { id } = (await created.json()) as { id: string };

    const page = admin.page;
    await page.goto(`/materials/${id}`);
    const removeButton = page.getByRole("button", { name: "Remove from the library" });
    const dialog = page.getByTestId("confirm-dialog");

    await removeButton.click();
    await poll(() => dialog.isVisible()).toBe(true);
    expect(await dialog.textContent()).toContain(`Remove ${name}?`);
    // Focus starts on Keep, so Enter does not remove.
    expect(await page.evaluate(() => document.activeElement?.textContent)).toBe("Keep");
    expect(await seriousViolations(page)).toEqual([]);
    await screenshot(page, "confirm-remove-material");
    await page.keyboard.press("Escape");
    await poll(() => dialog.count()).toBe(0);

    await removeButton.click();
    await dialog.getByRole("button", { name: "Keep" }).click();
    await poll(() => dialog.count()).toBe(0);
    expect((await api.fetch(`/api/materials/${id}`)).status).toBe(200);

    await removeButton.click();
    await dialog.getByRole("button", { name: "Remove from the library" }).click();
    await page.waitForURL(/\/materials$/);
    await poll(async () => (await api.fetch(`/api/materials/${id}`)).status).toBe(404);
  });
});
