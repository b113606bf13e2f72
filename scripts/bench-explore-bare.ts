/**
 * The yardsticks of bench-explore.ts: the bare arithmetic of the benchmark's
 * 10,000-point map, hand-inlined for its one formulation (scripts/bench-input.ts:
 * a solids-content basis filled with ethanol, water by R, a catalyst, no
 * coating, no measured bulk density) over Float64Arrays extracted once, with
 * no input objects, no maps, no knobs, no dispatch and no result objects.
 *
 * - `core`: the 12 core figures only (sol mass and volume, solids, residue per
 *   litre, density, organic weight and volume fractions, dense shrinkage, R,
 *   h, solvent); the yardstick of the first version of the benchmark.
 * - `full`: every scalar figure the numeric path returns for this formulation
 *   (SCALAR_FIGURES, 32 per point): the core figures plus organic content,
 *   porosity, water and solvent added, solvent per network atom, the highest
 *   allowed temperature, film figures (NaN: no coating), refractive index and
 *   mismatch (Lorentz–Lorenz), VOC in three forms, cure ratio and cost in four
 *   forms, and the checks the figures need (network atoms present, the fill
 *   solvable, a volume left without water). The thermal verdict does not
 *   change over this grid (every component stays present and no step
 *   temperature varies), so it is computed once, as the kernel does.
 *
 * The extraction (not timed) reads per-material constants through the
 * engine's material table and coat data; the timed loops are written here and
 * in bench-explore-full.ts.
 */
import { coatMaterialData } from "../lib/formulation/numeric/coat-material";
import { materialTable } from "../lib/formulation/numeric/material-table";
import { thermalVerdict, type ThermalProfile } from "../lib/formulation/numeric/thermal";
import { DEFAULT_THERMAL_MARGIN_C } from "../lib/formulation/constants";
import type { FormulationInput, ProcessStep } from "../lib/formulation";

export const CORE = 12;

/** Per-component constants of `input` (per g of residue or per unit weight fraction) and its lines', extracted once. */
export function extract(input: FormulationInput) {
  const table = materialTable(input.materials);
  const row = (id: string) => table.materials[table.indexOf.get(id)!]!;
  const n = input.components.length;
  const core = {
    weight: new Float64Array(n),
    isPrecursor: new Uint8Array(n),
    molPerResidueGram: new Float64Array(n),
    gramsPerMol: new Float64Array(n),
    perAssay: new Float64Array(n),
    perDensity: new Float64Array(n),
    atomsPerMol: new Float64Array(n),
    groupsPerMol: new Float64Array(n),
    waterPerGram: new Float64Array(n),
    crystalWater: new Float64Array(n),
    perPhaseDensity: new Float64Array(n),
  };
  // per g of residue, for the full yardstick
  const mass = new Float64Array(n);
  const volume = new Float64Array(n);
  const atoms = new Float64Array(n);
  const groups = new Float64Array(n);
  const water = new Float64Array(n);
  const voc = new Float64Array(n);
  const epoxy = new Float64Array(n);
  const amine = new Float64Array(n);
  const cost = new Float64Array(n);
  // per unit weight fraction
  const organic = new Float64Array(n);
  const share = new Float64Array(n);
  const optics = new Float64Array(n);
  const subjects: ThermalProfile[] = [];
  const conversions: number[] = [];
  input.components.forEach((c, i) => {
    const r = row(c.materialId);
    const m = r.material;
    const p = m.precursor;
    const data = coatMaterialData(m);
    const carried = m.solventId === undefined ? undefined : table.byId.get(m.solventId);
    const carriedVoc = !carried || coatMaterialData(carried).volatile ? r.solventFraction : 0;
    const phaseDensity = p ? p.residueDensity : r.phaseDensity;
    core.weight[i] = c.weightFraction;
    core.isPrecursor[i] = p ? 1 : 0;
    core.molPerResidueGram[i] = p ? r.molPerResidueGram : 0;
    core.gramsPerMol[i] = r.molarMass * r.perAssay;
    core.perAssay[i] = r.perAssay;
    core.perDensity[i] = r.perDensity;
    core.atomsPerMol[i] = p?.networkAtomsPerMolecule ?? 0;
    core.groupsPerMol[i] = p?.hydrolysableGroupsPerMolecule ?? 0;
    core.waterPerGram[i] = r.waterMolPerGram;
    core.crystalWater[i] = r.crystalWater;
    core.perPhaseDensity[i] = 1 / phaseDensity;
    const grams = p ? r.molPerResidueGram * r.molarMass * r.perAssay : r.perAssay;
    const mol = p ? r.molPerResidueGram : 0;
    const active = p ? grams * data.assayFactor : 1;
    mass[i] = grams;
    volume[i] = grams * r.perDensity;
    atoms[i] = mol * (p?.networkAtomsPerMolecule ?? 0);
    groups[i] = mol * (p?.hydrolysableGroupsPerMolecule ?? 0);
    water[i] = grams * r.waterMolPerGram + mol * r.crystalWater;
    voc[i] = grams * carriedVoc + (r.alcoholSlot >= 0 ? table.alcohols[r.alcoholSlot]!.molarMass * groups[i]! : 0);
    epoxy[i] = active * data.epoxyPerGram;
    amine[i] = active * data.aminePerGram;
    cost[i] = grams * data.pricePerKg;
    organic[i] = p ? 0 : 1;
    share[i] = r.organicShare;
    optics[i] = data.lorentzLorenzTerm / phaseDensity;
    if (r.thermal && !p) subjects.push(r.thermal);
    if (p?.conversionTemperatureC !== undefined) conversions.push(p.conversionTemperatureC);
  });
  const catalyst = row(input.catalyst!.materialId);
  const waterRow = row(input.water.materialId);
  const solvent = row(input.solvent!.materialId);
  const substrate = row(input.substrateId!);
  if (substrate.thermal) subjects.push(substrate.thermal);
  const verdict = thermalVerdict(subjects, conversions, input.steps as ProcessStep[], input.marginC ?? DEFAULT_THERMAL_MARGIN_C);
  const lineVoc = (r: typeof catalyst) => (coatMaterialData(r.material).volatile ? coatMaterialData(r.material).assayFactor : 0);
  return {
    ...core,
    n,
    full: { mass, volume, atoms, groups, water, voc, epoxy, amine, cost, organic, share, optics },
    catalystRatio: input.catalyst!.molPerNetworkAtom,
    catalystGramsPerMol: catalyst.molarMass * catalyst.perAssay,
    catalystWaterPerGram: catalyst.waterMolPerGram,
    catalystPerDensity: catalyst.perDensity,
    catalystVocPerGram: lineVoc(catalyst) + catalyst.solventFraction,
    catalystPrice: coatMaterialData(catalyst.material).pricePerKg,
    waterMolarMass: waterRow.molarMass,
    waterDensity: waterRow.density,
    waterPerDensity: waterRow.perDensity,
    waterPrice: coatMaterialData(waterRow.material).pricePerKg,
    solventPerDensity: solvent.perDensity,
    solventWaterPerGram: solvent.waterMolPerGram,
    solventMolPerGram: (solvent.material.assay ?? 1) / solvent.molarMass,
    solventVocPerGram: lineVoc(solvent),
    solventPrice: coatMaterialData(solvent.material).pricePerKg,
    substrateIndex: substrate.material.refractiveIndex ?? Number.NaN,
    maxAllowedC: verdict.maxAllowedC,
    statusCaution: verdict.status,
  };
}

