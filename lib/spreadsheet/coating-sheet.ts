/**
 * The optional Coating sheet of a formulation file: how the coat is applied
 * (dip, spin or a wet film of stated thickness), with a target dry thickness
 * and the area to coat. Written from a FormulationInput's `coating` on
 * export, read back here on import. Files written before coatings existed
 * have no such sheet and import without a coating.
 */
import { coatingSpecSchema, type CoatingSpec, type FormulationInput } from "@/lib/formulation";
import { headerKey, headerStem, isBlankRow, readNumber, readText, SheetProblems } from "./cells";
import type { Location } from "./import-formulation";
import { COATING_COLUMNS, COATING_METHOD_LABELS, COATING_SETTINGS, SHEET, type CoatingSettingKey } from "./template";
import type { Cell, ImportProblem, SheetGrid } from "./types";
import type { SheetSpec } from "./write";

type Method = CoatingSpec["method"];

/** The settings each method needs, beside the optional target and area. */
const METHOD_SETTINGS: Record<Method, readonly CoatingSettingKey[]> = {
  dip: ["withdrawalMmPerS", "viscosityMPaS", "surfaceTensionMNPerM"],
  spin: ["rpm", "calibrationRpm", "calibrationDryThicknessNm"],
  wetFilm: ["wetThicknessUm"],
};
const ANY_METHOD: readonly CoatingSettingKey[] = ["targetDryThicknessNm", "areaM2"];

/** Words a person may write for each method (the template writes the first). */
const METHOD_WORDS: Record<Method, readonly string[]> = {
  dip: [COATING_METHOD_LABELS.dip, "dip coating", "dip-coating"],
  spin: [COATING_METHOD_LABELS.spin, "spin coating", "spin-coating"],
  wetFilm: [COATING_METHOD_LABELS.wetFilm, "wetfilm", "wet-film", "wet film coating"],
};

/** Where each setting sits in the engine's input (dotted path under `coating`). */
const PATHS: Record<CoatingSettingKey, string> = {
  method: "method",
  withdrawalMmPerS: "withdrawalMmPerS",
  viscosityMPaS: "viscosityMPaS",
  surfaceTensionMNPerM: "surfaceTensionMNPerM",
  rpm: "rpm",
  calibrationRpm: "calibration.rpm",
  calibrationDryThicknessNm: "calibration.dryThicknessNm",
  wetThicknessUm: "wetThicknessUm",
  targetDryThicknessNm: "targetDryThicknessNm",
  areaM2: "areaM2",
};

/** The method in the template's words: "dip", "spin", "wet film". */
export function coatingMethodWords(method: Method): string {
  return COATING_METHOD_LABELS[method];
}

function settingValues(coating: CoatingSpec | undefined): Partial<Record<CoatingSettingKey, Cell>> {
  if (!coating) return {};
  const values: Partial<Record<CoatingSettingKey, Cell>> = {
    method: COATING_METHOD_LABELS[coating.method],
    targetDryThicknessNm: coating.targetDryThicknessNm ?? null,
    areaM2: coating.areaM2 ?? null,
  };
  if (coating.method === "dip") {
    values.withdrawalMmPerS = coating.withdrawalMmPerS;
    values.viscosityMPaS = coating.viscosityMPaS;
    values.surfaceTensionMNPerM = coating.surfaceTensionMNPerM;
  } else if (coating.method === "spin") {
    values.rpm = coating.rpm;
    values.calibrationRpm = coating.calibration.rpm;
    values.calibrationDryThicknessNm = coating.calibration.dryThicknessNm;
  } else {
    values.wetThicknessUm = coating.wetThicknessUm;
  }
  return values;
}

/**
 * The Coating sheet: every setting with its unit, values blank when the
 * formulation has no coating (so the sheet shows how to fill it in).
 *
 * @example
 * ```ts
 * coatingSheet({ ...input, coating: { method: "spin", rpm: 3000, calibration: { rpm: 2000, dryThicknessNm: 300 } } }).rows[0]; // ["Coating method", "spin", "dip | spin | wet film"]
 * ```
 */
export function coatingSheet(input: FormulationInput): SheetSpec {
  const values = settingValues(input.coating);
  const rows = (Object.keys(COATING_SETTINGS) as CoatingSettingKey[]).map((key): Cell[] => [
    COATING_SETTINGS[key].label,
    values[key] ?? null,
    COATING_SETTINGS[key].unit,
  ]);
  return { name: SHEET.coating, header: [[...COATING_COLUMNS]], rows, widths: [28, 18, 44] };
}

function methodOf(text: string): Method | undefined {
  const word = headerKey(text);
  return (Object.keys(METHOD_WORDS) as Method[]).find((m) => METHOD_WORDS[m].includes(word) || m.toLowerCase() === word);
}

function setPath(target: Record<string, unknown>, path: string, value: unknown): void {
  const [head, tail] = path.split(".") as [string, string | undefined];
  if (tail === undefined) target[head] = value;
  else target[head] = { ...((target[head] as Record<string, unknown> | undefined) ?? {}), [tail]: value };
}

/**
 * Reads the Coating sheet into a coating spec; undefined when the sheet is
 * missing or has no values. Every problem names the sheet, the row and the
 * Value cell: a number cell holding text, a value outside its range
 * (negative viscosity), a method that is not dip, spin or wet film, a setting
 * the method needs left blank (spin without its measured film). A coating
 * with any error is left out of the input (the import is refused anyway).
 *
 * @param locate - records where each `coating.*` field was read, for engine messages
 */
