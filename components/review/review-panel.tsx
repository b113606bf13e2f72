"use client";

import { useRouter } from "next/navigation";
import { useId, useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { FieldError, inputClass } from "@/components/ui/field";
import { ThermalBadge } from "@/components/ui/status";
import { ApiRequestError, errorMessage } from "@/lib/client/fetcher";
import { transitionRevision, type Revision } from "@/lib/client/formulations";
import { useInvalidate } from "@/lib/client/invalidate";
import type { Abilities } from "./abilities";

interface ReviewPanelProps {
  revision: Revision;
  can: Abilities;
  onChanged: () => void;
}

/** Approve or send back a revision that waits for review, with a comment. */
export function ReviewPanel({ revision, can, onChanged }: ReviewPanelProps) {
  const router = useRouter();
  const invalidate = useInvalidate();
  const id = useId();
  const [comment, setComment] = useState("");
  const [fieldError, setFieldError] = useState<string | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState<"approve" | "return" | null>(null);

  if (revision.state !== "in_review") return null;
  const own = revision.authorId === can.userId || (revision.authorIds ?? []).includes(can.userId);
  const thermal = revision.result?.thermal.status;

  if (!can.review) {
    return (
      <Alert tone="info" data-testid="review-not-allowed">
        Waiting for a reviewer. Only reviewers approve or send back revisions{own ? ", and never their own" : ""}.
      </Alert>
    );
  }
  if (own) {
    return (
      <Alert tone="info" data-testid="review-own">
        You wrote or changed this revision; another reviewer must decide on it.
      </Alert>
    );
  }

  async function decide(action: "approve" | "return") {
    setBusy(action);
    setMessage(null);
    setFieldError(null);
    if (action === "return" && !comment.trim()) {
      setFieldError("Say what needs changing: a comment is required to send a revision back.");
      setBusy(null);
      return;
    }
    try {
      await transitionRevision(revision.id, action, comment.trim() || null);
      setComment("");
      onChanged();
      await invalidate("formulations");
      router.refresh();
    } catch (err) {
      if (err instanceof ApiRequestError && err.fields.comment) setFieldError(err.fields.comment);
      else setMessage(errorMessage(err));
    } finally {
      setBusy(null);
    }
  }

  const fails = thermal === "fail";
  return (
    <section aria-labelledby={`${id}-title`} className="rounded border border-accent/40 bg-accent-soft/40 p-3">
      <h2 id={`${id}-title`} className="text-sm font-semibold">
        Your review
      </h2>
      <p className="mt-1 flex flex-wrap items-center gap-2 text-sm">
        Thermal check: {thermal ? <ThermalBadge status={thermal} /> : <span>not computed</span>}
        {thermal === "caution" ? <span className="text-muted">Approving needs a comment saying why the schedule is acceptable.</span> : null}
      </p>
      <label htmlFor={`${id}-comment`} className="mt-2 block text-[13px] font-medium">
        Comment <span className="font-normal text-muted">(required to send back, and to approve with a thermal caution)</span>
      </label>
      <textarea
        id={`${id}-comment`}
        rows={3}
        value={comment}
        onChange={(e) => setComment(e.target.value)}
        className={inputClass(!!fieldError)}
        aria-invalid={fieldError ? true : undefined}
        aria-describedby={`${id}-comment-error`}
      />
      <FieldError id={`${id}-comment-error`} message={fieldError} />
      <div className="mt-2 flex flex-wrap items-center gap-2">
        <Button variant="primary" onClick={() => decide("approve")} busy={busy === "approve"} disabled={fails} aria-describedby={fails ? `${id}-blocked` : undefined}>
          Approve
        </Button>
        <Button onClick={() => decide("return")} busy={busy === "return"}>
          Send back with comment
        </Button>
        {fails ? (
          <span id={`${id}-blocked`} className="text-sm text-fail">
            Cannot be approved: a process step exceeds a material&apos;s temperature limit.
          </span>
        ) : null}
      </div>
      <p aria-live="assertive" role={message ? "alert" : undefined} className="mt-1 text-sm text-fail">
        {message}
      </p>
    </section>
  );
}
