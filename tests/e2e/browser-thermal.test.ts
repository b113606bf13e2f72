/**
 * End to end, in Chromium: a curing step above the substrate's limit
 * (150 °C on polycarbonate, whose heat deflection temperature at 1.8 MPa in
 * the reference data is 132 °C) shows as a fail in the thermal view, with
 * each step's stage and atmosphere, and the reviewer cannot
 * approve it: no enabled button, a reason on screen, and a server refusal.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { openSession, poll, screenshot, signInAs, unique, type Session } from "./browser";
import { demo, signIn } from "./http";

interface LibraryRow {
  id: string;
  name: string;
  kind: string;
  [key: string]: unknown;
}

/** Creates and submits, through the API, a hard coat cured at 150 °C on polycarbonate. */
async function submitHotCure(): Promise<string> {
  const api = await signIn(demo.formulator);
  const lib = (await (await api.fetch("/api/materials?pageSize=500")).json()) as { rows: LibraryRow[] };
  const pick = (re: RegExp, kind: string) => {
    const m = lib.rows.find((r) => r.kind === kind && re.test(r.name));
    if (!m) throw new Error(`no ${kind} matching ${re}`);
    const { updatedAt: _u, casNumber: _c, ...rest } = m;
    void _u;
    void _c;
    return rest;
  };
  const teos = pick(/Tetraethoxysilane/, "precursor");
  const gptms = pick(/Glycidoxypropyl/, "precursor");
  const water = pick(/water/i, "water");
  const ethanol = pick(/^Ethanol/, "solvent");
  const pc = pick(/Polycarbonate/, "substrate");
  const input = {
    materials: [teos, gptms, water, ethanol, pc],
    basis: { type: "solidMass", grams: 20 },
    components: [
      { materialId: gptms.id, weightFraction: 0.7 },
      { materialId: teos.id, weightFraction: 0.3 },
    ],
    water: { materialId: water.id, ratio: "R", value: 4 },
    solvent: { materialId: ethanol.id, mode: "molPerNetworkAtom", value: 4 },
    substrateId: pc.id,
    steps: [
      { name: "Hydrolysis", temperatureC: 25, durationH: 2 },
      { name: "Fast cure", temperatureC: 150, durationH: 0.5 },
    ],
    marginC: 20,
  };
  const created = await api.fetch("/api/formulations", { method: "POST", json: { name: `E2E hot cure ${unique()}`, project: "End-to-end checks", input } });
  if (created.status !== 201) throw new Error(`create: ${created.status} ${await created.text()}`);
  const { revisionId } = (await created.json()) as { revisionId: string };
  const submitted = await api.fetch(`/api/revisions/${revisionId}/submit`, { method: "POST", json: {} });
  if (submitted.status !== 200) throw new Error(`submit: ${submitted.status} ${await submitted.text()}`);
  return revisionId;
}

describe("thermal fail in the browser", () => {
  let formulator: Session;
  let reviewer: Session;
  let revisionId = "";

  beforeAll(async () => {
    revisionId = await submitHotCure();
    formulator = await openSession();
    reviewer = await openSession();
    await signInAs(formulator.page, demo.formulator);
    await signInAs(reviewer.page, demo.reviewer);
  });

  afterAll(async () => {
    await formulator?.close();
    await reviewer?.close();
  });

  it("marks the cure step as failing on the substrate and names the binding limit", async () => {
    const page = formulator.page;
    await page.goto(`/revisions/${revisionId}`);
    const matrix = page.getByTestId("thermal-matrix");
    await poll(() => matrix.getByRole("row", { name: /Polycarbonate/ }).textContent()).toMatch(/Fails/);
    // 132 °C heat deflection temperature less the 20 °C margin.
    expect(await page.getByTestId("max-allowed").textContent()).toMatch(/112\s°C/);
    expect(await matrix.textContent()).toMatch(/bound by Polycarbonate.*heat deflection temperature/);
    // Steps stored without a stage or atmosphere are checked, and shown, as cures in air.
    expect(await page.getByTestId("step-conditions-1").textContent()).toBe("Curing · Air");
    // 150 °C for 0.5 h is above the 125 °C continuous-use rating as well: the hours are stated.
    expect(await page.getByTestId("service-rating").textContent()).toMatch(/0\.5 h at or above its continuous-use rating of 125 °C/);
    await poll(() => page.getByTestId("thermal-block").textContent()).toMatch(/cannot be approved.*Fast cure.*150 °C/s);
    await screenshot(page, "thermal-fail");
  });

  it("blocks the reviewer's approval and shows why, and the server refuses it too", async () => {
    const page = reviewer.page;
    await page.goto(`/revisions/${revisionId}`);
    await poll(() => page.getByTestId("thermal-block").count()).toBe(1);
    const approve = page.getByRole("button", { name: "Approve" });
    await poll(() => approve.count()).toBe(1);
    expect(await approve.isDisabled()).toBe(true);
    expect(await page.getByText(/Cannot be approved: a process step exceeds/).count()).toBe(1);
    await screenshot(page, "review-thermal-fail");
    const res = await page.evaluate(async (id) => {
      const r = await fetch(`/api/revisions/${id}/approve`, { method: "POST", headers: { "content-type": "application/json" }, body: "{}" });
      return { status: r.status, body: (await r.json()) as { error: { code: string; message: string } } };
    }, revisionId);
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe("thermal_fail");
    // Sending it back stays possible.
    await page.getByLabel(/^Comment/).fill("Cure at 100 °C or below on polycarbonate.");
    await page.getByRole("button", { name: "Send back with comment" }).click();
    await poll(() => page.locator("h1").first().textContent()).toMatch(/Draft/);
  });

  it("shows the failing step beside the process steps in the editor", async () => {
    const page = formulator.page;
    await page.goto(`/revisions/${revisionId}/edit`);
    await poll(() => page.locator("#f-steps-error").textContent()).toMatch(/Fast cure.*150 °C.*Polycarbonate/);
  });
});
