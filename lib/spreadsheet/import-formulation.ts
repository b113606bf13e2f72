/**
 * Reads a formulation file in our template (Input, Components, Process
 * steps, Addition order, Materials, Material sources) into a
 * FormulationInput, resolving material names against the file's Materials
 * sheet and the team's library, and lists every problem by sheet, row and
 * column. Pure: the caller supplies the library and the names in use.
 */
import {
  computeFormulation,
  formulationInputSchema,
  isFormulationError,
  type FormulationInput,
  type Material,
} from "@/lib/formulation";
import { headerKey, headerStem, isBlankRow, readFlag, readNumber, readText, SheetProblems } from "./cells";
import { readCoatingSheet } from "./coating-sheet";
import { readModifiersSheet } from "./import-modifiers";
import { readComponentsSheet, readOrderSheet, readStepsSheet } from "./import-tables";
import {
  DISPENSED_KINDS,
  proposeMaterials,
  readMaterialsSheets,
  sortProblems,
  type LibraryEntry,
  type MaterialProposal,
} from "./import-materials";
import {
  BASIS_LABELS,
  INPUT_SETTINGS,
  MATERIAL_COLUMNS,
  SHEET,
  SOLVENT_MODE_LABELS,
  WATER_RATIO_LABELS,
  type InputSettingKey,
} from "./template";
import { columnLetter, type Cell, type ImportProblem, type SheetGrid } from "./types";

/** Where a value of the input came from, for locating problems. */
export interface Location {
  sheet: SheetGrid;
  rowIndex: number | null;
  col: { index: number; header: string } | null;
}

/** Preview of a formulation import. */
export interface FormulationPreview {
  kind: "formulation";
  formulation: { name: string | null; project: string | null; description: string | null };
  /** The input as it will be saved (material ids are the library's or the new materials'). */
  input: FormulationInput | null;
  materials: MaterialProposal[];
  /** Whether the engine computes it; a draft that cannot be computed can still be saved. */
  computed: { ok: boolean; message?: string; thermalStatus?: string };
  problems: ImportProblem[];
  counts: {
    sheets: number;
    rows: number;
    materials: number;
    toCreate: number;
    toLink: number;
    components: number;
    steps: number;
    errors: number;
    warnings: number;
  };
}

function findSheet(sheets: readonly SheetGrid[], name: string): SheetGrid | undefined {
  return sheets.find((s) => headerKey(s.name) === headerKey(name));
}

/**
 * The preview of a formulation import.
 *
 * @param sheets - the sheets read from the file
 * @param library - the team's materials
 * @param takenNames - formulation names already used in the team (any case)
 * @param newId - makes an id for a material to create
 */
