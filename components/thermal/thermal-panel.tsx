import type { FormulationInput, FormulationResult } from "@/lib/formulation";
import { ScheduleChart } from "./schedule-chart";
import { ThermalMatrix } from "./thermal-matrix";

interface ThermalPanelProps {
  input: FormulationInput;
  result: FormulationResult;
}

/** The thermal compatibility view: matrix, then the schedule with the limits. */
export function ThermalPanel({ input, result }: ThermalPanelProps) {
  return (
    <div className="flex flex-col gap-4">
      <ThermalMatrix input={input} result={result} />
      <ScheduleChart input={input} result={result} />
    </div>
  );
}