export type Extracted = ReturnType<typeof extract>;

/** What a yardstick runs over: the constants, the first axis (component 0's weight fraction), the second (R), the basis. */
export interface BareGrid {
  t: Extracted;
  fractions: Float64Array;
  ratios: Float64Array;
  solMassGrams: number;
  solidsFraction: number;
}

/**
 * The 12 core figures of every point into `out` (CORE per point): the first version's yardstick.
 *
 * @example
 * ```ts
 * coreArithmetic(grid, new Float64Array(count * CORE));
 * ```
 */
export function coreArithmetic(g: BareGrid, out: Float64Array): void {
  const { t, fractions, ratios } = g;
  const solidMass = g.solidsFraction * g.solMassGrams;
  let othersTotal = 0;
  for (let i = 1; i < t.n; i++) othersTotal += t.weight[i]!;
  let p = 0;
  for (let a = 0; a < fractions.length; a++) {
    const w0 = fractions[a]!;
    const scale = (1 - w0) / othersTotal;
    for (let b = 0; b < ratios.length; b++, p++) {
      let atoms = 0;
      let groups = 0;
      let carried = 0;
      let mass = 0;
      let volume = 0;
      let specificVolume = 0;
      let organicSpecific = 0;
      let organicWeight = 0;
      for (let i = 0; i < t.n; i++) {
        const w = i === 0 ? w0 : t.weight[i]! * scale;
        const residue = w * solidMass;
        let grams: number;
        if (t.isPrecursor[i]) {
          const moles = residue * t.molPerResidueGram[i]!;
          grams = moles * t.gramsPerMol[i]!;
          atoms += moles * t.atomsPerMol[i]!;
          groups += moles * t.groupsPerMol[i]!;
          carried += moles * t.crystalWater[i]!;
        } else {
          grams = residue * t.perAssay[i]!;
          organicSpecific += w * t.perPhaseDensity[i]!;
          organicWeight += w;
        }
        carried += grams * t.waterPerGram[i]!;
        mass += grams;
        volume += grams * t.perDensity[i]!;
        specificVolume += w * t.perPhaseDensity[i]!;
      }
      const catalystGrams = t.catalystRatio * atoms * t.catalystGramsPerMol;
      carried += catalystGrams * t.catalystWaterPerGram;
      mass += catalystGrams;
      volume += catalystGrams * t.catalystPerDensity;
      const need = ratios[b]! * atoms - carried;
      const available = g.solMassGrams - mass;
      let solvent = available;
      let addWater = 0;
      if (need > 0) {
        solvent = (available - need * t.waterMolarMass) / (1 - t.solventWaterPerGram * t.waterMolarMass);
        addWater = need - solvent * t.solventWaterPerGram;
      }
      const waterGrams = addWater * t.waterMolarMass;
      const solMass = mass + solvent + waterGrams;
      const solVolume = volume + solvent * t.solventPerDensity + waterGrams * t.waterPerDensity;
      const density = 1 / specificVolume;
      const ratio = solidMass / density / solVolume;
      const totalWater = carried + addWater;
      const o = p * CORE;
      out[o] = solMass;
      out[o + 1] = solVolume;
      out[o + 2] = solidMass / solMass;
      out[o + 3] = (solidMass * 1000) / solVolume;
      out[o + 4] = density;
      out[o + 5] = organicWeight;
      out[o + 6] = organicSpecific * density;
      out[o + 7] = 1 - ratio;
      out[o + 8] = 1 - Math.cbrt(ratio);
      out[o + 9] = totalWater / atoms;
      out[o + 10] = totalWater / groups;
      out[o + 11] = solvent;
    }
  }
}
