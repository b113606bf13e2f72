"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useEffect, useState } from "react";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { Button } from "@/components/ui/button";
import { ErrorPanel } from "@/components/ui/error-panel";
import { Field, inputClass } from "@/components/ui/field";
import { OutcomeMessage, type Outcome } from "@/components/ui/outcome";
import { saveBatchSettings, useBatchSettings } from "@/lib/client/batch-settings";
import { ApiRequestError, errorMessage } from "@/lib/client/fetcher";

// The form speaks in per cent and grams; the API stores a fraction.
const schema = z.object({
  tolerancePercent: z.coerce.number({ error: "Enter a number in %" }).positive("Must be greater than 0 %").max(50, "At most 50 %"),
  balanceResolutionGrams: z.coerce.number({ error: "Enter a number in g" }).positive("Must be greater than 0 g").max(10, "At most 10 g"),
});
type Values = z.infer<typeof schema>;

/** The team's weighing tolerance for batch records (admins change it; new batches use it). */
export function BatchTolerancePanel({ canEdit }: { canEdit: boolean }) {
  const { data, error, mutate } = useBatchSettings();
  const [message, setMessage] = useState<Outcome>(null);
  const { register, handleSubmit, formState, reset, setError } = useForm<z.input<typeof schema>, unknown, Values>({
    resolver: zodResolver(schema),
  });
  const { errors, isSubmitting } = formState;

  useEffect(() => {
    if (data) reset({ tolerancePercent: data.toleranceFraction * 100, balanceResolutionGrams: data.balanceResolutionGrams });
  }, [data, reset]);

  const onSubmit = handleSubmit(async (values) => {
    setMessage(null);
    try {
      await saveBatchSettings({
        toleranceFraction: values.tolerancePercent / 100,
        balanceResolutionGrams: values.balanceResolutionGrams,
      });
      setMessage({ tone: "info", text: "Saved. Batches started from now on use these values." });
      await mutate();
    } catch (err) {
      if (err instanceof ApiRequestError) {
        if (err.fields.toleranceFraction) setError("tolerancePercent", { message: err.fields.toleranceFraction });
        if (err.fields.balanceResolutionGrams) setError("balanceResolutionGrams", { message: err.fields.balanceResolutionGrams });
      }
      setMessage({ tone: "error", text: `Not saved: ${errorMessage(err)}` });
    }
  });

  if (error) return <ErrorPanel message={errorMessage(error)} onRetry={() => mutate()} />;
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3">
      <p className="text-[13px] text-muted">
        A weighed line is flagged when it differs from its target by more than this share of the target or the balance
        resolution, whichever is larger.{data?.isDefault ? " These are the defaults." : ""}
      </p>
      <div className="grid gap-3 sm:grid-cols-2">
        <Field id="tolerance-percent" label="Tolerance" hint="% of the target mass" error={errors.tolerancePercent?.message}>
          <input
            id="tolerance-percent"
            type="number"
            step="any"
            inputMode="decimal"
            disabled={!canEdit}
            className={`num ${inputClass(!!errors.tolerancePercent)}`}
            aria-invalid={errors.tolerancePercent ? true : undefined}
            aria-describedby="tolerance-percent-error"
            {...register("tolerancePercent")}
          />
        </Field>
        <Field id="balance-resolution" label="Balance resolution" hint="g" error={errors.balanceResolutionGrams?.message}>
          <input
            id="balance-resolution"
            type="number"
            step="any"
            inputMode="decimal"
            disabled={!canEdit}
            className={`num ${inputClass(!!errors.balanceResolutionGrams)}`}
            aria-invalid={errors.balanceResolutionGrams ? true : undefined}
            aria-describedby="balance-resolution-error"
            {...register("balanceResolutionGrams")}
          />
        </Field>
      </div>
      {canEdit ? (
        <div>
          <Button type="submit" variant="primary" disabled={isSubmitting || !data}>
            Save tolerance
          </Button>
        </div>
      ) : null}
      <OutcomeMessage outcome={message} />
    </form>
  );
}
