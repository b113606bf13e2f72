/**
 * End to end, in Chromium: a formulator imports a workbook built from our
 * template (downloaded through the API and edited with the `xlsx` package).
 * A wrong cell is listed with its sheet, row and column; the fixed file is
 * uploaded again, confirmed, and the new revision's exported workbook holds
 * the values of the file.
 */
import { mkdirSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import * as XLSX from "xlsx";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { openSession, poll, revisionIdOf, screenshot, seriousViolations, signInAs, unique, type Session } from "./browser";
import { demo, signIn } from "./http";

const DIR = join(process.cwd(), ".tmp", "test", "import");
const stamp = unique();
const NAME = `Imported hard coat ${stamp}`;

/** The template with our own formulation name and the "Ageing of the sol" step's duration (Process steps, C3) set to `duration`. */
function workbook(template: Buffer, duration: string | number, file: string): string {
  const wb = XLSX.read(template, { type: "buffer" });
  const input = wb.Sheets.Input!;
  expect(input.A2?.v).toBe("Formulation name");
  input.B2 = { t: "s", v: NAME };
  const steps = wb.Sheets["Process steps"]!;
  expect(steps.A3?.v).toBe("Ageing of the sol");
  steps.C3 = typeof duration === "number" ? { t: "n", v: duration } : { t: "s", v: duration };
  mkdirSync(DIR, { recursive: true });
  const path = join(DIR, file);
  writeFileSync(path, XLSX.write(wb, { type: "buffer", bookType: "xlsx" }) as Buffer);
  return path;
}

describe("import of a formulation workbook in the browser", () => {
  let session: Session;
  let template: Buffer;

  beforeAll(async () => {
    const api = await signIn(demo.formulator);
    const res = await api.fetch("/api/templates/formulation?format=xlsx");
    expect(res.status).toBe(200);
    template = Buffer.from(await res.arrayBuffer());
    session = await openSession();
    await signInAs(session.page, demo.formulator);
  });

  afterAll(async () => {
    await session?.close();
  });

  it("lists a wrong cell with its sheet, row and column and saves nothing", async () => {
    const page = session.page;
    await page.goto("/formulations");
    await page.getByRole("link", { name: "Import from a spreadsheet" }).click();
    await page.waitForURL(/\/import\?kind=formulation$/);
    expect(await page.getByRole("radio", { name: "A formulation" }).isChecked()).toBe(true);
    expect(await page.getByRole("link", { name: /Template \(\.xlsx\)/ }).getAttribute("href")).toBe("/api/templates/formulation?format=xlsx");
    await screenshot(page, "import-start");

    await page.locator("#import-file").setInputFiles(workbook(template, "twenty-four", "bad.xlsx"));
    await page.getByRole("button", { name: "Upload and check" }).click();
    const problems = page.getByTestId("import-problems");
    await poll(() => problems.count()).toBe(1);
    const row = problems.locator("tbody tr").filter({ hasText: "Process steps" });
    expect(await row.count()).toBe(1);
    const cells = (await row.locator("td").allTextContents()).map((t) => t.replace(/^[✕!]/, "").replace(/\s+/g, " ").trim());
    expect(cells.slice(0, 4)).toEqual(["Error", "Process steps", "3", "C Duration (h)"]);
    expect(await page.getByTestId("import-preview").textContent()).toMatch(/1 error: nothing can be saved/);
    expect(await page.getByRole("button", { name: "Save as a new formulation" }).count()).toBe(0);
    await screenshot(page, "import-preview-errors");
    const violations = await seriousViolations(page);
    expect(violations, JSON.stringify(violations, null, 2)).toEqual([]);
  });

  it("saves the fixed file as a new formulation, and its exported workbook holds the file's values", async () => {
    const page = session.page;
    await page.locator("#import-file").setInputFiles(workbook(template, 24, "fixed.xlsx"));
    await page.getByRole("button", { name: "Upload again and check" }).click();
    await poll(async () => (await page.getByTestId("import-preview").textContent()) ?? "").toMatch(/No errors/);
    expect(await page.getByTestId("import-problems").locator("tbody tr").filter({ hasText: "Error" }).count()).toBe(0);
    expect(await page.getByTestId("import-counts").textContent()).toMatch(/Process steps\s*4/);
    const accept = page.getByRole("checkbox", { name: /warning/ });
    if ((await accept.count()) > 0) await accept.check();
    await screenshot(page, "import-preview-ready");
    await page.getByRole("button", { name: "Save as a new formulation" }).click();
    const saved = page.getByTestId("import-saved");
    await poll(() => saved.count()).toBe(1);
    expect(await saved.textContent()).toContain(NAME);
    await screenshot(page, "import-saved");
    expect(await seriousViolations(page)).toEqual([]);

    await saved.getByRole("link", { name: "Open revision 1" }).click();
    await page.waitForURL(/\/revisions\/[0-9a-f-]{36}$/);
    const revisionId = revisionIdOf(page.url());
    const [download] = await Promise.all([page.waitForEvent("download"), page.getByRole("link", { name: /Workbook \(\.xlsx\)/ }).click()]);
    const path = join(DIR, `export-${revisionId}.xlsx`);
    await download.saveAs(path);
    const wb = XLSX.readFile(path);
    expect(wb.Sheets.Input!.B2!.v).toBe(NAME);
    const steps = XLSX.utils.sheet_to_json<unknown[]>(wb.Sheets["Process steps"]!, { header: 1, raw: true });
    expect(steps[2]).toEqual(["Ageing of the sol", 25, 24, "sol"]); // with its stage; no atmosphere stated (air)
  });

  describe("edge cases", () => {
    it("refuses a file that is not a workbook with a message naming the file", async () => {
      const page = session.page;
      await page.goto("/import?kind=materials");
      expect(await page.getByRole("radio", { name: "Materials for the library" }).isChecked()).toBe(true);
      await page.locator("#import-file").setInputFiles({ name: "notes.txt", mimeType: "text/plain", buffer: Buffer.from("hello") });
      await poll(() => page.locator("#import-file-error").textContent()).toMatch(/“notes\.txt” is not a workbook \(\.xlsx\) or a CSV file/);
    });

    it("fits the import page into 390 px without sideways scrolling", async () => {
      const narrow = await openSession({ width: 390, height: 844 });
      try {
        await signInAs(narrow.page, demo.formulator);
        await narrow.page.goto("/import");
        await poll(() => narrow.page.locator("#import-file").count()).toBe(1);
        expect(await narrow.page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)).toBeLessThanOrEqual(1);
        await screenshot(narrow.page, "import-390");
      } finally {
        await narrow.close();
      }
    });

    it("keeps production out of the import page", async () => {
      const production = await openSession();
      try {
        await signInAs(production.page, demo.production);
        await production.page.goto("/import");
        await poll(() => production.page.getByRole("heading", { name: "Not allowed" }).count()).toBe(1);
      } finally {
        await production.close();
      }
    });
  });
});
