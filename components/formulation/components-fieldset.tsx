"use client";

import { useFieldArray, useWatch } from "react-hook-form";
import { KIND_LABELS } from "@/components/results/words";
import { Button } from "@/components/ui/button";
import { FieldError, inputClass } from "@/components/ui/field";
import { HazardCodes } from "@/components/ui/hazards";
import { a11y, idFor, useEditor } from "./editor-context";
import { MaterialSelect } from "./material-select";

const KINDS = ["precursor", "organic"] as const;

function sumOf(values: { weightPercent: number }[] | undefined): number {
  return (values ?? []).reduce((s, c) => s + (Number.isFinite(c.weightPercent) ? c.weightPercent : 0), 0);
}

/** Dry-composite components: precursors (by their residue) and organic phases, with weight fractions. */
export function ComponentsFieldset() {
  const { control, register, setValue, getValues, messageFor, options, record, readOnly } = useEditor();
  const { fields, append, remove } = useFieldArray({ control, name: "components" });
  const watched = useWatch({ control, name: "components" });
  const sum = sumOf(watched);
  const off = Math.abs(sum - 100) > 1e-4;

  function scaleTo100() {
    const list = getValues("components");
    const total = sumOf(list);
    if (!(total > 0)) return;
    let others = 0;
    list.forEach((c, i) => {
      const w = Number.isFinite(c.weightPercent) ? c.weightPercent : 0;
      const scaled = i === list.length - 1 ? 100 - others : Number(((w * 100) / total).toPrecision(10));
      others += scaled;
      setValue(`components.${i}.weightPercent`, Number(scaled.toPrecision(10)), { shouldDirty: true, shouldValidate: true });
    });
  }

  const listMessage = messageFor("components");
  return (
    <fieldset className="flex flex-col gap-2 rounded border border-rule bg-panel p-3" aria-describedby="f-components-error">
      <legend className="px-1 text-sm font-semibold">Dry composite: components and weight fractions</legend>
      <p className="text-xs text-muted">A precursor counts by its residue (oxide or R-SiO₁.₅ unit); an organic phase by its dry mass.</p>
      <div className="flex flex-col gap-2">
        {fields.map((f, i) => {
          const materialField = `components.${i}.materialId` as const;
          const weightField = `components.${i}.weightPercent` as const;
          const mMsg = messageFor(materialField);
          const wMsg = messageFor(weightField);
          const picked = record(watched?.[i]?.materialId ?? "");
          return (
            <div key={f.id} className="rounded border border-rule/70 p-2" data-testid={`component-row-${i}`}>
              <div className="grid grid-cols-[minmax(0,1fr)_6.5rem_auto] items-end gap-2">
                <div className="flex min-w-0 flex-col gap-1">
                  <label htmlFor={idFor(materialField)} className="text-[13px] font-medium">
                    Component {i + 1}
                  </label>
                  <MaterialSelect
                    options={options}
                    kinds={KINDS}
                    emptyLabel="Pick a precursor or organic phase"
                    disabled={readOnly}
                    invalid={!!mMsg}
                    {...a11y(idFor(materialField), mMsg)}
                    {...register(materialField)}
                  />
                </div>
                <div className="flex flex-col gap-1">
                  <label htmlFor={idFor(weightField)} className="text-[13px] font-medium">
                    wt%
                  </label>
                  <input
                    type="number"
                    inputMode="decimal"
                    step="any"
                    readOnly={readOnly}
                    className={inputClass(!!wMsg, "num text-right")}
                    {...a11y(idFor(weightField), wMsg)}
                    {...register(weightField, { valueAsNumber: true })}
                  />
                </div>
                {readOnly ? null : (
                  <Button variant="ghost" onClick={() => remove(i)} disabled={fields.length <= 1} aria-label={`Remove component ${i + 1}`}>
                    Remove
                  </Button>
                )}
              </div>
              <FieldError id={`${idFor(materialField)}-error`} message={mMsg} />
              <FieldError id={`${idFor(weightField)}-error`} message={wMsg} />
              {picked ? (
                <p className="mt-1 flex flex-wrap items-center gap-2 text-xs text-muted">
                  <span>{KIND_LABELS[picked.kind]}</span>
                  {picked.precursor ? <span>residue {picked.precursor.residueFormula}</span> : null}
                  <HazardCodes codes={picked.hazards} />
                </p>
              ) : null}
            </div>
          );
        })}
      </div>
      <div className="flex flex-wrap items-center justify-between gap-2">
        <p className="text-sm" aria-live="polite" data-testid="fraction-sum">
          Sum of weight fractions: <strong className="num">{sum.toFixed(2)} %</strong>{" "}
          {off ? <span className="text-fail">(must be 100 %)</span> : <span className="text-clear">(adds up)</span>}
        </p>
        {readOnly ? null : (
          <div className="flex gap-2">
            <Button onClick={scaleTo100} disabled={!off || !(sum > 0)}>
              Scale to 100 %
            </Button>
            <Button onClick={() => append({ materialId: "", weightPercent: Math.max(0, Number((100 - sum).toFixed(4))) })}>Add component</Button>
          </div>
        )}
      </div>
      <FieldError id="f-components-error" message={listMessage} />
    </fieldset>
  );
}
