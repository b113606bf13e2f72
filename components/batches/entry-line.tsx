"use client";

import { LINE_ROLE_LABELS } from "@/components/results/words";
import { FieldError, inputClass } from "@/components/ui/field";
import type { Batch, BatchLine } from "@/lib/client/batches";
import { fmtDateTime, fmtMass, fmtVolume } from "@/lib/format";
import { deviationWords } from "./batch-deviation";
import { ToleranceBadge } from "./batch-words";
import { isDirty, lineName, lotPicked, shownDeviation, shownLot, type Draft, type LineProblem } from "./line-draft";
import type { BatchEntryState } from "./use-batch-entry";
import type { EntryKeys } from "./use-entry-keys";

/** The grid of a line: material and target, actual mass, lot number, deviation. Shared by the column headings. */
export const LINE_GRID = "md:grid-cols-[minmax(0,1.7fr)_8.5rem_10rem_minmax(0,1.8fr)]";

interface EntryLineProps {
  index: number;
  line: BatchLine;
  draft: Draft;
  problem: LineProblem | undefined;
  saving: boolean;
  batch: Pick<Batch, "toleranceFraction" | "balanceResolutionGrams">;
  entry: Pick<BatchEntryState, "setDraft" | "saveIfChanged">;
  keys: Pick<EntryKeys, "inputRef" | "onKey">;
}

/** One line of the weighing entry: what to weigh, the two fields, and the tolerance check as it is typed. */
export function EntryLine({ index: i, line, draft, problem, saving, batch, entry, keys }: EntryLineProps) {
  const res = batch.balanceResolutionGrams;
  const { deviation, live } = shownDeviation(line, draft, batch);
  const name = lineName(line);
  const state = saving
    ? "Saving…"
    : isDirty(draft, line) || live
      ? "Not saved yet: leave the line or press Enter"
      : line.at
        ? `Saved ${fmtDateTime(line.at)}${line.initials ? ` · ${line.initials}` : ""}`
        : "";
  return (
    <li
      data-testid={`batch-line-${i}`}
      className={`grid grid-cols-2 gap-x-3 gap-y-1.5 border-b border-rule/70 px-3 py-2 last:border-0 ${LINE_GRID} md:items-start ${
        deviation?.outside ? "bg-fail-soft/40" : ""
      }`}
    >
      <div className="col-span-2 min-w-0 md:col-span-1">
        <p className="font-medium">
          <span className="num mr-1.5 text-muted">{i + 1}.</span>
          {name}
        </p>
        <p className="num text-xs text-muted">
          {line.role ? LINE_ROLE_LABELS[line.role] : "Material"} · target <strong className="text-ink">{fmtMass(line.targetGrams, res)}</strong>
          {line.targetMl !== undefined ? ` (≈ ${fmtVolume(line.targetMl)})` : ""}
        </p>
      </div>
      <LineInput
        field="mass"
        index={i}
        label="Actual mass (g)"
        name={name}
        value={draft.mass}
        invalid={problem?.field === "mass"}
        placeholder={line.targetGrams !== undefined ? fmtMass(line.targetGrams, res).replace(/\s*g$/, "") : ""}
        entry={entry}
        keys={keys}
      />
      <LineInput
        field="lot"
        index={i}
        label="Lot number"
        name={name}
        value={shownLot(draft, line)}
        readOnly={lotPicked(line)}
        invalid={problem?.field === "lot"}
        placeholder={line.role === "water" ? "not needed" : ""}
        entry={entry}
        keys={keys}
      />
      <div className="col-span-2 flex min-w-0 flex-col gap-0.5 text-sm md:col-span-1" data-testid={`line-status-${i}`}>
        <span className="flex flex-wrap items-center gap-1.5">
          <ToleranceBadge deviation={deviation} toleranceFraction={batch.toleranceFraction} resolution={res} />
          {deviation ? <span className="num whitespace-nowrap">{deviationWords(deviation, res)}</span> : null}
        </span>
        <span className="num text-xs text-muted">{state}</span>
      </div>
      <div className="col-span-2 md:col-span-4">
        <FieldError id={`line-${i}-error`} message={problem?.message} />
      </div>
    </li>
  );
}

interface LineInputProps {
  field: "mass" | "lot";
  index: number;
  label: string;
  /** The line's material, for the label screen readers hear. */
  name: string;
  value: string;
  /** The lot number of a picked lot: shown, not typed (choose "no lot" to type one). */
  readOnly?: boolean;
  invalid: boolean;
  placeholder: string;
  entry: Pick<BatchEntryState, "setDraft" | "saveIfChanged">;
  keys: Pick<EntryKeys, "inputRef" | "onKey">;
}

/** The mass or lot-number field of a line: saved when left, moved through with the keys. */
function LineInput({ field, index: i, label, name, value, readOnly = false, invalid, placeholder, entry, keys }: LineInputProps) {
  const mass = field === "mass";
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={`${field}-${i}`} className="text-[13px] font-medium md:sr-only">
        {label}
        <span className="sr-only">
          , line {i + 1}: {name}
          {readOnly ? ", from the picked lot" : ""}
        </span>
      </label>
      <input
        id={`${field}-${i}`}
        ref={keys.inputRef(field, i)}
        type="text"
        inputMode={mass ? "decimal" : undefined}
        autoComplete="off"
        enterKeyHint="next"
        maxLength={mass ? undefined : 100}
        className={inputClass(invalid, mass ? "num text-right" : readOnly ? "font-mono bg-paper text-muted" : "font-mono")}
        value={value}
        readOnly={readOnly}
        title={readOnly ? "From the picked lot; to type a lot number, set the line's lot to “no lot”." : undefined}
        placeholder={placeholder}
        aria-invalid={invalid ? true : undefined}
        aria-describedby={mass ? `line-${i}-error entry-help` : `line-${i}-error`}
        onChange={(e) => entry.setDraft(i, { [field]: e.target.value })}
        onKeyDown={(e) => keys.onKey(field, i, e)}
        onBlur={() => entry.saveIfChanged(i)}
      />
    </div>
  );
}
