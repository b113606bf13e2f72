"use client";

import { ROLE_WORDS } from "@/components/results/words";
import { FieldError, inputClass } from "@/components/ui/field";
import type { Batch, BatchLine } from "@/lib/client/batches";
import { fmtDateTime, fmtMass, fmtVolume } from "@/lib/format";
import { deviationWords } from "./batch-deviation";
import { ToleranceBadge } from "./batch-words";
import { isDirty, lineName, shownDeviation, type Draft, type LineProblem } from "./line-draft";
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
          {line.role ? ROLE_WORDS[line.role] : "Material"} · target <strong className="text-ink">{fmtMass(line.targetGrams, res)}</strong>
          {line.targetMl !== undefined ? ` (≈ ${fmtVolume(line.targetMl)})` : ""}
        </p>
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor={`mass-${i}`} className="text-[13px] font-medium md:sr-only">
          Actual mass (g)<span className="sr-only">, line {i + 1}: {name}</span>
        </label>
        <input
          id={`mass-${i}`}
          ref={keys.inputRef("mass", i)}
          type="text"
          inputMode="decimal"
          autoComplete="off"
          enterKeyHint="next"
          className={inputClass(problem?.field === "mass", "num text-right")}
          value={draft.mass}
          placeholder={line.targetGrams !== undefined ? fmtMass(line.targetGrams, res).replace(/\s*g$/, "") : ""}
          aria-invalid={problem?.field === "mass" ? true : undefined}
          aria-describedby={`line-${i}-error entry-help`}
          onChange={(e) => entry.setDraft(i, { mass: e.target.value })}
          onKeyDown={(e) => keys.onKey("mass", i, e)}
          onBlur={() => entry.saveIfChanged(i)}
        />
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor={`lot-${i}`} className="text-[13px] font-medium md:sr-only">
          Lot number<span className="sr-only">, line {i + 1}: {name}</span>
        </label>
        <input
          id={`lot-${i}`}
          ref={keys.inputRef("lot", i)}
          type="text"
          autoComplete="off"
          enterKeyHint="next"
          maxLength={100}
          className={inputClass(problem?.field === "lot", "font-mono")}
          value={draft.lot}
          placeholder={line.role === "water" ? "not needed" : ""}
          aria-invalid={problem?.field === "lot" ? true : undefined}
          aria-describedby={`line-${i}-error`}
          onChange={(e) => entry.setDraft(i, { lot: e.target.value })}
          onKeyDown={(e) => keys.onKey("lot", i, e)}
          onBlur={() => entry.saveIfChanged(i)}
        />
      </div>
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
