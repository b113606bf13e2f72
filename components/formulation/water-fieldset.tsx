"use client";

import { useWatch } from "react-hook-form";
import { Field, inputClass } from "@/components/ui/field";
import { a11y, idFor, useEditor } from "./editor-context";
import { MaterialSelect } from "./material-select";
import { NumberField } from "./number-field";
import { PrecursorSelect } from "./precursor-select";

const RATIO_WORDS = { R: "R", h: "h", perPrecursor: "H₂O : precursor" } as const;

/** The water: which water, how its ratio is stated, and whether carried water counts. */
export function WaterFieldset() {
  const { control, register, messageFor, options, readOnly } = useEditor();
  const ratio = useWatch({ control, name: "water.ratio" });
  const msg = (field: "water.materialId" | "water.ratio" | "water.referenceId") => messageFor(field);
  return (
    <div className="flex flex-col gap-2" data-testid="water-fields">
      <div className="grid gap-3 @sm:grid-cols-2">
        <Field id={idFor("water.materialId")} label="Water" error={msg("water.materialId")}>
          <MaterialSelect
            options={options}
            kinds={["water"]}
            emptyLabel="Pick the water"
            disabled={readOnly}
            invalid={!!msg("water.materialId")}
            {...a11y(idFor("water.materialId"), msg("water.materialId"))}
            {...register("water.materialId")}
          />
        </Field>
        <Field id={idFor("water.ratio")} label="Water ratio given as" error={msg("water.ratio")}>
          <select disabled={readOnly} className={inputClass(!!msg("water.ratio"))} {...a11y(idFor("water.ratio"), msg("water.ratio"))} {...register("water.ratio")}>
            <option value="R">R: mol H₂O per mol network-forming atom</option>
            <option value="h">h: mol H₂O per mol alkoxy group</option>
            <option value="perPrecursor">mol H₂O per mol of one precursor</option>
          </select>
        </Field>
        {ratio === "perPrecursor" ? (
          <Field id={idFor("water.referenceId")} label="Precursor the ratio refers to" error={msg("water.referenceId")}>
            <PrecursorSelect field="water.referenceId" message={msg("water.referenceId")} />
          </Field>
        ) : null}
        <NumberField name="water.value" label={`Water ratio ${RATIO_WORDS[ratio] ?? ratio}`} unit="mol/mol" />
      </div>
      <label className="flex items-start gap-2 text-sm">
        <input type="checkbox" disabled={readOnly} className="mt-0.5" id={idFor("water.countCarried")} {...register("water.countCarried")} />
        <span>
          Count the water the other materials carry
          <span className="block text-xs text-muted">
            On: the water in acids, colloidal silica and salt hydrates counts toward the ratio. Off: the whole ratio is added as water, as many
            published recipes count it.
          </span>
        </span>
      </label>
      <details className="text-xs text-muted">
        <summary className="cursor-pointer">Which ratio does my recipe use?</summary>
        <ul className="mt-1 list-disc pl-5">
          <li>
            <strong>R</strong>: mol water per mol network-forming atom (Si, Ti, Zr, Al…). Many transition-metal papers call this h = H₂O/M.
          </li>
          <li>
            <strong>h</strong>: mol water per mol hydrolysable alkoxy group left after ligand exchange; 1 is full hydrolysis.
          </li>
          <li>
            <strong>Per mol of a precursor</strong>: the recipe gives water against one reagent, e.g. H₂O : TEOS = 12.
          </li>
        </ul>
      </details>
    </div>
  );
}
