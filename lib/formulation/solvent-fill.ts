import type { DecLine } from "./composition";
import { MIN_LINE_GRAMS, WATER_MOLAR_MASS_G_PER_MOL } from "./constants";
import type { Basis } from "./input-schema";
import { type Dec, dec, ONE, per, positive, quotient, timesFactor, WATER_MOL_PER_GRAM, wide, ZERO } from "./decimal";
import { FormulationError } from "./errors";
import { requireDensity, solutionWaterMol, volumeOf, waterFractionOf, type IndexedMaterial } from "./material-index";

/** What a fill makes the sol up to. */
export interface FillTarget {
  /** "mass": sol mass in g (solids-content basis); "volume": mould volume in mL (gel-body basis). */
  kind: "mass" | "volume";
  /** g or mL. */
  amount: Dec;
}

/** Result of a fill: solvent as supplied (g) and water still to add (mol). */
export interface FillResult {
  solventGrams: Dec;
  addWaterMol: Dec;
}

/**
 * Solves a solvent fill (chemistry: "Solvent 2."): the added solvent makes
 * the sol up to the basis's sol mass (or mould volume, ideal mixing),
 * counting the water the solvent itself carries toward the water target.
 * With c_s the cost of 1 g solvent (1 g, or 1/ρs mL), c_w the cost of 1 mol
 * added water (M_w g, or M_w/ρw mL) and p = waterFraction / 18.015 the water
 * carried per g solvent, the solvent mass m solves
 * m · c_s + max(0, need − m · p) · c_w = target − others.
 * Throws "mould_too_small" (field basis.volumeMl) or "solids_content_too_high"
 * (field basis.solidsFraction) when the other reagents alone exceed the target.
 *
 * @param p - target; mass and volume of everything else; water still needed
 *   (mol, W − C without the solvent, may be negative); solvent and water materials
 * @returns solvent grams and water to add (mol), both ≥ 0
 * @example
 * ```ts
 * // 100 g sol, others 40 g, 0.5 mol water needed (9.0075 g), dry ethanol → 50.9925 g ethanol
 * solveFill({ target: { kind: "mass", amount: new Dec(100) }, otherGrams: new Dec(40), otherMl: new Dec(45),
 *   waterNeededMol: new Dec(0.5), solvent: ethanol, water: waterDi }).solventGrams.toNumber(); // 50.9925
 * ```
 */
export function solveFill(p: {
  target: FillTarget;
  otherGrams: Dec;
  otherMl: Dec;
  waterNeededMol: Dec;
  solvent: IndexedMaterial;
  water: IndexedMaterial;
  /** S, g of dry composite: lets the error state the highest reachable solids content. */
  solidGrams?: Dec;
}): FillResult {
  const isVolume = p.target.kind === "volume";
  const needMol = positive(p.waterNeededMol) ? p.waterNeededMol : ZERO;
  const waterMolarMass = dec(p.water.material.molarMass ?? WATER_MOLAR_MASS_G_PER_MOL);
  const solventCost = isVolume ? ONE.div(requireDensity(p.solvent)) : ONE;
  const waterCost = needMol.isZero()
    ? ZERO
    : isVolume
      ? waterMolarMass.div(requireDensity(p.water))
      : waterMolarMass;
  const carriedPerGram = waterFractionOf(p.solvent.material).times(WATER_MOL_PER_GRAM);
  const available = p.target.amount.minus(isVolume ? p.otherMl : p.otherGrams);
  const reagentsAlone = p.target.amount.minus(available).plus(needMol.times(waterCost));

  let solventGrams: Dec;
  let addWaterMol: Dec;
  if (needMol.isZero()) {
    solventGrams = quotient(available, solventCost);
    addWaterMol = ZERO;
  } else {
    const coefficient = solventCost.minus(carriedPerGram.times(waterCost));
    if (!positive(coefficient)) {
      throw new FormulationError(
        "invalid_input",
        `${p.solvent.path}.waterFraction`,
        `${p.solvent.material.name} carries so much water that adding it cannot make up the sol; use a drier solvent`,
      );
    }
    solventGrams = quotient(available.minus(needMol.times(waterCost)), coefficient);
    addWaterMol = needMol.minus(solventGrams.times(carriedPerGram));
    if (addWaterMol.isNegative()) {
      solventGrams = quotient(available, solventCost);
      addWaterMol = ZERO;
    }
  }

  // No room left: a remainder within rounding of zero is no solvent at all, not a 1e-14 g line or an error.
  if (solventGrams.abs().lessThan(dec(MIN_LINE_GRAMS))) solventGrams = ZERO;
  if (solventGrams.isNegative()) {
    const unit = isVolume ? "mL" : "g";
    const show = (value: Dec): string => String(Number(value.toPrecision(5)));
    const show4 = (value: Dec): string => String(Number(value.toPrecision(4)));
    if (isVolume) {
      throw new FormulationError(
        "mould_too_small",
        "basis.volumeMl",
        `the reagents alone take ${show(reagentsAlone)} ${unit}, more than the ${show(p.target.amount)} ${unit} mould; ` +
          "lower the bulk density, raise the expected shrinkage or use a larger mould",
      );
    }
    throw new FormulationError(
      "solids_content_too_high",
      "basis.solidsFraction",
      `the reagents alone weigh ${show(reagentsAlone)} ${unit}, more than the ${show(p.target.amount)} ${unit} sol; ` +
        (p.solidGrams
          ? `lower the solids content: the highest these reagents reach is ${show4(quotient(p.solidGrams, reagentsAlone))} (with no solvent added)`
          : "lower the solids content"),
    );
  }
  return { solventGrams, addWaterMol };
}

