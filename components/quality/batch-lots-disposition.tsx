"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { DownloadLinks } from "@/components/exports/download-links";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Field, inputClass } from "@/components/ui/field";
import { OutcomeMessage, type Outcome } from "@/components/ui/outcome";
import { Panel } from "@/components/ui/panel";
import { TD, TDN, TH, THN } from "@/components/ui/table-head";
import { TEXT_LINK } from "@/components/ui/text-link";
import { apiSend, errorMessage } from "@/lib/client/fetcher";
import { DISPOSITION_LABELS } from "@/lib/labels";

type Disposition = keyof typeof DISPOSITION_LABELS;

export interface BatchLotsProps {
  batchId: string;
  open: boolean;
  closed: boolean;
  canRecord: boolean;
  canDispose: boolean;
  lines: { index: number; name: string; materialId: string; role?: string; grams: number | null }[];
  uses: { lineIndex: number; lotId: string; supplierLot: string; unit: string; quantityUsed: number | null; measuredAssay: number | null; nominalAssay: number; correctedGrams: number | null }[];
  choices: { id: string; materialId: string; supplierLot: string; unit: string; quantityOnHand: number; expiresOn: string | null }[];
  status: {
    disposition: { disposition: Disposition; justification: string | null; disposedByName: string | null; disposedAt: string | Date } | null;
    madeByYou: boolean;
    outOfSpecResults: { id: string }[];
    deviations: { lineIndex: number; name: string }[];
  };
}

const g = (n: number) => `${Number(n.toPrecision(6))} g`;

