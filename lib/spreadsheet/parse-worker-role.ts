/**
 * Marks the data the spreadsheet worker (parse-worker.ts) is started with, so
 * that loading that file anywhere else does nothing. Its own module so that
 * the app's thread can use it without loading `xlsx`.
 */
export const PARSE_WORKER = "gelwright-spreadsheet-parse";
