import { ATMOSPHERE_LABELS, STAGE_LABELS } from "@/components/results/words";
import { FigureRows } from "@/components/results/table";
import type { FormulationInput } from "@/lib/formulation";
import { fmtHours, fmtQuantity, fmtRatio, fmtTemp } from "@/lib/format";
import { COAT_METHOD_LABELS } from "@/lib/labels";

interface InputSummaryProps {
  input: FormulationInput;
}

/** The coat's settings as entered, one row each, with units. */
function coatRows(coating: FormulationInput["coating"]): { label: string; value: string }[] {
  if (!coating) return [{ label: "How the coat is applied", value: COAT_METHOD_LABELS.none }];
  const rows = [{ label: "How the coat is applied", value: COAT_METHOD_LABELS[coating.method] }];
  if (coating.method === "dip") {
    rows.push(
      { label: "Withdrawal speed", value: fmtQuantity(coating.withdrawalMmPerS, "mm/s") },
      { label: "Sol viscosity", value: fmtQuantity(coating.viscosityMPaS, "mPa·s") },
      { label: "Surface tension", value: fmtQuantity(coating.surfaceTensionMNPerM, "mN/m") },
    );
  } else if (coating.method === "spin") {
    rows.push(
      { label: "Spin speed", value: fmtQuantity(coating.rpm, "rpm") },
      { label: "Measured film", value: `${fmtQuantity(coating.calibration.dryThicknessNm, "nm")} dry at ${fmtQuantity(coating.calibration.rpm, "rpm")}` },
    );
  } else {
    rows.push({ label: "Wet film thickness", value: fmtQuantity(coating.wetThicknessUm, "µm") });
  }
  rows.push(
    { label: "Target dry thickness", value: coating.targetDryThicknessNm !== undefined ? fmtQuantity(coating.targetDryThicknessNm, "nm") : "none" },
    { label: "Area to coat", value: coating.areaM2 !== undefined ? fmtQuantity(coating.areaM2, "m²") : "not stated" },
  );
  return rows;
}

/** What the author chose that the recipe does not show by itself: modifiers, the water convention, each step's stage and atmosphere, the coat. */
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
      <FigureRows
        caption="Coat as entered"
        rows={coatRows(input.coating).map((r, i) => ({ label: r.label, value: <span data-testid={`summary-coat-${i}`}>{r.value}</span> }))}
      />
    </div>
  );
}
