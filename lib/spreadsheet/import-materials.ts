/**
 * Reads the Materials and Material sources sheets of our template into
 * Material records, with every problem located by sheet, row and column, and
 * decides for each material whether it links to a library material (same
 * name, or same CAS number) or is to be created.
 *
 * Parsed values are copied one by one into fresh objects under keys that come
 * from our own column list, never from the file.
 */
import { materialSchema, MATERIAL_KINDS, type Material, type MaterialKind } from "@/lib/formulation";
import { headerKey, headerStem, isBlankRow, readFlag, readNumber, readText, SheetProblems } from "./cells";
import { resolveCarriedSolvents } from "./carried-solvent";
import { MATERIAL_COLUMNS, NO_HAZARDS, SHEET, SOURCE_COLUMNS, type MaterialColumn } from "./template";
import { sourcePropertyKey } from "./source-properties";
import type { Cell, ImportProblem, SheetGrid } from "./types";

/** A library material, as the import compares against it. */
export interface LibraryEntry {
  id: string;
  name: string;
  casNumber: string | null;
  material: Material;
}

/** What the import will do with one material of the file. */
export interface MaterialProposal {
  /** Row on the Materials sheet, or null for a library material only named elsewhere in the file. */
  row: number | null;
  name: string;
  kind: MaterialKind;
  action: "link" | "create";
  /** The material's id after saving: the library id when linked, a new id when created. */
  id: string;
  matchedBy?: "name" | "casNumber";
  libraryName?: string;
  /** The values from the file (or the library's, for a material only named). */
  material: Material;
}

/** A material read from a row, before linking. */
export interface MaterialDraft {
  rowIndex: number;
  material: Material;
  /** Where the carried solvent's name was read (its `solventId` holds the name until the names are resolved). */
  solventAt?: { index: number; header: string };
}

const KIND_ALIASES: Record<string, MaterialKind> = {
  "organic phase": "organic",
  polymer: "organic",
  alkoxide: "precursor",
  acid: "catalyst",
  base: "catalyst",
  ligand: "modifier",
  "chelating agent": "modifier",
};
/** Kinds that are weighed out into the batch and so need a density. */
export const DISPENSED_KINDS: readonly MaterialKind[] = ["precursor", "organic", "solvent", "water", "catalyst"];

function setPath(target: Record<string, unknown>, path: string, value: unknown): void {
  const keys = path.split(".");
  let node = target;
  for (const key of keys.slice(0, -1)) {
    if (!Object.prototype.hasOwnProperty.call(node, key)) node[key] = {};
    node = node[key] as Record<string, unknown>;
  }
  node[keys[keys.length - 1]!] = value;
}

/** Maps the header row to our columns; unknown headers give a warning. */
function mapHeader<T extends { header: string }>(
  sheet: SheetGrid,
  columns: readonly T[],
  problems: SheetProblems,
): Map<number, T & { index: number }> | null {
  const header = sheet.rows[0] ?? [];
  const byKey = new Map<string, T>();
  for (const column of columns) {
    byKey.set(headerKey(column.header), column);
    if (!byKey.has(headerStem(column.header))) byKey.set(headerStem(column.header), column);
  }
  const found = new Map<number, T & { index: number }>();
  const seen = new Set<string>();
  header.forEach((cell, index) => {
    const text = readText(cell);
    if (!text) return;
    const column = byKey.get(headerKey(text)) ?? byKey.get(headerStem(text));
    if (!column) {
      problems.warning(0, { index, header: text }, `Column “${text}” is not part of the template and is ignored.`);
      return;
    }
    if (seen.has(column.header)) {
      problems.error(0, { index, header: text }, `Column “${column.header}” appears twice; keep one.`);
      return;
    }
    seen.add(column.header);
    found.set(index, { ...column, index });
  });
  return found;
}

function cellAt(row: readonly Cell[], index: number): Cell | undefined {
  return row[index];
}

/** Where each material field lives, for turning schema issues into cells. */
function columnOfPath(path: readonly PropertyKey[], columns: Map<number, MaterialColumn & { index: number }>) {
  const dotted = path.map(String).join(".");
  let best: (MaterialColumn & { index: number }) | undefined;
  for (const column of columns.values()) {
    if (dotted === column.path || dotted.startsWith(`${column.path}.`) || column.path.startsWith(`${dotted}.`)) {
      if (!best || column.path.length < best.path.length || dotted === column.path) best = column;
      if (dotted === column.path) break;
    }
  }
  return best ? { index: best.index, header: best.header } : null;
}

