/**
 * The plain tables of a formulation file: Components, Process steps (with
 * the optional Stage and Atmosphere columns) and Addition order, each read
 * into drafts for the schema, every problem located by sheet, row and cell.
 */
import { WEIGHT_FRACTION_SCALE_TOLERANCE } from "@/lib/formulation";
import { Dec, ZERO } from "@/lib/formulation/decimal";
import { headerKey, headerStem, isBlankRow, readNumber, readText, SheetProblems } from "./cells";
import type { Location } from "./import-formulation";
import { optionalColumn, readStepWord } from "./import-modifiers";
import { ATMOSPHERE_WORDS, COMPONENT_COLUMNS, ORDER_COLUMNS, SHEET, STAGE_WORDS, STEP_COLUMNS, STEP_EXTRA_COLUMNS } from "./template";
import type { ImportProblem, SheetGrid } from "./types";

/** A component row as read, before the schema checks it. */
export interface ComponentDraft {
  materialId: string;
  weightFraction: number | undefined;
}

/** A process step row as read, before the schema checks it. */
export interface StepDraft {
  name?: string;
  temperatureC?: number;
  durationH?: number;
  stage?: string;
  atmosphere?: string;
}

/** Column indexes of a simple table by its expected headers (matched leniently), header in row 1. */
export function tableColumns(sheet: SheetGrid, headers: readonly string[], p: SheetProblems): (number | undefined)[] {
  const row = sheet.rows[0] ?? [];
  const keys = row.map((cell) => {
    const text = readText(cell);
    return text ? [headerKey(text), headerStem(text)] : [];
  });
  return headers.map((header) => {
    const index = keys.findIndex((k) => k.includes(headerKey(header)) || k.includes(headerStem(header)));
    if (index < 0) {
      p.error(0, null, `Row ${p.rowNumber(0)} must be the header row with a “${header}” column.`);
      return undefined;
    }
    return index;
  });
}

/** Indexes of the rows below the header that are not blank. */
export function dataRows(sheet: SheetGrid): number[] {
  const out: number[] = [];
  for (let r = 1; r < sheet.rows.length; r++) if (!isBlankRow(sheet.rows[r])) out.push(r);
  return out;
}

/**
 * Reads the Components sheet: material name and weight fraction per row,
 * weight fractions summing to 1 (the engine's rule: within 0.5 % is scaled).
 */
export function readComponentsSheet(
  componentsSheet: SheetGrid | undefined,
  problems: ImportProblem[],
  resolve: (name: string, at: Location) => string,
  locate: (path: string, at: Location) => void,
): ComponentDraft[] {
  const components: ComponentDraft[] = [];
  if (!componentsSheet) {
    problems.push({ level: "error", sheet: SHEET.components, row: null, column: null, columnLetter: null, message: `The file has no “${SHEET.components}” sheet (or table).` });
  } else {
    const p = new SheetProblems(problems, componentsSheet);
    const [materialCol, fractionCol] = tableColumns(componentsSheet, COMPONENT_COLUMNS, p);
    if (materialCol !== undefined && fractionCol !== undefined) {
      const fractionAt = { index: fractionCol, header: COMPONENT_COLUMNS[1] };
      const materialAt = { index: materialCol, header: COMPONENT_COLUMNS[0] };
      let total = ZERO;
      let complete = true;
      let lastRow = 0;
      for (const r of dataRows(componentsSheet)) {
        const row = componentsSheet.rows[r]!;
        const i = components.length;
        lastRow = r;
        const materialName = readText(row[materialCol]);
        const at: Location = { sheet: componentsSheet, rowIndex: r, col: materialAt };
        locate(`components.${i}`, at);
        locate(`components.${i}.materialId`, at);
        locate(`components.${i}.weightFraction`, { sheet: componentsSheet, rowIndex: r, col: fractionAt });
        if (!materialName) p.error(r, materialAt, "Each component needs a material name.");
        const { value, error } = readNumber(row[fractionCol], "mass fraction");
        if (error) p.error(r, fractionAt, `Weight fraction: ${error}.`);
        else if (value === undefined) p.error(r, fractionAt, `“${materialName ?? "This component"}” needs a weight fraction.`);
        if (value === undefined) complete = false;
        else total = total.plus(new Dec(value));
        components.push({ materialId: materialName ? resolve(materialName, at) : "", weightFraction: value });
      }
      if (components.length === 0) p.error(null, null, "At least one component (a precursor or organic phase with its weight fraction) is needed.");
      else if (complete && total.minus(1).abs().greaterThan(WEIGHT_FRACTION_SCALE_TOLERANCE)) {
        // The engine's own rule: a sum within 0.5 % of 1 is scaled to 1 (with a notice), beyond it refused.
        p.error(lastRow, fractionAt, `Weight fractions sum to ${Number(total.toPrecision(8))}; they must sum to 1.`);
        locate("components", { sheet: componentsSheet, rowIndex: lastRow, col: fractionAt });
      }
    }
  }
  return components;
}

