/**
 * The coat in the exports: what production must set (method, speed or rpm,
 * the expected wet and dry thickness, the area and the sol it needs) and the
 * VOC figure, for the batch sheet; and every coat prediction (thickness,
 * index against the substrate, VOC, epoxy–amine balance, cost) for the
 * revision workbook's overview. Rows are Item / Value / Unit; values keep
 * their full precision, each row carries the step it is shown at.
 */
import type { CoatingSpec, FormulationInput, FormulationResult } from "@/lib/formulation";
import type { Cell } from "./types";

/** One Item / Value / Unit row and the resolution its value is shown at. */
export interface CoatRow {
  item: string;
  value: Cell;
  unit: string;
  /** Resolution the value is shown at (undefined: text, or shown as it is). */
  step?: number;
}

/** Words for the coating methods on sheets production reads. */
export const COATING_METHOD_WORDS: Record<CoatingSpec["method"], string> = {
  dip: "dip coating",
  spin: "spin coating",
  wetFilm: "wet film (bar, slot die or spray)",
};

/**
 * The step that shows `value` to `digits` significant figures: 0.01 for 1.234
 * at 3 figures, 10 for 1234 at 3 figures. Display only; the cell keeps the
 * exact value.
 *
 * @example significantStep(1.987, 3) // 0.01
 * @example significantStep(712.4, 3) // 1
 */
export function significantStep(value: number, digits = 3): number | undefined {
  if (!Number.isFinite(value) || value === 0) return undefined;
  const exponent = Math.floor(Math.log10(Math.abs(value))) - digits + 1;
  // 10 ** -n is not always exact in binary (10 ** -5 = 0.000009999999999999999): build it from text.
  return Number(`1e${exponent}`);
}

function row(item: string, value: number | undefined, unit: string, digits = 3): CoatRow[] {
  if (value === undefined || !Number.isFinite(value)) return [];
  return [{ item, value, unit, step: significantStep(value, digits) }];
}

/** The coating settings as stated in the recipe, in production's words. */
function settingRows(coating: CoatingSpec): CoatRow[] {
  const rows: CoatRow[] = [{ item: "Coating method", value: COATING_METHOD_WORDS[coating.method], unit: "" }];
  if (coating.method === "dip") {
    rows.push(
      ...row("Withdrawal speed", coating.withdrawalMmPerS, "mm/s"),
      ...row("Sol viscosity (for the prediction)", coating.viscosityMPaS, "mPa·s"),
      ...row("Sol surface tension (for the prediction)", coating.surfaceTensionMNPerM, "mN/m"),
    );
  } else if (coating.method === "spin") {
    rows.push(
      ...row("Spin speed", coating.rpm, "rpm"),
      ...row("Calibration film: spin speed", coating.calibration.rpm, "rpm"),
      ...row("Calibration film: dry thickness", coating.calibration.dryThicknessNm, "nm"),
    );
  } else {
    rows.push(...row("Wet film thickness to lay", coating.wetThicknessUm, "µm"));
  }
  return rows;
}

/** What the film will be and what a target needs, from the engine's coating result. */
function filmRows(coating: CoatingSpec, film: FormulationResult["coating"]): CoatRow[] {
  const rows: CoatRow[] = [];
  if (film) {
    if (coating.method !== "wetFilm") rows.push(...row("Expected wet film thickness", film.wetThicknessUm, "µm"));
    rows.push(...row("Expected dry film thickness", film.dryThicknessNm, "nm"));
  }
  rows.push(...row("Target dry thickness", coating.targetDryThicknessNm, "nm"));
  if (film?.withdrawalMmPerSForTarget !== undefined) rows.push(...row("Withdrawal speed for the target", film.withdrawalMmPerSForTarget, "mm/s"));
  if (film?.rpmForTarget !== undefined) rows.push(...row("Spin speed for the target", film.rpmForTarget, "rpm"));
  rows.push(...row("Area to coat", coating.areaM2, "m²"));
  if (film?.solMlForArea !== undefined) rows.push(...row("Sol needed for the area (no losses)", film.solMlForArea, "mL"));
  if (film) rows.push(...row("Coverage (no losses)", film.coverageM2PerL, "m² per litre of sol"));
  return rows;
}

/** VOC in both bases and for the batch. */
function vocRows(voc: FormulationResult["voc"]): CoatRow[] {
  if (!voc) return [];
  return [
    ...row("VOC", voc.gramsPerLitre, "g/L of sol"),
    // The basis of ASTM D3960 and US EPA Method 24: g per litre of sol less its water.
    ...row("VOC less water", voc.gramsPerLitreLessWater, "g/L of sol less water"),
    ...row("VOC in the batch (hydrolysis alcohol included)", voc.massGrams, "g"),
  ];
}

