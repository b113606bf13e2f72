"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useEffect, useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { Button } from "@/components/ui/button";
import { ErrorPanel } from "@/components/ui/error-panel";
import { Field, inputClass } from "@/components/ui/field";
import { OutcomeMessage, type Outcome } from "@/components/ui/outcome";
import { ApiRequestError, errorMessage } from "@/lib/client/fetcher";
import { saveTeamSettings, useTeamSettings } from "@/lib/client/team-settings";
import { teamSettingsSchema } from "@/lib/validations/team-settings";

type Values = z.output<typeof teamSettingsSchema>;

/** The currency the team's material prices are in (admins change it; every cost is shown in it). */
export function CurrencyPanel({ canEdit }: { canEdit: boolean }) {
  const { data, error, mutate } = useTeamSettings();
  const [message, setMessage] = useState<Outcome>(null);
  const { register, handleSubmit, formState, reset, setError } = useForm<z.input<typeof teamSettingsSchema>, unknown, Values>({
    resolver: zodResolver(teamSettingsSchema),
  });
  const { errors, isSubmitting } = formState;

  useEffect(() => {
    if (data) reset({ currency: data.currency });
  }, [data, reset]);

  const onSubmit = handleSubmit(async (values) => {
    setMessage(null);
    try {
      await saveTeamSettings({ currency: values.currency });
      setMessage({ tone: "info", text: `Saved. Prices and costs are now read in ${values.currency}.` });
      await mutate();
    } catch (err) {
      if (err instanceof ApiRequestError && err.fields.currency) setError("currency", { message: err.fields.currency });
      setMessage({ tone: "error", text: `Not saved: ${errorMessage(err)}` });
    }
  });

  if (error) return <ErrorPanel message={errorMessage(error)} onRetry={() => mutate()} />;
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3" data-testid="currency-form">
      <p className="text-[13px] text-muted">
        Material prices (per kg as supplied) are entered in this currency and every cost is shown in it; nothing is converted.
        {data?.isDefault ? " This is the default." : ""}
      </p>
      <Field id="team-currency" label="Currency" hint="ISO 4217 code, e.g. EUR, USD, GBP" error={errors.currency?.message}>
        <input
          id="team-currency"
          maxLength={3}
          autoCapitalize="characters"
          spellCheck={false}
          disabled={!canEdit}
          className={`w-24 uppercase ${inputClass(!!errors.currency)}`}
          aria-invalid={errors.currency ? true : undefined}
          aria-describedby="team-currency-error"
          {...register("currency")}
        />
      </Field>
      {canEdit ? (
        <div>
          <Button type="submit" variant="primary" disabled={isSubmitting || !data}>
            Save currency
          </Button>
        </div>
      ) : null}
      <OutcomeMessage outcome={message} />
    </form>
  );
}
