/**
 * The batch record as an .xlsx workbook: the record, line by line, and the
 * composition made. The arithmetic is in lib/batches; masses keep their exact
 * value in the cell, with a number format that shows the balance resolution.
 */
import { lineDeviation, VOLUME_RESOLUTION_ML, type ActualComposition, type LineValues } from "@/lib/batches";
import { SHEET } from "./template";
import type { Cell } from "./types";
import { buildWorkbook } from "./write";

/** What the batch record export needs. */
export interface BatchForExport {
  id: string;
  formulationName: string;
  revisionNumber: number;
  state: string;
  startedByName: string | null;
  closedByName: string | null;
  createdAt: Date | string;
  closedAt: Date | string | null;
  toleranceFraction: number;
  balanceResolutionGrams: number;
  notes: string | null;
  lines: LineValues[];
  composition: ActualComposition | null;
}

function when(value: Date | string | null | undefined): string | null {
  if (!value) return null;
  const d = typeof value === "string" ? new Date(value) : value;
  return Number.isNaN(d.getTime()) ? null : `${d.toISOString().replace("T", " ").slice(0, 16)} UTC`;
}

/** The batch record as an .xlsx workbook: the record, line by line, and the composition made. */
export function batchWorkbook(batch: BatchForExport): Buffer {
  const grams = batch.balanceResolutionGrams;
  const overview: Cell[][] = [
    ["Formulation", batch.formulationName, ""],
    ["Revision", batch.revisionNumber, ""],
    ["Batch record", batch.id, ""],
    ["State", batch.state, ""],
    ["Started", when(batch.createdAt), batch.startedByName ?? ""],
    ["Closed", when(batch.closedAt) ?? "open", batch.closedByName ?? ""],
    ["Tolerance per line", batch.toleranceFraction, "fraction of the target (or the balance resolution, whichever is larger)"],
    ["Balance resolution", batch.balanceResolutionGrams, "g"],
    ["Notes", batch.notes ?? "", ""],
  ];
  const lineRows: Cell[][] = batch.lines.map((line, index) => {
    const dev =
      line.actualGrams !== null && line.targetGrams !== undefined
        ? lineDeviation(line.targetGrams, line.actualGrams, batch.toleranceFraction, batch.balanceResolutionGrams)
        : null;
    return [
      index + 1,
      line.name ?? line.materialId,
      line.lotNumber,
      line.targetGrams ?? null,
      line.targetMl ?? null,
      line.actualGrams,
      dev?.absoluteGrams ?? null,
      dev?.relative ?? null,
      dev?.toleranceGrams ?? null,
      dev ? (dev.outside ? "outside tolerance" : "within tolerance") : "not weighed",
      line.at ?? null,
      line.initials ?? null,
    ];
  });
  const c = batch.composition;
  const made: Cell[][] = c
    ? [
        ...c.components.map((x): Cell[] => [x.name, x.targetWeightFraction, x.actualWeightFraction]),
        [null, null, null],
        ["Dry composite mass (g)", c.solidGrams.target, c.solidGrams.actual],
        ["Effective water ratio R (mol H2O per mol network atom)", c.effectiveR.target, c.effectiveR.actual],
        ...(c.effectiveH ? [["Effective water ratio h (mol H2O per mol hydrolysable group)", c.effectiveH.target, c.effectiveH.actual] as Cell[]] : []),
        ...("composite" in c.engine
          ? [["Theoretical density of the composite made (g/cm³)", null, c.engine.composite.theoreticalDensity] as Cell[]]
          : [["Composite not computed", null, c.engine.error] as Cell[]]),
      ]
    : [["Enter every line's actual mass to see the composition made.", null, null]];
  return buildWorkbook([
    { name: SHEET.overview, header: [["Item", "Value", "Note"]], rows: overview, widths: [24, 44, 60] },
    {
      name: SHEET.batchRecord,
      header: [
        [
          "Order",
          "Material",
          "Lot number",
          "Target mass (g)",
          "Target volume (mL)",
          "Actual mass (g)",
          "Deviation (g)",
          "Deviation (fraction of target)",
          "Tolerance (g)",
          "Check",
          "Time (UTC)",
          "Initials",
        ],
      ],
      rows: lineRows,
      // Masses at the balance resolution, the volume at 0.01 mL (exact values stay in the cells).
      steps: [undefined, undefined, undefined, grams, VOLUME_RESOLUTION_ML, grams, grams, undefined, grams],
      widths: [7, 34, 16, 14, 14, 14, 12, 14, 12, 18, 24, 9],
    },
    {
      name: SHEET.actual,
      header: [["Component", "Target weight fraction (mass fraction)", "Actual weight fraction (mass fraction)"]],
      rows: made,
      widths: [56, 22, 22],
    },
  ]);
}
