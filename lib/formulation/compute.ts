import { basisNotices } from "./basis-notices";
import { addCoatPredictions } from "./coat";
import { solidMassFromBasis } from "./basis";
import { compositeFigures, type BulkDensity } from "./composite";
import { composeComponents, type DecLine } from "./composition";
import { DEFAULT_THERMAL_MARGIN_C, ENGINE_VERSION, MIN_LINE_GRAMS, ML_PER_L, WATER_MOLAR_MASS_G_PER_MOL } from "./constants";
import { add, type Dec, dec, HALF, ONE, positive, quotient, toNumber, wide, Wide, ZERO } from "./decimal";
import { dosePerNetworkAtom } from "./dosing";
import { decimalSum } from "./sum-compare";
import { FormulationError } from "./errors";
import type { FormulationInput } from "./input-schema";
import { assayBalanceNotices, catalystRatioNotices, fractionsScaledNotice } from "./input-notices";
import { orderLines } from "./line-order";
import { indexMaterials, materialById, volumeOf, type IndexedMaterial } from "./material-index";
import type { Material } from "./material-schema";
import { checkModifierLoad, fastHydrolysisNotices, ligandMassPerFreeGram, modifierAmounts, modifierNotices, planModifiers } from "./modifiers";
import type { AlcoholRelease, FormulationResult, ModifierResult, Notice, RecipeLine, SolventResult } from "./result-types";
import { safetyNotices } from "./safety";
import { carriedSolventGrams, solventByRatio, solventMol } from "./solvent";
import { fillSolvent } from "./solvent-fill";
import { checkThermal } from "./thermal";
import { parseFormulationInput } from "./validate";
import { waterNotices, waterTarget, waterToAdd } from "./water";

/** `{ [key]: value }` when the value is a finite number (a ratio over a vanishing amount is left out). */
function finiteField<K extends string>(key: K, value: Dec): { [P in K]?: number } {
  const n = toNumber(value);
  return (Number.isFinite(n) ? { [key]: n } : {}) as { [P in K]?: number };
}

/** Always-present notes on what the ideal figures leave out. */
const IDEAL_NOTICES: readonly Notice[] = [
  {
    level: "info",
    code: "ideal_composite",
    message:
      "Composite figures are ideal: complete hydrolysis and condensation, with all solvent, water, alcohol and catalyst removed. " +
      "Real gels keep OH groups, water and some alkoxy groups, so real residue masses are higher and densities lower.",
  },
  {
    level: "info",
    code: "ideal_mixing",
    message: "Sol volume assumes ideal mixing (sum of the volumes as supplied); real mixtures of alcohols and water contract slightly.",
  },
];

function toRecipeLine(line: DecLine): RecipeLine {
  const out: RecipeLine = {
    materialId: line.materialId,
    role: line.role,
    massGrams: toNumber(line.massGrams),
    volumeMl: toNumber(line.volumeMl),
  };
  if (line.moles) out.moles = toNumber(line.moles);
  if (line.residueGrams) out.residueGrams = toNumber(line.residueGrams);
  if (line.networkAtomMol) out.networkAtomMol = toNumber(line.networkAtomMol);
  if (line.hydrolysableGroupMol) out.hydrolysableGroupMol = toNumber(line.hydrolysableGroupMol);
  if (line.carriedWaterMol && !line.carriedWaterMol.isZero()) out.carriedWaterMol = toNumber(line.carriedWaterMol);
  if (line.carriedSolventGrams && !line.carriedSolventGrams.isZero()) {
    out.carriedSolventGrams = toNumber(line.carriedSolventGrams);
  }
  return out;
}

