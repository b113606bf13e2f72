"use client";

import { useWatch } from "react-hook-form";
import { Field, inputClass } from "@/components/ui/field";
import { HazardCodes } from "@/components/ui/hazards";
import { fmtTemp } from "@/lib/format";
import { a11y, idFor, useEditor } from "./editor-context";
import { MaterialSelect } from "./material-select";
import { NumberField } from "./number-field";
import { WaterFieldset } from "./water-fieldset";

/** Water ratio, solvent, catalyst and substrate. */
export function ReagentsFieldset() {
  const { control, register, messageFor, options, record, readOnly } = useEditor();
  const solventMode = useWatch({ control, name: "solvent.mode" });
  const catalystId = useWatch({ control, name: "catalyst.materialId" });
  const substrateId = useWatch({ control, name: "substrateId" });
  const solventId = useWatch({ control, name: "solvent.materialId" });
  const substrate = record(substrateId);
  const sel = (field: "solvent.materialId" | "catalyst.materialId" | "substrateId") => ({
    ...a11y(idFor(field), messageFor(field)),
    ...register(field),
    invalid: !!messageFor(field),
    disabled: readOnly,
  });
  return (
    <fieldset className="@container flex flex-col gap-3 rounded border border-rule bg-panel p-3">
      <legend className="px-1 text-sm font-semibold">Water, solvent, catalyst and substrate</legend>
      <WaterFieldset />
      <div className="grid gap-3 @sm:grid-cols-2">
        <Field id={idFor("solvent.mode")} label="Solvent" error={messageFor("solvent.mode")}>
          <select disabled={readOnly} className={inputClass(!!messageFor("solvent.mode"))} {...a11y(idFor("solvent.mode"), messageFor("solvent.mode"))} {...register("solvent.mode")}>
            <option value="none">No added solvent</option>
            <option value="molPerNetworkAtom">Molar ratio to network atoms</option>
            <option value="fill">Fill to the sol mass or mould volume</option>
          </select>
        </Field>
        {solventMode !== "none" ? (
          <Field id={idFor("solvent.materialId")} label="Solvent material" error={messageFor("solvent.materialId")}>
            <MaterialSelect options={options} kinds={["solvent"]} emptyLabel="Pick a solvent" {...sel("solvent.materialId")} />
          </Field>
        ) : null}
        {solventMode === "molPerNetworkAtom" ? <NumberField name="solvent.value" label="Solvent ratio" unit="mol per mol network atom" /> : null}
      </div>
      {solventMode !== "none" && record(solventId)?.hazards?.length ? <HazardCodes codes={record(solventId)?.hazards} /> : null}
      <div className="grid gap-3 @sm:grid-cols-2">
        <Field id={idFor("catalyst.materialId")} label="Catalyst" error={messageFor("catalyst.materialId")}>
          <MaterialSelect options={options} kinds={["catalyst"]} emptyLabel="No catalyst" {...sel("catalyst.materialId")} />
        </Field>
        {catalystId ? <NumberField name="catalyst.molPerNetworkAtom" label="Catalyst ratio" unit="mol active per mol network atom" /> : null}
        {catalystId ? (
          <div className="self-end pb-2">
            <HazardCodes codes={record(catalystId)?.hazards} />
          </div>
        ) : null}
      </div>
      <div className="grid gap-3 @sm:grid-cols-2">
        <Field id={idFor("substrateId")} label="Substrate (the coated part)" error={messageFor("substrateId")} className="@sm:col-span-2">
          <MaterialSelect options={options} kinds={["substrate"]} emptyLabel="None (free-standing body)" {...sel("substrateId")} />
        </Field>
        {substrate?.thermal ? (
          <p className="num self-end pb-2 text-xs text-muted">
            Tg {fmtTemp(substrate.thermal.glassTransitionC)} · Tm {fmtTemp(substrate.thermal.meltingC)} · Td {fmtTemp(substrate.thermal.degradationOnsetC)} · max{" "}
            {fmtTemp(substrate.thermal.maxServiceC)}
            {substrate.thermal.heatDeflectionC !== undefined ? ` · HDT ${fmtTemp(substrate.thermal.heatDeflectionC)}` : ""}
          </p>
        ) : null}
      </div>
    </fieldset>
  );
}
