import type { ReactNode } from "react";

/** One column heading: its words, and whether the column holds figures (right-aligned). */
export interface Column {
  label: ReactNode;
  /** A column of figures: heading and cells right-aligned. */
  numeric?: boolean;
  /** Leave the column out (a column shown only to some people). */
  hidden?: boolean;
  /** Heading shown to screen readers only (an actions column, say). */
  srOnly?: boolean;
  key?: string;
}

/** Class of a heading cell: text columns left, figure columns right. */
export const TH = "px-2 py-1 text-left text-xs font-semibold text-muted whitespace-nowrap";
export const THN = "px-2 py-1 text-right text-xs font-semibold text-muted whitespace-nowrap";
/** Class of a body cell: text columns, and figure columns (tabular digits, right-aligned). */
export const TD = "px-2 py-1 align-top";
export const TDN = "num px-2 py-1 text-right whitespace-nowrap align-top";

interface TableHeadProps {
  columns: readonly (Column | string)[];
  /** Extra classes for the heading row (a background, say). */
  rowClassName?: string;
  /** Class of every heading cell instead of the usual one (the printed batch sheet's ruled cells). */
  cellClassName?: string;
}

/**
 * The heading row of a table: one `<th scope="col">` per column.
 *
 * @example
 * ```tsx
 * <TableHead columns={["Material", { label: "Mass", numeric: true }]} />
 * ```
 */
export function TableHead({ columns, rowClassName = "", cellClassName }: TableHeadProps) {
  return (
    <thead>
      <tr className={`border-b border-rule ${rowClassName}`}>
        {columns.map((c, i) => {
          const col: Column = typeof c === "string" ? { label: c } : c;
          if (col.hidden) return null;
          const base = cellClassName ? `${cellClassName}${col.numeric ? " text-right" : ""}` : col.numeric ? THN : TH;
          return (
            <th key={col.key ?? i} scope="col" className={base}>
              {col.srOnly ? <span className="sr-only">{col.label}</span> : col.label}
            </th>
          );
        })}
      </tr>
    </thead>
  );
}
