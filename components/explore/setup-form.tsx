"use client";

import { useWatch } from "react-hook-form";
import { Field, FieldError, inputClass } from "@/components/ui/field";
import { EXPLORE_MAX_POINTS } from "@/lib/explore/spec";
import type { GridPlan } from "@/lib/explore/types";
import { componentChoices } from "./setup-choices";
import { a11y, useSetup, xid } from "./setup-context";
import type { Mode } from "./setup-values";
import { VariableRow } from "./variable-row";

const MODES: { value: Mode; label: string; hint: string }[] = [
  { value: "line", label: "One thing", hint: "a line plot" },
  { value: "map", label: "Two things", hint: "a colour map" },
  { value: "ternary", label: "Three components", hint: "a triangle map of their shares" },
];

interface SetupFormProps {
  plan: GridPlan | undefined;
}

/** What varies (a line, a map or a triangle of three components), the point count, and the figures to show. */
export function SetupForm({ plan }: SetupFormProps) {
  const { form, base, catalogue, messageFor } = useSetup();
  const { register, control } = form;
  const mode = useWatch({ control, name: "mode" });
  const components = componentChoices(base);
  const modeMessage = messageFor("mode");
  const outputsMessage = messageFor("outputs");
  return (
    <div className="flex flex-col gap-3">
      <fieldset>
        <legend className="mb-1 text-[13px] font-semibold">What varies</legend>
        <div className="flex flex-wrap gap-4" role="radiogroup" aria-describedby="x-mode-error">
          {MODES.map((m) => (
            <label key={m.value} className="flex items-center gap-1.5 text-sm">
              <input type="radio" value={m.value} id={`x-mode-${m.value}`} {...register("mode")} />
              {m.label} <span className="text-muted">({m.hint})</span>
            </label>
          ))}
        </div>
        <FieldError id="x-mode-error" message={modeMessage} />
      </fieldset>

      {mode === "ternary" ? (
        <fieldset className="rounded border border-rule p-3">
          <legend className="px-1 text-[13px] font-semibold">Three components sharing their total (the others stay as they are)</legend>
          <div className="flex flex-wrap items-start gap-3">
            {[0, 1, 2].map((k) => {
              const path = `materialIds.${k}` as const;
              const message = messageFor(path);
              return (
                <Field key={k} id={xid(path)} label={`Corner ${k + 1}`} error={message}>
                  <select className={inputClass(!!message, "w-64")} {...a11y(path, message)} {...register(path)}>
                    {components.map((c) => (
                      <option key={c.value} value={c.value}>
                        {c.label}
                      </option>
                    ))}
                  </select>
                </Field>
              );
            })}
            <Field id={xid("ternaryStep")} label="Step" hint="(% of their total)" error={messageFor("ternaryStep")}>
              <input
                type="number"
                inputMode="decimal"
                step="any"
                className={inputClass(!!messageFor("ternaryStep"), "num w-28")}
                {...a11y("ternaryStep", messageFor("ternaryStep"))}
                {...register("ternaryStep", { valueAsNumber: true })}
              />
            </Field>
          </div>
        </fieldset>
      ) : (
        <>
          <VariableRow index={0} />
          {mode === "map" ? <VariableRow index={1} /> : null}
        </>
      )}

      <p id="x-point-count" data-testid="point-count" data-count={plan?.count ?? ""} aria-live="polite" className="text-sm">
        {plan ? (
          <>
            <span className="num font-semibold">{plan.count.toLocaleString("en")}</span> points to compute (at most {EXPLORE_MAX_POINTS.toLocaleString("en")} per
            exploration).
          </>
        ) : messageFor("count") ? (
          <span id="x-count-error" className="text-fail">
            {messageFor("count")}
          </span>
        ) : (
          <span className="text-fail">Nothing to run yet: see the message beside the field above.</span>
        )}
      </p>

      <fieldset aria-describedby="x-outputs-error">
        <legend className="mb-1 text-[13px] font-semibold">Figures to show</legend>
        <div className="grid max-h-56 grid-cols-1 gap-x-4 gap-y-1 overflow-y-auto rounded border border-rule p-2 sm:grid-cols-2 xl:grid-cols-3">
          {catalogue.map((o) => (
            <label key={o.key} className="flex items-center gap-1.5 text-sm">
              <input type="checkbox" value={o.key} id={xid(`outputs.${o.key.replace(/[^a-zA-Z0-9-]/g, "-")}`)} {...register("outputs")} />
              {o.label}
              {o.unit ? <span className="text-muted">({o.unit})</span> : null}
            </label>
          ))}
        </div>
        <FieldError id="x-outputs-error" message={outputsMessage} />
      </fieldset>
    </div>
  );
}
