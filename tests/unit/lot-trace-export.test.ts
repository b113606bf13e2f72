/**
 * A lot's traceability export (lib/spreadsheet/trace.ts): the lot, every
 * batch that used it (for a supplier recall) and its stock adjustments, as
 * .xlsx (read back with the same library) and CSV. Text cells are
 * neutralised against formula injection (OWASP "CSV Injection"; common
 * practice, no other source). The lot and its figures are invented for the
 * test.
 */
import * as XLSX from "xlsx";
import { describe, expect, it } from "vitest";
import { parseCsv } from "@/lib/spreadsheet/csv";
import { lotTraceCsv, lotTraceWorkbook, type LotTrace } from "@/lib/spreadsheet/trace";

const lot: LotTrace = {
  materialName: "TEOS",
  supplier: "=HYPERLINK(\"http://x\")",
  supplierLot: "T-2291",
  unit: "kg",
  quantityReceived: 5,
  quantityOnHand: 3.4,
  receivedOn: "2026-10-01",
  expiresOn: "2027-10-01",
  uses: [
    {
      batchId: "b-1",
      lineIndex: 0,
      quantityUsed: 1.25,
      batchState: "released",
      formulationName: "Visor hard coat",
      revisionNumber: 2,
      batchClosedAt: new Date("2026-11-02T09:30:00Z"),
      disposition: null,
    },
  ],
  adjustments: [
    { adjustedAt: new Date("2026-11-20T08:00:00Z"), adjustedByName: "Pat Production", quantityBefore: 3.75, quantityAfter: 3.4, reason: "damaged", note: "one tin dented" },
    { adjustedAt: "2026-11-10T08:00:00.000Z", adjustedByName: null, quantityBefore: 3.7, quantityAfter: 3.75, reason: "recount", note: null },
  ],
};

const sheet = (wb: XLSX.WorkBook, name: string) => XLSX.utils.sheet_to_json<unknown[]>(wb.Sheets[name]!, { header: 1, defval: null });

describe("lot traceability export", () => {
  it("lists the stock adjustments beside the batches, newest first, with the change in the lot's unit", () => {
    const wb = XLSX.read(lotTraceWorkbook(lot), { type: "buffer" });
    expect(wb.SheetNames).toEqual(["Lot", "Batches", "Stock adjustments"]);
    const rows = sheet(wb, "Stock adjustments");
    expect(rows[0]).toEqual(["Adjusted at (UTC)", "By", "Before (kg)", "After (kg)", "Change (kg)", "Reason", "Note"]);
    expect(rows[1]!.slice(0, 4)).toEqual(["2026-11-20T08:00:00.000Z", "Pat Production", 3.75, 3.4]);
    expect(rows[1]![4] as number).toBeCloseTo(-0.35, 12);
    expect(rows[1]!.slice(5)).toEqual(["Spilled or damaged", "one tin dented"]);
    expect(rows[2]).toEqual(["2026-11-10T08:00:00.000Z", null, 3.7, 3.75, expect.closeTo(0.05, 12), "Recount", null]);
    // the batches the lot went into, for a recall
    expect(sheet(wb, "Batches")[1]).toEqual(["b-1", "Visor hard coat", 2, 1, "released", "not disposed", 1.25, "2026-11-02T09:30:00.000Z"]);
  });

  it("writes an empty adjustments table (its header only) for a lot never adjusted", () => {
    const wb = XLSX.read(lotTraceWorkbook({ ...lot, adjustments: undefined }), { type: "buffer" });
    expect(sheet(wb, "Stock adjustments")).toHaveLength(1);
  });

  it("writes the same tables as CSV sections, text neutralised", () => {
    const { rows } = parseCsv(lotTraceCsv(lot));
    const texts = rows.map((r) => r.map(String).join("|"));
    const at = texts.indexOf("[Stock adjustments]");
    expect(at).toBeGreaterThan(0);
    expect(rows[at + 2]!.slice(0, 2)).toEqual(["2026-11-20T08:00:00.000Z", "Pat Production"]);
    expect(rows[at + 2]![5]).toBe("Spilled or damaged");
    // a supplier name that looks like a formula stays text
    const supplier = rows.find((r) => r[0] === "Supplier")!;
    expect(String(supplier[1]).startsWith("=")).toBe(false);
    expect(String(supplier[1])).toContain("HYPERLINK");
  });
});