/**
 * The batch sheet's coating and VOC rows: the settings production must use
 * (method, speed or rpm, wet thickness), the expected wet and dry thickness,
 * the target, the area and the sol it needs, and VOC in g/L and g/L less
 * water. Empty when the revision has neither a coating nor a VOC figure.
 *
 * @example
 * ```ts
 * batchCoatRows(input, result).map((r) => r.item); // ["Coating method", "Withdrawal speed", …, "VOC", "VOC less water", "VOC in the batch"]
 * ```
 */
export function batchCoatRows(input: FormulationInput, result: FormulationResult | null): CoatRow[] {
  return [...batchCoatingRows(input, result), ...vocRows(result?.voc)];
}

/** The coating part of `batchCoatRows` alone (empty without a coating). */
export function batchCoatingRows(input: FormulationInput, result: FormulationResult | null): CoatRow[] {
  return input.coating ? [...settingRows(input.coating), ...filmRows(input.coating, result?.coating)] : [];
}

/** The VOC part of `batchCoatRows` alone (empty for a result stored before VOC was computed). */
export function batchVocRows(result: FormulationResult | null): CoatRow[] {
  return vocRows(result?.voc);
}

function costUnit(currency: string | undefined, per: string): string {
  return `${currency ?? "team's currency"}${per}`;
}

/** A money row: to the cent from 1 up, three significant figures below (a thin coat's cost per m²). */
function money(item: string, value: number | undefined, unit: string): CoatRow[] {
  if (value === undefined || !Number.isFinite(value)) return [];
  return [{ item, value, unit, step: Math.abs(value) >= 1 ? 0.01 : significantStep(value, 3) }];
}

/**
 * Every coat prediction for the revision workbook's overview: the film (with
 * its capillary number), the refractive index beside the substrate's, VOC, the
 * epoxy–amine balance and the cost, each only when the engine gave it.
 *
 * @param currency - the team's currency code (ISO 4217), written beside each cost
 */
export function coatPredictionRows(input: FormulationInput, result: FormulationResult, currency?: string): CoatRow[] {
  const rows: CoatRow[] = [];
  const film = result.coating;
  if (input.coating) {
    rows.push({ item: "Coat: method", value: COATING_METHOD_WORDS[input.coating.method], unit: "" });
  }
  if (film) {
    rows.push(
      ...row("Coat: solid volume fraction of the sol", film.solidVolumeFraction, "fraction"),
      ...row("Coat: wet film thickness", film.wetThicknessUm, "µm"),
      ...row("Coat: dry film thickness", film.dryThicknessNm, "nm"),
      ...row("Coat: coverage (no losses)", film.coverageM2PerL, "m² per litre of sol"),
    );
    if (film.capillaryNumber !== undefined) {
      rows.push(...row("Coat: capillary number Ca", film.capillaryNumber, film.capillaryNumber > 0.01 ? "above 0.01: outside the Landau–Levich range" : "within the Landau–Levich range (Ca ≪ 1)"));
    }
    rows.push(
      ...row("Coat: withdrawal speed for the target", film.withdrawalMmPerSForTarget, "mm/s"),
      ...row("Coat: spin speed for the target", film.rpmForTarget, "rpm"),
      ...row("Coat: sol needed for the area (no losses)", film.solMlForArea, "mL"),
    );
  }
  const optics = result.optics;
  if (optics) {
    rows.push(...row("Refractive index of the dry coat", optics.refractiveIndex, "n_D, 589 nm", 4));
    rows.push(...row("Refractive index of the substrate", optics.substrateIndex, "n_D, 589 nm", 4));
    if (optics.mismatch !== undefined) {
      const fringes = Math.abs(optics.mismatch) > 0.01 ? "more than 0.01: interference fringes likely on a transparent substrate" : "within 0.01";
      rows.push({ item: "Index mismatch, coat − substrate", value: optics.mismatch, unit: fringes, step: 0.001 });
    }
  }
  rows.push(...vocRows(result.voc));
  const cure = result.cure;
  if (cure) {
    rows.push(...row("Epoxy groups", cure.epoxyEq, "mol (eq)"), ...row("Amine hydrogens", cure.amineHydrogenEq, "mol (eq)"));
    rows.push(...row("Epoxy–amine ratio", cure.ratio, cure.ratio !== undefined && (cure.ratio < 0.8 || cure.ratio > 1.2) ? "amine-H eq per epoxy eq: outside 0.8–1.2" : "amine-H eq per epoxy eq"));
  }
  const cost = result.cost;
  if (cost) {
    rows.push(
      ...money("Cost of the batch", cost.total, costUnit(currency, "")),
      ...money("Cost per kg of dry composite", cost.perKgDry, costUnit(currency, " per kg")),
      ...money("Cost per litre of sol", cost.perLitreSol, costUnit(currency, " per L")),
      ...money("Cost per m² coated", cost.perM2, costUnit(currency, " per m²")),
    );
  }
  return rows;
}

/** Rows as cells, and the step of each row. */
export function coatCells(rows: readonly CoatRow[]): { rows: Cell[][]; rowSteps: (number | undefined)[] } {
  return { rows: rows.map((r) => [r.item, r.value, r.unit]), rowSteps: rows.map((r) => r.step) };
}
