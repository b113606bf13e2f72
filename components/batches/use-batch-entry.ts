"use client";

import { useCallback, useEffect, useRef, useState } from "react";
import { recordLine, useBatch, type Batch } from "@/lib/client/batches";
import { ApiRequestError, errorMessage } from "@/lib/client/fetcher";
import { fmtMass } from "@/lib/format";
import { deviationWords } from "./batch-deviation";
import { draftOf, isDirty, lineChanges, type Draft, type LineProblem } from "./line-draft";

/**
 * The state of the weighing entry: the record as last saved, what is typed
 * per line, each line's problem and saving flag, the initials, and the save
 * queue. Saves run one after another, so the record each answers with is the
 * newest; what the user typed is never thrown away on a failed save.
 */
export function useBatchEntry(initial: Batch, defaultInitials: string) {
  const { data, mutate } = useBatch(initial.id, { initial, revalidateOnFocus: false });
  const batch = data ?? initial;
  const [drafts, setDrafts] = useState<Draft[]>(() => initial.lines.map(draftOf));
  const [problems, setProblems] = useState<Record<number, LineProblem | undefined>>({});
  const [saving, setSaving] = useState<Record<number, boolean>>({});
  const [initials, setInitials] = useState(defaultInitials);
  const [announcement, setAnnouncement] = useState("");

  // Latest values for the save queue, which runs after renders.
  const batchRef = useRef(batch);
  const draftsRef = useRef(drafts);
  const initialsRef = useRef(initials);
  useEffect(() => {
    batchRef.current = batch;
    draftsRef.current = drafts;
    initialsRef.current = initials;
  });
  const queue = useRef<Promise<unknown>>(Promise.resolve());

  const setProblem = useCallback((index: number, problem: LineProblem | undefined) => setProblems((p) => ({ ...p, [index]: problem })), []);
  const addProblems = useCallback((more: Record<number, LineProblem>) => setProblems((p) => ({ ...p, ...more })), []);

  /** Keeps a record the server answered with as the one shown. */
  const keep = useCallback(
    async (next: Batch) => {
      batchRef.current = next;
      await mutate(next, { revalidate: false });
    },
    [mutate],
  );

  /** Saves one line if it changed; resolves false (with the line's problem set) when it could not be saved. */
  const saveLine = useCallback(
    (index: number): Promise<boolean> => {
      const run = async (): Promise<boolean> => {
        const line = batchRef.current.lines[index];
        const draft = draftsRef.current[index];
        if (!line || !draft) return true;
        const { body, problem } = lineChanges(index, draft, line);
        if (problem) {
          setProblem(index, problem);
          return false;
        }
        if (!body) return true;
        const who = initialsRef.current.trim();
        setSaving((s) => ({ ...s, [index]: true }));
        try {
          const next = await recordLine(batchRef.current.id, index, who ? { ...body, initials: who } : body);
          await keep(next);
          setProblem(index, undefined);
          const saved = next.lines[index]!;
          const res = next.balanceResolutionGrams;
          const words = saved.deviation
            ? `${saved.deviation.outside ? "outside" : "within"} tolerance, ${deviationWords(saved.deviation, res)}`
            : "no mass yet";
          setAnnouncement(`Line ${index + 1} saved: ${fmtMass(saved.actualGrams, res)}, ${words}.`);
          return true;
        } catch (err) {
          const fields = err instanceof ApiRequestError ? err.fields : {};
          const field: LineProblem["field"] = fields.lotNumber && !fields.actualGrams ? "lot" : "mass";
          const detail = fields.actualGrams ?? fields.lotNumber ?? fields.initials ?? errorMessage(err);
          setProblem(index, { field, message: `Line ${index + 1} not saved: ${detail} What you typed is kept.` });
          return false;
        } finally {
          setSaving((s) => ({ ...s, [index]: false }));
        }
      };
      const p = queue.current.then(run, run);
      queue.current = p;
      return p;
    },
    [keep, setProblem],
  );

  /** Changes what is typed in a line; a problem with the changed field is cleared. */
  function setDraft(index: number, patch: Partial<Draft>) {
    setDrafts((all) => all.map((d, i) => (i === index ? { ...d, ...patch } : d)));
    const problem = problems[index];
    if ((patch.mass !== undefined && problem?.field === "mass") || (patch.lot !== undefined && problem?.field === "lot")) setProblem(index, undefined);
  }

  /** Puts a field back as it was last saved (Esc). */
  function undoField(index: number, field: keyof Draft) {
    const line = batch.lines[index];
    if (line) setDraft(index, { [field]: draftOf(line)[field] });
  }

  /** Saves a line as it is left, when it changed. */
  function saveIfChanged(index: number) {
    const line = batch.lines[index];
    const draft = drafts[index];
    if (line && draft && isDirty(draft, line)) void saveLine(index);
  }

  /** Saves every changed line, in order; the index of the first that failed, or -1. */
  async function saveAll(): Promise<number> {
    const results = await Promise.all(drafts.map((d, i) => (isDirty(d, batch.lines[i]!) ? saveLine(i) : Promise.resolve(true))));
    return results.findIndex((ok) => !ok);
  }

  return { batch, drafts, problems, saving, initials, setInitials, announcement, setDraft, undoField, saveIfChanged, saveAll, setProblem, addProblems, keep };
}

/** Everything the entry's parts read from useBatchEntry. */
export type BatchEntryState = ReturnType<typeof useBatchEntry>;
