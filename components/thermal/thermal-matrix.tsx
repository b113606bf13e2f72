import { ThermalBadge, thermalCellClass } from "@/components/ui/status";
import type { FormulationInput, FormulationResult } from "@/lib/formulation";
import { fmtHours, fmtTemp } from "@/lib/format";
import { LIMIT_LABELS } from "@/components/results/words";
import { TableHead } from "@/components/ui/table-head";
import { conversionChecks, serviceNotices, stepConditions, thermalRows } from "./thermal-model";

const MATRIX_HEAD = "border border-rule bg-paper px-2 py-1 text-left text-xs font-semibold text-muted";

interface ThermalMatrixProps {
  input: FormulationInput;
  result: FormulationResult;
}

/** Materials × process steps: clear, caution or fails, in words and colour, with the binding limit. */
export function ThermalMatrix({ input, result }: ThermalMatrixProps) {
  const rows = thermalRows(input, result);
  const t = result.thermal;
  const byId = new Map(input.materials.map((m) => [m.id, m]));
  const binding = t.binding ? byId.get(t.binding.materialId) : undefined;
  const conversions = conversionChecks(result);
  const service = serviceNotices(result);
  return (
    <div className="flex flex-col gap-3" data-testid="thermal-matrix">
      <div className="flex flex-wrap items-center gap-x-4 gap-y-1 text-sm">
        <span className="flex items-center gap-1.5">
          Thermal check: <ThermalBadge status={t.status} />
        </span>
        <span>
          Highest allowed step temperature:{" "}
          <strong className="num" data-testid="max-allowed">
            {t.maxAllowedC === undefined ? "no limit known" : fmtTemp(t.maxAllowedC)}
          </strong>
          {binding && t.binding ? (
            <span className="text-muted">
              {" "}
              — bound by {binding.name}, {LIMIT_LABELS[t.binding.limit]} less the {fmtTemp(input.marginC ?? 20)} margin
            </span>
          ) : null}
        </span>
      </div>
      {rows.length === 0 || input.steps.length === 0 ? (
        <p className="text-sm text-muted">
          {input.steps.length === 0 ? "No process steps yet." : "No organic phase or substrate with thermal limits in this formulation."}
        </p>
      ) : (
        <div className="overflow-x-auto">
          <table className="w-full border-collapse text-sm">
            <caption className="sr-only">Thermal compatibility of each material with each process step</caption>
            <TableHead
              cellClassName={MATRIX_HEAD}
              columns={[
                "Material (hard limit)",
                ...input.steps.map((s, i) => ({
                  key: String(i),
                  label: (
                    <>
                      {s.name}
                      <span className="num block font-normal">
                        {fmtTemp(s.temperatureC)} · {fmtHours(s.durationH)}
                      </span>
                      <span className="block font-normal" data-testid={`step-conditions-${i}`}>
                        {stepConditions(s)}
                      </span>
                    </>
                  ),
                })),
              ]}
            />
            <tbody>
              {rows.map((r) => (
                <tr key={r.materialId}>
                  <th scope="row" className="border border-rule px-2 py-1 text-left font-medium">
                    {r.name}
                    <span className="block text-xs font-normal text-muted">
                      {r.role === "substrate" ? "substrate" : "organic phase"}
                      {r.hard ? ` · ${LIMIT_LABELS[r.hard.limit as keyof typeof LIMIT_LABELS]} ${fmtTemp(r.hard.limitC)}` : " · no hard limit"}
                      {r.hardInert ? ` · ${LIMIT_LABELS[r.hardInert.limit as keyof typeof LIMIT_LABELS]} ${fmtTemp(r.hardInert.limitC)}` : ""}
                    </span>
                  </th>
                  {r.cells.map((c, i) => (
                    <td key={i} className={`border border-rule px-2 py-1 ${c ? thermalCellClass(c.status) : ""}`}>
                      {c ? (
                        <>
                          <ThermalBadge status={c.status} />
                          <span className="num block text-xs text-ink">
                            vs {LIMIT_LABELS[c.limit]} {fmtTemp(c.limitC)}
                          </span>
                        </>
                      ) : (
                        <span className="text-xs text-muted">not checked</span>
                      )}
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      {service.length > 0 ? (
        <ul className="flex flex-col gap-1 text-sm" data-testid="service-rating">
          {service.map((n, i) => (
            <li key={i} className="flex flex-wrap items-center gap-2">
              <ThermalBadge status="caution" />
              {n.message}
            </li>
          ))}
        </ul>
      ) : null}
      {conversions.length > 0 ? (
        <ul className="flex flex-col gap-1 text-sm">
          {conversions.map((c) => (
            <li key={c.materialId} className="flex flex-wrap items-center gap-2">
              <ThermalBadge status={c.status} />
              {byId.get(c.materialId)?.name ?? c.materialId} needs {fmtTemp(c.limitC)} to convert; the hottest step reaches {fmtTemp(c.temperatureC)}.
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
