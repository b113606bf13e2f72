import type { ReactNode } from "react";

interface FigureRowsProps {
  rows: { label: ReactNode; value: ReactNode; note?: ReactNode }[];
  caption?: string;
}

/** Label–value pairs in a compact two-column table (figures right-aligned). */
export function FigureRows({ rows, caption }: FigureRowsProps) {
  return (
    <table className="w-full text-sm">
      {caption ? <caption className="sr-only">{caption}</caption> : null}
      <tbody>
        {rows.map((r, i) => (
          <tr key={i} className="border-b border-rule/60 last:border-0">
            <th scope="row" className="py-1 pr-2 text-left font-normal text-muted">
              {r.label}
              {r.note ? <span className="block text-xs">{r.note}</span> : null}
            </th>
            <td className="num py-1 text-right whitespace-nowrap">{r.value}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

export { TH, THN, TD, TDN } from "@/components/ui/table-head";
