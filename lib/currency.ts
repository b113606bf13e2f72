/**
 * The team's currency: the one its material prices (price per kg as supplied)
 * are in. An ISO 4217 alphabetic code, three capital letters. The engine never
 * converts currencies; the code is shown beside every cost.
 */

/** A team that never chose a currency prices in euros. */
export const DEFAULT_CURRENCY = "EUR";

/** Three capital Latin letters (ISO 4217 alphabetic code). */
export const CURRENCY_CODE = /^[A-Z]{3}$/;

/**
 * A money figure with its currency code, two decimals ("12.35 EUR"); more
 * significant figures below 1 so a cost per m² of a thin coat does not read 0.00.
 *
 * @example
 * ```ts
 * fmtMoney(12.345, "EUR"); // "12.35 EUR"
 * fmtMoney(0.004321, "USD"); // "0.004321 USD"
 * ```
 */
export function fmtMoney(value: number | null | undefined, currency: string): string {
  if (typeof value !== "number" || !Number.isFinite(value)) return "–";
  const abs = Math.abs(value);
  const text = abs === 0 || abs >= 1 ? value.toFixed(2) : value.toPrecision(4).replace(/(\.\d*?[1-9])0+$/, "$1");
  return `${text}\u00a0${currency}`;
}
