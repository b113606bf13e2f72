"use client";

import type { Batch } from "@/lib/client/batches";
import { fmtMass } from "@/lib/format";
import { toleranceWords } from "./batch-deviation";
import { ClosePanel } from "./close-panel";
import { CompositionPanel } from "./composition-panel";
import { EntryHelp } from "./entry-help";
import { EntryLine, LINE_GRID } from "./entry-line";
import { entryCounts } from "./line-draft";
import { useBatchEntry } from "./use-batch-entry";
import { useCloseBatch } from "./use-close-batch";
import { useEntryKeys } from "./use-entry-keys";

interface BatchEntryProps {
  initial: Batch;
  /** Initials to record with each line (the user may change them). */
  defaultInitials: string;
}

/**
 * Keyboard-fast weighing entry: actual mass and lot number per line, Enter
 * moves on (mass → lot → next line's mass), every line is saved as it is left,
 * the deviation and the tolerance flag show while typing; then close the record.
 * State and saving live in useBatchEntry, keys in useEntryKeys, closing in useCloseBatch.
 */
export function BatchEntry({ initial, defaultInitials }: BatchEntryProps) {
  const entry = useBatchEntry(initial, defaultInitials);
  const keys = useEntryKeys(entry);
  const closing = useCloseBatch(entry, keys);
  const { batch, drafts } = entry;
  const res = batch.balanceResolutionGrams;
  const counts = entryCounts(batch, drafts);

  return (
    <div className="flex flex-col gap-4">
      <EntryHelp initials={entry.initials} onInitials={entry.setInitials} />

      <p className="num text-sm" data-testid="entry-summary">
        Tolerance <strong>{toleranceWords(batch.toleranceFraction)}</strong> of the target mass, never tighter than the balance resolution of{" "}
        <strong>{fmtMass(res, res)}</strong> · {counts.weighed} of {batch.lines.length} lines weighed ·{" "}
        {counts.outside === 0 ? "no line outside tolerance" : <strong className="text-fail">{counts.outside} outside tolerance</strong>}
      </p>

      <section aria-labelledby="lines-title" className="rounded border border-rule bg-panel">
        <h2 id="lines-title" className="border-b border-rule px-3 py-2 text-sm font-semibold">
          Weighings, in order of addition
        </h2>
        <div aria-hidden="true" className={`hidden gap-x-3 border-b border-rule bg-paper px-3 py-1.5 text-xs font-semibold text-muted md:grid ${LINE_GRID}`}>
          <span>Material and target</span>
          <span>Actual mass (g)</span>
          <span>Lot number</span>
          <span>Deviation and tolerance</span>
        </div>
        <ol className="flex flex-col" data-testid="batch-lines">
          {batch.lines.map((line, i) => (
            <EntryLine
              key={line.index}
              index={i}
              line={line}
              draft={drafts[i]!}
              problem={entry.problems[i]}
              saving={entry.saving[i] ?? false}
              batch={batch}
              entry={entry}
              keys={keys}
            />
          ))}
        </ol>
      </section>
      <p aria-live="polite" role="status" className="sr-only">
        {entry.announcement}
      </p>

      <CompositionPanel batch={batch} />

      <ClosePanel batchId={batch.id} lineCount={batch.lines.length} counts={counts} state={closing} closeRef={keys.closeRef} />
    </div>
  );
}