/** The solvent line of a fill and the water it leaves to add. */
export interface FillOutcome {
  /** The solvent line, absent when there is no room left. */
  line?: DecLine;
  /** mol water the added solvent carries. */
  carriedWaterMol: Dec;
  /** mol water still to add. */
  addWaterMol: Dec;
}

/**
 * A solvent fill for a solids-content or gel-body basis: makes the sol up to
 * the basis's sol mass or mould volume around the lines already in it (see
 * `solveFill`), and returns the solvent's line.
 *
 * @param p - basis, mass and volume of the rest of the sol, solvent and water materials, S (g), water still needed (mol)
 * @example
 * ```ts
 * fillSolvent({ basis, otherGrams: new Dec(40), otherMl: new Dec(45), solventEntry: ethanol, waterEntry: waterDi, solidMass: new Dec(20), waterNeededMol: new Dec(0.5) }).line?.massGrams;
 * ```
 */
export function fillSolvent(p: {
  basis: Exclude<Basis, { type: "solidMass" }>;
  /** g and mL of everything else in the sol. */
  otherGrams: Dec;
  otherMl: Dec;
  solventEntry: IndexedMaterial;
  waterEntry: IndexedMaterial;
  solidMass: Dec;
  waterNeededMol: Dec;
}): FillOutcome {
  const fill = solveFill({
    // Wide: what the fill leaves is then an exact difference
    target: p.basis.type === "gelBody" ? { kind: "volume", amount: wide(p.basis.volumeMl) } : { kind: "mass", amount: wide(p.basis.solMassGrams) },
    otherGrams: p.otherGrams,
    otherMl: p.otherMl,
    waterNeededMol: p.waterNeededMol,
    solvent: p.solventEntry,
    water: p.waterEntry,
    solidGrams: p.solidMass,
  });
  const material = p.solventEntry.material;
  const carriedWaterMol = solutionWaterMol(material, fill.solventGrams);
  if (!positive(fill.solventGrams)) return { carriedWaterMol, addWaterMol: fill.addWaterMol };
  return {
    line: {
      materialId: material.id,
      role: "solvent",
      moles: material.molarMass === undefined ? undefined : per(timesFactor(fill.solventGrams, material.assay ?? 1), material.molarMass),
      massGrams: fill.solventGrams,
      volumeMl: volumeOf(p.solventEntry, fill.solventGrams),
      carriedWaterMol,
      carriedSolventGrams: ZERO,
    },
    carriedWaterMol,
    addWaterMol: fill.addWaterMol,
  };
}
