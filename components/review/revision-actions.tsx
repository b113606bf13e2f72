"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button, ButtonLink } from "@/components/ui/button";
import { errorMessage } from "@/lib/client/fetcher";
import { startRevision, transitionRevision, type Revision } from "@/lib/client/formulations";
import { useInvalidate } from "@/lib/client/invalidate";
import type { Abilities } from "./abilities";

interface RevisionActionsProps {
  revision: Revision;
  can: Abilities;
  onChanged: () => void;
}

/** The buttons a revision's state and the viewer's role allow (the server checks again). */
export function RevisionActions({ revision, can, onChanged }: RevisionActionsProps) {
  const router = useRouter();
  const invalidate = useInvalidate();
  const [busy, setBusy] = useState<string | null>(null);
  const [message, setMessage] = useState<string | null>(null);

  async function act(action: "submit" | "release" | "archive") {
    setBusy(action);
    setMessage(null);
    try {
      await transitionRevision(revision.id, action);
      onChanged();
      await invalidate("formulations");
      router.refresh();
    } catch (err) {
      setMessage(errorMessage(err));
    } finally {
      setBusy(null);
    }
  }

  async function newRevision() {
    setBusy("new");
    setMessage(null);
    try {
      const created = await startRevision(revision.formulationId);
      await invalidate("formulations");
      router.push(`/revisions/${created.revisionId}/edit`);
    } catch (err) {
      setMessage(errorMessage(err));
      setBusy(null);
    }
  }

  const s = revision.state;
  return (
    <div className="flex flex-col items-end gap-1">
      <div className="flex flex-wrap justify-end gap-2">
        {s === "draft" && can.update ? (
          <ButtonLink href={`/revisions/${revision.id}/edit`} variant={can.submit ? "secondary" : "primary"}>
            Edit draft
          </ButtonLink>
        ) : null}
        {s === "draft" && can.submit ? (
          <Button variant="primary" onClick={() => act("submit")} busy={busy === "submit"}>
            Submit for review
          </Button>
        ) : null}
        {s === "approved" && can.release ? (
          <Button variant="primary" onClick={() => act("release")} busy={busy === "release"}>
            Release to production
          </Button>
        ) : null}
        {s === "released" ? (
          <ButtonLink href={`/revisions/${revision.id}/batch-sheet`} variant="primary">
            Batch sheet
          </ButtonLink>
        ) : null}
        {(s === "approved" || s === "released" || s === "archived") && can.update ? (
          <Button onClick={newRevision} busy={busy === "new"}>
            Start a new revision
          </Button>
        ) : null}
        {(s === "draft" || s === "approved" || s === "released") && can.archive ? (
          <Button variant="danger" onClick={() => act("archive")} busy={busy === "archive"}>
            Archive
          </Button>
        ) : null}
      </div>
      <p aria-live="assertive" role={message ? "alert" : undefined} className="max-w-md text-right text-sm text-fail">
        {message}
      </p>
    </div>
  );
}
