/**
 * The design explorer's core: planning a grid, the input at a point, the
 * output catalogue, running a grid and the target search. Pure TypeScript
 * (runs in a Web Worker and in Node). Export rows: ./rows; the .csv/.xlsx
 * files: lib/spreadsheet/exploration-sheet.ts.
 */
export * from "./spec";
export * from "./types";
export { planGrid, isPlanError, rangeCount, rangeValues, ternaryShares } from "./grid";
export { pointInput, isPointRefusal, type PointRefusal } from "./apply";
export { outputCatalogue, outputInfo, outputValue, outputReader, SCALAR_FIGURE_KEYS, type OutputReader, type ScalarFigureKey } from "./outputs";
export { bestCandidates, pointValues, searchOutputs } from "./search";
export { runExploration, runExplorationSync, planAndRun, abortError, DEFAULT_CHUNK, type RunOptions, type AsyncRunOptions } from "./run";
export { variableLabel, materialName, shownValue } from "./labels";
export { explorationRows, refusalWords, NUMERIC_PATH_NOTE, STATUS_WORDS, type ExplorationExport, type ExplorationRows, type ExportCell } from "./rows";
