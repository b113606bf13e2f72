"use client";

import { useBalanceResolution } from "@/components/results/balance";
import { BalanceSelect } from "@/components/results/balance-select";
import { ATMOSPHERE_LABELS, materialsById, LINE_ROLE_LABELS, STAGE_LABELS } from "@/components/results/words";
import { BatchCoat } from "@/components/production/batch-coat";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { SAFETY_REMINDER } from "@/components/ui/hazards";
import { TableHead } from "@/components/ui/table-head";
import type { FormulationInput, FormulationResult } from "@/lib/formulation";
import { fmtDateTime, fmtHours, fmtMass, fmtPercent, fmtRatio, fmtTemp, fmtVolume } from "@/lib/format";

interface BatchSheetProps {
  formulationName: string;
  project: string | null;
  revisionNumber: number;
  released: boolean;
  releasedAt: string | null;
  input: FormulationInput;
  result: FormulationResult;
}

const PRINT_CSS = `
@media print {
  @page { size: A4 landscape; margin: 10mm; }
  body { font-size: 10.5pt; }
  main { padding: 0 !important; max-width: none !important; }
  .batch-sheet { border: none !important; padding: 0 !important; }
  .batch-sheet table { page-break-inside: auto; }
  .batch-sheet tr { page-break-inside: avoid; }
  .batch-sheet .write-in { height: 9mm; }
}
`;

const DISPENSING_COLUMNS = [
  "#",
  "Material",
  "Lot number",
  { label: "Target mass", numeric: true },
  { label: "Target volume", numeric: true },
  "Actual mass (g)",
  "Time",
  "Initials",
];
const STEP_COLUMNS = ["#", "Step", { label: "Temperature", numeric: true }, { label: "Duration", numeric: true }, "Started", "Ended", "Initials"];

function basisWords(input: FormulationInput): string {
  const b = input.basis;
  if (b.type === "solidMass") return `${fmtMass(b.grams)} dry solid`;
  if (b.type === "solidsContent") return `${fmtMass(b.solMassGrams)} of sol at ${fmtPercent(b.solidsFraction)} solids`;
  return `gel body of ${fmtVolume(b.volumeMl)} at ${b.bulkDensity} g/cm³`;
}

