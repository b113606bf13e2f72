/**
 * End to end, in Chromium: production starts a batch record from a released
 * revision's batch sheet, enters every actual mass and lot number from the
 * keyboard (Enter moves on), sees the overdosed line flagged outside
 * tolerance in words, and closes the record; the record and the list of
 * records per formulation read back; a formulator cannot open the entry page.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { openSession, poll, screenshot, seriousViolations, signInAs, unique, type Session } from "./browser";
import { demo, signIn, type Client } from "./http";

interface BatchLine {
  index: number;
  role: string;
  targetGrams: number;
  actualGrams: number | null;
  lotNumber: string | null;
}

interface Batch {
  id: string;
  state: string;
  balanceResolutionGrams: number;
  lines: BatchLine[];
  summary: { lines: number; weighed: number; outside: number };
}

let api: Client;
let formulationId: string;
let releasedId: string;

async function batchOf(id: string): Promise<Batch> {
  return (await (await api.fetch(`/api/batches/${id}`)).json()) as Batch;
}

async function focusedId(session: Session): Promise<string | undefined> {
  return session.page.evaluate(() => document.activeElement?.id);
}

function overflow(session: Session): Promise<number> {
  return session.page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
}

beforeAll(async () => {
  api = await signIn(demo.production);
  const list = (await (await api.fetch("/api/formulations?pageSize=100")).json()) as { rows: { id: string; name: string }[] };
  formulationId = list.rows.find((f) => f.name === "Visor hard coat HC-3")!.id;
  const detail = (await (await api.fetch(`/api/formulations/${formulationId}`)).json()) as { revisions: { id: string; state: string }[] };
  releasedId = detail.revisions.find((r) => r.state === "released")!.id;
});

describe("batch records in the browser", () => {
  let production: Session;
  let batchId: string;
  const stamp = unique();

  beforeAll(async () => {
    production = await openSession();
    await signInAs(production.page, demo.production);
  });

  afterAll(async () => {
    await production?.close();
  });

  it("starts a batch from the released batch sheet and records every line from the keyboard, flagging the overdosed line", async () => {
    const page = production.page;
    await page.goto(`/revisions/${releasedId}/batch-sheet`);
    await page.getByRole("button", { name: "Start a batch record" }).click();
    await page.waitForURL(/\/batches\/[0-9a-f-]{36}\/weigh$/);
    batchId = /\/batches\/([0-9a-f-]{36})\/weigh/.exec(page.url())![1]!;
    const batch = await batchOf(batchId);
    expect(batch.state).toBe("open");
    const res = batch.balanceResolutionGrams;
    const decimals = Math.max(0, Math.round(-Math.log10(res)));

    // A wrong entry is named with its line and kept; Enter does not move on.
    await page.locator("#mass-0").click();
    await page.keyboard.type("12,3 kg");
    await page.keyboard.press("Enter");
    await poll(() => page.locator("#line-0-error").textContent()).toMatch(/Line 1, actual mass: Write the mass in g as a number/);
    expect(await focusedId(production)).toBe("mass-0");
    expect(await page.locator("#mass-0").inputValue()).toBe("12,3 kg");
    await page.locator("#mass-0").fill("");

    for (const line of batch.lines) {
      // Line 1 is weighed 5 % over its target (beyond the ±1 % tolerance); every other line on target.
      const actual = line.index === 0 ? line.targetGrams * 1.05 : line.targetGrams;
      await page.locator(`#mass-${line.index}`).focus();
      await page.keyboard.type(actual.toFixed(decimals));
      await page.keyboard.press("Enter");
      expect(await focusedId(production)).toBe(`lot-${line.index}`);
      if (line.role !== "water") await page.keyboard.type(`LOT-${stamp}-${line.index + 1}`);
      await page.keyboard.press("Enter");
      if (line.index + 1 < batch.lines.length) expect(await focusedId(production)).toBe(`mass-${line.index + 1}`);
    }
    // After the last line, Enter lands on the close button.
    expect(await page.evaluate(() => document.activeElement?.textContent)).toMatch(/Close the batch record/);

    await poll(async () => (await batchOf(batchId)).summary).toEqual({ lines: batch.lines.length, weighed: batch.lines.length, outside: 1 });
    await poll(() => page.getByTestId("line-status-0").textContent()).toMatch(/Outside tolerance/);
    expect(await page.getByTestId("line-status-0").textContent()).toMatch(/\+[\d.]+\s?g \(\+5\.0\s?%\)/);
    expect(await page.getByTestId("line-status-1").textContent()).toMatch(/Within tolerance/);
    expect(await page.getByTestId("entry-summary").textContent()).toMatch(/1 outside tolerance/);
    await poll(() => page.getByTestId("composition-made").count()).toBe(1);
    const saved = await batchOf(batchId);
    expect(saved.lines.filter((l) => l.role !== "water").every((l) => l.lotNumber === `LOT-${stamp}-${l.index + 1}`)).toBe(true);

    await screenshot(page, "batch-weigh");
    const violations = await seriousViolations(page);
    expect(violations, JSON.stringify(violations, null, 2)).toEqual([]);
  });

  it("closes the batch and shows the closed record with its download and the overdosed line", async () => {
    const page = production.page;
    await page.getByRole("button", { name: "Close the batch record…" }).click();
    await page.getByRole("button", { name: "Close it now" }).click();
    await page.waitForURL(new RegExp(`/batches/${batchId}$`));
    await poll(() => page.getByRole("heading", { level: 1 }).textContent()).toMatch(/Batch record\s*■?\s*Closed/);
    expect(await page.getByTestId("record-summary").textContent()).toMatch(/1 outside tolerance/);
    const first = page.getByTestId("record-lines").locator("tbody tr").first();
    expect(await first.textContent()).toMatch(/Outside tolerance/);
    expect(await page.getByRole("link", { name: /Batch record \(\.xlsx\)/ }).getAttribute("href")).toBe(`/api/batches/${batchId}/export`);
    expect(await page.getByRole("link", { name: "Record weighings" }).count()).toBe(0);
    expect((await batchOf(batchId)).state).toBe("closed");
    await screenshot(page, "batch-record");
    const violations = await seriousViolations(page);
    expect(violations, JSON.stringify(violations, null, 2)).toEqual([]);
  });

  it("lists the formulation's batch records with their state and tolerance check in words", async () => {
    const page = production.page;
    await page.goto(`/batches?formulationId=${formulationId}`);
    const list = page.getByTestId("batch-list");
    await poll(() => list.count()).toBe(1);
    expect(await page.getByRole("heading", { level: 1 }).textContent()).toBe("Batch records of Visor hard coat HC-3");
    const row = list.locator("tbody tr").filter({ has: page.locator(`a[href="/batches/${batchId}"]`) });
    expect(await row.textContent()).toMatch(/Closed[\s\S]*1 outside tolerance/);
    expect(await list.locator("thead th").allTextContents()).toContain("Formulation");
    await screenshot(page, "batch-list");

    // On one revision's batch sheet every record is of that revision: no formulation column.
    await page.goto(`/revisions/${releasedId}/batch-sheet`);
    const own = page.getByTestId("batch-list");
    await poll(() => own.locator(`a[href="/batches/${batchId}"]`).count()).toBe(1);
    const headers = (await own.locator("thead th").allTextContents()).map((t) => t.trim());
    expect(headers).toContain("State");
    expect(headers).not.toContain("Formulation");
    const violations = await seriousViolations(page);
    expect(violations, JSON.stringify(violations, null, 2)).toEqual([]);
  });

  it("fits the entry page into 390 px without sideways scrolling", async () => {
    const started = (await (await api.fetch("/api/batches", { method: "POST", json: { revisionId: releasedId } })).json()) as Batch;
    const narrow = await openSession({ width: 390, height: 844 });
    try {
      await signInAs(narrow.page, demo.production);
      await narrow.page.goto(`/batches/${started.id}/weigh`);
      await poll(() => narrow.page.getByTestId("batch-lines").count()).toBe(1);
      await narrow.page.getByLabel(/^Actual mass \(g\), line 1/).fill(String(started.lines[0]!.targetGrams.toFixed(2)));
      await narrow.page.keyboard.press("Enter");
      expect(await focusedId(narrow)).toBe("lot-0");
      expect(await overflow(narrow)).toBeLessThanOrEqual(1);
      await screenshot(narrow.page, "batch-weigh-390");
    } finally {
      await narrow.close();
    }
  });
});

describe("documents of a batch record", () => {
  it("adds a certificate of analysis PDF to an open record and lists it with its type and size; refuses a file that is not a PDF", async () => {
    const started = (await (await api.fetch("/api/batches", { method: "POST", json: { revisionId: releasedId } })).json()) as Batch;
    const session = await openSession();
    try {
      await signInAs(session.page, demo.production);
      const page = session.page;
      await page.goto(`/batches/${started.id}/weigh`);
      const form = page.getByRole("form", { name: "Add a document" });
      await poll(() => form.count()).toBe(1);
      expect(await page.getByRole("region", { name: "Documents" }).textContent()).toMatch(/PDF, up to 10 MB/);
      await form.getByLabel("PDF file").setInputFiles({ name: "notes.txt", mimeType: "text/plain", buffer: Buffer.from("not a pdf") });
      await poll(() => form.locator("[id$='-file-error']").textContent()).toMatch(/“notes\.txt” is not a PDF/);
      const pdf = Buffer.from("%PDF-1.4\n1 0 obj <<>> endobj\ntrailer <<>>\n%%EOF\n", "latin1");
      await form.getByLabel("PDF file").setInputFiles({ name: "coa-teos-lot-7.pdf", mimeType: "application/pdf", buffer: pdf });
      await form.getByRole("button", { name: "Add document" }).click();
      const list = page.getByTestId("attachments-list");
      await poll(() => list.count()).toBe(1);
      expect(await list.textContent()).toMatch(/coa-teos-lot-7\.pdf[\s\S]*Certificate of analysis · \d+\s?bytes/);
      expect(await list.getByRole("link", { name: /Open coa-teos-lot-7\.pdf/ }).getAttribute("href")).toMatch(/^\/api\/attachments\/[0-9a-f-]{36}\?download=1$/);
      await screenshot(page, "batch-documents");
      expect(await seriousViolations(page)).toEqual([]);
    } finally {
      await session.close();
    }
  });
});

describe("batch records for other roles", () => {
  it("keeps a formulator out of the entry page but lets them read the record", async () => {
    const started = (await (await api.fetch("/api/batches", { method: "POST", json: { revisionId: releasedId } })).json()) as Batch;
    const formulator = await openSession();
    try {
      await signInAs(formulator.page, demo.formulator);
      const page = formulator.page;
      await page.goto(`/batches/${started.id}/weigh`);
      await poll(() => page.getByRole("heading", { name: "Not allowed" }).count()).toBe(1);
      expect(await page.locator("#mass-0").count()).toBe(0);
      await page.goto(`/batches/${started.id}`);
      await poll(() => page.getByTestId("record-lines").count()).toBe(1);
      expect(await page.getByRole("link", { name: "Record weighings" }).count()).toBe(0);
      expect(await page.getByRole("form", { name: "Add a document" }).count()).toBe(0);
    } finally {
      await formulator.close();
    }
  });
});
