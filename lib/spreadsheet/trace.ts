/**
 * Traceability exports: a lot's batches (for a supplier recall) and a
 * batch's lots, as .xlsx and CSV. Every text cell is neutralised by the
 * writers (write.ts), so a supplier name like "=HYPERLINK(…)" stays text.
 */
import { ADJUSTMENT_REASON_LABELS, DISPOSITION_LABELS } from "@/lib/labels";
import type { Cell } from "./types";
import { buildWorkbook, toCsv } from "./write";

export interface LotTrace {
  materialName: string;
  supplier: string;
  supplierLot: string;
  unit: string;
  quantityReceived: number;
  quantityOnHand: number;
  receivedOn: string;
  expiresOn: string | null;
  uses: {
    batchId: string;
    lineIndex: number;
    quantityUsed: number | null;
    batchState: string;
    formulationName: string;
    revisionNumber: number;
    batchClosedAt: Date | string | null;
    disposition: keyof typeof DISPOSITION_LABELS | null;
  }[];
  /** Stock adjustments of the lot (newest first), when the export lists them. */
  adjustments?: {
    adjustedAt: Date | string;
    adjustedByName: string | null;
    quantityBefore: number;
    quantityAfter: number;
    reason: keyof typeof ADJUSTMENT_REASON_LABELS;
    note: string | null;
  }[];
}

export interface BatchTrace {
  batchId: string;
  rows: {
    lineIndex: number;
    lineName: string | null;
    materialName: string;
    supplier: string;
    supplierLot: string;
    unit: string;
    quantityUsed: number | null;
    expiresOn: string | null;
    measuredAssay: number | null;
    grams: number | null;
    correctedGrams: number | null;
  }[];
}

const iso = (d: Date | string | null) => (d === null ? null : typeof d === "string" ? d : d.toISOString());

function lotTables(lot: LotTrace): { name: string; header: Cell[][]; rows: Cell[][] }[] {
  return [
    {
      name: "Lot",
      header: [["Item", "Value"]],
      rows: [
        ["Material", lot.materialName],
        ["Supplier", lot.supplier],
        ["Supplier lot number", lot.supplierLot],
        [`Quantity received (${lot.unit})`, lot.quantityReceived],
        [`Quantity on hand (${lot.unit})`, lot.quantityOnHand],
        ["Received on", lot.receivedOn],
        ["Expires on", lot.expiresOn],
      ],
    },
    {
      name: "Batches",
      header: [["Batch", "Formulation", "Revision", "Line", "Batch state", "Disposition", `Quantity used (${lot.unit})`, "Closed at (UTC)"]],
      rows: lot.uses.map((u) => [
        u.batchId,
        u.formulationName,
        u.revisionNumber,
        u.lineIndex + 1,
        u.batchState,
        u.disposition ? DISPOSITION_LABELS[u.disposition] : "not disposed",
        u.quantityUsed,
        iso(u.batchClosedAt),
      ]),
    },
    {
      name: "Stock adjustments",
      header: [["Adjusted at (UTC)", "By", `Before (${lot.unit})`, `After (${lot.unit})`, `Change (${lot.unit})`, "Reason", "Note"]],
      rows: (lot.adjustments ?? []).map((a) => [
        iso(a.adjustedAt),
        a.adjustedByName,
        a.quantityBefore,
        a.quantityAfter,
        a.quantityAfter - a.quantityBefore,
        ADJUSTMENT_REASON_LABELS[a.reason],
        a.note,
      ]),
    },
  ];
}

function batchTable(batch: BatchTrace): { name: string; header: Cell[][]; rows: Cell[][] } {
  return {
    name: "Lots",
    header: [["Line", "Line material", "Material", "Supplier", "Supplier lot number", "Expires on", "Quantity used", "Unit", "Mass (g)", "Measured assay", "Corrected mass (g)"]],
    rows: batch.rows.map((r) => [
      r.lineIndex + 1,
      r.lineName,
      r.materialName,
      r.supplier,
      r.supplierLot,
      r.expiresOn,
      r.quantityUsed,
      r.unit,
      r.grams,
      r.measuredAssay,
      r.correctedGrams,
    ]),
  };
}

/** A lot, every batch that used it and its stock adjustments, as .xlsx. */
export function lotTraceWorkbook(lot: LotTrace): Buffer {
  return buildWorkbook(lotTables(lot));
}

/** A lot, every batch that used it and its stock adjustments, as CSV (one section per table). */
export function lotTraceCsv(lot: LotTrace): string {
  return toCsv(lotTables(lot).map((t) => ({ name: t.name, rows: [...t.header, ...t.rows] })));
}

/** Every lot in a batch, as .xlsx. */
export function batchTraceWorkbook(batch: BatchTrace): Buffer {
  return buildWorkbook([batchTable(batch)]);
}

/** Every lot in a batch, as CSV. */
export function batchTraceCsv(batch: BatchTrace): string {
  const t = batchTable(batch);
  return toCsv([{ name: t.name, rows: [...t.header, ...t.rows] }]);
}
