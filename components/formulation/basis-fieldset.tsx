"use client";

import { useWatch } from "react-hook-form";
import { Field, inputClass } from "@/components/ui/field";
import { a11y, idFor, useEditor } from "./editor-context";
import { NumberField } from "./number-field";

/** What fixes the batch size: dry solid mass, sol mass with solids content, or a gel body. */
export function BasisFieldset() {
  const { control, register, messageFor, readOnly } = useEditor();
  const type = useWatch({ control, name: "basis.type" });
  const id = idFor("basis.type");
  return (
    <fieldset className="@container flex flex-col gap-3 rounded border border-rule bg-panel p-3">
      <legend className="px-1 text-sm font-semibold">Batch size</legend>
      <Field id={id} label="Basis" error={messageFor("basis.type")}>
        <select disabled={readOnly} className={inputClass(!!messageFor("basis.type"))} {...a11y(id, messageFor("basis.type"))} {...register("basis.type")}>
          <option value="solidMass">Dry solid mass</option>
          <option value="solidsContent">Sol mass and solids content</option>
          <option value="gelBody">Gel body in a mould</option>
        </select>
      </Field>
      <div className="grid grid-cols-2 gap-3 @md:grid-cols-3">
        {type === "solidMass" ? <NumberField name="basis.grams" label="Dry solid mass" unit="g" /> : null}
        {type === "solidsContent" ? (
          <>
            <NumberField name="basis.solMassGrams" label="Sol mass" unit="g" />
            <NumberField name="basis.solidsPercent" label="Solids content" unit="wt%" />
          </>
        ) : null}
        {type === "gelBody" ? (
          <>
            <NumberField name="basis.volumeMl" label="Mould volume" unit="mL" />
            <NumberField name="basis.bulkDensity" label="Target bulk density" unit="g/cm³" />
            <NumberField name="basis.linearShrinkagePercent" label="Linear drying shrinkage" unit="%" />
          </>
        ) : null}
      </div>
    </fieldset>
  );
}