/** Lots of a batch (choose one per line while open; corrected masses for measured assays) and its disposition. */
export function BatchLotsDisposition(p: BatchLotsProps) {
  const router = useRouter();
  const [outcome, setOutcome] = useState<Outcome>(null);
  const [busy, setBusy] = useState(false);
  const [kind, setKind] = useState<Disposition>("released");
  const [justification, setJustification] = useState("");
  const [notes, setNotes] = useState<Record<number, string>>({});
  const byLine = new Map(p.uses.map((u) => [u.lineIndex, u]));

  async function choose(index: number, lotId: string) {
    setOutcome(null);
    try {
      await apiSend("PUT", `/api/batches/${p.batchId}/lines/${index}/lot`, { lotId: lotId || null });
      router.refresh();
    } catch (err) {
      setOutcome({ tone: "error", text: errorMessage(err) });
    }
  }

  async function dispose() {
    setBusy(true);
    setOutcome(null);
    try {
      await apiSend("POST", `/api/batches/${p.batchId}/disposition`, {
        disposition: kind,
        justification: justification.trim() || null,
        acknowledgedDeviations: kind === "rejected" ? [] : p.status.deviations.map((d) => ({ lineIndex: d.lineIndex, note: (notes[d.lineIndex] ?? "").trim() })).filter((d) => d.note),
      });
      router.refresh();
    } catch (err) {
      setOutcome({ tone: "error", text: errorMessage(err) });
    } finally {
      setBusy(false);
    }
  }

  const notices = p.uses.filter((u) => u.correctedGrams !== null && u.measuredAssay !== null);
  const d = p.status.disposition;
  return (
    <>
      <Panel title="Lots used" id="lots">
        <DownloadLinks
          links={[
            { href: `/api/batches/${p.batchId}/lots?format=xlsx`, label: "Lots (.xlsx)", description: "Every lot in this batch, as a workbook" },
            { href: `/api/batches/${p.batchId}/lots?format=csv`, label: "Lots (.csv)", description: "Every lot in this batch, as CSV" },
          ]}
        />
        {notices.map((u) => (
          <Alert key={u.lineIndex} tone="caution" title={`Line ${u.lineIndex + 1}: lot ${u.supplierLot} has a measured assay`} className="mt-2">
            Measured assay {u.measuredAssay} instead of the nominal {u.nominalAssay}: weigh {g(u.correctedGrams!)} for the same active amount (mass × nominal assay ÷
            measured assay).
          </Alert>
        ))}
        <table className="mt-2 w-full text-sm" data-testid="batch-lots">
          <thead>
            <tr>
              <th className={TH}>Line</th>
              <th className={TH}>Material</th>
              <th className={TH}>Lot</th>
              <th className={THN}>Taken at release</th>
            </tr>
          </thead>
          <tbody>
            {p.lines
              .filter((l) => l.role !== "water")
              .map((l) => {
                const use = byLine.get(l.index);
                const options = p.choices.filter((c) => c.materialId === l.materialId);
                return (
                  <tr key={l.index} className="border-t border-rule">
                    <td className={TD}>{l.index + 1}</td>
                    <td className={TD}>{l.name}</td>
                    <td className={TD}>
                      {p.open && p.canRecord ? (
                        <select
                          aria-label={`Lot for line ${l.index + 1} (${l.name})`}
                          className={inputClass(false, "py-0.5")}
                          value={use?.lotId ?? ""}
                          onChange={(e) => choose(l.index, e.target.value)}
                        >
                          <option value="">{options.length ? "Choose a lot (earliest expiry first)" : "No lot in stock"}</option>
                          {use && !options.some((o) => o.id === use.lotId) ? <option value={use.lotId}>{use.supplierLot}</option> : null}
                          {options.map((o) => (
                            <option key={o.id} value={o.id}>
                              {o.supplierLot} · {Number(o.quantityOnHand.toPrecision(6))} {o.unit} on hand · {o.expiresOn ? `expires ${o.expiresOn}` : "no expiry"}
                            </option>
                          ))}
                        </select>
                      ) : use ? (
                        <Link className={TEXT_LINK} href={`/lots/${use.lotId}`}>
                          {use.supplierLot}
                        </Link>
                      ) : (
                        <span className="text-muted">no lot chosen</span>
                      )}
                    </td>
                    <td className={TDN}>{use?.quantityUsed != null ? `${Number(use.quantityUsed.toPrecision(6))} ${use.unit}` : "—"}</td>
                  </tr>
                );
              })}
          </tbody>
        </table>
        {p.open ? <OutcomeMessage outcome={outcome} className="mt-2" /> : null}
      </Panel>
      {p.closed ? (
        <Panel title="Disposition" id="disposition">
          {d ? (
            <p className="text-sm" data-testid="disposition">
              <strong>{DISPOSITION_LABELS[d.disposition]}</strong>
              {d.disposedByName ? ` by ${d.disposedByName}` : ""} on {new Date(d.disposedAt).toISOString().slice(0, 16).replace("T", " ")} UTC
              {d.justification ? <span className="block whitespace-pre-wrap">Justification: {d.justification}</span> : null}
            </p>
          ) : !p.canDispose ? (
            <p className="text-sm text-muted">Waiting for a reviewer to release or reject this batch.</p>
          ) : p.status.madeByYou ? (
            <p className="text-sm">You started or recorded this batch; another reviewer must release or reject it.</p>
          ) : (
            <div className="flex flex-col gap-3">
              {p.status.outOfSpecResults.length > 0 ? (
                <Alert tone="fail" title="Blocks a release">
                  {p.status.outOfSpecResults.length} out-of-specification result{p.status.outOfSpecResults.length === 1 ? " is" : "s are"} not acknowledged.
                </Alert>
              ) : null}
              {p.status.deviations.map((dev) => (
                <Field key={dev.lineIndex} id={`dev-${dev.lineIndex}`} label={`Line ${dev.lineIndex + 1} (${dev.name}) is outside the weighing tolerance: acknowledge with a note`}>
                  <input
                    id={`dev-${dev.lineIndex}`}
                    className={inputClass()}
                    maxLength={2000}
                    value={notes[dev.lineIndex] ?? ""}
                    onChange={(e) => setNotes({ ...notes, [dev.lineIndex]: e.target.value })}
                  />
                </Field>
              ))}
              <fieldset className="flex flex-wrap gap-4 text-sm">
                <legend className="mb-1 font-medium">Decision</legend>
                {(Object.keys(DISPOSITION_LABELS) as Disposition[]).map((k) => (
                  <label key={k} className="flex items-center gap-1">
                    <input type="radio" name="disposition" value={k} checked={kind === k} onChange={() => setKind(k)} />
                    {DISPOSITION_LABELS[k]}
                  </label>
                ))}
              </fieldset>
              <Field id="disposition-justification" label="Justification" hint={kind === "released_under_deviation" ? "required for a release under deviation" : "optional"}>
                <textarea id="disposition-justification" rows={2} maxLength={5000} className={inputClass()} value={justification} onChange={(e) => setJustification(e.target.value)} />
              </Field>
              <div className="flex items-center gap-3">
                <Button variant="primary" busy={busy} onClick={dispose}>
                  Record disposition
                </Button>
                <OutcomeMessage outcome={outcome} />
              </div>
            </div>
          )}
        </Panel>
      ) : null}
    </>
  );
}