/**
 * Turns a target dry composition into a batch recipe and every derived
 * figure, exactly as in the formulation chemistry: precursor and organic
 * amounts, water (target, carried, to add, effective R and h), alcohol
 * released, solvent and catalyst, sol figures, the ideal dry composite
 * (volume fractions, theoretical density, porosity, shrinkage), thermal
 * checks and notices. Masses in g, volumes in mL, amounts in mol,
 * temperatures in °C, densities in g/cm³; plain numbers at full precision.
 *
 * Validates its input first; throws FormulationError (with the offending
 * field) on infeasible or inconsistent input, never returns NaN or a
 * negative mass.
 *
 * @param rawInput - the formulation input (validated here)
 * @returns the formulation result
 * @example
 * ```ts
 * const result = computeFormulation({
 *   materials: [teos, ethanol, waterDi, hcl37],
 *   basis: { type: "solidMass", grams: 10 },
 *   components: [{ materialId: "teos", weightFraction: 1 }],
 *   water: { materialId: "water-di", ratio: "R", value: 4 },
 *   solvent: { materialId: "ethanol", mode: "molPerNetworkAtom", value: 4 },
 *   catalyst: { materialId: "hcl-37", molPerNetworkAtom: 0.01 },
 *   steps: [{ name: "dry", temperatureC: 60, durationH: 24 }],
 * });
 * result.lines[0]?.massGrams; // 34.673… g TEOS for 10 g SiO2
 * ```
 */
