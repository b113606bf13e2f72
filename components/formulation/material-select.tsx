"use client";

import { forwardRef, type SelectHTMLAttributes } from "react";
import type { Material, MaterialKind } from "@/lib/formulation";
import { KIND_LABELS } from "@/components/results/words";
import { inputClass } from "@/components/ui/field";

interface MaterialSelectProps extends SelectHTMLAttributes<HTMLSelectElement> {
  options: Material[];
  kinds: readonly MaterialKind[];
  /** Text of the empty choice ("Pick a material", "None"). */
  emptyLabel: string;
  invalid?: boolean;
}

/** A select of the team's materials of the given kinds, grouped by kind. */
export const MaterialSelect = forwardRef<HTMLSelectElement, MaterialSelectProps>(function MaterialSelect(
  { options, kinds, emptyLabel, invalid = false, className = "", ...rest },
  ref,
) {
  return (
    <select ref={ref} className={inputClass(invalid, className)} aria-invalid={invalid || undefined} {...rest}>
      <option value="">{emptyLabel}</option>
      {kinds.map((kind) => {
        const list = options.filter((m) => m.kind === kind);
        if (list.length === 0) return null;
        return kinds.length > 1 ? (
          <optgroup key={kind} label={KIND_LABELS[kind]}>
            {list.map((m) => (
              <option key={m.id} value={m.id}>
                {m.name}
                {m.hazards?.length ? ` ⚠ ${m.hazards.join(" ")}` : ""}
              </option>
            ))}
          </optgroup>
        ) : (
          list.map((m) => (
            <option key={m.id} value={m.id}>
              {m.name}
              {m.hazards?.length ? ` ⚠ ${m.hazards.join(" ")}` : ""}
            </option>
          ))
        );
      })}
    </select>
  );
});
