/**
 * Batch-record arithmetic: deviation against tolerance, the composition made,
 * a new batch's lines and rounding to the balance. Pure TypeScript (no
 * framework, database or spreadsheet); the workbook is written by
 * lib/spreadsheet/batch-record.ts.
 */
export { actualComposition, type ActualComposition } from "./composition";
export { DEFAULT_BALANCE_RESOLUTION_G, DEFAULT_TOLERANCE_FRACTION, lineDeviation, type LineDeviation } from "./deviation";
export { batchLinesFrom, type LineValues } from "./lines";
export { decimalPlaces, roundToResolution, VOLUME_RESOLUTION_ML } from "./resolution";
