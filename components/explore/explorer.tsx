"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useCallback, useMemo, useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Panel } from "@/components/ui/panel";
import { outputCatalogue } from "@/lib/explore/outputs";
import type { ExplorationBody } from "@/lib/explore/spec";
import type { OutputInfo } from "@/lib/explore/types";
import type { FormulationInput } from "@/lib/formulation";
import { Candidates } from "./candidates";
import { ResultsView } from "./results-view";
import { RunProgress } from "./run-progress";
import { SavePanel } from "./save-panel";
import type { SavedSetup } from "./saved-setup";
import { SearchFieldset } from "./search-fieldset";
import { initialSetup } from "./setup-choices";
import { SetupContext, type SetupContextValue } from "./setup-context";
import { SetupForm } from "./setup-form";
import { checkSetup, setupSchema, type SetupValues } from "./setup-values";
import { useExplorationWorker } from "./use-exploration-worker";

export interface ExplorerProps {
  formulationId: string;
  revision: { id: string; number: number; input: FormulationInput };
  /** A saved exploration of this revision to start from. */
  saved: Pick<SavedSetup, "id" | "name" | "grid" | "outputs" | "search"> | null;
  /** formulation:update: may save explorations and open candidates as drafts. */
  canUpdate: boolean;
}

/**
 * The design explorer of one revision: what varies, the figures to show and
 * an optional target search; Run computes the grid in a Web Worker with
 * progress and cancel, then shows the plots, the candidates and Save.
 */
export function Explorer({ formulationId, revision, saved, canUpdate }: ExplorerProps) {
  const base = revision.input;
  const catalogue = useMemo(() => outputCatalogue(base), [base]);
  const schema = useMemo(() => setupSchema(base, catalogue), [base, catalogue]);
  const form = useForm<SetupValues>({ resolver: zodResolver(schema), defaultValues: initialSetup(base, catalogue, saved), mode: "onChange" });
  const values = useWatch({ control: form.control }) as SetupValues;
  const check = useMemo(() => checkSetup(values, base, catalogue), [values, base, catalogue]);
  const messageFor = useCallback((path: string) => check.issues.find((i) => i.path === path)?.message, [check]);
  const ctx: SetupContextValue = useMemo(() => ({ form, base, catalogue, messageFor }), [form, base, catalogue, messageFor]);
  const worker = useExplorationWorker();
  const [shown, setShown] = useState<string[]>([]);
  const [savedId, setSavedId] = useState<string | null>(saved?.id ?? null);

  const onRun = form.handleSubmit((v) => {
    const now = checkSetup(v, base, catalogue);
    if (!now.grid || !now.plan) return;
    setShown(v.outputs);
    setSavedId(null);
    worker.start({ base, grid: now.grid, plan: now.plan, outputs: v.outputs, search: now.search });
  });

  const infoOf = (key: string): OutputInfo => catalogue.find((o) => o.key === key) ?? { key, label: key, unit: "" };
  const run = worker.run;
  const shownInfos = shown.map(infoOf);
  const body: Omit<ExplorationBody, "name"> | null =
    run && worker.grid
      ? { revisionId: revision.id, grid: worker.grid, outputs: shown, search: worker.search ?? undefined, pointCount: run.plan.count, candidates: run.candidates }
      : null;

  return (
    <SetupContext.Provider value={ctx}>
      <div className="flex flex-col gap-4">
        <Panel title="Set up the exploration" id="explore-setup">
          <form
            noValidate
            onSubmit={(e) => {
              e.preventDefault();
              void onRun(e);
            }}
            className="flex flex-col gap-4"
          >
            <SetupForm plan={check.plan} />
            <SearchFieldset />
            <div className="flex flex-wrap items-center gap-3">
              <Button type="submit" variant="primary" busy={worker.phase === "running"}>
                Run
              </Button>
              <span className="text-[13px] text-muted">Computed in your browser; the revision does not change.</span>
            </div>
            <RunProgress phase={worker.phase} done={worker.done} total={worker.total} message={worker.message} ms={worker.ms} onCancel={worker.cancel} />
          </form>
        </Panel>
        {run ? (
          <Panel title="Results" id="explore-results">
            <ResultsView key={`${run.plan.count}:${shown.join()}:${worker.ms ?? 0}`} run={run} outputs={shownInfos} base={base} />
          </Panel>
        ) : null}
        {run?.candidates ? (
          <Panel title="Candidates" id="explore-candidates">
            <Candidates
              formulationId={formulationId}
              base={base}
              run={run}
              candidates={run.candidates}
              outputs={run.outputs.map(infoOf)}
              explorationId={savedId ?? undefined}
              canUpdate={canUpdate}
            />
          </Panel>
        ) : null}
        {canUpdate ? (
          <Panel title="Save" id="explore-save">
            <SavePanel
              formulationId={formulationId}
              body={body}
              defaultName={saved?.name ?? `Exploration of revision ${revision.number}`}
              onSaved={setSavedId}
              savedId={savedId}
            />
          </Panel>
        ) : null}
      </div>
    </SetupContext.Provider>
  );
}
