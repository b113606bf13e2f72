/**
 * Display formatting. Rounding happens here only: the engine's numbers stay at
 * full precision everywhere else. Every figure carries its unit.
 */

const NBSP = "\u00a0";

/** Balance resolutions a user can choose, g. */
export const BALANCE_RESOLUTIONS = [1, 0.1, 0.01, 0.001, 0.0001] as const;
/** The default balance resolution, g (a two-decimal top-loading balance). */
export const DEFAULT_BALANCE_RESOLUTION = 0.01;

/** Decimal places that a resolution such as 0.01 g shows (2). */
export function decimalsFor(resolution: number): number {
  if (!(resolution > 0)) return 2;
  return Math.max(0, Math.round(-Math.log10(resolution)));
}

function finite(value: number | null | undefined): value is number {
  return typeof value === "number" && Number.isFinite(value);
}

/** Rounds to a multiple of `resolution` and prints the matching decimals. */
export function roundTo(value: number, resolution: number): string {
  const decimals = decimalsFor(resolution);
  const rounded = Math.round(value / resolution) * resolution;
  const text = rounded.toFixed(decimals);
  return text === `-${(0).toFixed(decimals)}` ? (0).toFixed(decimals) : text;
}

/** A number to `digits` significant figures, without exponent for everyday magnitudes. */
export function sig(value: number, digits = 4): string {
  if (!finite(value)) return "–";
  if (value === 0) return "0";
  const magnitude = Math.floor(Math.log10(Math.abs(value)));
  const decimals = Math.max(0, digits - 1 - magnitude);
  if (decimals > 10) return value.toExponential(digits - 1);
  return value.toFixed(decimals);
}

/** Mass to the balance resolution: "12.35 g". */
export function fmtMass(grams: number | null | undefined, resolution = DEFAULT_BALANCE_RESOLUTION): string {
  return finite(grams) ? `${roundTo(grams, resolution)}${NBSP}g` : "–";
}

/** Volume as supplied: 0.01 mL below 10 mL, 0.1 mL up to 1 L, 1 mL above. */
export function fmtVolume(ml: number | null | undefined): string {
  if (!finite(ml)) return "–";
  const resolution = Math.abs(ml) < 10 ? 0.01 : Math.abs(ml) < 1000 ? 0.1 : 1;
  return `${roundTo(ml, resolution)}${NBSP}mL`;
}

/** Amount of substance: "0.1234 mol" (4 significant figures). */
export function fmtMol(mol: number | null | undefined): string {
  return finite(mol) ? `${sig(mol, 4)}${NBSP}mol` : "–";
}

/** A fraction as a percentage: 0.1234 → "12.3 %". */
export function fmtPercent(fraction: number | null | undefined, decimals = 1): string {
  return finite(fraction) ? `${(fraction * 100).toFixed(decimals)}${NBSP}%` : "–";
}

/** Temperature in °C, to 0.1 °C when not whole. */
export function fmtTemp(celsius: number | null | undefined): string {
  if (!finite(celsius)) return "–";
  return `${Number.isInteger(celsius) ? celsius.toFixed(0) : celsius.toFixed(1)}${NBSP}°C`;
}

/** Density: "1.234 g/cm³". */
export function fmtDensity(value: number | null | undefined): string {
  return finite(value) ? `${sig(value, 4)}${NBSP}g/cm³` : "–";
}

/** A dimensionless ratio such as R or h: "1.50". */
export function fmtRatio(value: number | null | undefined, digits = 3): string {
  return finite(value) ? sig(value, digits) : "–";
}

/** Any figure with a unit, to 4 significant figures. */
export function fmtQuantity(value: number | null | undefined, unit: string, digits = 4): string {
  return finite(value) ? `${sig(value, digits)}${NBSP}${unit}` : "–";
}

/** Duration in hours: "2 h", "0.25 h". */
export function fmtHours(hours: number | null | undefined): string {
  return finite(hours) ? `${Number(hours.toPrecision(4))}${NBSP}h` : "–";
}

const dateTime = new Intl.DateTimeFormat("en-GB", {
  day: "numeric",
  month: "short",
  year: "numeric",
  hour: "2-digit",
  minute: "2-digit",
  timeZone: "UTC",
});
const dateOnly = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric", timeZone: "UTC" });

/** "12 Mar 2026, 14:05 UTC" (UTC so server and browser agree). */
export function fmtDateTime(value: string | Date | null | undefined): string {
  if (!value) return "–";
  const d = typeof value === "string" ? new Date(value) : value;
  return Number.isNaN(d.getTime()) ? "–" : `${dateTime.format(d)} UTC`;
}

/** "12 Mar 2026". */
export function fmtDate(value: string | Date | null | undefined): string {
  if (!value) return "–";
  const d = typeof value === "string" ? new Date(value) : value;
  return Number.isNaN(d.getTime()) ? "–" : dateOnly.format(d);
}