/** Reads the Process steps sheet: name, temperature, duration, and the optional stage and atmosphere. */
export function readStepsSheet(stepsSheet: SheetGrid | undefined, problems: ImportProblem[], locate: (path: string, at: Location) => void): StepDraft[] {
  const steps: StepDraft[] = [];
  if (stepsSheet) {
    const p = new SheetProblems(problems, stepsSheet);
    const cols = tableColumns(stepsSheet, STEP_COLUMNS, p);
    if (cols.every((c) => c !== undefined)) {
      const [nameCol, tempCol, durCol] = cols as number[];
      const [stageCol, atmosphereCol] = STEP_EXTRA_COLUMNS.map((header) => optionalColumn(stepsSheet, header));
      for (const r of dataRows(stepsSheet)) {
        const row = stepsSheet.rows[r]!;
        const i = steps.length;
        const at = (index: number, header: string): Location => ({ sheet: stepsSheet, rowIndex: r, col: { index, header } });
        locate(`steps.${i}`, at(nameCol!, STEP_COLUMNS[0]));
        locate(`steps.${i}.name`, at(nameCol!, STEP_COLUMNS[0]));
        locate(`steps.${i}.temperatureC`, at(tempCol!, STEP_COLUMNS[1]));
        locate(`steps.${i}.durationH`, at(durCol!, STEP_COLUMNS[2]));
        const t = readNumber(row[tempCol!], "°C");
        const d = readNumber(row[durCol!], "h");
        if (t.error) p.error(r, { index: tempCol!, header: STEP_COLUMNS[1] }, `Temperature: ${t.error}.`);
        if (d.error) p.error(r, { index: durCol!, header: STEP_COLUMNS[2] }, `Duration: ${d.error}.`);
        const stage = readStepWord(row, stageCol, STEP_EXTRA_COLUMNS[0], STAGE_WORDS, "Stage", "curing", p, r);
        const atmosphere = readStepWord(row, atmosphereCol, STEP_EXTRA_COLUMNS[1], ATMOSPHERE_WORDS, "Atmosphere", "air", p, r);
        if (stageCol !== undefined) locate(`steps.${i}.stage`, at(stageCol, STEP_EXTRA_COLUMNS[0]));
        if (atmosphereCol !== undefined) locate(`steps.${i}.atmosphere`, at(atmosphereCol, STEP_EXTRA_COLUMNS[1]));
        steps.push({
          name: readText(row[nameCol!]),
          temperatureC: t.value,
          durationH: d.value,
          ...(stage !== undefined ? { stage } : {}),
          ...(atmosphere !== undefined ? { atmosphere } : {}),
        });
      }
    }
  }
  return steps;
}

/** Reads the Addition order sheet into material ids; undefined when it lists none. */
export function readOrderSheet(
  orderSheet: SheetGrid | undefined,
  problems: ImportProblem[],
  resolve: (name: string, at: Location) => string,
  locate: (path: string, at: Location) => void,
): string[] | undefined {
  let additionOrder: string[] | undefined;
  if (orderSheet) {
    const p = new SheetProblems(problems, orderSheet);
    const [, materialCol] = tableColumns(orderSheet, ORDER_COLUMNS, p);
    if (materialCol !== undefined) {
      const list: string[] = [];
      for (const r of dataRows(orderSheet)) {
        const materialName = readText(orderSheet.rows[r]![materialCol]);
        const at: Location = { sheet: orderSheet, rowIndex: r, col: { index: materialCol, header: ORDER_COLUMNS[1] } };
        locate(`additionOrder.${list.length}`, at);
        if (!materialName) {
          p.error(r, at.col, "Each position needs a material name.");
          continue;
        }
        list.push(resolve(materialName, at));
      }
      if (list.length > 0) additionOrder = list;
    }
  }
  return additionOrder;
}
