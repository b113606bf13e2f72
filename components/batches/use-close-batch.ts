"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { plural } from "@/components/ui/plural";
import { closeBatch, saveBatchNotes } from "@/lib/client/batches";
import { ApiRequestError, errorMessage } from "@/lib/client/fetcher";
import { useInvalidate } from "@/lib/client/invalidate";
import { closeProblems } from "./line-draft";
import type { BatchEntryState } from "./use-batch-entry";
import type { EntryKeys } from "./use-entry-keys";

/** The outcome of the last notes save: saved, or why not. */
export interface NotesStatus {
  saved: boolean;
  text: string;
}

/**
 * The notes and the closing of a record: notes are saved as the field is
 * left; closing saves every typed line and the notes first, asks once more,
 * and on a refusal marks each incomplete line and moves to the first.
 */
export function useCloseBatch(entry: Pick<BatchEntryState, "batch" | "saveAll" | "addProblems" | "keep">, keys: Pick<EntryKeys, "focus">) {
  const router = useRouter();
  const invalidate = useInvalidate();
  const { batch } = entry;
  const [notes, setNotes] = useState(batch.notes ?? "");
  const [notesStatus, setNotesStatus] = useState<NotesStatus | null>(null);
  const [confirming, setConfirming] = useState(false);
  const [closing, setClosing] = useState(false);
  const [closeMessage, setCloseMessage] = useState<string | null>(null);

  async function saveNotes() {
    if ((notes.trim() || null) === (batch.notes ?? null)) return;
    setNotesStatus(null);
    try {
      await entry.keep(await saveBatchNotes(batch.id, notes.trim() || null));
      setNotesStatus({ saved: true, text: "Notes saved." });
    } catch (err) {
      setNotesStatus({ saved: false, text: `Notes not saved: ${errorMessage(err)} What you typed is kept.` });
    }
  }

  function refused(err: unknown) {
    const problems = err instanceof ApiRequestError ? closeProblems(err.fields) : {};
    const indexes = Object.keys(problems).map(Number);
    if (indexes.length === 0) {
      setCloseMessage(`Not closed: ${errorMessage(err)}`);
      return;
    }
    entry.addProblems(problems);
    const words = Object.values(problems).map((p) => p.message);
    setCloseMessage(`Not closed: ${plural(indexes.length, "line is", "lines are")} incomplete. ${words.join(" ")}`);
    const first = Math.min(...indexes);
    keys.focus(problems[first]!.field, first);
  }

  async function close() {
    setClosing(true);
    setCloseMessage(null);
    try {
      // Everything typed is saved first, in order.
      const failed = await entry.saveAll();
      if (failed >= 0) {
        setCloseMessage(`Not closed: line ${failed + 1} could not be saved. Correct it and try again.`);
        setConfirming(false);
        keys.focus("mass", failed);
        return;
      }
      await saveNotes();
      await entry.keep(await closeBatch(batch.id));
      void invalidate("batches");
      router.push(`/batches/${batch.id}`);
      router.refresh();
    } catch (err) {
      setConfirming(false);
      refused(err);
    } finally {
      setClosing(false);
    }
  }

  return { notes, setNotes, notesStatus, saveNotes, confirming, setConfirming, closing, closeMessage, close };
}

/** Everything the close panel reads from useCloseBatch. */
export type CloseBatchState = ReturnType<typeof useCloseBatch>;
