"use client";

import { useFieldArray, useWatch } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { FieldError, inputClass } from "@/components/ui/field";
import { HazardCodes } from "@/components/ui/hazards";
import { a11y, idFor, useEditor } from "./editor-context";
import { MaterialSelect } from "./material-select";
import { PrecursorSelect } from "./precursor-select";

/**
 * Chelating and exchanging ligands (acetylacetone, ethyl acetoacetate,
 * methacrylic acid): one line per modifier and the precursor it modifies,
 * in mol modifier per mol metal of that precursor.
 */
export function ModifiersFieldset() {
  const { control, register, messageFor, options, record, readOnly } = useEditor();
  const { fields, append, remove } = useFieldArray({ control, name: "modifiers" });
  const watched = useWatch({ control, name: "modifiers" });
  const components = useWatch({ control, name: "components" });
  const precursors = (components ?? []).map((c) => record(c?.materialId ?? "")).filter((m) => m?.kind === "precursor");
  const firstFast = precursors.find((m) => m?.fastHydrolysing) ?? precursors[0];
  const hasModifiers = options.some((m) => m.kind === "modifier");
  return (
    <fieldset className="flex flex-col gap-2 rounded border border-rule bg-panel p-3" aria-describedby="f-modifiers-error" data-testid="modifiers-fieldset">
      <legend className="px-1 text-sm font-semibold">Modifiers (chelating ligands)</legend>
      <p className="text-xs text-muted">
        A modifier replaces alkoxy groups of a fast-hydrolysing alkoxide (Ti, Zr, Al) before any water is added, so it co-condenses instead of
        precipitating; 0.5 to 2 mol per mol metal is usual.
      </p>
      {fields.map((f, i) => {
        const mField = `modifiers.${i}.materialId` as const;
        const pField = `modifiers.${i}.precursorId` as const;
        const xField = `modifiers.${i}.molPerMetal` as const;
        const [mMsg, pMsg, xMsg] = [messageFor(mField), messageFor(pField), messageFor(xField)];
        const picked = record(watched?.[i]?.materialId ?? "");
        return (
          <div key={f.id} className="rounded border border-rule/70 p-2" data-testid={`modifier-row-${i}`}>
            <div className="grid grid-cols-1 items-end gap-2 sm:grid-cols-[minmax(0,1fr)_minmax(0,1fr)_6.5rem_auto]">
              <div className="flex min-w-0 flex-col gap-1">
                <label htmlFor={idFor(mField)} className="text-[13px] font-medium">
                  Modifier {i + 1}
                </label>
                <MaterialSelect
                  options={options}
                  kinds={["modifier"]}
                  emptyLabel="Pick a modifier"
                  disabled={readOnly}
                  invalid={!!mMsg}
                  {...a11y(idFor(mField), mMsg)}
                  {...register(mField)}
                />
              </div>
              <div className="flex min-w-0 flex-col gap-1">
                <label htmlFor={idFor(pField)} className="text-[13px] font-medium">
                  Precursor it modifies
                </label>
                <PrecursorSelect field={pField} message={pMsg} />
              </div>
              <div className="flex flex-col gap-1">
                <label htmlFor={idFor(xField)} className="text-[13px] font-medium">
                  mol/mol metal
                </label>
                <input
                  type="number"
                  inputMode="decimal"
                  step="any"
                  readOnly={readOnly}
                  className={inputClass(!!xMsg, "num text-right")}
                  {...a11y(idFor(xField), xMsg)}
                  {...register(xField, { valueAsNumber: true })}
                />
              </div>
              {readOnly ? null : (
                <Button variant="ghost" onClick={() => remove(i)} aria-label={`Remove modifier ${i + 1}`}>
                  Remove
                </Button>
              )}
            </div>
            <FieldError id={`${idFor(mField)}-error`} message={mMsg} />
            <FieldError id={`${idFor(pField)}-error`} message={pMsg} />
            <FieldError id={`${idFor(xField)}-error`} message={xMsg} />
            {picked?.modifier ? (
              <p className="mt-1 flex flex-wrap items-center gap-2 text-xs text-muted">
                <span>
                  replaces {picked.modifier.groupsReplacedPerMolecule} alkoxy group{picked.modifier.groupsReplacedPerMolecule === 1 ? "" : "s"} per molecule;
                  bonded as {picked.modifier.bondedFormula}
                </span>
                <HazardCodes codes={picked.hazards} />
              </p>
            ) : null}
          </div>
        );
      })}
      {readOnly ? null : (
        <Button
          className="self-start"
          disabled={!hasModifiers}
          onClick={() => append({ materialId: "", precursorId: firstFast?.id ?? "", molPerMetal: 1 })}
        >
          Add modifier
        </Button>
      )}
      {!hasModifiers ? <p className="text-xs text-muted">The library has no modifier yet; add one in Materials.</p> : null}
      <FieldError id="f-modifiers-error" message={messageFor("modifiers")} />
    </fieldset>
  );
}
