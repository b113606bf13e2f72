import {
  CATALYST_RATIO_CAUTION,
  DEFAULT_THERMAL_MARGIN_C,
  ENGINE_VERSION,
  MIN_LINE_GRAMS,
  ML_PER_L,
  WATER_MOLAR_MASS_G_PER_MOL,
} from "./constants";
import { basisNotices } from "./basis-notices";
import { solidMassFromBasis } from "./basis";
import { compositeFigures, type BulkDensity, type PhaseInput } from "./composite";
import { type Dec, dec, toNumber, WATER_MOLAR_MASS, ZERO } from "./decimal";
import { dosePerNetworkAtom } from "./dosing";
import { FormulationError } from "./errors";
import type { FormulationInput } from "./input-schema";
import { orderLines } from "./line-order";
import { assayBalanceNotices, catalystRatioNotices, fractionsScaledNotice } from "./input-notices";
import { indexMaterials, materialById, requireDensity, waterFractionOf, type IndexedMaterial } from "./material-index";
import type { Material } from "./material-schema";
import { organicAmounts } from "./organic";
import { precursorAmounts, requirePrecursorData } from "./precursor";
import type { AlcoholRelease, FormulationResult, Notice, RecipeLine } from "./result-types";
import { safetyNotices } from "./safety";
import { solveFill } from "./solvent-fill";
import { checkThermal, type ConversionSubject, type ThermalSubject } from "./thermal";
import { parseFormulationInput } from "./validate";
import { waterNotices, waterTarget, waterToAdd } from "./water";

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

