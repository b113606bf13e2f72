"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Field, inputClass } from "@/components/ui/field";
import { OutcomeMessage, type Outcome } from "@/components/ui/outcome";
import { lotSaveFailure } from "./lot-save-failure";
import { apiSend } from "@/lib/client/fetcher";
import { LOT_CORRECTION_FIELDS, lotCorrectionFormSchema, type LotCorrectionFormInput, type LotCorrectionFormValues } from "@/lib/validations/lots";

interface LotCorrectionFormProps {
  lot: {
    id: string;
    version: number;
    supplier: string;
    supplierLot: string;
    expiresOn: string | null;
    measuredAssay: number | null;
    notes: string | null;
  };
}

type Stored = Record<(typeof LOT_CORRECTION_FIELDS)[number], string | number | null>;

/**
 * "Edit" on a lot page (production and admins): corrects the supplier, the
 * supplier lot number, the expiry date, the measured assay and the notes.
 * Only the changed fields are sent, with the lot's version as read.
 */
export function LotCorrectionForm({ lot }: LotCorrectionFormProps) {
  const router = useRouter();
  const [open, setOpen] = useState(false);
  const [outcome, setOutcome] = useState<Outcome>(null);
  const [stale, setStale] = useState(false);
  const { register, handleSubmit, formState, setError } = useForm<LotCorrectionFormInput, unknown, LotCorrectionFormValues>({
    resolver: zodResolver(lotCorrectionFormSchema),
    defaultValues: {
      supplier: lot.supplier,
      supplierLot: lot.supplierLot,
      expiresOn: lot.expiresOn ?? "",
      measuredAssay: lot.measuredAssay === null ? "" : String(lot.measuredAssay),
      notes: lot.notes ?? "",
    },
  });
  const { errors, isSubmitting } = formState;

  const onSubmit = handleSubmit(async (values) => {
    setOutcome(null);
    const stored: Stored = { supplier: lot.supplier, supplierLot: lot.supplierLot, expiresOn: lot.expiresOn, measuredAssay: lot.measuredAssay, notes: lot.notes };
    const changes = Object.fromEntries(LOT_CORRECTION_FIELDS.filter((f) => values[f] !== stored[f]).map((f) => [f, values[f]]));
    if (Object.keys(changes).length === 0) {
      setOutcome({ tone: "info", text: "Nothing changed." });
      return;
    }
    try {
      await apiSend("PATCH", `/api/lots/${lot.id}`, { version: lot.version, ...changes });
      setOpen(false);
      router.refresh();
    } catch (err) {
      // after someone else's change (409 on the version) the form offers the saved lot (the page keys it by the lot's version)
      const failure = lotSaveFailure(err, LOT_CORRECTION_FIELDS, (f, message) => setError(f, { message }));
      setStale(failure.stale);
      setOutcome({ tone: "error", text: failure.text });
    }
  });

  if (!open) {
    return (
      <Button className="mt-3" onClick={() => setOpen(true)}>
        Edit
      </Button>
    );
  }
  const input = (name: (typeof LOT_CORRECTION_FIELDS)[number], id: string) => ({
    id,
    className: inputClass(!!errors[name]),
    "aria-invalid": errors[name] ? true : undefined,
    "aria-describedby": `${id}-error`,
    ...register(name),
  });
  return (
    <form onSubmit={onSubmit} noValidate className="mt-3 flex flex-col gap-3 border-t border-rule pt-3" aria-label="Correct this lot">
      <p className="text-[13px] text-muted">
        Correct what was mistyped at receipt, or enter the assay once it is measured. The quantities are not corrected here: they change only
        when a batch using the lot is released.
      </p>
      <div className="grid gap-3 sm:grid-cols-2">
        <Field id="edit-lot-supplier" label="Supplier" error={errors.supplier?.message}>
          <input maxLength={200} {...input("supplier", "edit-lot-supplier")} />
        </Field>
        <Field id="edit-lot-number" label="Supplier lot number" error={errors.supplierLot?.message}>
          <input maxLength={100} {...input("supplierLot", "edit-lot-number")} />
        </Field>
        <Field id="edit-lot-expires" label="Expires on" hint="empty: no expiry given" error={errors.expiresOn?.message}>
          <input type="date" {...input("expiresOn", "edit-lot-expires")} />
        </Field>
        <Field id="edit-lot-assay" label="Measured assay (mass fraction, 0–1)" hint="empty: not measured" error={errors.measuredAssay?.message}>
          <input inputMode="decimal" {...input("measuredAssay", "edit-lot-assay")} />
        </Field>
        <Field id="edit-lot-notes" label="Notes" error={errors.notes?.message} className="sm:col-span-2">
          <textarea rows={2} maxLength={5000} {...input("notes", "edit-lot-notes")} />
        </Field>
      </div>
      <p className="text-[13px] text-muted" data-testid="lot-assay-help">
        A new measured assay applies to batches not yet released: their corrected mass to weigh follows it. Batches already released from
        this lot keep the assay they were released with; their records do not change.
      </p>
      <div className="flex items-center gap-3">
        <Button type="submit" variant="primary" busy={isSubmitting}>
          Save correction
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
