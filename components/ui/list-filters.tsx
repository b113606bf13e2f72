"use client";

import { inputClass } from "./field";

interface SearchBoxProps {
  label: string;
  value: string;
  onChange: (value: string) => void;
}

/** The search box above a server-side list; the label says what it searches. */
export function SearchBox({ label, value, onChange }: SearchBoxProps) {
  return (
    <label className="flex min-w-[14rem] flex-1 flex-col gap-1 text-[13px] font-medium">
      {label}
      <input type="search" className={inputClass()} value={value} onChange={(e) => onChange(e.target.value)} />
    </label>
  );
}

interface FilterSelectProps<V extends string> {
  label: string;
  value: V | "";
  onChange: (value: V | "") => void;
  /** The first option, meaning no filter, e.g. "Any state". */
  anyLabel: string;
  options: readonly V[];
  words: Record<V, string>;
  /** Tailwind min-width class, e.g. "min-w-[12rem]". */
  width?: string;
}

/** A select that narrows a server-side list to one value, or none. */
export function FilterSelect<V extends string>({ label, value, onChange, anyLabel, options, words, width = "min-w-[11rem]" }: FilterSelectProps<V>) {
  return (
    <label className="flex flex-col gap-1 text-[13px] font-medium">
      {label}
      <select className={inputClass(false, width)} value={value} onChange={(e) => onChange(e.target.value as V | "")}>
        <option value="">{anyLabel}</option>
        {options.map((o) => (
          <option key={o} value={o}>
            {words[o]}
          </option>
        ))}
      </select>
    </label>
  );
}
