"use client";

import { useState } from "react";
import { Button, buttonClass } from "@/components/ui/button";
import { useConfirm } from "@/components/ui/confirm-dialog";
import { ErrorPanel } from "@/components/ui/error-panel";
import { OutcomeMessage, type Outcome } from "@/components/ui/outcome";
import { TableSkeleton } from "@/components/ui/skeleton";
import { plural } from "@/components/ui/plural";
import { TextLink } from "@/components/ui/text-link";
import { explorationExportUrl, explorerUrl } from "@/lib/client/downloads";
import { deleteExploration, useExplorations, type ExplorationSummary } from "@/lib/client/explorations";
import { errorMessage } from "@/lib/client/fetcher";
import { fmtDateTime } from "@/lib/format";
import { candidateValuesWords, constraintWords, figureWords, gridWords, objectiveWords, thermalWords } from "./exploration-words";

interface SavedExplorationsProps {
  formulationId: string;
  /** Only this revision's explorations (the revision page); all of the formulation's without it. */
  revisionId?: string;
  /** May delete (formulation:update). */
  canDelete: boolean;
}

/**
 * The saved design explorations of a formulation or of one revision: what
 * varied, the search's limits and aim, the best candidate's figures, and
 * links to open it in the explorer or download its points.
 */
export function SavedExplorations({ formulationId, revisionId, canDelete }: SavedExplorationsProps) {
  const { data, error, isLoading, mutate } = useExplorations(formulationId, revisionId);
  const [message, setMessage] = useState<Outcome>(null);
  const [confirmDialog, ask] = useConfirm();

  async function remove(e: ExplorationSummary) {
    const confirmed = await ask({
      title: `Delete the exploration “${e.name}”?`,
      message: "The saved grid, limits and candidates are deleted. The revision it explored does not change.",
      confirmLabel: "Delete the exploration",
    });
    if (!confirmed) return;
    setMessage(null);
    try {
      await deleteExploration(e.id);
      setMessage({ tone: "info", text: `The exploration “${e.name}” was deleted.` });
    } catch (err) {
      setMessage({ tone: "error", text: errorMessage(err) });
    }
    await mutate();
  }

  if (error) return <ErrorPanel title="Could not load the saved explorations" message={error.message} onRetry={() => mutate()} />;
  if (isLoading || !data) return <TableSkeleton rows={2} label="Loading saved explorations" />;
  return (
    <div className="flex flex-col gap-2" data-testid="saved-explorations">
      {confirmDialog}
      {data.rows.length === 0 ? (
        <p className="text-sm text-muted">{revisionId ? "No exploration of this revision has been saved." : "No exploration of this formulation has been saved."}</p>
      ) : (
        <ul className="flex flex-col gap-3">
          {data.rows.map((e) => (
            <ExplorationItem key={e.id} exploration={e} showRevision={!revisionId} onDelete={canDelete ? () => remove(e) : undefined} />
          ))}
        </ul>
      )}
      <OutcomeMessage outcome={message} />
    </div>
  );
}

interface ExplorationItemProps {
  exploration: ExplorationSummary;
  showRevision: boolean;
  onDelete?: () => void;
}

function ExplorationItem({ exploration: e, showRevision, onDelete }: ExplorationItemProps) {
  const best = e.candidates?.[0];
  const outputWords = (key: string) => e.outputWords[key] ?? { key, label: key, unit: "" };
  return (
    <li className="rounded border border-rule/70 p-2 text-sm" data-testid="saved-exploration">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 className="font-medium">{e.name}</h3>
        <p className="num text-xs text-muted">
          {e.createdByName ?? "someone"} · {fmtDateTime(e.createdAt)}
          {showRevision ? (
            <>
              {" · "}
              <TextLink href={`/revisions/${e.revisionId}`}>revision {e.revisionNumber}</TextLink>
            </>
          ) : null}
          {" · "}
          {plural(e.pointCount, "point")}
        </p>
      </div>
      <dl className="mt-1 grid gap-x-3 gap-y-0.5 sm:grid-cols-[auto_1fr]">
        <dt className="text-muted">What varied</dt>
        <dd>
          {gridWords(e.grid, e.names).map((line) => (
            <span key={line} className="block">
              {line}
            </span>
          ))}
        </dd>
        <dt className="text-muted">Figures shown</dt>
        <dd>{e.outputs.map((k) => outputWords(k).label).join(", ")}</dd>
        {e.search ? (
          <>
            <dt className="text-muted">Limits</dt>
            <dd>{[...e.search.constraints.map((c) => constraintWords(c, outputWords)), thermalWords(e.search)].join("; ")}</dd>
            <dt className="text-muted">Aim</dt>
            <dd>{objectiveWords(e.search.objective, outputWords)}</dd>
          </>
        ) : null}
        {e.search ? (
          <>
            <dt className="text-muted">Best candidate</dt>
            <dd data-testid="best-candidate">
              {best ? (
                <>
                  point {best.point + 1} ({candidateValuesWords(e.grid, best.values)}), thermal {best.thermalStatus}
                  {Object.entries(best.figures).length > 0 ? ": " : ""}
                  {Object.entries(best.figures)
                    .map(([k, v]) => `${outputWords(k).label} ${figureWords(v, outputWords(k))}`)
                    .join(" · ")}
                </>
              ) : (
                "no point met every limit"
              )}
            </dd>
          </>
        ) : null}
      </dl>
      <div className="no-print mt-2 flex flex-wrap items-center gap-2">
        <a href={explorerUrl(e.formulationId, { explorationId: e.id })} className={buttonClass("secondary", "py-1")}>
          Open in explorer
        </a>
        <a href={explorationExportUrl(e.id, "xlsx")} download className={buttonClass("secondary", "py-1")} title={`Download the points of “${e.name}” as a workbook`}>
          <span aria-hidden="true">↓</span>Download .xlsx
        </a>
        <a href={explorationExportUrl(e.id, "csv")} download className={buttonClass("secondary", "py-1")} title={`Download the points of “${e.name}” as CSV`}>
          <span aria-hidden="true">↓</span>Download .csv
        </a>
        {onDelete ? (
          <Button variant="danger" className="py-1" onClick={onDelete} aria-label={`Delete the exploration ${e.name}`}>
            Delete
          </Button>
        ) : null}
      </div>
    </li>
  );
}