/** A printable batch sheet: order of addition, targets, blank columns to fill in, the coating settings and VOC, safety cautions. */
export function BatchSheet({ formulationName, project, revisionNumber, released, releasedAt, input, result }: BatchSheetProps) {
  const [resolution, setResolution] = useBalanceResolution();
  const byId = materialsById(input);
  const dispensed = result.lines.map((l) => byId.get(l.materialId)).filter((m) => m !== undefined);
  const hazardous = dispensed.filter((m, i, all) => (m.hazards?.length ?? 0) > 0 && all.indexOf(m) === i);
  const cautions = result.notices.filter((n) => n.level !== "info");
  const cell = "border border-ink/60 px-2 py-1";
  const head = `${cell} bg-paper text-left text-xs font-semibold`;
  return (
    <article className="batch-sheet rounded border border-rule bg-panel p-4" data-testid="batch-sheet">
      <style>{PRINT_CSS}</style>
      <div className="no-print mb-3 flex flex-wrap items-center justify-between gap-2">
        <BalanceSelect value={resolution} onChange={setResolution} />
        <Button variant="primary" onClick={() => window.print()}>
          Print batch sheet
        </Button>
      </div>
      {!released ? (
        <Alert tone="fail" role="status" className="mb-3" title="Preview only: this revision is not released to production. Do not use it to make a batch." />
      ) : null}
      <header className="flex flex-wrap items-start justify-between gap-3 border-b border-ink/60 pb-2">
        <div>
          <p className="text-xs tracking-wide text-muted uppercase">Gelwright batch sheet</p>
          <h1 className="text-xl font-semibold">{formulationName}</h1>
          <p className="text-sm">
            Revision {revisionNumber}
            {releasedAt ? ` · released ${fmtDateTime(releasedAt)}` : ""} · {project ?? "No project"}
          </p>
          <p className="num text-sm">
            Batch: {basisWords(input)} · sol {fmtMass(result.sol.massGrams, resolution)} (≈ {fmtVolume(result.sol.volumeMl)}) · solids{" "}
            {fmtPercent(result.sol.solidsFraction, 2)} · masses to {resolution} g
          </p>
        </div>
        <dl className="grid grid-cols-[auto_12rem] gap-x-2 gap-y-1 text-sm">
          <dt>Batch lot number</dt>
          <dd className="border-b border-ink/60" />
          <dt>Date</dt>
          <dd className="border-b border-ink/60" />
          <dt>Made by</dt>
          <dd className="border-b border-ink/60" />
          <dt>Balance id</dt>
          <dd className="border-b border-ink/60" />
        </dl>
      </header>

      <section aria-label="Safety cautions" className="mt-3 rounded border-2 border-caution bg-caution-soft px-3 py-2 text-sm">
        <h2 className="font-semibold text-caution">
          <span aria-hidden="true">⚠ </span>Safety cautions
        </h2>
        <ul className="mt-1 list-disc pl-5">
          {hazardous.map((m) => (
            <li key={m.id}>
              {m.name}: GHS <span className="num font-mono">{m.hazards!.join(", ")}</span>
            </li>
          ))}
          {cautions.map((n, i) => (
            <li key={`${n.code}-${i}`}>
              <span className="font-medium">{n.level === "error" ? "Error" : "Caution"}:</span> {n.message}
            </li>
          ))}
        </ul>
        <p className="mt-1 font-medium">{SAFETY_REMINDER}</p>
      </section>

      <h2 className="mt-4 mb-1 text-sm font-semibold">Dispensing, in order of addition</h2>
      <div className="overflow-x-auto">
        <table className="w-full border-collapse text-sm">
          <caption className="sr-only">Dispensing, in order of addition</caption>
          <TableHead columns={DISPENSING_COLUMNS} cellClassName={head} />
          <tbody>
            {result.lines.map((l, i) => {
              const m = byId.get(l.materialId);
              return (
                <tr key={`${l.materialId}-${l.role}`} className="write-in">
                  <td className={`${cell} num`}>{i + 1}</td>
                  <td className={cell}>
                    <span className="font-medium">{m?.name ?? l.materialId}</span>
                    <span className="block text-xs text-muted">
                      {LINE_ROLE_LABELS[l.role]}
                      {m?.hazards?.length ? ` · GHS ${m.hazards.join(", ")}` : ""}
                    </span>
                    {l.role === "modifier" ? <ModifierNote input={input} materialId={l.materialId} /> : null}
                  </td>
                  <td className={`${cell} min-w-[7rem]`} />
                  <td className={`${cell} num text-right font-semibold whitespace-nowrap`}>{fmtMass(l.massGrams, resolution)}</td>
                  <td className={`${cell} num text-right whitespace-nowrap`}>{fmtVolume(l.volumeMl)}</td>
                  <td className={`${cell} min-w-[6rem]`} />
                  <td className={`${cell} min-w-[4rem]`} />
                  <td className={`${cell} min-w-[4rem]`} />
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>

      <h2 className="mt-4 mb-1 text-sm font-semibold">Process steps</h2>
      <div className="overflow-x-auto">
        <table className="w-full border-collapse text-sm">
          <caption className="sr-only">Process steps</caption>
          <TableHead columns={STEP_COLUMNS} cellClassName={head} />
          <tbody>
            {input.steps.map((s, i) => (
              <tr key={i} className="write-in">
                <td className={`${cell} num`}>{i + 1}</td>
                <td className={cell}>
                  {s.name}
                  <span className="block text-xs text-muted">
                    {STAGE_LABELS[s.stage ?? "curing"]} · {ATMOSPHERE_LABELS[s.atmosphere ?? "air"]}
                  </span>
                </td>
                <td className={`${cell} num text-right`}>{fmtTemp(s.temperatureC)}</td>
                <td className={`${cell} num text-right`}>{fmtHours(s.durationH)}</td>
                <td className={`${cell} min-w-[5rem]`} />
                <td className={`${cell} min-w-[5rem]`} />
                <td className={`${cell} min-w-[4rem]`} />
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {result.thermal.maxAllowedC !== undefined ? (
        <p className="mt-2 text-sm">
          Thermal limit: never reach <strong className="num">{fmtTemp(result.thermal.maxAllowedC + (input.marginC ?? 20))}</strong> in any step;
          the highest step temperature with the {fmtTemp(input.marginC ?? 20)} margin is{" "}
          <strong className="num">{fmtTemp(result.thermal.maxAllowedC)}</strong>. Check the oven set point and its calibration.
        </p>
      ) : null}
      <BatchCoat input={input} result={result} cellClassName={cell} headClassName={head} />

      <footer className="mt-6 grid gap-4 text-sm sm:grid-cols-2">
        <p>
          Made by (signature) <span className="ml-2 inline-block w-48 border-b border-ink/60" />
        </p>
        <p>
          Checked by (signature) <span className="ml-2 inline-block w-48 border-b border-ink/60" />
        </p>
      </footer>
    </article>
  );
}

interface ModifierNoteProps {
  input: FormulationInput;
  materialId: string;
}

/** Which precursor a modifier line goes onto, and that it goes in before any water. */
function ModifierNote({ input, materialId }: ModifierNoteProps) {
  const names = new Map(input.materials.map((m) => [m.id, m.name]));
  const specs = (input.modifiers ?? []).filter((m) => m.materialId === materialId);
  if (specs.length === 0) return null;
  return (
    <span className="block text-xs" data-testid="modifier-note">
      onto {specs.map((m) => `${names.get(m.precursorId) ?? m.precursorId} (${fmtRatio(m.molPerMetal)} mol/mol metal)`).join(", ")}; stir before adding
      any water
    </span>
  );
}
