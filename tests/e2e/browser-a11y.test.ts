/**
 * axe-core on each main screen, signed in with a role that sees it: no
 * serious or critical violation. Every screen is also saved as a screenshot
 * in .tmp/test/screenshots/.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { openSession, poll, screenshot, seriousViolations, signInAs, type Session } from "./browser";
import { demo, signIn } from "./http";

async function revisionIds(): Promise<{ inReview: string; released: string; material: string }> {
  const api = await signIn(demo.formulator);
  const first = async (q: string) => {
    const list = (await (await api.fetch(`/api/formulations?q=${encodeURIComponent(q)}&pageSize=100`)).json()) as {
      rows: { id: string; name: string }[];
    };
    // The search matches copies too (imports keep the name in theirs): take the exact one.
    const exact = list.rows.find((r) => r.name === q)!;
    return (await (await api.fetch(`/api/formulations/${exact.id}`)).json()) as { revisions: { id: string; state: string }[] };
  };
  const hc4 = await first("Visor hard coat HC-4");
  const hc3 = await first("Visor hard coat HC-3");
  const lib = (await (await api.fetch("/api/materials?q=Tetraethoxysilane")).json()) as { rows: { id: string }[] };
  return {
    inReview: hc4.revisions[0]!.id,
    released: hc3.revisions.find((r) => r.state === "released")!.id,
    material: lib.rows[0]!.id,
  };
}

describe("accessibility of the main screens (axe-core)", () => {
  const sessions: Partial<Record<keyof typeof demo, Session>> = {};
  let ids: Awaited<ReturnType<typeof revisionIds>>;

  beforeAll(async () => {
    ids = await revisionIds();
    for (const role of ["admin", "formulator", "reviewer", "production"] as const) {
      const s = await openSession();
      await signInAs(s.page, demo[role]);
      sessions[role] = s;
    }
  });

  afterAll(async () => {
    for (const s of Object.values(sessions)) await s?.close();
  });

  const screens: { name: string; role: keyof typeof demo; path: () => string; ready: string }[] = [
    { name: "home", role: "formulator", path: () => "/home", ready: "h1" },
    { name: "formulations", role: "formulator", path: () => "/formulations", ready: "table tbody tr" },
    { name: "editor-new", role: "formulator", path: () => "/formulations/new", ready: "form[aria-label='Formulation editor']" },
    { name: "revision-review", role: "reviewer", path: () => `/revisions/${ids.inReview}`, ready: "[data-testid='thermal-matrix']" },
    { name: "materials", role: "formulator", path: () => "/materials", ready: "table tbody tr" },
    { name: "material-form", role: "formulator", path: () => `/materials/${ids.material}`, ready: "form[aria-label='Material']" },
    { name: "team", role: "admin", path: () => "/team", ready: "table tbody tr" },
    { name: "mailbox", role: "admin", path: () => "/team/mail", ready: "h1" },
    { name: "activity", role: "reviewer", path: () => "/activity", ready: "ol li" },
    { name: "production", role: "production", path: () => "/production", ready: "[data-testid='released-list']" },
    { name: "batch-sheet", role: "production", path: () => `/revisions/${ids.released}/batch-sheet`, ready: "[data-testid='batch-sheet']" },
  ];

  for (const screen of screens) {
    it(`finds no serious or critical violation on ${screen.name}`, async () => {
      const page = sessions[screen.role]!.page;
      await page.goto(screen.path());
      await poll(() => page.locator(screen.ready).count()).toBeGreaterThan(0);
      await page.waitForTimeout(300);
      await screenshot(page, `screen-${screen.name}`);
      const violations = await seriousViolations(page);
      expect(violations, JSON.stringify(violations, null, 2)).toEqual([]);
    });
  }

  it("finds no serious or critical violation on the sign-in page", async () => {
    const s = await openSession();
    try {
      await s.page.goto("/sign-in");
      await screenshot(s.page, "screen-sign-in");
      expect(await seriousViolations(s.page)).toEqual([]);
    } finally {
      await s.close();
    }
  });
});
