"use client";

import { useFieldArray } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Field, FieldError, inputClass } from "@/components/ui/field";
import { ATMOSPHERE_LABELS, STAGE_LABELS } from "@/components/results/words";
import { STEP_ATMOSPHERES, STEP_STAGES } from "@/lib/formulation/input-schema";
import { a11y, idFor, useEditor } from "./editor-context";
import { NumberField } from "./number-field";

/** Process steps in order: name, temperature, duration; add, move, remove. */
export function StepsFieldset() {
  const { control, register, messageFor, readOnly } = useEditor();
  const { fields, append, remove, move } = useFieldArray({ control, name: "steps" });
  return (
    <fieldset className="flex flex-col gap-2 rounded border border-rule bg-panel p-3" aria-describedby="f-steps-error">
      <legend className="px-1 text-sm font-semibold">Process steps</legend>
      <p className="text-xs text-muted">
        Stage decides which limits apply: in the sol a dissolved polymer cannot melt; drying and curing check every limit. Inert gas raises the
        degradation onset of organics that have one measured in nitrogen.
      </p>
      <ol className="flex flex-col gap-2">
        {fields.map((f, i) => {
          const nameField = `steps.${i}.name` as const;
          const nMsg = messageFor(nameField);
          return (
            <li key={f.id} className="rounded border border-rule/70 p-2" data-testid={`step-row-${i}`}>
              <div className="grid grid-cols-2 gap-2 sm:grid-cols-[minmax(0,1fr)_6.5rem_6.5rem]">
                <div className="col-span-2 flex flex-col gap-1 sm:col-span-1">
                  <label htmlFor={idFor(nameField)} className="text-[13px] font-medium">
                    Step {i + 1}
                  </label>
                  <input readOnly={readOnly} className={inputClass(!!nMsg)} {...a11y(idFor(nameField), nMsg)} {...register(nameField)} />
                  <FieldError id={`${idFor(nameField)}-error`} message={nMsg} />
                </div>
                <NumberField name={`steps.${i}.temperatureC`} label="Temperature" unit="°C" />
                <NumberField name={`steps.${i}.durationH`} label="Duration" unit="h" />
              </div>
              <div className="mt-2 grid grid-cols-2 gap-2 sm:grid-cols-[minmax(0,1fr)_minmax(0,1fr)]">
                <Field id={idFor(`steps.${i}.stage`)} label="Stage" error={messageFor(`steps.${i}.stage`)}>
                  <select disabled={readOnly} className={inputClass()} {...a11y(idFor(`steps.${i}.stage`), messageFor(`steps.${i}.stage`))} {...register(`steps.${i}.stage`)}>
                    {STEP_STAGES.map((st) => (
                      <option key={st} value={st}>
                        {STAGE_LABELS[st]}
                      </option>
                    ))}
                  </select>
                </Field>
                <Field id={idFor(`steps.${i}.atmosphere`)} label="Atmosphere" error={messageFor(`steps.${i}.atmosphere`)}>
                  <select disabled={readOnly} className={inputClass()} {...a11y(idFor(`steps.${i}.atmosphere`), messageFor(`steps.${i}.atmosphere`))} {...register(`steps.${i}.atmosphere`)}>
                    {STEP_ATMOSPHERES.map((at) => (
                      <option key={at} value={at}>
                        {ATMOSPHERE_LABELS[at]}
                      </option>
                    ))}
                  </select>
                </Field>
              </div>
              {readOnly ? null : (
                <div className="mt-1 flex gap-1">
                  <Button variant="ghost" onClick={() => move(i, i - 1)} disabled={i === 0} aria-label={`Move step ${i + 1} up`}>
                    Up
                  </Button>
                  <Button variant="ghost" onClick={() => move(i, i + 1)} disabled={i === fields.length - 1} aria-label={`Move step ${i + 1} down`}>
                    Down
                  </Button>
                  <Button variant="ghost" onClick={() => remove(i)} aria-label={`Remove step ${i + 1}`}>
                    Remove
                  </Button>
                </div>
              )}
            </li>
          );
        })}
      </ol>
      {readOnly ? null : (
        <Button className="self-start" onClick={() => append({ name: `Step ${fields.length + 1}`, temperatureC: 25, durationH: 1, stage: "curing", atmosphere: "air" })}>
          Add step
        </Button>
      )}
      <FieldError id="f-steps-error" message={messageFor("steps")} />
      <div className="grid grid-cols-2 gap-3 border-t border-rule pt-2">
        <NumberField name="marginC" label="Thermal margin" unit="°C" hint="below each hard limit" />
        <NumberField name="measuredBulkDensity" label="Measured bulk density" unit="g/cm³" hint="optional, for porosity" />
      </div>
    </fieldset>
  );
}
