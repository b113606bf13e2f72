"use client";

import { useWatch } from "react-hook-form";
import { Field, inputClass } from "@/components/ui/field";
import type { VariableKind } from "@/lib/explore/spec";
import { componentChoices, defaultVariable, kindChoices, modifierChoices, rowUnit, stepChoices } from "./setup-choices";
import { a11y, useSetup, xid } from "./setup-context";

interface VariableRowProps {
  index: 0 | 1;
}

/** One thing that varies: its kind, which component/modifier/step, and the range from → to in steps. */
export function VariableRow({ index }: VariableRowProps) {
  const { form, base, messageFor } = useSetup();
  const { register, setValue, control } = form;
  const kind = useWatch({ control, name: `variables.${index}.kind` }) as VariableKind;
  const p = `variables.${index}` as const;
  const unit = rowUnit(kind);
  const which =
    kind === "weightFraction"
      ? { path: `${p}.materialId` as const, label: "Component", choices: componentChoices(base) }
      : kind === "modifierRatio"
        ? { path: `${p}.index` as const, label: "Modifier", choices: modifierChoices(base) }
        : kind === "stepTemperature"
          ? { path: `${p}.index` as const, label: "Process step", choices: stepChoices(base) }
          : null;
  const num = (leaf: "from" | "to" | "step", label: string) => {
    const path = `${p}.${leaf}` as const;
    const message = messageFor(path);
    return (
      <Field id={xid(path)} label={label} hint={`(${unit})`} error={message}>
        <input type="number" inputMode="decimal" step="any" className={inputClass(!!message, "num w-28")} {...a11y(path, message)} {...register(path, { valueAsNumber: true })} />
      </Field>
    );
  };
  return (
    <fieldset className="rounded border border-rule p-3">
      <legend className="px-1 text-[13px] font-semibold">{index === 0 ? "First thing that varies" : "Second thing that varies"}</legend>
      <div className="flex flex-wrap items-start gap-3">
        <Field id={xid(`${p}.kind`)} label="What" error={messageFor(`${p}.kind`)}>
          <select
            className={inputClass(!!messageFor(`${p}.kind`), "w-64")}
            {...a11y(`${p}.kind`, messageFor(`${p}.kind`))}
            {...register(`${p}.kind`, {
              onChange: (e: { target: { value: string } }) => setValue(p, defaultVariable(base, e.target.value as VariableKind), { shouldValidate: false, shouldDirty: true }),
            })}
          >
            {kindChoices(base).map((c) => (
              <option key={c.value} value={c.value}>
                {c.label}
              </option>
            ))}
          </select>
        </Field>
        {which ? (
          <Field id={xid(which.path)} label={which.label} error={messageFor(which.path)}>
            <select className={inputClass(!!messageFor(which.path), "w-72")} {...a11y(which.path, messageFor(which.path))} {...register(which.path)}>
              {which.choices.map((c) => (
                <option key={c.value} value={c.value}>
                  {c.label}
                </option>
              ))}
            </select>
          </Field>
        ) : null}
        {num("from", "From")}
        {num("to", "To")}
        {num("step", "Step")}
      </div>
    </fieldset>
  );
}
