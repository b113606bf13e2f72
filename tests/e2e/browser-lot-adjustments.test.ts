/**
 * End to end, in Chromium: production records a recount on a lot page through
 * "Adjust stock" (a negative amount and a missing note for "Other" named
 * beside their fields), sees the new amount on hand and the history row
 * (before → after with units, reason, who); after someone else's change the
 * form offers to reload the saved lot; a lot adjusted to 0 reads used up; a
 * reviewer sees the history but no form.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { openSession, poll, signInAs, unique, type Session } from "./browser";
import { demo, signIn, type Client } from "./http";

interface Lot {
  id: string;
  materialId: string;
  quantityOnHand: number;
  version: number;
}

let api: Client;

beforeAll(async () => {
  api = await signIn(demo.production);
});

describe("stock adjustments of a lot in the browser", () => {
  let production: Session;
  let reviewer: Session;
  const stamp = unique();
  let lot: Lot;

  beforeAll(async () => {
    production = await openSession();
    await signInAs(production.page, demo.production);
    reviewer = await openSession();
    await signInAs(reviewer.page, demo.reviewer);
    const lots = (await (await api.fetch("/api/lots")).json()) as { rows: Lot[] };
    const res = await api.fetch("/api/lots", {
      method: "POST",
      json: { materialId: lots.rows[0]!.materialId, supplier: "Browser Stock", supplierLot: `ST-${stamp}`, quantity: 2, unit: "kg", receivedOn: "2026-03-10", expiresOn: "2099-03-01" },
    });
    expect(res.status).toBe(201);
    lot = (await res.json()) as Lot;
  });

  afterAll(async () => {
    await production?.close();
    await reviewer?.close();
  });

  it("records a recount: bad input named beside its field, then the new amount on hand and a history row", async () => {
    const page = production.page;
    await page.goto(`/lots/${lot.id}`);
    expect(await page.getByTestId("lot-on-hand").textContent()).toBe("2 kg");
    expect(await page.locator("#adjustments").textContent()).toMatch(/has not been adjusted by hand/);
    await page.getByRole("button", { name: "Adjust stock" }).click();
    // The field starts at what the lot shows.
    expect(await page.locator("#adjust-lot-quantity").inputValue()).toBe("2");
    await page.locator("#adjust-lot-quantity").fill("-1");
    await page.getByRole("button", { name: "Save adjustment" }).click();
    await poll(() => page.locator("#adjust-lot-quantity-error").textContent()).toMatch(/must not be negative/);
    await page.locator("#adjust-lot-quantity").fill("1,85");
    await page.locator("#adjust-lot-reason").selectOption("other");
    await page.getByRole("button", { name: "Save adjustment" }).click();
    await poll(() => page.locator("#adjust-lot-note-error").textContent()).toMatch(/required when the reason is "other"/);
    await page.locator("#adjust-lot-reason").selectOption("recount");
    await page.getByRole("button", { name: "Save adjustment" }).click();
    await poll(() => page.getByTestId("lot-on-hand").textContent()).toBe("1.85 kg");
    const rows = page.getByTestId("lot-adjustments").locator("tbody tr");
    await poll(() => rows.count()).toBe(1);
    const row = (await rows.first().textContent())!;
    expect(row).toContain("2 kg → 1.85 kg");
    expect(row).toContain("Recount");
    const saved = (await (await api.fetch(`/api/lots/${lot.id}/adjustments`)).json()) as { rows: { adjustedByName: string }[] };
    expect(row).toContain(saved.rows[0]!.adjustedByName);
    expect(((await (await api.fetch(`/api/lots/${lot.id}`)).json()) as Lot)).toMatchObject({ quantityOnHand: 1.85, version: 2 });
  });

  it("after someone else's change offers to reload the saved lot, and writes nothing of its own", async () => {
    const page = production.page;
    await page.getByRole("button", { name: "Adjust stock" }).click();
    // someone else records a spill meanwhile (version 2 → 3)
    const other = await api.fetch(`/api/lots/${lot.id}/adjustments`, { method: "POST", json: { version: 2, quantityOnHand: 1.8, reason: "damaged", note: `spill ${stamp}` } });
    expect(other.status).toBe(201);
    await page.locator("#adjust-lot-quantity").fill("1.7");
    await page.locator("#adjust-lot-reason").selectOption("sample");
    await page.getByRole("button", { name: "Save adjustment" }).click();
    await poll(() => page.getByText(/Someone changed this lot after you opened it/).count()).toBe(1);
    await page.getByRole("button", { name: "Reload the saved lot" }).click();
    await poll(() => page.getByTestId("lot-on-hand").textContent()).toBe("1.8 kg");
    const rows = page.getByTestId("lot-adjustments").locator("tbody tr");
    await poll(() => rows.count()).toBe(2);
    // Newest first: the spill, with its note.
    const newest = (await rows.first().textContent())!;
    expect(newest).toContain("1.85 kg → 1.8 kg");
    expect(newest).toContain("Spilled or damaged");
    expect(newest).toContain(`spill ${stamp}`);
  });

  it("reads used up once the lot is adjusted to 0, and leaves the in-stock list", async () => {
    const page = production.page;
    await page.getByRole("button", { name: "Adjust stock" }).click();
    await page.locator("#adjust-lot-quantity").fill("0");
    await page.locator("#adjust-lot-reason").selectOption("disposed");
    await page.locator("#adjust-lot-note").fill("past its expiry, sent to waste");
    await page.getByRole("button", { name: "Save adjustment" }).click();
    await poll(() => page.getByTestId("lot-on-hand").textContent()).toBe("0 kg");
    expect(await page.locator("#received").textContent()).toContain("(used up)");
    const inStock = (await (await api.fetch("/api/lots?inStock=1")).json()) as { rows: { id: string }[] };
    expect(inStock.rows.map((r) => r.id)).not.toContain(lot.id);
  });

  it("shows a reviewer the history but no Adjust stock form", async () => {
    const page = reviewer.page;
    await page.goto(`/lots/${lot.id}`);
    const rows = page.getByTestId("lot-adjustments").locator("tbody tr");
    await poll(() => rows.count()).toBe(3);
    expect(await rows.first().textContent()).toContain("1.8 kg → 0 kg");
    expect(await rows.first().textContent()).toContain("Disposed of (expired or off-spec)");
    expect(await page.getByRole("button", { name: "Adjust stock" }).count()).toBe(0);
  });
});
