/**
 * The exploration export runs in a worker thread of its own: the file comes
 * back whole, a grid that no longer fits is a 422 naming its field, and more
 * exports than EXPORT_LIMITS.concurrent at once are refused with a 503 instead
 * of piling up on the server.
 */
import { describe, expect, it } from "vitest";
import * as XLSX from "xlsx";
import { visorCoat } from "@/lib/explore/test-fixtures";
import { ApiError } from "@/lib/http/errors";
import { RuleError } from "@/lib/errors";
import { EXPORT_LIMITS, exportExploration, type ExportJob } from "@/lib/spreadsheet/exploration-export";

const job = (over: Partial<ExportJob> = {}): ExportJob => ({
  format: "csv",
  formulationName: "Visor hard coat HC-3",
  revisionLabel: "Revision 2",
  explorationName: "Titania sweep",
  base: visorCoat(0.05),
  grid: { kind: "sweep", variables: [{ kind: "weightFraction", materialId: "ti-isopropoxide", from: 0, to: 0.2, step: 0.05 }] },
  outputs: ["refractiveIndex"],
  ...over,
});

describe("exploration export in a worker thread", () => {
  it("writes one CSV row per point after the About block", async () => {
    const text = new TextDecoder().decode(await exportExploration(job()));
    const lines = text.trim().split(/\r\n/);
    const points = lines.slice(lines.findIndex((line) => line.includes("[Points]")) + 1);
    expect(points).toHaveLength(1 + 5); // header + 0, 5, 10, 15, 20 wt%
    expect(points[0]).toMatch(/refractive index/i);
  }, 30_000);

  it("writes an .xlsx workbook with a Points sheet", async () => {
    const bytes = await exportExploration(job({ format: "xlsx" }));
    const book = XLSX.read(bytes, { type: "array" });
    const rows = XLSX.utils.sheet_to_json<unknown[]>(book.Sheets["Points"]!, { header: 1 });
    expect(rows).toHaveLength(1 + 5);
  }, 30_000);

  it("refuses a grid that no longer fits the revision with the grid's field", async () => {
    const bad = job({ grid: { kind: "sweep", variables: [{ kind: "weightFraction", materialId: "peg-2000", from: 0, to: 0.2, step: 0.05 }] } });
    const error = await exportExploration(bad).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(RuleError);
    expect((error as RuleError).message).toMatch(/no longer fits revision 2/);
  }, 30_000);

  it(`answers 503 beyond ${EXPORT_LIMITS.concurrent} exports at once`, async () => {
    const outcomes = await Promise.allSettled(Array.from({ length: EXPORT_LIMITS.concurrent + 1 }, () => exportExploration(job())));
    const refused = outcomes.filter((o) => o.status === "rejected");
    expect(refused).toHaveLength(1);
    const reason = (refused[0] as PromiseRejectedResult).reason as ApiError;
    expect(reason).toBeInstanceOf(ApiError);
    expect(reason.status).toBe(503);
    expect(outcomes.filter((o) => o.status === "fulfilled")).toHaveLength(EXPORT_LIMITS.concurrent);
  }, 60_000);
});