/**
 * Reads the Materials sheet (and Material sources, when present). Returns
 * the materials with the 0-based row each came from; every problem goes to
 * `problems`. `densityLevel` says whether a dispensed material without a
 * density is an error (formulation import) or a warning (library import).
 */
export function readMaterialsSheets(
  sheets: readonly SheetGrid[],
  problems: ImportProblem[],
  opts: { densityLevel: "error" | "warning"; required: boolean },
): MaterialDraft[] {
  const sheet = sheets.find((s) => headerKey(s.name) === headerKey(SHEET.materials));
  if (!sheet) {
    if (opts.required) {
      problems.push({ level: "error", sheet: SHEET.materials, row: null, column: null, columnLetter: null, message: `The file has no “${SHEET.materials}” sheet (or table).` });
    }
    return [];
  }
  const p = new SheetProblems(problems, sheet);
  const columns = mapHeader(sheet, MATERIAL_COLUMNS, p);
  if (!columns) return [];
  const nameColumn = [...columns.values()].find((c) => c.path === "name");
  const kindColumn = [...columns.values()].find((c) => c.path === "kind");
  if (!nameColumn || !kindColumn) {
    p.error(0, null, `The header row (row ${p.rowNumber(0)}) needs at least the columns “Name” and “Kind”.`);
    return [];
  }
  const drafts: MaterialDraft[] = [];
  const byName = new Map<string, number>();
  for (let r = 1; r < sheet.rows.length; r++) {
    const row = sheet.rows[r]!;
    if (isBlankRow(row)) continue;
    const record: Record<string, unknown> = {};
    let rowOk = true;
    for (const column of columns.values()) {
      const cell = cellAt(row, column.index);
      const at = { index: column.index, header: column.header };
      if (column.type === "number") {
        const unit = /\(([^)]*)\)/.exec(column.header)?.[1];
        const { value, error } = readNumber(cell, unit);
        if (error) {
          p.error(r, at, `${column.header.replace(/\s*\(.*\)$/, "")}: ${error}.`);
          rowOk = false;
        } else if (value !== undefined) setPath(record, column.path, value);
        continue;
      }
      if (column.type === "flag") {
        const { value, error } = readFlag(cell);
        if (error) {
          p.error(r, at, `${column.header.replace(/\s*\(.*\)$/, "")}: ${error}.`);
          rowOk = false;
        } else if (value !== undefined) setPath(record, column.path, value);
        continue;
      }
      const text = readText(cell);
      if (text === undefined) continue;
      if (column.type === "kind") {
        const lower = text.toLowerCase();
        const kind = (MATERIAL_KINDS as readonly string[]).includes(lower) ? (lower as MaterialKind) : KIND_ALIASES[lower];
        if (!kind) {
          p.error(r, at, `Kind “${text}” is not one of ${MATERIAL_KINDS.join(", ")}.`);
          rowOk = false;
        } else setPath(record, column.path, kind);
      } else if (column.type === "hazards") {
        setPath(record, column.path, text.toLowerCase() === NO_HAZARDS ? [] : text.split(/[;,\s]+/).filter(Boolean).map((code) => code.toUpperCase()));
      } else setPath(record, column.path, text);
    }
    const name = typeof record.name === "string" ? record.name : undefined;
    if (!name) {
      p.error(r, { index: nameColumn.index, header: nameColumn.header }, "Every material needs a name.");
      continue;
    }
    const key = name.toLowerCase();
    const earlier = byName.get(key);
    if (earlier !== undefined) {
      p.error(r, { index: nameColumn.index, header: nameColumn.header }, `“${name}” is a duplicate name: it already appears in row ${p.rowNumber(earlier)}. Names must be unique.`);
      continue;
    }
    byName.set(key, r);
    if (record.kind === undefined) {
      if (rowOk) p.error(r, { index: kindColumn.index, header: kindColumn.header }, `“${name}” needs a kind (${MATERIAL_KINDS.join(", ")}).`);
      continue;
    }
    const parsed = materialSchema.safeParse({ ...record, id: `row-${r}` });
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        if (issue.path[0] === "id") continue;
        p.error(r, columnOfPath(issue.path, columns), `“${name}”: ${issue.message}.`);
      }
      continue;
    }
    const material = parsed.data;
    if (DISPENSED_KINDS.includes(material.kind) && material.density === undefined) {
      const col = [...columns.values()].find((c) => c.path === "density") ?? null;
      p.add(
        opts.densityLevel,
        r,
        col ? { index: col.index, header: col.header } : null,
        `“${name}” has no density as supplied (g/cm³); it is needed to turn its mass into a volume for the batch.`,
      );
      if (opts.densityLevel === "error") continue;
    }
    if (material.kind === "precursor" && !material.precursor) {
      p.add(opts.densityLevel, r, null, `“${name}” is a precursor without residue data (residue formula, residue molar mass, residue units per molecule, residue density, network-forming atoms, hydrolysable groups).`);
      if (opts.densityLevel === "error") continue;
    }
    const solventColumn = [...columns.values()].find((c) => c.type === "material");
    if (rowOk) drafts.push({ rowIndex: r, material, ...(material.solventId !== undefined && solventColumn ? { solventAt: { index: solventColumn.index, header: solventColumn.header } } : {}) });
  }
  readSources(sheets, drafts, problems);
  return drafts;
}

