"use client";

import { useCallback, useEffect, useRef, useState, type ReactNode } from "react";
import { Button } from "./button";

/** What a confirmation asks: a title, one sentence on what happens, and the action on the button. */
export interface ConfirmRequest {
  title: string;
  message: string;
  /** The words of the confirming button, e.g. "Remove from the library". */
  confirmLabel: string;
}

interface Pending extends ConfirmRequest {
  resolve: (confirmed: boolean) => void;
}

/**
 * An in-page confirmation for removals: a modal `<dialog>` that names the
 * action on its button. Escape, the Keep button and a click outside it all
 * answer "no"; focus starts on Keep, so Enter never removes by accident.
 * Returns the element to render and `ask`, which resolves to true only when
 * the user confirms.
 *
 * @example
 * ```tsx
 * const [dialog, ask] = useConfirm();
 * if (await ask({ title: "Remove member", message: "…", confirmLabel: "Remove" })) await remove();
 * return <>{dialog}…</>;
 * ```
 */
export function useConfirm(): [ReactNode, (request: ConfirmRequest) => Promise<boolean>] {
  const [pending, setPending] = useState<Pending | null>(null);
  const ref = useRef<HTMLDialogElement>(null);

  const ask = useCallback(
    (request: ConfirmRequest) =>
      new Promise<boolean>((resolve) => {
        setPending({ ...request, resolve });
      }),
    [],
  );

  useEffect(() => {
    const dialog = ref.current;
    if (pending && dialog && !dialog.open) dialog.showModal();
  }, [pending]);

  const answer = (confirmed: boolean) => {
    ref.current?.close();
    pending?.resolve(confirmed);
    setPending(null);
  };

  const element = pending ? (
    <dialog
      ref={ref}
      aria-labelledby="confirm-title"
      aria-describedby="confirm-message"
      data-testid="confirm-dialog"
      className="m-auto w-[min(28rem,calc(100vw-2rem))] rounded border border-rule bg-panel p-0 text-ink shadow-lg backdrop:bg-ink/30"
      onCancel={(e) => {
        e.preventDefault();
        answer(false);
      }}
      onClick={(e) => {
        if (e.target === e.currentTarget) answer(false);
      }}
    >
      <div className="flex flex-col gap-3 p-4">
        <h2 id="confirm-title" className="text-base font-semibold">
          {pending.title}
        </h2>
        <p id="confirm-message" className="text-sm">
          {pending.message}
        </p>
        <div className="flex justify-end gap-2">
          <Button autoFocus onClick={() => answer(false)}>
            Keep
          </Button>
          <Button variant="danger" onClick={() => answer(true)}>
            {pending.confirmLabel}
          </Button>
        </div>
      </div>
    </dialog>
  ) : null;

  return [element, ask];
}
