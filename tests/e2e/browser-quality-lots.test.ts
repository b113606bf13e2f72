/**
 * End to end, in Chromium: production receives a material lot through the
 * form (a bad expiry date is named beside its field), the lot page shows
 * what is on hand; a line of a batch takes from that lot; a reviewer who did
 * not make the batch releases it from the batch record's disposition panel,
 * and the lot's quantity on hand goes down by the line's mass. Production
 * then corrects the lot's expiry and assay through its Edit form (a bad
 * assay named beside its field); Edit opens again on the saved values and,
 * after someone else's correction, offers the saved lot; a reviewer sees no Edit, and a batch line
 * that picked the lot shows its lot number read-only.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { openSession, poll, signInAs, unique, type Session } from "./browser";
import { demo, signIn, type Client } from "./http";

interface Batch {
  id: string;
  lines: { index: number; role: string; materialId: string; name: string; targetGrams: number }[];
}

let api: Client;
let releasedId: string;

beforeAll(async () => {
  api = await signIn(demo.production);
  const list = (await (await api.fetch("/api/formulations?pageSize=100")).json()) as { rows: { id: string; name: string }[] };
  const hc3 = list.rows.find((f) => f.name === "Visor hard coat HC-3")!.id;
  const detail = (await (await api.fetch(`/api/formulations/${hc3}`)).json()) as { revisions: { id: string; state: string }[] };
  releasedId = detail.revisions.find((r) => r.state === "released")!.id;
});

describe("material lots and batch disposition in the browser", () => {
  let production: Session;
  let reviewer: Session;
  const stamp = unique();
  let batch: Batch;
  let lotId: string;

  beforeAll(async () => {
    production = await openSession();
    await signInAs(production.page, demo.production);
    reviewer = await openSession();
    await signInAs(reviewer.page, demo.reviewer);
    batch = (await (await api.fetch("/api/batches", { method: "POST", json: { revisionId: releasedId } })).json()) as Batch;
  });

  afterAll(async () => {
    await production?.close();
    await reviewer?.close();
  });

  it("receives a lot through the form, naming a bad expiry date beside its field", async () => {
    const page = production.page;
    const line = batch.lines.find((l) => l.role !== "water")!;
    await page.goto("/lots");
    await page.locator("#lot-material").selectOption(line.materialId);
    await page.locator("#lot-supplier").fill("Browser Silanes");
    await page.locator("#lot-number").fill(`BR-${stamp}`);
    await page.locator("#lot-quantity").fill("2");
    await page.locator("#lot-unit").selectOption("kg");
    await page.locator("#lot-received").fill("2026-03-10");
    await page.locator("#lot-expires").fill("2026-03-01");
    await page.getByRole("button", { name: "Receive lot" }).click();
    await poll(() => page.locator("#lot-expires-error").textContent()).toMatch(/must not be before the received date/);
    await page.locator("#lot-expires").fill("2099-03-01");
    await page.getByRole("button", { name: "Receive lot" }).click();
    await page.waitForURL(/\/lots\/[0-9a-f-]{36}$/);
    lotId = /\/lots\/([0-9a-f-]{36})$/.exec(page.url())![1]!;
    expect(await page.getByTestId("lot-on-hand").textContent()).toBe("2 kg");
  });

  it("lets a reviewer who did not make the batch release it, taking the line's mass off the lot", async () => {
    const line = batch.lines.find((l) => l.role !== "water")!;
    for (const l of batch.lines) {
      await api.fetch(`/api/batches/${batch.id}/lines/${l.index}`, { method: "PATCH", json: { actualGrams: l.targetGrams, lotNumber: l.role === "water" ? null : `T-${stamp}` } });
    }
    const chosen = await api.fetch(`/api/batches/${batch.id}/lines/${line.index}/lot`, { method: "PUT", json: { lotId } });
    expect(chosen.status).toBe(200);
    expect((await api.fetch(`/api/batches/${batch.id}/close`, { method: "POST", json: {} })).status).toBe(200);

    const page = reviewer.page;
    await page.goto(`/batches/${batch.id}`);
    await page.getByLabel("Released for use").check();
    await page.getByRole("button", { name: "Record disposition" }).click();
    await poll(() => page.getByTestId("disposition").count()).toBeGreaterThan(0);
    expect(await page.getByTestId("disposition").textContent()).toMatch(/Released for use/);
    const lot = (await (await api.fetch(`/api/lots/${lotId}`)).json()) as { quantityOnHand: number; uses: { quantityUsed: number }[] };
    // 2 kg received, the line's mass (g) taken off in kg: 1 kg = 1000 g.
    expect(lot.quantityOnHand).toBeCloseTo(2 - line.targetGrams / 1000, 9);
    expect(lot.uses[0]!.quantityUsed).toBeCloseTo(line.targetGrams / 1000, 9);
  });

  it("lets production correct the lot's expiry and assay through Edit, and shows the new values", async () => {
    const page = production.page;
    await page.goto(`/lots/${lotId}`);
    await page.getByRole("button", { name: "Edit", exact: true }).click();
    await page.locator("#edit-lot-assay").fill("1.5");
    await page.getByRole("button", { name: "Save correction" }).click();
    await poll(() => page.locator("#edit-lot-assay-error").textContent()).toMatch(/mass fraction: at most 1/);
    expect(await page.getByTestId("lot-assay-help").textContent()).toMatch(/already released from this lot keep the assay they were released with/);
    await page.locator("#edit-lot-assay").fill("0.97");
    await page.locator("#edit-lot-expires").fill("2099-06-30");
    await page.getByRole("button", { name: "Save correction" }).click();
    await poll(() => page.locator("#received").textContent()).toMatch(/0\.97 \(mass fraction\)/);
    const received = (await page.locator("#received").textContent())!;
    expect(received).toMatch(/Expires on\s*2099-06-30/);
    // The quantity on hand is not the correction's: as the release left it.
    const lot = (await (await api.fetch(`/api/lots/${lotId}`)).json()) as { version: number; measuredAssay: number; expiresOn: string; quantityOnHand: number };
    expect(lot).toMatchObject({ version: 2, measuredAssay: 0.97, expiresOn: "2099-06-30" });
    expect(lot.quantityOnHand).toBeLessThan(2);
  });

  it("opens Edit again on the saved values, and after someone else's correction offers to reload the saved lot", async () => {
    // still on the lot page where the correction above was saved: no new page load
    const page = production.page;
    await page.getByRole("button", { name: "Edit", exact: true }).click();
    // the fields show the correction saved above, not the values at receipt
    expect(await page.locator("#edit-lot-assay").inputValue()).toBe("0.97");
    expect(await page.locator("#edit-lot-expires").inputValue()).toBe("2099-06-30");
    // someone else corrects the notes meanwhile (version 2 → 3)
    const other = await api.fetch(`/api/lots/${lotId}`, { method: "PATCH", json: { version: 2, notes: `Recounted ${stamp}` } });
    expect(other.status).toBe(200);
    await page.locator("#edit-lot-supplier").fill("Browser Silanes GmbH");
    await page.getByRole("button", { name: "Save correction" }).click();
    await poll(() => page.getByText(/Someone changed this lot after you opened it/).count()).toBe(1);
    await page.getByRole("button", { name: "Reload the saved lot" }).click();
    // the page shows the saved lot; Edit opens on its values, the unsaved supplier gone
    await poll(() => page.locator("#received").textContent()).toContain(`Recounted ${stamp}`);
    await page.getByRole("button", { name: "Edit", exact: true }).click();
    expect(await page.locator("#edit-lot-notes").inputValue()).toBe(`Recounted ${stamp}`);
    expect(await page.locator("#edit-lot-supplier").inputValue()).toBe("Browser Silanes");
    const lot = (await (await api.fetch(`/api/lots/${lotId}`)).json()) as { version: number; supplier: string };
    expect(lot).toMatchObject({ version: 3, supplier: "Browser Silanes" });
  });

  it("shows a reviewer the lot without an Edit button", async () => {
    const page = reviewer.page;
    await page.goto(`/lots/${lotId}`);
    await poll(() => page.locator("#received").textContent()).toMatch(/0\.97 \(mass fraction\)/);
    expect(await page.getByRole("button", { name: "Edit", exact: true }).count()).toBe(0);
  });

  it("shows a picked lot's number read-only in the weighing form: typing over it changes nothing", async () => {
    const open = (await (await api.fetch("/api/batches", { method: "POST", json: { revisionId: releasedId } })).json()) as Batch;
    const line = open.lines.find((l) => l.role !== "water")!;
    expect((await api.fetch(`/api/batches/${open.id}/lines/${line.index}/lot`, { method: "PUT", json: { lotId } })).status).toBe(200);
    const page = production.page;
    await page.goto(`/batches/${open.id}/weigh`);
    const field = page.locator(`#lot-${line.index}`);
    await poll(() => field.inputValue()).toBe(`BR-${stamp}`);
    expect(await field.getAttribute("readonly")).not.toBeNull();
    await field.click();
    await page.keyboard.type("HAND");
    expect(await field.inputValue()).toBe(`BR-${stamp}`);
    // A field that could not be typed into leaves nothing to save: the record keeps the lot's number.
    await page.locator(`#mass-${line.index}`).click();
    const saved = (await (await api.fetch(`/api/batches/${open.id}`)).json()) as { lines: { lotNumber: string | null }[] };
    expect(saved.lines[line.index]!.lotNumber).toBe(`BR-${stamp}`);
  });
});
