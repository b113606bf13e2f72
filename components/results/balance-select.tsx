"use client";

import { useId } from "react";
import { BALANCE_RESOLUTIONS } from "@/lib/format";

interface BalanceSelectProps {
  value: number;
  onChange: (value: number) => void;
}

/** Choice of balance resolution for displayed masses. */
export function BalanceSelect({ value, onChange }: BalanceSelectProps) {
  const id = useId();
  return (
    <span className="flex items-center gap-1.5 text-xs">
      <label htmlFor={id} className="text-muted">
        Balance resolution
      </label>
      <select id={id} className="num rounded border border-rule bg-panel px-1 py-0.5 text-ink" value={value} onChange={(e) => onChange(Number(e.target.value))}>
        {BALANCE_RESOLUTIONS.map((r) => (
          <option key={r} value={r}>
            {r} g
          </option>
        ))}
      </select>
    </span>
  );
}
