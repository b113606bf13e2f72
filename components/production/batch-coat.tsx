import { TableHead } from "@/components/ui/table-head";
import { roundToResolution } from "@/lib/batches/resolution";
import type { FormulationInput, FormulationResult } from "@/lib/formulation";
import { batchCoatingRows, batchVocRows, type CoatRow } from "@/lib/spreadsheet/coat-rows";

interface BatchCoatProps {
  input: FormulationInput;
  result: FormulationResult;
  /** Classes of the printed sheet's ruled cells. */
  cellClassName: string;
  headClassName: string;
}

/** A row's value as production reads it: to its step (three significant figures), with its unit. */
function shown(row: CoatRow): string {
  if (typeof row.value !== "number") return String(row.value ?? "");
  const figure = row.step === undefined ? String(row.value) : roundToResolution(row.value, row.step);
  return row.unit ? `${figure}\u00a0${row.unit}` : figure;
}

interface CoatTableProps {
  id: string;
  title: string;
  rows: CoatRow[];
  /** A write-in column for the initials of whoever set or checked the value. */
  initials: boolean;
  cellClassName: string;
  headClassName: string;
}

function CoatTable({ id, title, rows, initials, cellClassName, headClassName }: CoatTableProps) {
  const columns = [initials ? "Setting" : "Figure", { label: "Value", numeric: true }, ...(initials ? ["Set or checked (initials)"] : [])];
  return (
    <section aria-labelledby={id} data-testid={id}>
      <h2 id={id} className="mt-4 mb-1 text-sm font-semibold">
        {title}
      </h2>
      <div className="overflow-x-auto">
        <table className="w-full border-collapse text-sm">
          <caption className="sr-only">{title}</caption>
          <TableHead columns={columns} cellClassName={headClassName} />
          <tbody>
            {rows.map((row) => (
              <tr key={row.item}>
                <th scope="row" className={`${cellClassName} text-left font-normal`}>
                  {row.item}
                </th>
                <td className={`${cellClassName} num text-right font-semibold whitespace-nowrap`}>{shown(row)}</td>
                {initials ? <td className={`${cellClassName} w-40`} /> : null}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}

/**
 * The printed batch sheet's coating and VOC sections: the method and the
 * speed or rpm to set, the expected wet and dry thickness, the target, the
 * area and the sol it needs (with a column for initials); then VOC in g/L and
 * g/L less water. The same rows as the exported sheets
 * (lib/spreadsheet/coat-rows.ts). No coating section when the revision has no
 * coating, no VOC section for a result stored before VOC was computed.
 */
export function BatchCoat({ input, result, cellClassName, headClassName }: BatchCoatProps) {
  const coating = batchCoatingRows(input, result);
  const voc = batchVocRows(result);
  const cells = { cellClassName, headClassName };
  return (
    <>
      {coating.length > 0 ? <CoatTable id="batch-coating" title="Coating" rows={coating} initials {...cells} /> : null}
      {voc.length > 0 ? <CoatTable id="batch-voc" title="VOC (volatile organic compounds)" rows={voc} initials={false} {...cells} /> : null}
    </>
  );
}
