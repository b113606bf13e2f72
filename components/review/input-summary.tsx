import { ATMOSPHERE_LABELS, STAGE_LABELS } from "@/components/results/words";
import { FigureRows } from "@/components/results/table";
import type { FormulationInput } from "@/lib/formulation";
import { fmtHours, fmtRatio, fmtTemp } from "@/lib/format";

interface InputSummaryProps {
  input: FormulationInput;
}

/** What the author chose that the recipe does not show by itself: modifiers, the water convention, each step's stage and atmosphere. */
export function InputSummary({ input }: InputSummaryProps) {
  const names = new Map(input.materials.map((m) => [m.id, m.name]));
  const name = (id: string | undefined) => (id ? (names.get(id) ?? id) : "—");
  const w = input.water;
  const convention =
    w.ratio === "R"
      ? `R = ${fmtRatio(w.value)} mol H₂O per mol network-forming atom`
      : w.ratio === "h"
        ? `h = ${fmtRatio(w.value)} mol H₂O per mol alkoxy group`
        : `${fmtRatio(w.value)} mol H₂O per mol ${name(w.referenceId)}`;
  return (
    <div className="grid gap-4 md:grid-cols-2" data-testid="input-summary">
      <FigureRows
        caption="Water and modifiers as entered"
        rows={[
          { label: "Water ratio", value: <span data-testid="summary-water">{convention}</span> },
          { label: "Water carried by other materials", value: w.countCarried === false ? "not counted (whole ratio added)" : "counted toward the ratio" },
          ...(input.modifiers ?? []).map((m, i) => ({
            label: `Modifier ${i + 1}`,
            value: <span data-testid={`summary-modifier-${i}`}>{`${name(m.materialId)} on ${name(m.precursorId)}, ${fmtRatio(m.molPerMetal)} mol/mol metal`}</span>,
          })),
          ...((input.modifiers ?? []).length === 0 ? [{ label: "Modifiers", value: "none" }] : []),
        ]}
      />
      <FigureRows
        caption="Process steps as entered"
        rows={input.steps.map((s, i) => ({
          label: `${i + 1}. ${s.name}`,
          value: (
            <span data-testid={`summary-step-${i}`}>
              {fmtTemp(s.temperatureC)} · {fmtHours(s.durationH)} · {STAGE_LABELS[s.stage ?? "curing"]} · {ATMOSPHERE_LABELS[s.atmosphere ?? "air"]}
            </span>
          ),
        }))}
      />
    </div>
  );
}
