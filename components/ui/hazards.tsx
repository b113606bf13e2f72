interface HazardCodesProps {
  codes?: readonly string[];
}

/** GHS hazard statement codes of a material, as compact tags. */
export function HazardCodes({ codes }: HazardCodesProps) {
  if (!codes || codes.length === 0) return <span className="text-muted">none listed</span>;
  return (
    <span className="inline-flex flex-wrap gap-1" aria-label={`GHS hazard statements ${codes.join(", ")}`}>
      <span aria-hidden="true" className="text-caution">⚠</span>
      {codes.map((c) => (
        <span key={c} className="num rounded border border-caution/50 bg-caution-soft px-1 font-mono text-[11px] text-caution">
          {c}
        </span>
      ))}
    </span>
  );
}

/** The standing safety reminder wherever hazardous materials appear. */
export const SAFETY_REMINDER =
  "Check the supplier's safety data sheet; follow local regulations and licensed practice.";

interface SafetyNoteProps {
  /** Names and GHS codes of the hazardous materials in view. */
  items: { name: string; hazards?: readonly string[] }[];
  className?: string;
}

/** A caution listing the hazardous materials in view and their GHS codes. */
export function SafetyNote({ items, className = "" }: SafetyNoteProps) {
  const hazardous = items.filter((i) => i.hazards && i.hazards.length > 0);
  if (hazardous.length === 0) return null;
  return (
    <div role="note" aria-label="Safety caution" className={`rounded border border-caution/50 bg-caution-soft px-3 py-2 text-sm ${className}`}>
      <p className="font-medium text-caution">
        <span aria-hidden="true">⚠ </span>Caution: hazardous materials
      </p>
      <ul className="mt-1 flex flex-col gap-0.5">
        {hazardous.map((i) => (
          <li key={i.name}>
            {i.name}: <span className="num font-mono text-[12px]">{i.hazards!.join(", ")}</span>
          </li>
        ))}
      </ul>
      <p className="mt-1 text-ink">{SAFETY_REMINDER}</p>
    </div>
  );
}
