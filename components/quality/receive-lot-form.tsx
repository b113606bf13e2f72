"use client";

import { useRouter } from "next/navigation";
import { useState, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { Field, inputClass } from "@/components/ui/field";
import { OutcomeMessage, type Outcome } from "@/components/ui/outcome";
import { Panel } from "@/components/ui/panel";
import { ApiRequestError, apiSend, errorMessage } from "@/lib/client/fetcher";

interface ReceiveLotFormProps {
  materials: { id: string; name: string }[];
}

const today = () => new Date().toISOString().slice(0, 10);

/** Receiving a lot: material, supplier, supplier lot number, quantity and unit, dates, optional measured assay. */
export function ReceiveLotForm({ materials }: ReceiveLotFormProps) {
  const router = useRouter();
  const [fields, setFields] = useState<Record<string, string>>({});
  const [outcome, setOutcome] = useState<Outcome>(null);
  const [busy, setBusy] = useState(false);

  async function submit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const f = new FormData(e.currentTarget);
    const text = (k: string) => String(f.get(k) ?? "").trim();
    const num = (k: string) => (text(k) === "" ? undefined : Number(text(k).replace(",", ".")));
    const assay = num("measuredAssay");
    setBusy(true);
    setFields({});
    setOutcome(null);
    try {
      const lot = await apiSend<{ id: string; supplierLot: string }>("POST", "/api/lots", {
        materialId: text("materialId"),
        supplier: text("supplier"),
        supplierLot: text("supplierLot"),
        quantity: num("quantity") ?? null,
        unit: text("unit"),
        receivedOn: text("receivedOn"),
        expiresOn: text("expiresOn") || null,
        measuredAssay: assay === undefined ? null : assay,
        notes: text("notes") || null,
      });
      router.push(`/lots/${lot.id}`);
    } catch (err) {
      if (err instanceof ApiRequestError) setFields(err.fields);
      setOutcome({ tone: "error", text: errorMessage(err) });
    } finally {
      setBusy(false);
    }
  }

  return (
    <Panel title="Receive a lot" id="receive">
      <form onSubmit={submit} className="grid gap-3 sm:grid-cols-2" noValidate>
        <Field id="lot-material" label="Material" error={fields.materialId}>
          <select id="lot-material" name="materialId" className={inputClass(!!fields.materialId)} defaultValue="">
            <option value="" disabled>
              Choose a material
            </option>
            {materials.map((m) => (
              <option key={m.id} value={m.id}>
                {m.name}
              </option>
            ))}
          </select>
        </Field>
        <Field id="lot-supplier" label="Supplier" error={fields.supplier}>
          <input id="lot-supplier" name="supplier" maxLength={200} className={inputClass(!!fields.supplier)} />
        </Field>
        <Field id="lot-number" label="Supplier lot number" error={fields.supplierLot}>
          <input id="lot-number" name="supplierLot" maxLength={100} className={inputClass(!!fields.supplierLot)} />
        </Field>
        <div className="flex gap-2">
          <Field id="lot-quantity" label="Quantity received" error={fields.quantity} className="flex-1">
            <input id="lot-quantity" name="quantity" inputMode="decimal" className={inputClass(!!fields.quantity)} />
          </Field>
          <Field id="lot-unit" label="Unit" error={fields.unit}>
            <select id="lot-unit" name="unit" className={inputClass(!!fields.unit)} defaultValue="kg">
              <option value="g">g</option>
              <option value="kg">kg</option>
              <option value="mL">mL</option>
              <option value="L">L</option>
            </select>
          </Field>
        </div>
        <Field id="lot-received" label="Received on" error={fields.receivedOn}>
          <input id="lot-received" name="receivedOn" type="date" defaultValue={today()} className={inputClass(!!fields.receivedOn)} />
        </Field>
        <Field id="lot-expires" label="Expires on" hint="leave empty when the supplier gives no expiry" error={fields.expiresOn}>
          <input id="lot-expires" name="expiresOn" type="date" className={inputClass(!!fields.expiresOn)} />
        </Field>
        <Field id="lot-assay" label="Measured assay (mass fraction, 0–1)" hint="optional; replaces the material's nominal assay for batches using this lot" error={fields.measuredAssay}>
          <input id="lot-assay" name="measuredAssay" inputMode="decimal" className={inputClass(!!fields.measuredAssay)} />
        </Field>
        <Field id="lot-notes" label="Notes" error={fields.notes}>
          <input id="lot-notes" name="notes" maxLength={5000} className={inputClass(!!fields.notes)} />
        </Field>
        <div className="sm:col-span-2 flex items-center gap-3">
          <Button type="submit" variant="primary" busy={busy}>
            Receive lot
          </Button>
          <OutcomeMessage outcome={outcome} />
        </div>
      </form>
    </Panel>
  );
}
