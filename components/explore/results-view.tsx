"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import type { ExplorationRun, OutputInfo } from "@/lib/explore/types";
import type { FormulationInput } from "@/lib/formulation";
import { ColourMap, LinePlot, PointsTable, TernaryMap } from "./plots";
import { statusSummary } from "./plots/display";

interface ResultsViewProps {
  run: ExplorationRun;
  /** The figures chosen to show, in order. */
  outputs: OutputInfo[];
  base: FormulationInput;
}

/** The substrate's refractive index, the reference line of the coat's index. */
function indexReference(base: FormulationInput): { value: number; label: string } | undefined {
  const substrate = base.materials.find((m) => m.id === base.substrateId);
  if (!substrate?.refractiveIndex) return undefined;
  return { value: substrate.refractiveIndex, label: `${substrate.name}, the substrate` };
}

/**
 * A run's figures: a line plot for one variable (the coat's index against the substrate's), a map of a chosen figure for
 * two variables or three components, or the same points as a table.
 */
export function ResultsView({ run, outputs, base }: ResultsViewProps) {
  const [asTable, setAsTable] = useState(false);
  const [mapKey, setMapKey] = useState(outputs[0]?.key ?? "");
  const mapOutput = outputs.find((o) => o.key === mapKey) ?? outputs[0];
  const isLine = !run.plan.ternary && run.plan.axes.length === 1;
  // The line plot draws the reference in its first figure's panel: the coat's index first when shown.
  const lineOrder = [...outputs].sort((a, b) => Number(b.key === "refractiveIndex") - Number(a.key === "refractiveIndex"));
  return (
    <div className="flex flex-col gap-3" data-testid="results">
      <div className="flex flex-wrap items-center gap-3">
        <Button onClick={() => setAsTable((v) => !v)} aria-pressed={asTable}>
          {asTable ? "Show as plot" : "Show as table"}
        </Button>
        {!isLine && !asTable && outputs.length > 1 ? (
          <label className="flex items-center gap-2 text-sm">
            Figure on the map
            <select id="x-map-figure" className={inputClass(false, "w-72")} value={mapOutput?.key} onChange={(e) => setMapKey(e.target.value)}>
              {outputs.map((o) => (
                <option key={o.key} value={o.key}>
                  {o.unit ? `${o.label} (${o.unit})` : o.label}
                </option>
              ))}
            </select>
          </label>
        ) : null}
        <span className="text-[13px] text-muted">{statusSummary(run)}</span>
      </div>
      {asTable ? (
        <PointsTable run={run} outputs={outputs} />
      ) : isLine ? (
        <LinePlot run={run} outputs={lineOrder} reference={lineOrder[0]?.key === "refractiveIndex" ? indexReference(base) : undefined} />
      ) : !mapOutput ? null : run.plan.ternary ? (
        <TernaryMap run={run} output={mapOutput} />
      ) : (
        <ColourMap run={run} output={mapOutput} />
      )}
      <p className="text-[13px] text-muted">
        Figures from the fast numeric path (plain floating point, the same equations as the full engine). Recipes, batch sheets and drafts opened from
        here are always computed by the full engine.
      </p>
    </div>
  );
}
