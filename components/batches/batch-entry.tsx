"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useCallback, useEffect, useRef, useState, type KeyboardEvent } from "react";
import useSWR from "swr";
import { ROLE_WORDS } from "@/components/results/words";
import { Button, buttonClass } from "@/components/ui/button";
import { Field, FieldError, inputClass } from "@/components/ui/field";
import { Panel } from "@/components/ui/panel";
import { ApiRequestError, apiSend, errorMessage, fetcher } from "@/lib/client/fetcher";
import { fmtDateTime, fmtMass, fmtPercent, fmtVolume } from "@/lib/format";
import { deviationWords, liveDeviation, ToleranceBadge } from "./batch-words";
import { CompositionPanel } from "./composition-panel";
import type { BatchDto, BatchLineDto, LineDeviationDto } from "./types";

interface Draft {
  mass: string;
  lot: string;
}

interface LineProblem {
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

function draftOf(line: BatchLineDto): Draft {
  return { mass: line.actualGrams === null ? "" : String(line.actualGrams), lot: line.lotNumber ?? "" };
}

function isDirty(draft: Draft, line: BatchLineDto): boolean {
  const parsed = parseMass(draft.mass);
  if (parsed.error) return true;
  return parsed.value !== line.actualGrams || (draft.lot.trim() || null) !== line.lotNumber;
}

function lineName(line: BatchLineDto): string {
  return line.name ?? line.materialId;
}

interface BatchEntryProps {
  initial: BatchDto;
  /** Initials to record with each line (the user may change them). */
  defaultInitials: string;
}

/**
 * Keyboard-fast weighing entry: actual mass and lot number per line, Enter
 * moves on (mass → lot → next line's mass), every line is saved as it is left,
 * the deviation and the tolerance flag show while typing; then close the record.
 */
export function BatchEntry({ initial, defaultInitials }: BatchEntryProps) {
  const router = useRouter();
  const key = `/api/batches/${initial.id}`;
  const { data, mutate } = useSWR<BatchDto>(key, fetcher, { fallbackData: initial, revalidateOnFocus: false });
  const batch = data ?? initial;
  const res = batch.balanceResolutionGrams;

  const [drafts, setDrafts] = useState<Draft[]>(() => initial.lines.map(draftOf));
  const [problems, setProblems] = useState<Record<number, LineProblem | undefined>>({});
  const [saving, setSaving] = useState<Record<number, boolean>>({});
  const [initials, setInitials] = useState(defaultInitials);
  const [announcement, setAnnouncement] = useState("");
  const [notes, setNotes] = useState(initial.notes ?? "");
  const [notesMessage, setNotesMessage] = useState<string | null>(null);
  const [confirming, setConfirming] = useState(false);
  const [closing, setClosing] = useState(false);
  const [closeMessage, setCloseMessage] = useState<string | null>(null);

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
  const massRefs = useRef<(HTMLInputElement | null)[]>([]);
  const lotRefs = useRef<(HTMLInputElement | null)[]>([]);
  const closeRef = useRef<HTMLButtonElement | null>(null);

  const setProblem = (index: number, problem: LineProblem | undefined) => setProblems((p) => ({ ...p, [index]: problem }));

  /** Saves one line if it changed; saves run one after another so each answer is the newest record. */
  const saveLine = useCallback(
    (index: number): Promise<boolean> => {
      const run = async (): Promise<boolean> => {
        const line = batchRef.current.lines[index];
        const draft = draftsRef.current[index];
        if (!line || !draft) return true;
        const parsed = parseMass(draft.mass);
        if (parsed.error) {
          setProblem(index, { field: "mass", message: `Line ${index + 1}, actual mass: ${parsed.error}` });
          return false;
        }
        const body: { actualGrams?: number | null; lotNumber?: string | null; initials?: string | null } = {};
        if (parsed.value !== line.actualGrams) body.actualGrams = parsed.value;
        const lot = draft.lot.trim() || null;
        if (lot !== line.lotNumber) body.lotNumber = lot;
        if (Object.keys(body).length === 0) return true;
        if (initialsRef.current.trim()) body.initials = initialsRef.current.trim();
        setSaving((s) => ({ ...s, [index]: true }));
        try {
          const next = await apiSend<BatchDto>("PATCH", `/api/batches/${batchRef.current.id}/lines/${index}`, body);
          batchRef.current = next;
          await mutate(next, { revalidate: false });
          setProblem(index, undefined);
          const saved = next.lines[index]!;
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
    [mutate, res],
  );

  function setDraft(index: number, patch: Partial<Draft>) {
    setDrafts((all) => all.map((d, i) => (i === index ? { ...d, ...patch } : d)));
    if (patch.mass !== undefined && problems[index]?.field === "mass") setProblem(index, undefined);
    if (patch.lot !== undefined && problems[index]?.field === "lot") setProblem(index, undefined);
  }

  function focusMass(index: number) {
    const el = massRefs.current[index];
    if (el) {
      el.focus();
      el.select();
    }
  }

  function focusLot(index: number) {
    const el = lotRefs.current[index];
    if (el) {
      el.focus();
      el.select();
    }
  }

  function onMassKey(index: number, e: KeyboardEvent<HTMLInputElement>) {
    if (e.key === "Enter") {
      e.preventDefault();
      const parsed = parseMass(drafts[index]!.mass);
      if (parsed.error) {
        setProblem(index, { field: "mass", message: `Line ${index + 1}, actual mass: ${parsed.error}` });
        return;
      }
      focusLot(index);
    } else if (e.key === "ArrowDown" && index + 1 < drafts.length) {
      e.preventDefault();
      focusMass(index + 1);
    } else if (e.key === "ArrowUp" && index > 0) {
      e.preventDefault();
      focusMass(index - 1);
    } else if (e.key === "Escape") {
      setDraft(index, { mass: draftOf(batch.lines[index]!).mass });
    }
  }

  function onLotKey(index: number, e: KeyboardEvent<HTMLInputElement>) {
    if (e.key === "Enter") {
      e.preventDefault();
      if (index + 1 < drafts.length) focusMass(index + 1);
      else closeRef.current?.focus();
    } else if (e.key === "ArrowDown" && index + 1 < drafts.length) {
      e.preventDefault();
      focusLot(index + 1);
    } else if (e.key === "ArrowUp" && index > 0) {
      e.preventDefault();
      focusLot(index - 1);
    } else if (e.key === "Escape") {
      setDraft(index, { lot: draftOf(batch.lines[index]!).lot });
    }
  }

  function onLineBlur(index: number) {
    const line = batch.lines[index];
    const draft = drafts[index];
    if (line && draft && isDirty(draft, line)) void saveLine(index);
  }

  async function saveNotes() {
    if ((notes.trim() || null) === (batch.notes ?? null)) return;
    setNotesMessage(null);
    try {
      const next = await apiSend<BatchDto>("PATCH", `/api/batches/${batch.id}`, { notes: notes.trim() || null });
      batchRef.current = next;
      await mutate(next, { revalidate: false });
      setNotesMessage("Notes saved.");
    } catch (err) {
      setNotesMessage(`Notes not saved: ${errorMessage(err)} What you typed is kept.`);
    }
  }

  async function close() {
    setClosing(true);
    setCloseMessage(null);
    try {
      // Everything typed is saved first, in order.
      const results = await Promise.all(drafts.map((d, i) => (isDirty(d, batch.lines[i]!) ? saveLine(i) : Promise.resolve(true))));
      const failed = results.findIndex((ok) => !ok);
      if (failed >= 0) {
        setCloseMessage(`Not closed: line ${failed + 1} could not be saved. Correct it and try again.`);
        setConfirming(false);
        focusMass(failed);
        return;
      }
      await saveNotes();
      await apiSend<BatchDto>("POST", `/api/batches/${batch.id}/close`);
      router.push(`/batches/${batch.id}`);
      router.refresh();
    } catch (err) {
      setConfirming(false);
      if (err instanceof ApiRequestError && Object.keys(err.fields).length) {
        let first: { index: number; field: LineProblem["field"] } | null = null;
        const next: Record<number, LineProblem> = {};
        for (const [path, message] of Object.entries(err.fields)) {
          const m = /^lines\.(\d+)\.(actualGrams|lotNumber)$/.exec(path);
          if (!m) continue;
          const index = Number(m[1]);
          const field = m[2] === "lotNumber" ? "lot" : "mass";
          next[index] = { field, message };
          if (!first || index < first.index) first = { index, field };
        }
        setProblems((p) => ({ ...p, ...next }));
        const count = Object.keys(next).length;
        setCloseMessage(`Not closed: ${count} line${count === 1 ? " is" : "s are"} incomplete. ${Object.values(next).map((p) => p.message).join(" ")}`);
        if (first) (first.field === "lot" ? focusLot : focusMass)(first.index);
      } else {
        setCloseMessage(`Not closed: ${errorMessage(err)}`);
      }
    } finally {
      setClosing(false);
    }
  }

  const liveOf = (line: BatchLineDto, draft: Draft): { deviation: LineDeviationDto | null; live: boolean } => {
    const parsed = parseMass(draft.mass);
    if (!parsed.error && parsed.value !== null && parsed.value !== line.actualGrams && line.targetGrams !== undefined) {
      return { deviation: liveDeviation(line.targetGrams, parsed.value, batch.toleranceFraction, res), live: true };
    }
    if (!parsed.error && parsed.value === null && line.actualGrams !== null) return { deviation: null, live: true };
    return { deviation: line.deviation, live: false };
  };

  const outsideNow = batch.lines.filter((l, i) => liveOf(l, drafts[i]!).deviation?.outside).length;
  const missingLot = batch.lines.filter((l, i) => l.role !== "water" && !drafts[i]!.lot.trim()).length;
  const weighedNow = drafts.filter((d) => parseMass(d.mass).value !== null).length;

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end justify-between gap-3 rounded border border-rule bg-panel px-3 py-2">
        <p className="max-w-2xl text-sm text-muted" id="entry-help">
          Type the actual mass and press <kbd className="rounded border border-rule px-1 font-mono text-xs">Enter</kbd> to go to the lot number;{" "}
          <kbd className="rounded border border-rule px-1 font-mono text-xs">Enter</kbd> again goes to the next line. Each line is saved as you
          leave it. <kbd className="rounded border border-rule px-1 font-mono text-xs">↑</kbd>/<kbd className="rounded border border-rule px-1 font-mono text-xs">↓</kbd>{" "}
          move between lines, <kbd className="rounded border border-rule px-1 font-mono text-xs">Esc</kbd> undoes a change not yet saved.
        </p>
        <Field id="batch-initials" label="Your initials" hint="saved with each line" className="w-48">
          <input
            id="batch-initials"
            className={inputClass(false, "font-mono uppercase")}
            value={initials}
            maxLength={10}
            autoComplete="off"
            onChange={(e) => setInitials(e.target.value.toUpperCase())}
          />
        </Field>
      </div>

      <p className="num text-sm" data-testid="entry-summary">
        Tolerance <strong>±{fmtPercent(batch.toleranceFraction, batch.toleranceFraction * 100 < 1 ? 1 : 0)}</strong> of the target mass, never
        tighter than the balance resolution of <strong>{fmtMass(res, res)}</strong> · {weighedNow} of {batch.lines.length} lines weighed ·{" "}
        {outsideNow === 0 ? "no line outside tolerance" : <strong className="text-fail">{outsideNow} outside tolerance</strong>}
      </p>

      <section aria-labelledby="lines-title" className="rounded border border-rule bg-panel">
        <h2 id="lines-title" className="border-b border-rule px-3 py-2 text-sm font-semibold">
          Weighings, in order of addition
        </h2>
        <div
          aria-hidden="true"
          className="hidden gap-x-3 border-b border-rule bg-paper px-3 py-1.5 text-xs font-semibold text-muted md:grid md:grid-cols-[minmax(0,1.7fr)_8.5rem_10rem_minmax(0,1.8fr)]"
        >
          <span>Material and target</span>
          <span>Actual mass (g)</span>
          <span>Lot number</span>
          <span>Deviation and tolerance</span>
        </div>
        <ol className="flex flex-col" data-testid="batch-lines">
          {batch.lines.map((line, i) => {
            const draft = drafts[i]!;
            const problem = problems[i];
            const { deviation, live } = liveOf(line, draft);
            const dirty = isDirty(draft, line);
            const name = lineName(line);
            return (
              <li
                key={line.index}
                data-testid={`batch-line-${i}`}
                className={`grid grid-cols-2 gap-x-3 gap-y-1.5 border-b border-rule/70 px-3 py-2 last:border-0 md:grid-cols-[minmax(0,1.7fr)_8.5rem_10rem_minmax(0,1.8fr)] md:items-start ${
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
                    ref={(el) => {
                      massRefs.current[i] = el;
                    }}
                    type="text"
                    inputMode="decimal"
                    autoComplete="off"
                    enterKeyHint="next"
                    className={inputClass(problem?.field === "mass", "num text-right")}
                    value={draft.mass}
                    placeholder={line.targetGrams !== undefined ? fmtMass(line.targetGrams, res).replace(/\s*g$/, "") : ""}
                    aria-invalid={problem?.field === "mass" ? true : undefined}
                    aria-describedby={`line-${i}-error entry-help`}
                    onChange={(e) => setDraft(i, { mass: e.target.value })}
                    onKeyDown={(e) => onMassKey(i, e)}
                    onBlur={() => onLineBlur(i)}
                  />
                </div>
                <div className="flex flex-col gap-1">
                  <label htmlFor={`lot-${i}`} className="text-[13px] font-medium md:sr-only">
                    Lot number<span className="sr-only">, line {i + 1}: {name}</span>
                  </label>
                  <input
                    id={`lot-${i}`}
                    ref={(el) => {
                      lotRefs.current[i] = el;
                    }}
                    type="text"
                    autoComplete="off"
                    enterKeyHint="next"
                    maxLength={100}
                    className={inputClass(problem?.field === "lot", "font-mono")}
                    value={draft.lot}
                    placeholder={line.role === "water" ? "not needed" : ""}
                    aria-invalid={problem?.field === "lot" ? true : undefined}
                    aria-describedby={`line-${i}-error`}
                    onChange={(e) => setDraft(i, { lot: e.target.value })}
                    onKeyDown={(e) => onLotKey(i, e)}
                    onBlur={() => onLineBlur(i)}
                  />
                </div>
                <div className="col-span-2 flex min-w-0 flex-col gap-0.5 text-sm md:col-span-1" data-testid={`line-status-${i}`}>
                  <span className="flex flex-wrap items-center gap-1.5">
                    <ToleranceBadge deviation={deviation} toleranceFraction={batch.toleranceFraction} resolution={res} />
                    {deviation ? <span className="num whitespace-nowrap">{deviationWords(deviation, res)}</span> : null}
                  </span>
                  <span className="num text-xs text-muted">
                    {saving[i]
                      ? "Saving…"
                      : dirty || live
                        ? "Not saved yet: leave the line or press Enter"
                        : line.at
                          ? `Saved ${fmtDateTime(line.at)}${line.initials ? ` · ${line.initials}` : ""}`
                          : ""}
                  </span>
                </div>
                <div className="col-span-2 md:col-span-4">
                  <FieldError id={`line-${i}-error`} message={problem?.message} />
                </div>
              </li>
            );
          })}
        </ol>
      </section>
      <p aria-live="polite" role="status" className="sr-only">
        {announcement}
      </p>

      <CompositionPanel batch={batch} />

      <Panel title="Close the batch record" id="close">
        <div className="flex flex-col gap-3">
          <Field
            id="batch-notes"
            label="Notes"
            hint="deviations, observations; saved when you leave the field"
            error={notesMessage && notesMessage.startsWith("Notes not saved") ? notesMessage : null}
          >
            <textarea
              id="batch-notes"
              rows={3}
              maxLength={5000}
              className={inputClass()}
              value={notes}
              onChange={(e) => setNotes(e.target.value)}
              onBlur={saveNotes}
              aria-describedby="batch-notes-error"
            />
          </Field>
          {notesMessage && !notesMessage.startsWith("Notes not saved") ? (
            <p role="status" className="text-xs text-clear">
              {notesMessage}
            </p>
          ) : null}
          <ul className="num text-sm">
            <li>
              {weighedNow} of {batch.lines.length} lines have an actual mass.
            </li>
            <li>{missingLot === 0 ? "Every line that needs one has a lot number." : `${missingLot} line${missingLot === 1 ? "" : "s"} without a lot number (water needs none).`}</li>
            <li className={outsideNow > 0 ? "font-medium text-fail" : ""}>
              {outsideNow === 0
                ? "No line is outside tolerance."
                : `${outsideNow} line${outsideNow === 1 ? " is" : "s are"} outside tolerance: say why in the notes before closing.`}
            </li>
          </ul>
          {confirming ? (
            <div role="group" aria-labelledby="confirm-close" className="flex flex-wrap items-center gap-2 rounded border border-caution/50 bg-caution-soft px-3 py-2">
              <p id="confirm-close" className="text-sm font-medium text-ink">
                Closing is final: the record can no longer change.
              </p>
              <Button variant="primary" busy={closing} onClick={close} autoFocus>
                Close it now
              </Button>
              <Button onClick={() => setConfirming(false)} disabled={closing}>
                Keep it open
              </Button>
            </div>
          ) : (
            <div className="flex flex-wrap gap-2">
              <button ref={closeRef} type="button" className={buttonClass("primary")} onClick={() => setConfirming(true)}>
                Close the batch record…
              </button>
              <Link href={`/batches/${batch.id}`} className="inline-flex items-center px-2 text-sm text-accent underline underline-offset-2">
                View the record
              </Link>
            </div>
          )}
          <div aria-live="assertive">
            {closeMessage ? (
              <p role="alert" className="rounded border border-fail/50 bg-fail-soft px-3 py-2 text-sm text-fail">
                {closeMessage}
              </p>
            ) : null}
          </div>
        </div>
      </Panel>
    </div>
  );
}
