"use client";

import { TextLink } from "@/components/ui/text-link";
import { DownloadLinks, revisionDownloads } from "@/components/exports/download-links";
import { ResultsView } from "@/components/results/results-view";
import { ErrorPanel } from "@/components/ui/error-panel";
import { Panel } from "@/components/ui/panel";
import { StateBadge, ThermalBadge } from "@/components/ui/status";
import { Alert } from "@/components/ui/alert";
import { useRevision, type Revision } from "@/lib/client/formulations";
import { fmtDateTime } from "@/lib/format";
import { SpecificationsPanel } from "@/components/quality/specifications-panel";
import { SavedExplorations } from "@/components/explore/saved-explorations";
import { explorerUrl } from "@/lib/client/downloads";
import { DiffPanel } from "./diff-panel";
import { InputSummary } from "./input-summary";
import { RevisionActions } from "./revision-actions";
import { ReviewPanel } from "./review-panel";
import type { Abilities } from "./abilities";

interface RevisionViewProps {
  initial: Revision;
  can: Abilities;
}

/** One revision: state, actions, review, changes since the previous revision, and every result. */
export function RevisionView({ initial, can }: RevisionViewProps) {
  const { data, error, mutate } = useRevision(initial.id, initial);
  const rev = data ?? initial;
  const fails = rev.result?.thermal.status === "fail";
  const thermalNotice = rev.result?.notices.find((n) => n.code === "thermal_limit_exceeded");

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div className="min-w-0">
          <p className="text-sm text-muted">
            <TextLink href={`/formulations/${rev.formulationId}`}>
              {rev.formulationName}
            </TextLink>{" "}
            · {rev.project ?? "No project"}
          </p>
          <h1 className="flex flex-wrap items-center gap-2 text-xl font-semibold">
            Revision {rev.number} <StateBadge state={rev.state} />
            {rev.result ? <ThermalBadge status={rev.result.thermal.status} detail=" (thermal)" /> : null}
          </h1>
          <p className="num text-xs text-muted">
            by {rev.authorName ?? "unknown"} · created {fmtDateTime(rev.createdAt)} · last change {fmtDateTime(rev.updatedAt)} · engine {rev.engineVersion}
          </p>
        </div>
        <RevisionActions revision={rev} can={can} onChanged={() => mutate()} />
      </div>
      <div className="flex flex-wrap items-center gap-2">
        <DownloadLinks links={revisionDownloads(rev.id)} />
        {can.readUnreleased ? (
          <a href={explorerUrl(rev.formulationId, { revisionId: rev.id })} className="no-print rounded border border-rule bg-panel px-3 py-1 text-sm font-medium" data-testid="explore-link">
            Explore
          </a>
        ) : null}
      </div>
      {error ? <ErrorPanel title="Could not refresh this revision" message={error.message} onRetry={() => mutate()} /> : null}
      {fails ? (
        <Alert tone="fail" title="Thermal check fails: this revision cannot be approved." data-testid="thermal-block">
          <p>{thermalNotice?.message ?? "A process step reaches a material's hard temperature limit."}</p>
          {rev.result?.thermal.maxAllowedC !== undefined ? (
            <p className="mt-0.5">Bring every step below {rev.result.thermal.maxAllowedC} °C, or choose materials that tolerate the schedule.</p>
          ) : null}
        </Alert>
      ) : null}
      <ReviewPanel revision={rev} can={can} onChanged={() => mutate()} />
      {rev.reviews.length > 0 ? (
        <Panel title="Review comments" id="reviews">
          <ul className="flex flex-col gap-2">
            {rev.reviews.map((r) => (
              <li key={r.id} className="text-sm">
                <span className="font-medium">{r.reviewerName ?? "A reviewer"}</span>{" "}
                {r.decision === "approved" ? "approved" : "sent it back"} · <span className="num text-xs text-muted">{fmtDateTime(r.createdAt)}</span>
                {r.comment ? <p className="mt-0.5 rounded bg-paper px-2 py-1">{r.comment}</p> : null}
              </li>
            ))}
          </ul>
        </Panel>
      ) : null}
      <SpecificationsPanel revisionId={rev.id} editable={rev.state === "draft" && can.update} result={rev.result ?? null} onSaved={() => mutate()} />
      {can.readUnreleased ? (
        <Panel title="Saved explorations of this revision" id="explorations">
          <SavedExplorations formulationId={rev.formulationId} revisionId={rev.id} canDelete={can.update} />
        </Panel>
      ) : null}
      <Panel title="Choices as entered" id="inputs">
        <InputSummary input={rev.input} />
      </Panel>
      {rev.number > 1 && can.readUnreleased ? (
        <Panel title={`Changes since revision ${rev.number - 1}`} id="diff">
          <DiffPanel formulationId={rev.formulationId} from={rev.number - 1} to={rev.number} />
        </Panel>
      ) : null}
      {rev.result ? (
        <ResultsView input={rev.input} result={rev.result} thermalFirst={rev.state === "in_review"} />
      ) : (
        <ErrorPanel title="The recipe cannot be computed" message={rev.computeError ?? "No result stored."} />
      )}
    </div>
  );
}
