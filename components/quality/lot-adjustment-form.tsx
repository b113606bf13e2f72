"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Field, inputClass } from "@/components/ui/field";
import { OutcomeMessage, type Outcome } from "@/components/ui/outcome";
import { lotSaveFailure } from "./lot-save-failure";
import { adjustLotStock } from "@/lib/client/lot-adjustments";
import { LOT_ADJUSTMENT_REASONS } from "@/lib/enums";
import { ADJUSTMENT_REASON_LABELS } from "@/lib/labels";
import { ADJUSTMENT_NOTE_MAX, lotAdjustmentFormSchema, type LotAdjustmentFormInput, type LotAdjustmentFormValues } from "@/lib/validations/lot-adjustments";

interface LotAdjustmentFormProps {
  lot: { id: string; version: number; unit: string; quantityOnHand: number };
}

const FIELDS = ["quantityOnHand", "reason", "note"] as const;

/**
 * "Adjust stock" on a lot page (production and admins): the quantity now on
 * hand as counted on the shelf, in the lot's unit, with a reason (and a note,
 * required for "other"). Sent with the lot's version as read; after someone
 * else's change (409) it offers to reload the saved lot.
 */
export function LotAdjustmentForm({ lot }: LotAdjustmentFormProps) {
  const router = useRouter();
  const [open, setOpen] = useState(false);
  const [outcome, setOutcome] = useState<Outcome>(null);
  const [stale, setStale] = useState(false);
  const { register, handleSubmit, formState, setError } = useForm<LotAdjustmentFormInput, unknown, LotAdjustmentFormValues>({
    resolver: zodResolver(lotAdjustmentFormSchema),
    defaultValues: { quantityOnHand: String(Number(lot.quantityOnHand.toPrecision(12))), reason: "recount", note: "" },
  });
  const { errors, isSubmitting } = formState;

  const onSubmit = handleSubmit(async (values) => {
    setOutcome(null);
    try {
      await adjustLotStock(lot.id, { version: lot.version, quantityOnHand: values.quantityOnHand, reason: values.reason, note: values.note });
      setOpen(false);
      router.refresh();
    } catch (err) {
      // after someone else's change (409 on the version) the form offers the saved lot (the page keys it by the lot's version)
      const failure = lotSaveFailure(err, FIELDS, (f, message) => setError(f, { message }));
      setStale(failure.stale);
      setOutcome({ tone: "error", text: failure.text });
    }
  });

  if (!open) {
    return (
      <Button className="mt-3" onClick={() => setOpen(true)}>
        Adjust stock
      </Button>
    );
  }
  const control = (name: (typeof FIELDS)[number], id: string) => ({
    id,
    className: inputClass(!!errors[name]),
    "aria-invalid": errors[name] ? true : undefined,
    "aria-describedby": `${id}-error`,
    ...register(name),
  });
  return (
    <form onSubmit={onSubmit} noValidate className="mt-3 flex flex-col gap-3 border-t border-rule pt-3" aria-label="Adjust the stock on hand">
      <p className="text-[13px] text-muted">
        Enter what is on the shelf now, in {lot.unit}, and why it differs from what the lot shows. A batch released from this lot later takes
        from the amount you enter.
      </p>
      <div className="grid gap-3 sm:grid-cols-2">
        <Field id="adjust-lot-quantity" label="Quantity on hand now" hint={`${lot.unit}, as counted`} error={errors.quantityOnHand?.message}>
          <input inputMode="decimal" {...control("quantityOnHand", "adjust-lot-quantity")} />
        </Field>
        <Field id="adjust-lot-reason" label="Reason" error={errors.reason?.message}>
          <select {...control("reason", "adjust-lot-reason")}>
            {LOT_ADJUSTMENT_REASONS.map((r) => (
              <option key={r} value={r}>
                {ADJUSTMENT_REASON_LABELS[r]}
              </option>
            ))}
          </select>
        </Field>
        <Field id="adjust-lot-note" label="Note" hint="required for Other" error={errors.note?.message} className="sm:col-span-2">
          <textarea rows={2} maxLength={ADJUSTMENT_NOTE_MAX} {...control("note", "adjust-lot-note")} />
        </Field>
      </div>
      <div className="flex items-center gap-3">
        <Button type="submit" variant="primary" busy={isSubmitting}>
          Save adjustment
        </Button>
        {stale ? <Button onClick={() => router.refresh()}>Reload the saved lot</Button> : null}
        <Button onClick={() => setOpen(false)} disabled={isSubmitting}>
          Cancel
        </Button>
        <OutcomeMessage outcome={outcome} />
      </div>
    </form>
  );
}