function readSources(sheets: readonly SheetGrid[], drafts: MaterialDraft[], problems: ImportProblem[]): void {
  const sheet = sheets.find((s) => headerKey(s.name) === headerKey(SHEET.sources));
  if (!sheet) return;
  const p = new SheetProblems(problems, sheet);
  const columns = mapHeader(sheet, SOURCE_COLUMNS.map((header) => ({ header })), p);
  if (!columns) return;
  const col = (header: string) => [...columns.values()].find((c) => c.header === header);
  const [materialCol, propertyCol, sourceCol] = [col("Material"), col("Property"), col("Source")];
  if (!materialCol || !propertyCol || !sourceCol) {
    p.error(0, null, "The header row needs the columns “Material”, “Property” and “Source”.");
    return;
  }
  const byName = new Map(drafts.map((d) => [d.material.name.toLowerCase(), d]));
  for (let r = 1; r < sheet.rows.length; r++) {
    const row = sheet.rows[r]!;
    if (isBlankRow(row)) continue;
    const name = readText(row[materialCol.index]);
    const property = readText(row[propertyCol.index]);
    const source = readText(row[sourceCol.index]);
    if (!name || !property || !source) {
      p.error(r, null, "Each source row needs a material, a property and a source.");
      continue;
    }
    const draft = byName.get(name.toLowerCase());
    if (!draft) {
      p.warning(r, { index: materialCol.index, header: materialCol.header }, `“${name}” is not on the Materials sheet; this source is ignored.`);
      continue;
    }
    const key = sourcePropertyKey(property);
    if (!/^[A-Za-z][A-Za-z0-9]*(\.[A-Za-z][A-Za-z0-9]*)*$/.test(key) || ["__proto__", "constructor", "prototype"].includes(key)) {
      p.error(r, { index: propertyCol.index, header: propertyCol.header }, `“${property}” is not a property: use a column header of the Materials sheet.`);
      continue;
    }
    const sources: Record<string, string> = Object.fromEntries(Object.entries(draft.material.sources ?? {}));
    Object.defineProperty(sources, key, { value: source, enumerable: true, writable: true, configurable: true });
    draft.material = { ...draft.material, sources };
  }
}

function comparable(material: Material): string {
  const copy = { ...material } as Record<string, unknown>;
  delete copy.id;
  delete copy.name;
  delete copy.sources;
  delete copy.casNumber;
  delete copy.updatedAt;
  delete copy.referenceId;
  const sort = (value: unknown): unknown =>
    Array.isArray(value)
      ? value.map(sort)
      : value && typeof value === "object"
        ? Object.fromEntries(Object.entries(value as Record<string, unknown>).filter(([, v]) => v !== undefined).sort(([a], [b]) => a.localeCompare(b)).map(([k, v]) => [k, sort(v)]))
        : value;
  return JSON.stringify(sort(copy));
}

/**
 * Links each material to the library (by name, then by CAS number) or
 * proposes creating it. `newId` makes the id of a material to create.
 */
