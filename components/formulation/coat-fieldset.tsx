"use client";

import { useWatch } from "react-hook-form";
import { Field, inputClass } from "@/components/ui/field";
import { COAT_METHOD_LABELS } from "@/lib/labels";
import { a11y, idFor, useEditor } from "./editor-context";
import { NumberField } from "./number-field";

/**
 * The coat: how it is applied (dip, spin or a wet film of stated thickness)
 * with that method's inputs, the dry thickness wanted and the area to coat.
 * The engine predicts the film from these and the sol it computes.
 */
export function CoatFieldset() {
  const { control, register, messageFor, readOnly } = useEditor();
  const method = useWatch({ control, name: "coating.method" }) ?? "none";
  const methodMsg = messageFor("coating.method");
  return (
    <fieldset className="@container flex flex-col gap-3 rounded border border-rule bg-panel p-3" data-testid="coat-fields">
      <legend className="px-1 text-sm font-semibold">Coat</legend>
      <Field id={idFor("coating.method")} label="How the coat is applied" error={methodMsg}>
        <select disabled={readOnly} className={inputClass(!!methodMsg)} {...a11y(idFor("coating.method"), methodMsg)} {...register("coating.method")}>
          <option value="none">{COAT_METHOD_LABELS.none}</option>
          <option value="dip">{COAT_METHOD_LABELS.dip}</option>
          <option value="spin">{COAT_METHOD_LABELS.spin}</option>
          <option value="wetFilm">{COAT_METHOD_LABELS.wetFilm}</option>
        </select>
      </Field>
      {method === "dip" ? (
        <div className="grid gap-3 @sm:grid-cols-3">
          <NumberField name="coating.withdrawalMmPerS" label="Withdrawal speed" unit="mm/s" />
          <NumberField name="coating.viscosityMPaS" label="Sol viscosity" unit="mPa·s" />
          <NumberField name="coating.surfaceTensionMNPerM" label="Surface tension" unit="mN/m" />
        </div>
      ) : null}
      {method === "spin" ? (
        <div className="grid gap-3 @sm:grid-cols-3">
          <NumberField name="coating.rpm" label="Spin speed" unit="rpm" />
          <NumberField name="coating.calibrationRpm" label="Measured film: spin speed" unit="rpm" />
          <NumberField name="coating.calibrationDryThicknessNm" label="Measured film: dry thickness" unit="nm" />
        </div>
      ) : null}
      {method === "wetFilm" ? (
        <div className="grid gap-3 @sm:grid-cols-3">
          <NumberField name="coating.wetThicknessUm" label="Wet film thickness" unit="µm" hint="as laid by the bar, slot die or spray" />
        </div>
      ) : null}
      {method !== "none" ? (
        <div className="grid gap-3 @sm:grid-cols-2">
          <NumberField name="coating.targetDryThicknessNm" label="Target dry thickness" unit="nm" hint="optional" />
          <NumberField name="coating.areaM2" label="Area to coat" unit="m²" hint="optional" />
        </div>
      ) : null}
      {method === "dip" ? (
        <p className="text-xs text-muted">
          Thickness from the Landau–Levich relation, valid while the capillary number (viscosity × speed / surface tension) stays well below 1;
          measure the sol&rsquo;s viscosity and surface tension at the coating temperature.
        </p>
      ) : method === "spin" ? (
        <p className="text-xs text-muted">
          Thickness scales as one over the square root of the spin speed, from one film of this sol you have measured.
        </p>
      ) : null}
    </fieldset>
  );
}
