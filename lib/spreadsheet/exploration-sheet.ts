/**
 * An exploration's export: one row per point, after a block that states the
 * formulation, revision, what varied, the limits and aim, the engine version
 * and that the figures come from the numeric path. As CSV (RFC 4180, every
 * cell quoted, text neutralised against formula injection) or as an .xlsx
 * workbook with an "About" sheet and a "Points" sheet. The rows come from
 * lib/explore/rows.ts; an export route plans and runs the stored exploration
 * first (planAndRun in lib/explore/run.ts).
 */
import { explorationRows, type ExplorationExport } from "@/lib/explore/rows";
import { buildWorkbook, toCsv, type SheetSpec } from "./write";

/** Sheet names of the exploration workbook (and the CSV's table names). */
export const EXPLORATION_SHEETS = { about: "About", points: "Points" } as const;

function sheets(exploration: ExplorationExport): SheetSpec[] {
  const { about, header, rows } = explorationRows(exploration);
  return [
    { name: EXPLORATION_SHEETS.about, header: [["Item", "Value"]], rows: about, widths: [30, 100] },
    { name: EXPLORATION_SHEETS.points, header: [header], rows },
  ];
}

/**
 * The exploration as a CSV file: the About table (Item, Value), a blank line, "[Points]", then the
 * points' header and one row per point. UTF-8 with a byte-order mark, CRLF line ends.
 *
 * @param exploration - names, the revision's input, the computed run and the search (if any)
 * @returns the file's text
 * @example
 * ```ts
 * const run = planAndRun({ base, grid, outputs, search, model: decimalModel(base.materials) });
 * if (!("message" in run)) return new Response(explorationCsv({ formulationName, revisionLabel: "Revision 2", base, run, search }));
 * ```
 */
export function explorationCsv(exploration: ExplorationExport): string {
  return toCsv(sheets(exploration).map((s) => ({ name: s.name, rows: [...s.header, ...s.rows] })));
}

/**
 * The exploration as an .xlsx workbook: sheet "About" (Item, Value) and sheet "Points" (one row per
 * point, header frozen). Numbers stay numeric cells; text is neutralised against formula injection.
 *
 * @param exploration - as for explorationCsv
 * @returns the file's bytes
 * @example
 * ```ts
 * const bytes = explorationWorkbook({ formulationName, revisionLabel: "Revision 2", base, run });
 * ```
 */
export function explorationWorkbook(exploration: ExplorationExport): Buffer {
  return buildWorkbook(sheets(exploration));
}