export function computeFormulation(rawInput: FormulationInput): FormulationResult {
  const input = parseFormulationInput(rawInput);
  const byId = indexMaterials(input.materials);
  const marginC = input.marginC ?? DEFAULT_THERMAL_MARGIN_C;
  const solidMass = solidMassFromBasis(input.basis);
  const notices: Notice[] = [];

  // Fractions within 0.5 % of 1 (33.3 / 33.3 / 33.3 %) are scaled to 1; the schema refused any beyond.
  // A sum within 1e-12 of 1 is float rounding of fractions that were meant to add up: used as they
  // are. Deciding that needs no decimals (the float sum of the fractions errs by ~1e-16); scaling does.
  let floatSum = 0;
  for (const component of input.components) floatSum += component.weightFraction;
  const exact = Math.abs(floatSum - 1) <= 1e-12;
  const fractionSum = exact ? ONE : decimalSum(input.components.map((c) => c.weightFraction));
  const components = input.components.map((c) => ({
    materialId: c.materialId,
    // Wide: the line amounts and totals that follow from a fraction are exact products and sums
    weightFraction: exact ? wide(c.weightFraction) : new Wide(dec(c.weightFraction).div(fractionSum)),
    ...(exact ? { value: c.weightFraction } : {}),
  }));
  if (!exact) notices.push(...fractionsScaledNotice(fractionSum));

  // Modifiers: the bonded ligands are part of the dry composite the basis fixes (S = S_free · (1 + c)).
  const plans = planModifiers(input.modifiers ?? [], byId, input.steps);
  checkModifierLoad(plans, (id) => byId.get(id)?.material.name ?? id);
  const fractionOf = (id: string): Dec => components.find((c) => c.materialId === id)?.weightFraction ?? ZERO;
  const c = ligandMassPerFreeGram(plans, fractionOf);
  const freeMass = c.isZero() ? solidMass : quotient(solidMass, c.plus(1));

  const pass = composeComponents(components, byId, freeMass, solidMass);
  const lines: DecLine[] = pass.lines;
  const { phases, subjects, conversions, networkAtomMol } = pass;
  let carriedWaterMol = pass.carriedWaterMol;

  if (!positive(networkAtomMol)) {
    throw new FormulationError(
      "no_network_atoms",
      "components",
      "the composition has no network-forming atoms (Si, Ti, Zr, Al, P); add a precursor that forms the oxide network",
    );
  }

  // Modifier lines, their exchanged groups and their bonded-ligand phases.
  let groupsReplacedMol = ZERO;
  const modifierResults: ModifierResult[] = [];
  const ligandPhases = new Map<string, { grams: Dec; formula: string; density: number }>();
  for (const plan of plans) {
    const atoms = pass.precursorMol.get(plan.spec.precursorId)?.atoms ?? ZERO;
    const a = modifierAmounts(plan, atoms);
    lines.push({
      materialId: plan.entry.material.id,
      role: "modifier",
      moles: a.moles,
      massGrams: a.massGrams,
      volumeMl: a.volumeMl,
      carriedWaterMol: a.carriedWaterMol,
      carriedSolventGrams: a.carriedSolventGrams,
    });
    carriedWaterMol = add(carriedWaterMol, a.carriedWaterMol);
    groupsReplacedMol = add(groupsReplacedMol, a.groupsReplacedMol);
    if (positive(a.bondedGrams)) {
      const previous = ligandPhases.get(plan.entry.material.id);
      ligandPhases.set(plan.entry.material.id, {
        grams: previous ? previous.grams.plus(a.bondedGrams) : a.bondedGrams,
        formula: plan.data.bondedFormula,
        density: plan.data.bondedDensity,
      });
    }
    modifierResults.push({
      materialId: plan.entry.material.id,
      precursorId: plan.spec.precursorId,
      molPerMetal: plan.spec.molPerMetal,
      ligandMol: toNumber(a.moles),
      groupsReplacedMol: toNumber(a.groupsReplacedMol),
      bondedGrams: toNumber(a.bondedGrams),
      ...(plan.removedBy ? { removedInStep: plan.removedBy.name } : {}),
    });
  }
  for (const [materialId, ligand] of ligandPhases) {
    const weightFraction = quotient(ligand.grams, solidMass);
    phases.push({
      materialId,
      residueFormula: ligand.formula,
      weightFraction,
      weightFractionValue: toNumber(weightFraction),
      density: dec(ligand.density),
      densityValue: ligand.density,
    });
  }
  notices.push(...modifierNotices(plans, ligandPhases.size > 0));
  // Σg': hydrolysable groups left after ligand exchange.
  const groupMol = pass.hydrolysableGroupMol.minus(groupsReplacedMol);

  const water = input.water;
  if (water.ratio === "h" && !positive(groupMol)) {
    throw new FormulationError(
      "no_hydrolysable_groups",
      "water.ratio",
      "the composition has no hydrolysable (alkoxy) groups, so a water ratio h per group cannot be used; set R (water per network-forming atom) instead",
    );
  }

  // Catalyst: mol active per mol network-forming atom.
  if (input.catalyst && input.catalyst.molPerNetworkAtom > 0) {
    const entry = materialById(byId, input.catalyst.materialId, "catalyst.materialId");
    const a = dosePerNetworkAtom(entry, wide(input.catalyst.molPerNetworkAtom), networkAtomMol);
    lines.push({ materialId: entry.material.id, role: "catalyst", ...a });
    carriedWaterMol = add(carriedWaterMol, a.carriedWaterMol);
    notices.push(...catalystRatioNotices(input.catalyst.molPerNetworkAtom, entry.material.name));
  }

  // Solvent by molar ratio, counting the same solvent carried by precursor solutions (a fill is solved below).
  let solventEntry: IndexedMaterial | undefined;
  let solventSummary: SolventResult | undefined;
  if (input.solvent) {
    solventEntry = materialById(byId, input.solvent.materialId, "solvent.materialId");
    if (input.solvent.mode === "molPerNetworkAtom") {
      const carried = carriedSolventGrams(lines, byId, solventEntry.material.id);
      const ratio = solventByRatio(solventEntry, dec(input.solvent.value), networkAtomMol, carried);
      if (ratio.added && ratio.added.massGrams.greaterThanOrEqualTo(dec(MIN_LINE_GRAMS))) {
        lines.push({ materialId: solventEntry.material.id, role: "solvent", ...ratio.added });
        carriedWaterMol = add(carriedWaterMol, ratio.added.carriedWaterMol);
      }
      notices.push(...ratio.notices);
      solventSummary = {
        materialId: solventEntry.material.id,
        addedGrams: toNumber(ratio.added?.massGrams ?? ZERO),
        carriedGrams: toNumber(carried),
        addedMol: toNumber(ratio.addedMol),
        carriedMol: toNumber(ratio.carriedMol),
        ...finiteField("molPerNetworkAtom", quotient(ratio.addedMol.plus(ratio.carriedMol), networkAtomMol)),
      };
    }
  }

  const waterEntry = materialById(byId, water.materialId, "water.materialId");
  const waterMolarMass = dec(waterEntry.material.molarMass ?? WATER_MOLAR_MASS_G_PER_MOL);
  const referenceMol = water.ratio === "perPrecursor" ? (pass.precursorMol.get(water.referenceId ?? "")?.moles ?? ZERO) : ZERO;
  const targetMol = waterTarget(water.ratio, dec(water.value), { networkAtomMol, groupMol, referenceMol });
  const countCarried = water.countCarried ?? true;

  // Running sol totals (g, mL, ideal mixing): every line so far; the fill and the water follow.
  let solMass = ZERO;
  let solVolume = ZERO;
  for (const l of lines) {
    solMass = add(solMass, l.massGrams);
    solVolume = add(solVolume, l.volumeMl);
  }
  let addMol: Dec;
  const basis = input.basis;
  if (input.solvent?.mode === "fill" && solventEntry) {
    if (basis.type === "solidMass") {
      throw new FormulationError("nothing_to_fill", "solvent.mode", "a dry-solid-mass basis leaves nothing to fill");
    }
    const fill = fillSolvent({
      basis,
      otherGrams: solMass,
      otherMl: solVolume,
      solventEntry,
      waterEntry,
      solidMass,
      waterNeededMol: countCarried ? targetMol.minus(carriedWaterMol) : targetMol,
    });
    if (fill.line) {
      lines.push(fill.line);
      solMass = add(solMass, fill.line.massGrams);
      solVolume = add(solVolume, fill.line.volumeMl);
    }
    carriedWaterMol = add(carriedWaterMol, fill.carriedWaterMol);
    addMol = fill.addWaterMol;
    const carried = carriedSolventGrams(lines, byId, solventEntry.material.id);
    const carriedMol = solventMol(solventEntry, carried);
    const addedMol = fill.line?.moles;
    solventSummary = {
      materialId: solventEntry.material.id,
      addedGrams: toNumber(fill.line?.massGrams ?? ZERO),
      carriedGrams: toNumber(carried),
      ...(addedMol ? { addedMol: toNumber(addedMol) } : {}),
      ...(carriedMol ? { carriedMol: toNumber(carriedMol) } : {}),
      ...(addedMol && carriedMol ? finiteField("molPerNetworkAtom", quotient(addedMol.plus(carriedMol), networkAtomMol)) : {}),
    };
  } else {
    addMol = countCarried ? waterToAdd(targetMol, carriedWaterMol) : targetMol;
  }

  let addGrams = ZERO;
  let addMl = ZERO;
  const addMolGrams = addMol.times(waterMolarMass);
  if (addMolGrams.lessThan(dec(MIN_LINE_GRAMS))) addMol = ZERO;
  if (positive(addMol)) {
    addGrams = addMolGrams;
    addMl = volumeOf(waterEntry, addGrams);
    lines.push({ materialId: waterEntry.material.id, role: "water", moles: addMol, massGrams: addGrams, volumeMl: addMl });
    solMass = add(solMass, addGrams);
    solVolume = add(solVolume, addMl);
  }
  const totalWaterMol = add(carriedWaterMol, addMol);

  // Sol figures (ideal mixing).
  const perMl = ONE.div(solVolume); // 1 / sol volume, 1/mL
  const perLitre = perMl.times(ML_PER_L); // 1 / (sol volume in L): an exact shift of perMl's digits

  // Dry composite.
  let bulk: BulkDensity | undefined;
  if (input.measuredBulkDensity !== undefined) {
    bulk = { density: dec(input.measuredBulkDensity), field: "measuredBulkDensity" };
  } else if (basis.type === "gelBody") {
    bulk = { density: dec(basis.bulkDensity), field: "basis.bulkDensity" };
  }
  const compositeDecimals = compositeFigures(phases, solidMass, perMl, bulk);
  const composite = compositeDecimals.result;

  // Thermal checks: organic phases and the substrate.
  if (input.substrateId !== undefined) {
    const entry = materialById(byId, input.substrateId, "substrateId");
    subjects.push({ materialId: entry.material.id, name: entry.material.name, role: "substrate", thermal: entry.material.thermal, path: entry.path });
  }
  const thermal = checkThermal(subjects, conversions, input.steps, marginC);

  // g of each alcohol released, once: the result reports it and the VOC figure adds it up
  const alcohols: { mol: Dec; molarMass: number; grams: Dec }[] = [];
  const alcohol: AlcoholRelease[] = [];
  for (const amount of pass.alcohols) {
    const grams = amount.mol.times(dec(amount.molarMass));
    alcohols.push({ mol: amount.mol, molarMass: amount.molarMass, grams });
    alcohol.push({ name: amount.name, mol: toNumber(amount.mol), grams: toNumber(grams) });
  }

  const ordered = orderLines(lines.map(toRecipeLine), input.additionOrder);
  const dispensed: Material[] = [];
  for (const line of ordered) {
    const material = byId.get(line.materialId)?.material;
    if (material && line.massGrams > 0 && !dispensed.includes(material)) dispensed.push(material);
  }
  const effectiveR = quotient(totalWaterMol, networkAtomMol);

  notices.push(
    ...assayBalanceNotices(dispensed.filter((m) => m.assay !== undefined && m.assay < 1).map((material) => ({ material, path: byId.get(material.id)!.path }))),
    ...fastHydrolysisNotices(pass.fastHydrolysing, plans, effectiveR),
    ...waterNotices({ targetMol, carriedMol: carriedWaterMol, totalMol: totalWaterMol, networkAtomMol, hydrolysableGroupMol: groupMol, countCarried }),
    ...basisNotices({ basis, fill: input.solvent?.mode === "fill", solMassGrams: solMass, solVolumeMl: solVolume, solidMassGrams: solidMass }),
    ...(composite.dryGelShrinkage && composite.dryGelShrinkage.volumetric < 0
      ? [
          {
            level: "caution" as const,
            code: "dry_gel_larger_than_sol",
            field: bulk?.field,
            message: "At this bulk density the dry gel would take more volume than the sol: check the bulk density or the solvent amount.",
          },
        ]
      : []),
    ...thermal.notices,
    ...safetyNotices(dispensed, alcohol),
    ...IDEAL_NOTICES,
  );

  const result: FormulationResult = {
    engineVersion: ENGINE_VERSION,
    lines: ordered,
    water: {
      targetMol: toNumber(targetMol),
      carriedMol: toNumber(carriedWaterMol),
      addMol: toNumber(addMol),
      addGrams: toNumber(addGrams),
      addMl: toNumber(addMl),
      hydrolysisMol: toNumber(groupMol),
      condensationMol: toNumber(groupMol.times(HALF)),
      effectiveR: toNumber(effectiveR),
      ...(groupMol.isZero() ? {} : { effectiveH: toNumber(quotient(totalWaterMol, groupMol)) }),
      ...(groupsReplacedMol.isZero() ? {} : { groupsReplacedMol: toNumber(groupsReplacedMol) }),
    },
    alcohol,
    sol: {
      massGrams: toNumber(solMass),
      volumeMl: toNumber(solVolume),
      residueGramsPerL: toNumber(solidMass.times(perLitre)),
      networkAtomMolarity: toNumber(networkAtomMol.times(perLitre)),
      solidsFraction: toNumber(quotient(solidMass, solMass)),
    },
    composite,
    thermal: thermal.thermal,
    notices,
  };
  if (solventSummary) result.solvent = solventSummary;
  if (modifierResults.length > 0) result.modifiers = modifierResults;
  // What the coat will be: film (with a coating), optics, VOC, epoxy–amine balance, cost.
  addCoatPredictions(result, { input, byId, lines, composite: compositeDecimals, phases, solidMass, solMass, solVolume, perMl, perLitre, totalWaterMol, waterEntry, alcohols });
  return result;
}
