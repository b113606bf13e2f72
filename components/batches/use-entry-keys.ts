"use client";

import { useRef, type KeyboardEvent } from "react";
import type { BatchEntryState } from "./use-batch-entry";
import { massProblem } from "./line-draft";

type Field = "mass" | "lot";

/**
 * Keyboard movement through the entry: Enter goes mass → lot → next line's
 * mass (and from the last lot to the close button), ↑/↓ move within a
 * column, Esc undoes a change not yet saved. A mass that cannot be read
 * keeps the focus and names the problem.
 */
export function useEntryKeys(entry: Pick<BatchEntryState, "drafts" | "setProblem" | "undoField">) {
  const inputs = useRef<Record<Field, (HTMLInputElement | null)[]>>({ mass: [], lot: [] });
  const closeRef = useRef<HTMLButtonElement | null>(null);
  const count = entry.drafts.length;

  function focus(field: Field, index: number) {
    const el = inputs.current[field][index];
    if (el) {
      el.focus();
      el.select();
    }
  }

  /** The ref callback of a line's field. */
  function inputRef(field: Field, index: number) {
    return (el: HTMLInputElement | null) => {
      inputs.current[field][index] = el;
    };
  }

  function onEnter(field: Field, index: number) {
    if (field === "lot") {
      if (index + 1 < count) focus("mass", index + 1);
      else closeRef.current?.focus();
      return;
    }
    const problem = massProblem(index, entry.drafts[index]!.mass);
    if (problem) entry.setProblem(index, problem);
    else focus("lot", index);
  }

  /** The keydown handler of a line's field. */
  function onKey(field: Field, index: number, e: KeyboardEvent<HTMLInputElement>) {
    if (e.key === "Enter") {
      e.preventDefault();
      onEnter(field, index);
    } else if (e.key === "ArrowDown" && index + 1 < count) {
      e.preventDefault();
      focus(field, index + 1);
    } else if (e.key === "ArrowUp" && index > 0) {
      e.preventDefault();
      focus(field, index - 1);
    } else if (e.key === "Escape") {
      entry.undoField(index, field);
    }
  }

  return { focus, inputRef, onKey, closeRef };
}

/** Everything the entry's parts read from useEntryKeys. */
export type EntryKeys = ReturnType<typeof useEntryKeys>;
