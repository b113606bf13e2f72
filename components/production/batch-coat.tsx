import { TableHead } from "@/components/ui/table-head";
import { roundToResolution } from "@/lib/batches/resolution";
import type { FormulationInput, FormulationResult } from "@/lib/formulation";
import { batchCoatRows, type CoatRow } from "@/lib/spreadsheet/coat-rows";

interface BatchCoatProps {
  input: FormulationInput;
  result: FormulationResult;
  /** Classes of the printed sheet's ruled cells. */
  cellClassName: string;
  headClassName: string;
}

const COLUMNS = ["Setting", { label: "Value", numeric: true }, "Set or checked (initials)"];

/** A row's value as production reads it: to its step (three significant figures), with its unit. */
function shown(row: CoatRow): string {
  if (typeof row.value !== "number") return String(row.value ?? "");
  const figure = row.step === undefined ? String(row.value) : roundToResolution(row.value, row.step);
  return row.unit ? `${figure}\u00a0${row.unit}` : figure;
}

/**
 * The printed batch sheet's coating and VOC section: the method and the
 * speed or rpm to set, the expected wet and dry thickness, the target, the
 * area and the sol it needs, and VOC in g/L and g/L less water. The same rows
 * as the exported sheets (lib/spreadsheet/coat-rows.ts). Nothing at all when
 * the revision has neither a coating nor a VOC figure.
 */
export function BatchCoat({ input, result, cellClassName, headClassName }: BatchCoatProps) {
  const rows = batchCoatRows(input, result);
  if (rows.length === 0) return null;
  const title = input.coating ? "Coating and VOC" : "VOC";
  return (
    <section aria-labelledby="batch-coat-title" data-testid="batch-coat">
      <h2 id="batch-coat-title" className="mt-4 mb-1 text-sm font-semibold">
        {title}
      </h2>
      <div className="overflow-x-auto">
        <table className="w-full border-collapse text-sm">
          <caption className="sr-only">{title}</caption>
          <TableHead columns={COLUMNS} cellClassName={headClassName} />
          <tbody>
            {rows.map((row) => (
              <tr key={row.item}>
                <th scope="row" className={`${cellClassName} text-left font-normal`}>
                  {row.item}
                </th>
                <td className={`${cellClassName} num text-right font-semibold whitespace-nowrap`}>{shown(row)}</td>
                <td className={`${cellClassName} min-w-[6rem]`} />
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}
