import type { Batch, BatchLine, LineDeviation } from "@/lib/client/batches";
import { liveDeviation } from "./batch-deviation";

/** What is typed into one line, not yet saved: the mass as text and the lot number (typed only when no lot is picked). */
export interface Draft {
  mass: string;
  lot: string;
}

/** Why a line is not saved, and which of its fields to point at. */
export interface LineProblem {
  field: "mass" | "lot";
  message: string;
}

/** What the user typed in a mass field: a number of grams, blank (null), or why it is not one. */
export function parseMass(text: string): { value: number | null; error?: string } {
  const t = text.trim().replace(/\s*g$/i, "").replace(",", ".");
  if (t === "") return { value: null };
  if (/^-\s*\d/.test(t)) return { value: null, error: "The actual mass must not be negative." };
  if (!/^\d*\.?\d+$|^\d+\.$/.test(t)) return { value: null, error: "Write the mass in g as a number, e.g. 12.34." };
  const value = Number(t);
  if (!Number.isFinite(value)) return { value: null, error: "Write the mass in g as a number, e.g. 12.34." };
  if (value > 1e7) return { value: null, error: "At most 10,000,000 g." };
  return { value };
}

/** The problem with a typed mass, named with its line (1-based in the words), or undefined when it reads. */
export function massProblem(index: number, text: string): LineProblem | undefined {
  const { error } = parseMass(text);
  return error ? { field: "mass", message: `Line ${index + 1}, actual mass: ${error}` } : undefined;
}

/** The draft that shows a saved line as it is. */
export function draftOf(line: BatchLine): Draft {
  return { mass: line.actualGrams === null ? "" : String(line.actualGrams), lot: line.lotNumber ?? "" };
}

/** True when a lot is picked for the line: its lot number then comes from the lot and is not typed. */
export function lotPicked(line: BatchLine): boolean {
  return !!line.lotId;
}

/** The lot number to show for a line: the picked lot's (as saved), else what is typed. */
export function shownLot(draft: Draft, line: BatchLine): string {
  return lotPicked(line) ? (line.lotNumber ?? "") : draft.lot;
}

/** True when the draft differs from the saved line (a mass that cannot be read counts as a change; a picked lot's number never does). */
export function isDirty(draft: Draft, line: BatchLine): boolean {
  const parsed = parseMass(draft.mass);
  if (parsed.error) return true;
  return parsed.value !== line.actualGrams || (!lotPicked(line) && (draft.lot.trim() || null) !== line.lotNumber);
}

/** The line's material name, or its id when the name was not kept. */
export function lineName(line: BatchLine): string {
  return line.name ?? line.materialId;
}

/**
 * The changes a draft makes to its saved line, as the body of a line save;
 * null when nothing changed, or the problem when the mass cannot be read.
 */
export function lineChanges(
  index: number,
  draft: Draft,
  line: BatchLine,
): { body: { actualGrams?: number | null; lotNumber?: string | null } | null; problem?: LineProblem } {
  const problem = massProblem(index, draft.mass);
  if (problem) return { body: null, problem };
  const parsed = parseMass(draft.mass);
  const body: { actualGrams?: number | null; lotNumber?: string | null } = {};
  if (parsed.value !== line.actualGrams) body.actualGrams = parsed.value;
  const lot = draft.lot.trim() || null;
  // A picked lot's number comes from the lot: the draft's text is never sent over it.
  if (!lotPicked(line) && lot !== line.lotNumber) body.lotNumber = lot;
  return { body: Object.keys(body).length ? body : null };
}

/**
 * The deviation to show for a line while typing: worked out live from a
 * typed mass that is not saved yet, none for a mass being cleared, else the
 * server's. `live` says the figure is not the saved one.
 */
export function shownDeviation(
  line: BatchLine,
  draft: Draft,
  batch: Pick<Batch, "toleranceFraction" | "balanceResolutionGrams">,
): { deviation: LineDeviation | null; live: boolean } {
  const parsed = parseMass(draft.mass);
  if (!parsed.error && parsed.value !== null && parsed.value !== line.actualGrams && line.targetGrams !== undefined) {
    return { deviation: liveDeviation(line.targetGrams, parsed.value, batch.toleranceFraction, batch.balanceResolutionGrams), live: true };
  }
  if (!parsed.error && parsed.value === null && line.actualGrams !== null) return { deviation: null, live: true };
  return { deviation: line.deviation, live: false };
}

/** Problems per line from a refused close: field paths "lines.<i>.actualGrams" / "lines.<i>.lotNumber". */
export function closeProblems(fields: Record<string, string>): Record<number, LineProblem> {
  const out: Record<number, LineProblem> = {};
  for (const [path, message] of Object.entries(fields)) {
    const m = /^lines\.(\d+)\.(actualGrams|lotNumber)$/.exec(path);
    if (!m) continue;
    out[Number(m[1])] = { field: m[2] === "lotNumber" ? "lot" : "mass", message };
  }
  return out;
}

/** How far the typed entry has come: lines with a mass, lines outside tolerance, lines still needing a lot number. */
export function entryCounts(batch: Batch, drafts: readonly Draft[]): { weighed: number; outside: number; missingLot: number } {
  let weighed = 0;
  let outside = 0;
  let missingLot = 0;
  batch.lines.forEach((line, i) => {
    const draft = drafts[i] ?? draftOf(line);
    if (parseMass(draft.mass).value !== null) weighed += 1;
    if (shownDeviation(line, draft, batch).deviation?.outside) outside += 1;
    if (line.role !== "water" && !shownLot(draft, line).trim()) missingLot += 1;
  });
  return { weighed, outside, missingLot };
}