export function previewFormulationImport(
  sheets: readonly SheetGrid[],
  library: readonly LibraryEntry[],
  takenNames: ReadonlySet<string>,
  newId: () => string,
): FormulationPreview {
  const problems: ImportProblem[] = [];
  const locations = new Map<string, Location>();
  const nowhere: Location = { sheet: { name: SHEET.input, rows: [] }, rowIndex: null, col: null };

  // Materials on the file, linked to the library or to be created.
  const drafts = readMaterialsSheets(sheets, problems, { densityLevel: "error", required: false });
  const materialsSheet = findSheet(sheets, SHEET.materials);
  const proposals = proposeMaterials(drafts, library, materialsSheet, problems, {
    newId,
    differsLevel: "warning",
    differsMessage: (name, libraryName) =>
      `“${name}” differs from the library's “${libraryName}”: the file's values are used in this formulation; the library is not changed.`,
  });
  const nameToProposal = new Map(proposals.map((x) => [x.name.toLowerCase(), x]));
  const libraryByName = new Map(library.map((entry) => [entry.name.toLowerCase(), entry]));
  const used: MaterialProposal[] = [...proposals];
  drafts.forEach((draft, index) => {
    const materialIndex = index;
    locations.set(`materials.${materialIndex}`, { sheet: materialsSheet!, rowIndex: draft.rowIndex, col: null });
    MATERIAL_COLUMNS.forEach((column) => {
      const header = (materialsSheet!.rows[0] ?? []).findIndex((cell) => {
        const text = readText(cell);
        return text !== undefined && (headerKey(text) === headerKey(column.header) || headerStem(text) === headerStem(column.header));
      });
      if (header >= 0) {
        locations.set(`materials.${materialIndex}.${column.path}`, { sheet: materialsSheet!, rowIndex: draft.rowIndex, col: { index: header, header: column.header } });
      }
    });
  });

  const namesOnSheet = new Map<string, number>();
  if (materialsSheet) {
    const nameCol = (materialsSheet.rows[0] ?? []).findIndex((cell) => headerKey(readText(cell) ?? "") === "name");
    const p = new SheetProblems([], materialsSheet);
    if (nameCol >= 0) {
      for (let r = 1; r < materialsSheet.rows.length; r++) {
        const text = readText(materialsSheet.rows[r]?.[nameCol]);
        if (text && !namesOnSheet.has(text.toLowerCase())) namesOnSheet.set(text.toLowerCase(), p.rowNumber(r));
      }
    }
  }

  /** Resolves a material name to an id: the Materials sheet first, then the library. */
  const resolve = (name: string, at: Location): string => {
    const key = name.toLowerCase();
    const own = nameToProposal.get(key);
    if (own) return own.id;
    const onSheet = namesOnSheet.get(key);
    if (onSheet !== undefined) {
      new SheetProblems(problems, at.sheet).error(at.rowIndex, at.col, `“${name}” cannot be used until the problems in its row on the Materials sheet (row ${onSheet}) are fixed.`);
      return `unknown:${name}`;
    }
    const entry = libraryByName.get(key);
    if (entry) {
      const proposal: MaterialProposal = {
        row: null,
        name: entry.name,
        kind: entry.material.kind,
        action: "link",
        id: entry.id,
        matchedBy: "name",
        libraryName: entry.name,
        material: { ...entry.material, id: entry.id },
      };
      nameToProposal.set(key, proposal);
      used.push(proposal);
      if (DISPENSED_KINDS.includes(entry.material.kind) && entry.material.density === undefined) {
        new SheetProblems(problems, at.sheet).error(at.rowIndex, at.col, `The library's “${entry.name}” has no density as supplied (g/cm³); add it in the library or on the Materials sheet.`);
      }
      return entry.id;
    }
    new SheetProblems(problems, at.sheet).error(
      at.rowIndex,
      at.col,
      `Unknown material “${name}”: it is neither on the Materials sheet nor in your team's library.`,
    );
    return `unknown:${name}`;
  };

  // Input settings.
  const settings = new Map<InputSettingKey, { cell: Cell; loc: Location }>();
  const inputSheet = findSheet(sheets, SHEET.input);
  if (!inputSheet) {
    problems.push({ level: "error", sheet: SHEET.input, row: null, column: null, columnLetter: null, message: `The file has no “${SHEET.input}” sheet (or table) with the formulation's settings.` });
  } else {
    const p = new SheetProblems(problems, inputSheet);
    const labelKey = new Map((Object.keys(INPUT_SETTINGS) as InputSettingKey[]).map((key) => [headerKey(INPUT_SETTINGS[key].label), key]));
    const firstIsHeader = headerKey(readText(inputSheet.rows[0]?.[0]) ?? "") === "setting";
    for (let r = firstIsHeader ? 1 : 0; r < inputSheet.rows.length; r++) {
      const row = inputSheet.rows[r]!;
      if (isBlankRow(row)) continue;
      const label = readText(row[0]);
      if (!label) {
        p.error(r, { index: 0, header: "Setting" }, "This row has a value but no setting name in column A.");
        continue;
      }
      const key = labelKey.get(headerKey(label)) ?? labelKey.get(headerStem(label));
      if (!key) {
        p.warning(r, { index: 0, header: "Setting" }, `“${label}” is not a setting of the template and is ignored.`);
        continue;
      }
      if (settings.has(key)) {
        p.error(r, { index: 0, header: "Setting" }, `“${INPUT_SETTINGS[key].label}” appears twice (also row ${p.rowNumber(settings.get(key)!.loc.rowIndex!)}).`);
        continue;
      }
      settings.set(key, { cell: row[1] ?? null, loc: { sheet: inputSheet, rowIndex: r, col: { index: 1, header: "Value" } } });
    }
  }
  const locOf = (key: InputSettingKey): Location => settings.get(key)?.loc ?? { sheet: inputSheet ?? nowhere.sheet, rowIndex: null, col: null };
  const problemAt = (loc: Location, level: ImportProblem["level"], message: string) =>
    new SheetProblems(problems, loc.sheet).add(level, loc.rowIndex, loc.col, message);
  const erroredKeys = new Set<InputSettingKey>();
  const text = (key: InputSettingKey): string | undefined => readText(settings.get(key)?.cell);
  const number = (key: InputSettingKey, path: string): number | undefined => {
    locations.set(path, locOf(key));
    const entry = settings.get(key);
    if (!entry) return undefined;
    const { value, error } = readNumber(entry.cell, INPUT_SETTINGS[key].unit);
    if (error) {
      erroredKeys.add(key);
      problemAt(entry.loc, "error", `${INPUT_SETTINGS[key].label}: ${error}.`);
      return undefined;
    }
    return value;
  };
  const required = <T>(value: T | undefined, key: InputSettingKey, what: string): T | undefined => {
    if (value === undefined && !erroredKeys.has(key)) {
      problemAt(locOf(key), "error", `${INPUT_SETTINGS[key].label} is required ${what}.`);
    }
    return value;
  };
  const materialRef = (key: InputSettingKey, path: string): string | undefined => {
    const name = text(key);
    locations.set(path, locOf(key));
    return name === undefined ? undefined : resolve(name, locOf(key));
  };

  const name = text("name") ?? null;
  if (inputSheet && !name) problemAt(locOf("name"), "error", "The formulation needs a name (setting “Formulation name”).");
  if (name && takenNames.has(name.toLowerCase())) {
    problemAt(locOf("name"), "error", `A formulation named “${name}” already exists in this team: choose another name.`);
  }
  if (name && name.length > 200) problemAt(locOf("name"), "error", "The formulation name is longer than 200 characters.");

  // Basis.
  const basisWord = text("basis")?.toLowerCase();
  const basisType = (Object.entries(BASIS_LABELS).find(([id, word]) => basisWord === word || basisWord === id.toLowerCase())?.[0] ?? undefined) as
    | keyof typeof BASIS_LABELS
    | undefined;
  locations.set("basis", locOf("basis"));
  locations.set("basis.type", locOf("basis"));
  let basis: unknown;
  if (inputSheet && !basisType) {
    problemAt(locOf("basis"), "error", `Basis must be one of: ${Object.values(BASIS_LABELS).join(", ")}${basisWord ? ` (not “${text("basis")}”)` : ""}.`);
  } else if (basisType === "solidMass") {
    basis = { type: "solidMass", grams: required(number("solidGrams", "basis.grams"), "solidGrams", "for a dry-solid-mass basis") };
  } else if (basisType === "solidsContent") {
    basis = {
      type: "solidsContent",
      solMassGrams: required(number("solMassGrams", "basis.solMassGrams"), "solMassGrams", "for a solids-content basis"),
      solidsFraction: required(number("solidsFraction", "basis.solidsFraction"), "solidsFraction", "for a solids-content basis"),
    };
  } else if (basisType === "gelBody") {
    const linearShrinkage = number("linearShrinkage", "basis.linearShrinkage");
    basis = {
      type: "gelBody",
      volumeMl: required(number("volumeMl", "basis.volumeMl"), "volumeMl", "for a gel-body basis"),
      bulkDensity: required(number("bulkDensity", "basis.bulkDensity"), "bulkDensity", "for a gel-body basis"),
      ...(linearShrinkage !== undefined ? { linearShrinkage } : {}),
    };
  }

  // Water, solvent, catalyst, substrate.
  const waterId = materialRef("water", "water.materialId");
  const ratio = text("waterRatio");
  locations.set("water.ratio", locOf("waterRatio"));
  locations.set("water", locOf("water"));
  const ratioWord = ratio?.toLowerCase().replace(/\s+/g, " ");
  const waterRatio = (Object.entries(WATER_RATIO_LABELS).find(([id, word]) => ratioWord === word.toLowerCase() || ratioWord === id.toLowerCase())?.[0]) as
    | keyof typeof WATER_RATIO_LABELS
    | undefined;
  if (inputSheet && ratio !== undefined && !waterRatio) {
    problemAt(locOf("waterRatio"), "error", `Water ratio must be R, h or per precursor (not “${ratio}”).`);
  }
  const referenceId = materialRef("waterReference", "water.referenceId");
  if (waterRatio === "perPrecursor" && referenceId === undefined) {
    problemAt(locOf("waterReference"), "error", `${INPUT_SETTINGS.waterReference.label} is required with a water ratio per precursor: name the precursor.`);
  }
  locations.set("water.countCarried", locOf("waterCountCarried"));
  const carried = readFlag(settings.get("waterCountCarried")?.cell);
  if (carried.error) problemAt(locOf("waterCountCarried"), "error", `${INPUT_SETTINGS.waterCountCarried.label}: ${carried.error}.`);
  const water = {
    materialId: inputSheet ? required(waterId, "water", "") : undefined,
    ratio: inputSheet && ratio === undefined ? required(undefined, "waterRatio", "(R, h or per precursor)") : waterRatio,
    value: inputSheet ? required(number("waterValue", "water.value"), "waterValue", "") : undefined,
    ...(referenceId !== undefined ? { referenceId } : {}),
    ...(carried.value !== undefined ? { countCarried: carried.value } : {}),
  };

  let solvent: unknown;
  const solventId = materialRef("solvent", "solvent.materialId");
  const modeText = text("solventMode")?.toLowerCase();
  locations.set("solvent.mode", locOf("solventMode"));
  locations.set("solvent", locOf("solvent"));
  if (solventId !== undefined) {
    const mode = (Object.entries(SOLVENT_MODE_LABELS).find(([id, word]) => modeText === word || modeText === id.toLowerCase())?.[0]) as
      | keyof typeof SOLVENT_MODE_LABELS
      | undefined;
    if (!mode) {
      problemAt(locOf("solventMode"), "error", `Solvent amount must be “molar ratio” or “fill”${modeText ? ` (not “${text("solventMode")}”)` : ""}.`);
    } else if (mode === "fill") {
      solvent = { materialId: solventId, mode };
    } else {
      solvent = { materialId: solventId, mode, value: required(number("solventValue", "solvent.value"), "solventValue", "with a molar ratio") };
    }
  } else if (modeText || settings.get("solventValue")?.cell != null) {
    problemAt(locOf("solvent"), "error", "A solvent amount is given but no solvent material.");
  }

  let catalyst: unknown;
  const catalystId = materialRef("catalyst", "catalyst.materialId");
  locations.set("catalyst", locOf("catalyst"));
  if (catalystId !== undefined) {
    catalyst = {
      materialId: catalystId,
      molPerNetworkAtom: required(number("catalystValue", "catalyst.molPerNetworkAtom"), "catalystValue", "with a catalyst"),
    };
  } else if (settings.get("catalystValue")?.cell != null) {
    problemAt(locOf("catalyst"), "error", "A catalyst ratio is given but no catalyst material.");
  }
  const substrateId = materialRef("substrate", "substrateId");
  const marginC = number("marginC", "marginC");
  const measuredBulkDensity = number("measuredBulkDensity", "measuredBulkDensity");

  // Components, modifiers, coating, process steps and addition order.
  const locate = (path: string, loc: Location) => locations.set(path, loc);
  const componentsSheet = findSheet(sheets, SHEET.components);
  const components = readComponentsSheet(componentsSheet, problems, resolve, locate);
  const steps = readStepsSheet(findSheet(sheets, SHEET.steps), problems, locate);
  const modifiers = readModifiersSheet(findSheet(sheets, SHEET.modifiers), problems, resolve, locate);
  const coating = readCoatingSheet(findSheet(sheets, SHEET.coating), problems, locate);
  const additionOrder = readOrderSheet(findSheet(sheets, SHEET.order), problems, resolve, locate);

  const materials: Material[] = used.map((x) => ({ ...x.material, id: x.id }));
  used.forEach((x, index) => {
    if (x.row === null) locations.set(`materials.${index}`, { sheet: componentsSheet ?? nowhere.sheet, rowIndex: null, col: null });
  });

  const candidate: Record<string, unknown> = { materials, basis, components, water, steps };
  if (solvent !== undefined) candidate.solvent = solvent;
  if (catalyst !== undefined) candidate.catalyst = catalyst;
  if (modifiers.length > 0) candidate.modifiers = modifiers;
  if (coating !== undefined) candidate.coating = coating;
  if (substrateId !== undefined) candidate.substrateId = substrateId;
  if (marginC !== undefined) candidate.marginC = marginC;
  if (measuredBulkDensity !== undefined) candidate.measuredBulkDensity = measuredBulkDensity;
  if (additionOrder !== undefined) candidate.additionOrder = additionOrder;

  let input: FormulationInput | null = null;
  const hadErrors = problems.some((x) => x.level === "error");
  const parsed = formulationInputSchema.safeParse(candidate);
  if (parsed.success) {
    input = parsed.data;
  } else if (!hadErrors) {
    // Only shown when nothing more specific was reported, so each problem appears once.
    for (const issue of parsed.error.issues) {
      const keys = issue.path.map(String);
      let loc: Location | undefined;
      for (let n = keys.length; n >= 0 && !loc; n--) loc = locations.get(keys.slice(0, n).join("."));
      problemAt(loc ?? nowhere, "error", issue.message.charAt(0).toUpperCase() + issue.message.slice(1) + ".");
    }
  }

  const computed: FormulationPreview["computed"] = { ok: false };
  if (input && !problems.some((x) => x.level === "error")) {
    try {
      const result = computeFormulation(input);
      computed.ok = true;
      computed.thermalStatus = result.thermal.status;
      for (const notice of result.notices.filter((n) => n.level === "error")) {
        problemAt(locations.get(notice.field ?? "") ?? locations.get("steps.0") ?? nowhere, "warning", notice.message);
      }
    } catch (err) {
      if (!isFormulationError(err)) throw err;
      computed.message = err.message;
      for (const issue of err.issues) {
        const keys = issue.field.split(".");
        let loc: Location | undefined;
        for (let n = keys.length; n >= 0 && !loc; n--) loc = locations.get(keys.slice(0, n).join("."));
        problemAt(loc ?? nowhere, "warning", `It can be saved as a draft, but it cannot be computed yet: ${issue.message}`);
      }
    }
  }

  const rows = sheets.reduce((n, s) => n + s.rows.filter((row) => !isBlankRow(row)).length, 0);
  const errors = problems.filter((x) => x.level === "error").length;
  return {
    kind: "formulation",
    formulation: { name, project: text("project") ?? null, description: text("description") ?? null },
    input: errors === 0 ? input : null,
    materials: used,
    computed,
    problems: sortProblems(problems),
    counts: {
      sheets: sheets.length,
      rows,
      materials: used.length,
      toCreate: used.filter((x) => x.action === "create").length,
      toLink: used.filter((x) => x.action === "link").length,
      components: components.length,
      steps: steps.length,
      errors,
      warnings: problems.length - errors,
    },
  };
}

export { columnLetter };
