"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { useSWRConfig } from "swr";
import { Button, ButtonLink } from "@/components/ui/button";
import { apiSend, errorMessage } from "@/lib/client/fetcher";
import type { Abilities, RevisionDto } from "./types";

interface RevisionActionsProps {
  revision: RevisionDto;
  can: Abilities;
  onChanged: () => void;
}

/** The buttons a revision's state and the viewer's role allow (the server checks again). */
export function RevisionActions({ revision, can, onChanged }: RevisionActionsProps) {
  const router = useRouter();
  const { mutate } = useSWRConfig();
  const [busy, setBusy] = useState<string | null>(null);
  const [message, setMessage] = useState<string | null>(null);

  async function act(action: "submit" | "release" | "archive") {
    setBusy(action);
    setMessage(null);
    try {
      await apiSend("POST", `/api/revisions/${revision.id}/${action}`, {});
      onChanged();
      await mutate((key) => typeof key === "string" && key.startsWith("/api/formulations"));
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
      const created = await apiSend<{ revisionId: string }>("POST", `/api/formulations/${revision.formulationId}/revisions`);
      await mutate((key) => typeof key === "string" && key.startsWith("/api/formulations"));
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