export function readCoatingSheet(
  sheet: SheetGrid | undefined,
  problems: ImportProblem[],
  locate: (path: string, at: Location) => void,
): CoatingSpec | undefined {
  if (!sheet) return undefined;
  const p = new SheetProblems(problems, sheet);
  const before = problems.length;
  const labelKey = new Map<string, CoatingSettingKey>();
  for (const key of Object.keys(COATING_SETTINGS) as CoatingSettingKey[]) {
    labelKey.set(headerKey(COATING_SETTINGS[key].label), key);
    labelKey.set(headerStem(COATING_SETTINGS[key].label), key);
  }
  const found = new Map<CoatingSettingKey, { cell: Cell; at: Location }>();
  const valueCol = { index: 1, header: COATING_COLUMNS[1] };
  const settingCol = { index: 0, header: COATING_COLUMNS[0] };
  const firstIsHeader = headerKey(readText(sheet.rows[0]?.[0]) ?? "") === headerKey(COATING_COLUMNS[0]);
  for (let r = firstIsHeader ? 1 : 0; r < sheet.rows.length; r++) {
    const row = sheet.rows[r]!;
    if (isBlankRow(row)) continue;
    const label = readText(row[0]);
    if (!label) {
      if (readText(row[1]) !== undefined) p.error(r, settingCol, "This row has a value but no setting name in column A.");
      continue;
    }
    const key = labelKey.get(headerKey(label)) ?? labelKey.get(headerStem(label));
    if (!key) {
      p.warning(r, settingCol, `“${label}” is not a coating setting of the template and is ignored.`);
      continue;
    }
    const earlier = found.get(key);
    if (earlier) {
      p.error(r, settingCol, `“${COATING_SETTINGS[key].label}” appears twice (also row ${p.rowNumber(earlier.at.rowIndex!)}).`);
      continue;
    }
    const at: Location = { sheet, rowIndex: r, col: valueCol };
    found.set(key, { cell: row[1] ?? null, at });
    locate(`coating.${PATHS[key]}`, at);
  }
  const filled = [...found].filter(([, v]) => readText(v.cell) !== undefined);
  if (filled.length === 0) return undefined;
  const methodEntry = found.get("method");
  const methodAt = methodEntry?.at ?? { sheet, rowIndex: null, col: null };
  locate("coating", methodAt);
  const methodText = readText(methodEntry?.cell);
  const method = methodText === undefined ? undefined : methodOf(methodText);
  const at = (loc: Location, message: string) => p.error(loc.rowIndex, loc.col, message);
  const methods = Object.values(COATING_METHOD_LABELS).join(", ");
  if (methodText === undefined) {
    at(methodAt, `Coating method is required when coating settings are given: write one of ${methods} (or clear the sheet's values for no coating).`);
  } else if (!method) {
    at(methodAt, `Coating method must be one of ${methods} (not “${methodText}”).`);
  }

  const spec: Record<string, unknown> = { method };
  for (const [key, { cell, at: loc }] of found) {
    if (key === "method" || readText(cell) === undefined) continue;
    const { label, unit } = COATING_SETTINGS[key];
    const { value, error } = readNumber(cell, unit.replace(/\s*\(.*\)$/, ""));
    if (error) {
      at(loc, `${label}: ${error}.`);
      continue;
    }
    if (method && !METHOD_SETTINGS[method].includes(key) && !ANY_METHOD.includes(key)) {
      p.warning(loc.rowIndex, loc.col, `${label} is not used with ${COATING_METHOD_LABELS[method]} coating and is ignored.`);
      continue;
    }
    setPath(spec, PATHS[key], value);
  }
  if (!method) return undefined;

  for (const key of METHOD_SETTINGS[method]) {
    const entry = found.get(key);
    if (entry && readText(entry.cell) !== undefined) continue;
    const { label, unit } = COATING_SETTINGS[key];
    const why = method === "spin" && key !== "rpm" ? " (spin coating is calibrated on one measured film: its spin speed and dry thickness)" : "";
    at(entry?.at ?? methodAt, `${label} (${unit.replace(/\s*\(.*\)$/, "")}) is required for ${COATING_METHOD_LABELS[method]} coating${why}.`);
  }
  // The schema's range checks, each at its own cell; a setting already reported (missing, not a number) is not reported again.
  const earlierErrors = problems.slice(before).some((x) => x.level === "error");
  const parsed = coatingSpecSchema.safeParse(spec);
  if (parsed.success) return earlierErrors ? undefined : parsed.data;
  for (const issue of parsed.error.issues) {
    const path = issue.path.map(String).join(".");
    const key = (Object.keys(PATHS) as CoatingSettingKey[]).find((k) => PATHS[k] === path);
    const read = key !== undefined && readPath(spec, PATHS[key]) !== undefined;
    if (read) at(found.get(key)!.at, `${issue.message.charAt(0).toUpperCase()}${issue.message.slice(1)}.`);
    else if (!earlierErrors) at(methodAt, `${issue.message.charAt(0).toUpperCase()}${issue.message.slice(1)}.`);
  }
  return undefined;
}

function readPath(target: Record<string, unknown>, path: string): unknown {
  const [head, tail] = path.split(".") as [string, string | undefined];
  const value = target[head];
  return tail === undefined ? value : (value as Record<string, unknown> | undefined)?.[tail];
}
