"use client";

import { useFieldArray, useWatch } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Field, inputClass } from "@/components/ui/field";
import { SEARCH_CANDIDATES } from "@/lib/explore/spec";
import { a11y, useSetup, xid } from "./setup-context";

const THERMAL: { value: "clear" | "caution" | "any"; label: string }[] = [
  { value: "clear", label: "Clear only" },
  { value: "caution", label: "Caution allowed" },
  { value: "any", label: "Any verdict (even failing)" },
];

/** The target search: limits on figures, the thermal verdict allowed, and one aim. */
export function SearchFieldset() {
  const { form, catalogue, messageFor } = useSetup();
  const { register, control } = form;
  const on = useWatch({ control, name: "search.on" });
  const goal = useWatch({ control, name: "search.goal" });
  const aimOutput = useWatch({ control, name: "search.output" });
  const limits = useWatch({ control, name: "search.constraints" });
  const { fields, append, remove } = useFieldArray({ control, name: "search.constraints" });
  const unitOf = (key: string | undefined) => {
    return catalogue.find((o) => o.key === key)?.unit ?? "";
  };
  const options = catalogue.map((o) => (
    <option key={o.key} value={o.key}>
      {o.label}
    </option>
  ));
  return (
    <fieldset className="flex flex-col gap-3 rounded border border-rule p-3">
      <legend className="px-1 text-[13px] font-semibold">Target search</legend>
      <label className="flex items-center gap-1.5 text-sm">
        <input type="checkbox" id="x-search-on" {...register("search.on")} />
        Search the grid for the best {SEARCH_CANDIDATES} candidates
      </label>
      {on ? (
        <>
          <div className="flex flex-col gap-2">
            <p className="text-[13px] font-medium">Limits (leave a side empty for no limit)</p>
            {fields.map((f, i) => {
              const p = `search.constraints.${i}` as const;
              const unit = unitOf(limits?.[i]?.output);
              return (
                <div key={f.id} className="flex flex-wrap items-start gap-3" data-testid="search-limit">
                  <Field id={xid(`${p}.output`)} label="Figure" error={messageFor(`${p}.output`)}>
                    <select className={inputClass(!!messageFor(`${p}.output`), "w-72")} {...a11y(`${p}.output`, messageFor(`${p}.output`))} {...register(`${p}.output`)}>
                      {options}
                    </select>
                  </Field>
                  {(["min", "max"] as const).map((side) => {
                    const path = `${p}.${side}` as const;
                    const message = messageFor(path);
                    return (
                      <Field key={side} id={xid(path)} label={side === "min" ? "At least" : "At most"} hint={unit ? `(${unit})` : undefined} error={message}>
                        <input type="number" inputMode="decimal" step="any" className={inputClass(!!message, "num w-28")} {...a11y(path, message)} {...register(path, { valueAsNumber: true })} />
                      </Field>
                    );
                  })}
                  <Button variant="ghost" className="mt-5" onClick={() => remove(i)} aria-label={`Remove limit ${i + 1}`}>
                    Remove
                  </Button>
                </div>
              );
            })}
            <div>
              <Button onClick={() => append({ output: catalogue[0]?.key ?? "", min: Number.NaN, max: Number.NaN })} disabled={fields.length >= 20}>
                Add a limit
              </Button>
            </div>
          </div>
          <fieldset>
            <legend className="mb-1 text-[13px] font-medium">Thermal verdict of a candidate</legend>
            <div className="flex flex-wrap gap-4">
              {THERMAL.map((t) => (
                <label key={t.value} className="flex items-center gap-1.5 text-sm">
                  <input type="radio" value={t.value} id={`x-search-thermal-${t.value}`} {...register("search.thermal")} />
                  {t.label}
                </label>
              ))}
            </div>
          </fieldset>
          <div className="flex flex-wrap items-start gap-3">
            <Field id={xid("search.goal")} label="Aim" error={messageFor("search.goal")}>
              <select className={inputClass(false, "w-44")} {...a11y("search.goal", messageFor("search.goal"))} {...register("search.goal")}>
                <option value="min">Lowest</option>
                <option value="max">Highest</option>
                <option value="closest">Closest to a value</option>
              </select>
            </Field>
            <Field id={xid("search.output")} label="Of the figure" error={messageFor("search.output")}>
              <select className={inputClass(!!messageFor("search.output"), "w-72")} {...a11y("search.output", messageFor("search.output"))} {...register("search.output")}>
                {options}
              </select>
            </Field>
            {goal === "closest" ? (
              <Field id={xid("search.value")} label="Value" hint={unitOf(aimOutput) ? `(${unitOf(aimOutput)})` : undefined} error={messageFor("search.value")}>
                <input
                  type="number"
                  inputMode="decimal"
                  step="any"
                  className={inputClass(!!messageFor("search.value"), "num w-28")}
                  {...a11y("search.value", messageFor("search.value"))}
                  {...register("search.value", { valueAsNumber: true })}
                />
              </Field>
            ) : null}
          </div>
        </>
      ) : null}
    </fieldset>
  );
}