/** Internal line with decimal figures, turned into a RecipeLine at the end. */
interface DecLine {
  materialId: string;
  role: RecipeLine["role"];
  moles?: Dec;
  massGrams: Dec;
  volumeMl: Dec;
  residueGrams?: Dec;
  networkAtomMol?: Dec;
  hydrolysableGroupMol?: Dec;
  carriedWaterMol?: Dec;
  carriedSolventGrams?: Dec;
}

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

  const lines: DecLine[] = [];
  const inputNotices: Notice[] = [];
  // Running sol totals (g, mL), kept as lines are added.
  let solMass = ZERO;
  let solVolume = ZERO;
  const addLine = (line: DecLine): void => {
    lines.push(line);
    solMass = solMass.plus(line.massGrams);
    solVolume = solVolume.plus(line.volumeMl);
  };
  const phases: PhaseInput[] = [];
  const subjects: ThermalSubject[] = [];
  const conversions: ConversionSubject[] = [];
  const alcohols = new Map<string, { name: string; molarMass: number; mol: Dec }>();
  let networkAtomMol = ZERO;
  let hydrolysableGroupMol = ZERO;
  let carriedWaterMol = ZERO;

  // Fractions within 0.5 % of 1 (33.3 / 33.3 / 33.3 %) are scaled to 1; the schema refused any beyond.
  const fractionSum = input.components.reduce((sum, c) => sum.plus(dec(c.weightFraction)), ZERO);
  const scaled = (value: number): Dec => (fractionSum.equals(1) ? dec(value) : dec(value).div(fractionSum));

  input.components.forEach((component, index) => {
    const entry = materialById(byId, component.materialId, `components.${index}.materialId`);
    const material = entry.material;
    const weightFraction = scaled(component.weightFraction);
    const present = !weightFraction.isZero();
    if (material.kind === "precursor") {
      const data = requirePrecursorData(entry);
      const a = precursorAmounts(entry, weightFraction, solidMass);
      addLine({ materialId: material.id, role: "precursor", ...a });
      phases.push({
        materialId: material.id,
        residueFormula: data.residueFormula,
        weightFraction,
        weightFractionValue: toNumber(weightFraction),
        density: dec(data.residueDensity),
        densityValue: data.residueDensity,
      });
      networkAtomMol = networkAtomMol.plus(a.networkAtomMol);
      hydrolysableGroupMol = hydrolysableGroupMol.plus(a.hydrolysableGroupMol);
      carriedWaterMol = carriedWaterMol.plus(a.carriedWaterMol);
      const leaving = data.leavingAlcohol;
      if (leaving && present && !a.alcoholMol.isZero()) {
        const key = `${leaving.name}|${leaving.molarMass}`;
        const previous = alcohols.get(key);
        alcohols.set(key, {
          name: leaving.name,
          molarMass: leaving.molarMass,
          mol: previous ? previous.mol.plus(a.alcoholMol) : a.alcoholMol,
        });
      }
      if (present && data.conversionTemperatureC !== undefined) {
        conversions.push({
          materialId: material.id,
          name: material.name,
          residueFormula: data.residueFormula,
          conversionTemperatureC: data.conversionTemperatureC,
          path: entry.path,
        });
      }
    } else {
      const a = organicAmounts(entry, weightFraction, solidMass);
      addLine({
        materialId: material.id,
        role: "organic",
        moles: a.moles,
        massGrams: a.massGrams,
        volumeMl: a.volumeMl,
        residueGrams: a.residueGrams,
        carriedWaterMol: a.carriedWaterMol,
        carriedSolventGrams: a.carriedSolventGrams,
      });
      phases.push({
        materialId: material.id,
        weightFraction,
        weightFractionValue: toNumber(weightFraction),
        density: dec(a.phaseDensity),
        densityValue: a.phaseDensity,
      });
      carriedWaterMol = carriedWaterMol.plus(a.carriedWaterMol);
      if (present) {
        subjects.push({ materialId: material.id, name: material.name, role: "organic", thermal: material.thermal, path: entry.path });
      }
    }
  });

  if (!networkAtomMol.greaterThan(0)) {
    throw new FormulationError(
      "no_network_atoms",
      "components",
      "the composition has no network-forming atoms (Si, Ti, Zr, Al, P); add a precursor that forms the oxide network",
    );
  }
  if (input.water.ratio === "h" && !hydrolysableGroupMol.greaterThan(0)) {
    throw new FormulationError(
      "no_hydrolysable_groups",
      "water.ratio",
      "the composition has no hydrolysable (alkoxy) groups, so a water ratio h per group cannot be used; set R (water per network-forming atom) instead",
    );
  }

  // Catalyst: mol active per mol network-forming atom.
  if (input.catalyst && input.catalyst.molPerNetworkAtom > 0) {
    const entry = materialById(byId, input.catalyst.materialId, "catalyst.materialId");
    const a = dosePerNetworkAtom(entry, dec(input.catalyst.molPerNetworkAtom), networkAtomMol);
    addLine({ materialId: entry.material.id, role: "catalyst", ...a });
    inputNotices.push(...catalystRatioNotices(input.catalyst.molPerNetworkAtom, entry.material.name));
    carriedWaterMol = carriedWaterMol.plus(a.carriedWaterMol);
  }

  // Solvent by molar ratio (a fill is solved together with the water below).
  let solventEntry: IndexedMaterial | undefined;
  if (input.solvent) {
    solventEntry = materialById(byId, input.solvent.materialId, "solvent.materialId");
    if (input.solvent.mode === "molPerNetworkAtom" && input.solvent.value > 0) {
      const a = dosePerNetworkAtom(solventEntry, dec(input.solvent.value), networkAtomMol);
      addLine({ materialId: solventEntry.material.id, role: "solvent", ...a });
      carriedWaterMol = carriedWaterMol.plus(a.carriedWaterMol);
    }
  }

  const waterEntry = materialById(byId, input.water.materialId, "water.materialId");
  const waterMolarMass = dec(waterEntry.material.molarMass ?? WATER_MOLAR_MASS_G_PER_MOL);
  const targetMol = waterTarget(input.water.ratio, dec(input.water.value), networkAtomMol, hydrolysableGroupMol);

  let addMol: Dec;
  const basis = input.basis;
  if (input.solvent?.mode === "fill" && solventEntry) {
    if (basis.type === "solidMass") {
      throw new FormulationError("nothing_to_fill", "solvent.mode", "a dry-solid-mass basis leaves nothing to fill");
    }
    const fill = solveFill({
      target:
        basis.type === "gelBody"
          ? { kind: "volume", amount: dec(basis.volumeMl) }
          : { kind: "mass", amount: dec(basis.solMassGrams) },
      otherGrams: solMass,
      otherMl: solVolume,
      waterNeededMol: targetMol.minus(carriedWaterMol),
      solvent: solventEntry,
      water: waterEntry,
      solidGrams: solidMass,
    });
    const solventMaterial = solventEntry.material;
    const solventCarried = fill.solventGrams.times(waterFractionOf(solventMaterial)).div(WATER_MOLAR_MASS);
    if (fill.solventGrams.greaterThan(0)) {
      addLine({
        materialId: solventMaterial.id,
        role: "solvent",
        moles:
          solventMaterial.molarMass === undefined
            ? undefined
            : fill.solventGrams.times(dec(solventMaterial.assay ?? 1)).div(dec(solventMaterial.molarMass)),
        massGrams: fill.solventGrams,
        volumeMl: fill.solventGrams.div(requireDensity(solventEntry)),
        carriedWaterMol: solventCarried,
        carriedSolventGrams: ZERO,
      });
    }
    carriedWaterMol = carriedWaterMol.plus(solventCarried);
    addMol = fill.addWaterMol;
  } else {
    addMol = waterToAdd(targetMol, carriedWaterMol);
  }

  let addGrams = ZERO;
  let addMl = ZERO;
  if (addMol.times(waterMolarMass).lessThan(MIN_LINE_GRAMS)) addMol = ZERO;
  if (addMol.greaterThan(0)) {
    addGrams = addMol.times(waterMolarMass);
    addMl = addGrams.div(requireDensity(waterEntry));
    addLine({ materialId: waterEntry.material.id, role: "water", moles: addMol, massGrams: addGrams, volumeMl: addMl });
  }
  const totalWaterMol = carriedWaterMol.plus(addMol);

  // Sol figures (ideal mixing): solMass and solVolume are the running totals.
  const perLitre = dec(ML_PER_L).div(solVolume); // 1 / (sol volume in L)

  // Dry composite.
  let bulk: BulkDensity | undefined;
  if (input.measuredBulkDensity !== undefined) {
    bulk = { density: dec(input.measuredBulkDensity), field: "measuredBulkDensity" };
  } else if (basis.type === "gelBody") {
    bulk = { density: dec(basis.bulkDensity), field: "basis.bulkDensity" };
  }
  const composite = compositeFigures(phases, solidMass, solVolume, bulk);

  // Thermal checks: organic phases and the substrate.
  if (input.substrateId !== undefined) {
    const entry = materialById(byId, input.substrateId, "substrateId");
    subjects.push({
      materialId: entry.material.id,
      name: entry.material.name,
      role: "substrate",
      thermal: entry.material.thermal,
      path: entry.path,
    });
  }
  const thermal = checkThermal(subjects, conversions, input.steps, marginC);

  const alcohol: AlcoholRelease[] = [...alcohols.values()].map((amount) => ({
    name: amount.name,
    mol: toNumber(amount.mol),
    grams: toNumber(amount.mol.times(dec(amount.molarMass))),
  }));

  const ordered = orderLines(lines.map(toRecipeLine), input.additionOrder);
  const dispensed: Material[] = [];
  for (const line of ordered) {
    const material = byId.get(line.materialId)?.material;
    if (material && line.massGrams > 0 && !dispensed.includes(material)) dispensed.push(material);
  }

  const notices: Notice[] = [
    ...fractionsScaledNotice(fractionSum),
    ...inputNotices,
    ...assayBalanceNotices(dispensed.map((material) => ({ material, path: byId.get(material.id)!.path }))),
    ...waterNotices({ targetMol, carriedMol: carriedWaterMol, totalMol: totalWaterMol, networkAtomMol, hydrolysableGroupMol }),
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
  ];

  return {
    engineVersion: ENGINE_VERSION,
    lines: ordered,
    water: {
      targetMol: toNumber(targetMol),
      carriedMol: toNumber(carriedWaterMol),
      addMol: toNumber(addMol),
      addGrams: toNumber(addGrams),
      addMl: toNumber(addMl),
      hydrolysisMol: toNumber(hydrolysableGroupMol),
      condensationMol: toNumber(hydrolysableGroupMol.div(2)),
      effectiveR: toNumber(totalWaterMol.div(networkAtomMol)),
      ...(hydrolysableGroupMol.isZero() ? {} : { effectiveH: toNumber(totalWaterMol.div(hydrolysableGroupMol)) }),
    },
    alcohol,
    sol: {
      massGrams: toNumber(solMass),
      volumeMl: toNumber(solVolume),
      residueGramsPerL: toNumber(solidMass.times(perLitre)),
      networkAtomMolarity: toNumber(networkAtomMol.times(perLitre)),
      solidsFraction: toNumber(solidMass.div(solMass)),
    },
    composite,
    thermal: thermal.thermal,
    notices,
  };
}