export function proposeMaterials(
  drafts: readonly MaterialDraft[],
  library: readonly LibraryEntry[],
  sheet: SheetGrid | undefined,
  problems: ImportProblem[],
  opts: { newId: () => string; differsLevel: "warning"; differsMessage: (name: string, libraryName: string) => string },
): MaterialProposal[] {
  const byName = new Map(library.map((entry) => [entry.name.toLowerCase(), entry]));
  const byCas = new Map(library.filter((entry) => entry.casNumber).map((entry) => [entry.casNumber!, entry]));
  const p = sheet ? new SheetProblems(problems, sheet) : undefined;
  // First the id each material gets (library match or a new id), then the carried solvents' names become ids.
  const matched = drafts.map((draft) => {
    const material = draft.material;
    let entry = byName.get(material.name.toLowerCase());
    let matchedBy: MaterialProposal["matchedBy"] = entry ? "name" : undefined;
    if (!entry && material.casNumber) {
      entry = byCas.get(material.casNumber);
      if (entry) matchedBy = "casNumber";
    }
    return { draft, entry, matchedBy, id: entry ? entry.id : opts.newId() };
  });
  resolveCarriedSolvents(matched, library, p);
  return matched.map(({ draft, entry, matchedBy, id }): MaterialProposal => {
    const material = draft.material;
    const row = p ? p.rowNumber(draft.rowIndex) : null;
    if (!entry) {
      return { row, name: material.name, kind: material.kind, action: "create", id, material: { ...material, id } };
    }
    if (entry.material.kind !== material.kind) {
      p?.error(draft.rowIndex, null, `“${material.name}” is ${material.kind} here but the library's “${entry.name}” (matched by ${matchedBy === "name" ? "name" : "CAS number"}) is ${entry.material.kind}.`);
    } else {
      if (matchedBy === "casNumber") {
        p?.warning(draft.rowIndex, null, `“${material.name}” is linked to the library's “${entry.name}” by its CAS number ${material.casNumber}.`);
      }
      if (comparable(material) !== comparable(entry.material)) p?.warning(draft.rowIndex, null, opts.differsMessage(material.name, entry.name));
    }
    return { row, name: material.name, kind: material.kind, action: "link", id: entry.id, matchedBy, libraryName: entry.name, material: { ...material, id: entry.id } };
  });
}

/** Preview of a materials-library import. */
export interface MaterialsPreview {
  kind: "materials";
  materials: MaterialProposal[];
  problems: ImportProblem[];
  counts: { rows: number; materials: number; toCreate: number; toLink: number; errors: number; warnings: number };
}

/**
 * The preview of a materials import: every material with its link or
 * creation, and every problem.
 */
export function previewMaterialsImport(sheets: readonly SheetGrid[], library: readonly LibraryEntry[], newId: () => string): MaterialsPreview {
  const problems: ImportProblem[] = [];
  const drafts = readMaterialsSheets(sheets, problems, { densityLevel: "warning", required: true });
  const sheet = sheets.find((s) => headerKey(s.name) === headerKey(SHEET.materials));
  const materials = proposeMaterials(drafts, library, sheet, problems, {
    newId,
    differsLevel: "warning",
    differsMessage: (name, libraryName) =>
      `“${name}” is already in the library as “${libraryName}” with other values; the library is not changed by this import (edit it there).`,
  });
  const rows = sheet ? sheet.rows.slice(1).filter((row) => !isBlankRow(row)).length : 0;
  return {
    kind: "materials",
    materials,
    problems: sortProblems(problems),
    counts: {
      rows,
      materials: materials.length,
      toCreate: materials.filter((m) => m.action === "create").length,
      toLink: materials.filter((m) => m.action === "link").length,
      errors: problems.filter((x) => x.level === "error").length,
      warnings: problems.filter((x) => x.level === "warning").length,
    },
  };
}

/** Problems in reading order: by sheet as found, then row, errors first. */
export function sortProblems(problems: ImportProblem[]): ImportProblem[] {
  const sheetOrder = new Map<string, number>();
  problems.forEach((x) => {
    if (!sheetOrder.has(x.sheet)) sheetOrder.set(x.sheet, sheetOrder.size);
  });
  return problems
    .map((x, i) => ({ x, i }))
    .sort((a, b) => sheetOrder.get(a.x.sheet)! - sheetOrder.get(b.x.sheet)! || (a.x.row ?? 0) - (b.x.row ?? 0) || a.i - b.i)
    .map(({ x }) => x);
}
