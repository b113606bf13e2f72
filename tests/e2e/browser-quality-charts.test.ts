/**
 * End to end, in Chromium: production opens the visor hard coat's control
 * charts from the formulation page and reads the solids-content I-MR chart —
 * the centre line and control limits in words (the same figures the chart API
 * gives, which are x̄ and x̄ ± 3·MR̄/1.128 as in NIST/SEMATECH e-Handbook
 * section 6.3.2), the specification limits apart, the shift in the demo data
 * flagged as 8 points in a row on one side, flagged points drawn as triangles,
 * Cpk with its caution (25 or more results), and the weighing-deviation charts;
 * no serious accessibility violation.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_QUALITY } from "@/db/demo";
import { openSession, poll, screenshot, seriousViolations, signInAs, type Session } from "./browser";
import { anonymous, demo, signIn } from "./http";

interface ChartsBody {
  specifications: { property: string; key: string; chart: { mean: number; upperControlLimit: number; lowerControlLimit: number } | null }[];
  weighing: { materialId: string }[];
}

let session: Session;
let formulationId: string;
let charts: ChartsBody;
const fmt = new Intl.NumberFormat("en-GB", { maximumSignificantDigits: 4 });

beforeAll(async () => {
  const api = await signIn(demo.production);
  const list = (await (await api.fetch("/api/formulations?pageSize=100")).json()) as { rows: { id: string; name: string }[] };
  formulationId = list.rows.find((r) => r.name === DEMO_QUALITY.formulation)!.id;
  const res = await api.fetch(`/api/formulations/${formulationId}/charts`);
  expect(res.status).toBe(200);
  charts = (await res.json()) as ChartsBody;
  session = await openSession({ width: 1400, height: 1000 });
  await signInAs(session.page, demo.production);
});

afterAll(async () => {
  await session?.close();
});

describe("control charts of the visor hard coat", () => {
  it("answers the chart API with 404 for a missing formulation or an odd id, 401 signed out, never a 500", async () => {
    const api = await signIn(demo.production);
    for (const id of ["missing", "x".repeat(300), crypto.randomUUID()]) {
      const res = await api.fetch(`/api/formulations/${id}/charts`);
      expect(res.status, id).toBe(404);
      expect(((await res.json()) as { error: { code: string } }).error.code).toBe("not_found");
    }
    expect((await anonymous().fetch(`/api/formulations/${formulationId}/charts`)).status).toBe(401);
  });

  it("shows the solids content chart with its centre line, limits, the flagged shift and Cpk", async () => {
    const page = session.page;
    await page.goto(`/formulations/${formulationId}`);
    await page.getByRole("link", { name: "Control charts" }).click();
    await page.waitForURL(`**/formulations/${formulationId}/charts`);
    expect(await page.getByRole("heading", { level: 1 }).textContent()).toBe(`Control charts of ${DEMO_QUALITY.formulation}`);

    const solids = charts.specifications.find((s) => s.property === "Solids content")!;
    const figure = page.getByTestId(`spec-chart-${solids.key}`);
    await poll(() => figure.count()).toBe(1);
    const limits = (await figure.getByTestId("chart-limits").innerText()).replace(/\s+/g, " ");
    expect(limits).toContain(`Centre line x̄: ${fmt.format(solids.chart!.mean)} % w/w`);
    expect(limits).toContain(`Upper control limit: ${fmt.format(solids.chart!.upperControlLimit)} % w/w`);
    expect(limits).toContain(`Lower control limit: ${fmt.format(solids.chart!.lowerControlLimit)} % w/w`);
    expect(limits).toContain("Specification: lower 19, upper 21, target 20 % w/w");
    expect(await figure.getByTestId("run-rules").innerText()).toMatch(/Flagged: 8 points in a row on one side of the centre line — batches \d+/);
    await poll(() => figure.locator('path[data-flagged="true"]').count()).toBeGreaterThan(0);
    const drawn = await figure.locator("svg").first().textContent();
    expect(drawn).toContain("USL (spec)");
    expect(drawn).toContain("LSL (spec)");
    expect(drawn).toContain("UCL");
    expect(await figure.getByTestId("cpk").innerText()).toMatch(new RegExp(`Cpk = -?\\d+\\.\\d\\d from ${DEMO_QUALITY.batches} results\\. .*stable process`));

    // The table view lists every batch, with the out-of-specification viscosity marked in its own chart.
    const viscosity = charts.specifications.find((s) => s.property === "Viscosity")!;
    const vFigure = page.getByTestId(`spec-chart-${viscosity.key}`);
    await vFigure.getByText("Values as a table").click();
    expect(await vFigure.locator("tbody tr").count()).toBe(DEMO_QUALITY.batches);
    expect(await vFigure.locator("tbody").innerText()).toContain("out of specification");

    expect(charts.weighing.length).toBeGreaterThan(3);
    await poll(() => page.locator('[data-testid^="weighing-chart-"]').count()).toBe(charts.weighing.length);
    await screenshot(page, "quality-charts");
    const violations = await seriousViolations(page);
    expect(violations, JSON.stringify(violations, null, 2)).toEqual([]);
  });
});
