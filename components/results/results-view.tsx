"use client";

import { ThermalPanel } from "@/components/thermal/thermal-panel";
import { SafetyNote } from "@/components/ui/hazards";
import { Panel } from "@/components/ui/panel";
import type { FormulationInput, FormulationResult } from "@/lib/formulation";
import { useBalanceResolution } from "./balance";
import { useTeamCurrency } from "@/lib/client/team-settings";
import { BalanceSelect } from "./balance-select";
import { CoatPanel } from "./coat-panel";
import { CompositePanel } from "./composite-panel";
import { LigandsPanel } from "./ligands-panel";
import { NoticesList } from "./notices-list";
import { RecipeTable } from "./recipe-table";
import { SolPanel } from "./sol-panel";
import { WaterPanel } from "./water-panel";

interface ResultsViewProps {
  input: FormulationInput;
  result: FormulationResult;
  /** Put the thermal view first (review). */
  thermalFirst?: boolean;
}

/** Every figure of a computed formulation: recipe, water, sol, composite, thermal, notices. */
export function ResultsView({ input, result, thermalFirst = false }: ResultsViewProps) {
  const [resolution, setResolution] = useBalanceResolution();
  const currency = useTeamCurrency();
  const dispensed = new Set(result.lines.map((l) => l.materialId));
  const hazardous = input.materials.filter((m) => dispensed.has(m.id));
  const thermal = (
    <Panel title="Thermal compatibility" id="thermal">
      <ThermalPanel input={input} result={result} />
    </Panel>
  );
  return (
    <div className="flex flex-col gap-4">
      {thermalFirst ? thermal : null}
      <Panel title="Notices" id="notices">
        <NoticesList notices={result.notices} />
      </Panel>
      <Panel title="Dispensing recipe" id="recipe" aside={<BalanceSelect value={resolution} onChange={setResolution} />}>
        <RecipeTable input={input} result={result} resolution={resolution} />
        <SafetyNote items={hazardous} className="mt-3" />
      </Panel>
      <Panel title="Water and alcohol" id="water">
        <WaterPanel input={input} result={result} resolution={resolution} />
      </Panel>
      {result.modifiers?.length || result.solvent ? (
        <Panel title={result.modifiers?.length ? "Modifiers and solvent" : "Solvent"} id="ligands">
          <LigandsPanel input={input} result={result} resolution={resolution} />
        </Panel>
      ) : null}
      <div className="grid gap-4 2xl:grid-cols-[minmax(0,1fr)_minmax(0,2fr)]">
        <Panel title="Sol" id="sol">
          <SolPanel result={result} resolution={resolution} />
        </Panel>
        <Panel title="Dry composite" id="composite">
          <CompositePanel input={input} result={result} resolution={resolution} />
        </Panel>
      </div>
      <Panel title="What the coat will be" id="coat">
        <CoatPanel input={input} result={result} currency={currency} />
      </Panel>
      {thermalFirst ? null : thermal}
    </div>
  );
}
