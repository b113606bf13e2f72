/**
 * Reference materials shipped with Gelwright and copied into each team's
 * library. Every value names its source in the material's `sources` map
 * (property → source); values recalled rather than looked up say
 * "from memory". Molar masses are computed from the formula with the
 * IUPAC/CIAAW 2021 abridged atomic weights (data/atomic-weights.ts) and
 * cross-checked in lib/formulation/reference-data.test.ts.
 *
 * GHS hazard statements are the ones commonly listed for these materials;
 * always check the supplier's safety data sheet for the grade in hand.
 *
 * Units: molarMass g/mol, density and phaseDensity g/cm³ (≈ g/mL) at about
 * 20–25 °C, temperatures °C, fractions by mass.
 */
import type { Material } from "../lib/formulation/material-schema";

/** Source strings used throughout this file. */
const SRC = {
  ciaaw: "computed from the formula with IUPAC/CIAAW 2021 standard atomic weights, abridged values",
  stoichiometry:
    "from the formula: one network-forming atom and one hydrolysable group per alkoxy group; Brinker & Scherer, Sol-Gel Science (1990), ch. 3",
  residueOxide: "stoichiometry of the oxide formed on complete hydrolysis and condensation; Brinker & Scherer, Sol-Gel Science (1990), ch. 3",
  residueSilsesquioxane:
    "R-SiO1.5 unit kept by an organically modified silane on complete condensation (R stays bonded to Si); Brinker & Scherer, Sol-Gel Science (1990)",
  silsesquioxaneDensity: "typical skeletal density of an organosilsesquioxane network (from memory)",
  fastHydrolysis:
    "transition-metal and aluminium alkoxides hydrolyse orders of magnitude faster than silicon alkoxides; Livage, Henry & Sanchez, Prog. Solid State Chem. 18 (1988) 259",
  fusedSilica: "CRC Handbook of Chemistry and Physics, fused (amorphous) silica ≈ 2.20 g/cm³",
  anatase: "CRC Handbook of Chemistry and Physics, TiO2 anatase (from memory); amorphous sol-gel titania is less dense",
  zirconia: "CRC Handbook of Chemistry and Physics, ZrO2 monoclinic (from memory); amorphous sol-gel zirconia is less dense",
  alumina: "CRC Handbook of Chemistry and Physics, α-Al2O3 (from memory); amorphous or γ alumina from gels is less dense",
  phosphorusPentoxide: "CRC Handbook of Chemistry and Physics, P2O5 (from memory)",
  calciumOxide: "CRC Handbook of Chemistry and Physics, CaO (from memory)",
  supplierDensity: "typical supplier data sheet value at 20–25 °C (from memory)",
  crcOrganic: "CRC Handbook of Chemistry and Physics, Physical Constants of Organic Compounds, 20 °C (from memory)",
  crcAqueous: "CRC Handbook of Chemistry and Physics, Concentrative Properties of Aqueous Solutions, 20 °C (from memory)",
  water20: "CRC Handbook of Chemistry and Physics, density of water at 20 °C (0.99820 g/cm³; also Kell 1975)",
  polymerHandbook: "Polymer Handbook, 4th ed. (Brandrup, Immergut, Grulke, 1999), typical value (from memory)",
  markHandbook: "Mark, Physical Properties of Polymers Handbook, typical value (from memory)",
  tga: "onset of mass loss in thermogravimetry, typical value (from memory)",
  hdt: "heat deflection temperature at 1.8 MPa, ISO 75-2 method A, typical unfilled general-purpose grade (from memory); check the grade's data sheet",
  amorphousTitania:
    "amorphous titania in hybrids cured below about 300 °C, ≈ 2.4–3.0 g/cm³ (ellipsometry and porosimetry of sol-gel films, from memory; anatase is 3.9)",
  amorphousZirconia:
    "amorphous zirconia in hybrids cured below about 300 °C, ≈ 3.3–4.0 g/cm³ (from memory; monoclinic zirconia is 5.68)",
  amorphousAlumina:
    "amorphous alumina (boehmite-like oxo-hydroxide) in hybrids cured below about 300 °C, ≈ 2.5–3.0 g/cm³ (from memory; corundum is 3.99)",
  gradeMax: "typical continuous-use maximum of common grades (from memory); check the grade's data sheet",
  stock: "nominal concentration of the commercial stock; the balance is water",
  ghs: "GHS hazard statements as commonly listed by suppliers (from memory); check the supplier's safety data sheet",
  ghsNone: "not classified as hazardous by common suppliers (from memory); check the supplier's safety data sheet",
  cas: "CAS Registry Number (from memory; check digit verified in tests)",
  repeatUnit: "repeat unit of the polymer",
  boilingPoint: "CRC Handbook of Chemistry and Physics, Physical Constants of Organic Compounds, normal boiling point at 101.3 kPa (from memory)",
  silicaIndex:
    "n_D of fused (amorphous) silica 1.4585 (Malitson, J. Opt. Soc. Am. 55 (1965) 1205, from memory); dense sol-gel silica comes close to it",
  silsesquioxaneIndex:
    "R-SiO1.5 units of organosilane hybrid coatings, n_D ≈ 1.42–1.50 by ellipsometry (from memory): methyl lowest, glycidoxy-, methacryloxy- and aminopropyl about 1.49",
  amorphousTitaniaIndex:
    "amorphous titania in hybrids cured below about 300 °C, n_D ≈ 1.9–2.1 (ellipsometry of sol-gel films, from memory); far below anatase (≈ 2.5) and rutile (≈ 2.7–2.9)",
  amorphousZirconiaIndex:
    "amorphous zirconia in hybrids cured below about 300 °C, n_D ≈ 1.7–1.9 (ellipsometry of sol-gel films, from memory); monoclinic zirconia ≈ 2.1–2.2",
  amorphousAluminaIndex:
    "amorphous (boehmite-like) alumina in hybrids cured below about 300 °C, n_D ≈ 1.55–1.62 (from memory); corundum 1.768",
  polymerIndex: "n_D at 20–25 °C, Polymer Handbook, 4th ed. (Brandrup, Immergut, Grulke, 1999), typical value (from memory)",
  ligandIndex:
    "n_D of the liquid at 20 °C, CRC Handbook (from memory), taken for the bonded ligand phase: an estimate, chelates of titanium and zirconium are somewhat higher",
  transparentSubstrate: "n_D at 20–25 °C, typical value (from memory); a substrate with an index is treated as transparent for the fringe check",
} as const;

/** Alcohols released by hydrolysis; molar masses from the formula (IUPAC/CIAAW 2021). */
const ALCOHOL = {
  methanol: { name: "methanol", molarMass: 32.042 }, // CH4O
  ethanol: { name: "ethanol", molarMass: 46.069 }, // C2H6O
  propan1ol: { name: "1-propanol", molarMass: 60.096 }, // C3H8O
  propan2ol: { name: "2-propanol", molarMass: 60.096 }, // C3H8O
  butan1ol: { name: "1-butanol", molarMass: 74.123 }, // C4H10O
  butan2ol: { name: "2-butanol", molarMass: 74.123 }, // C4H10O
} as const;

/** Sources shared by every alkoxide precursor. */
const alkoxideSources = {
  formula: "IUPAC name and composition of the compound",
  molarMass: SRC.ciaaw,
  "precursor.residueFormula": SRC.residueOxide,
  "precursor.residueMolarMass": SRC.ciaaw,
  "precursor.residuePerMolecule": SRC.residueOxide,
  "precursor.networkAtomsPerMolecule": SRC.stoichiometry,
  "precursor.hydrolysableGroupsPerMolecule": SRC.stoichiometry,
  "precursor.leavingAlcohol": "alcohol of the alkoxy group; Brinker & Scherer, Sol-Gel Science (1990), ch. 3",
  hazards: SRC.ghs,
  casNumber: SRC.cas,
} as const;

/** Sources shared by organically modified silanes R-Si(OR')3. */
const ormosilSources = {
  ...alkoxideSources,
  "precursor.residueFormula": SRC.residueSilsesquioxane,
  "precursor.residuePerMolecule": SRC.residueSilsesquioxane,
  "precursor.residueDensity": SRC.silsesquioxaneDensity,
} as const;

const precursors: Material[] = [
  {
    id: "teos",
    name: "Tetraethoxysilane (TEOS)",
    kind: "precursor",
    casNumber: "78-10-4",
    formula: "Si(OC2H5)4",
    molarMass: 208.329,
    density: 0.933,
    precursor: {
      residueRefractiveIndex: 1.4585,
      residueFormula: "SiO2",
      residueMolarMass: 60.083,
      residuePerMolecule: 1,
      residueDensity: 2.2,
      networkAtomsPerMolecule: 1,
      hydrolysableGroupsPerMolecule: 4,
      leavingAlcohol: ALCOHOL.ethanol,
    },
    hazards: ["H226", "H319", "H332", "H335"],
    sources: { ...alkoxideSources, density: SRC.crcOrganic, "precursor.residueDensity": SRC.fusedSilica, "precursor.residueRefractiveIndex": SRC.silicaIndex },
  },
  {
    id: "tmos",
    name: "Tetramethoxysilane (TMOS)",
    kind: "precursor",
    casNumber: "681-84-5",
    formula: "Si(OCH3)4",
    molarMass: 152.221,
    density: 1.032,
    precursor: {
      residueRefractiveIndex: 1.4585,
      residueFormula: "SiO2",
      residueMolarMass: 60.083,
      residuePerMolecule: 1,
      residueDensity: 2.2,
      networkAtomsPerMolecule: 1,
      hydrolysableGroupsPerMolecule: 4,
      leavingAlcohol: ALCOHOL.methanol,
    },
    hazards: ["H226", "H318", "H330"],
    sources: { ...alkoxideSources, density: SRC.supplierDensity, "precursor.residueDensity": SRC.fusedSilica, "precursor.residueRefractiveIndex": SRC.silicaIndex },
  },
  {
    id: "mtes",
    name: "Methyltriethoxysilane (MTES)",
    kind: "precursor",
    casNumber: "2031-67-6",
    formula: "CH3Si(OC2H5)3",
    molarMass: 178.303,
    density: 0.895,
    precursor: {
      residueRefractiveIndex: 1.42,
      residueFormula: "(CH3)SiO1.5",
      residueMolarMass: 67.1185,
      residuePerMolecule: 1,
      residueDensity: 1.3,
      networkAtomsPerMolecule: 1,
      hydrolysableGroupsPerMolecule: 3,
      leavingAlcohol: ALCOHOL.ethanol,
    },
    hazards: ["H226"],
    sources: { ...ormosilSources, density: SRC.supplierDensity, "precursor.residueRefractiveIndex": SRC.silsesquioxaneIndex },
  },
  {
    id: "mtms",
    name: "Methyltrimethoxysilane (MTMS)",
    kind: "precursor",
    casNumber: "1185-55-3",
    formula: "CH3Si(OCH3)3",
    molarMass: 136.222,
    density: 0.955,
    precursor: {
      residueRefractiveIndex: 1.42,
      residueFormula: "(CH3)SiO1.5",
      residueMolarMass: 67.1185,
      residuePerMolecule: 1,
      residueDensity: 1.3,
      networkAtomsPerMolecule: 1,
      hydrolysableGroupsPerMolecule: 3,
      leavingAlcohol: ALCOHOL.methanol,
    },
    hazards: ["H225"],
    sources: { ...ormosilSources, density: SRC.supplierDensity, "precursor.residueRefractiveIndex": SRC.silsesquioxaneIndex },
  },
  {
    id: "gptms",
    name: "3-Glycidoxypropyltrimethoxysilane (GPTMS)",
    kind: "precursor",
    casNumber: "2530-83-8",
    formula: "C9H20O5Si",
    molarMass: 236.339,
    density: 1.07,
    precursor: {
      residueRefractiveIndex: 1.49,
      // R = glycidoxypropyl C6H11O2; residue R-SiO1.5 = C6H11O3.5Si
      residueFormula: "(C6H11O2)SiO1.5",
      residueMolarMass: 167.2355,
      residuePerMolecule: 1,
      residueDensity: 1.35,
      networkAtomsPerMolecule: 1,
      hydrolysableGroupsPerMolecule: 3,
      leavingAlcohol: ALCOHOL.methanol,
    },
    epoxyEquivalentWeight: 236.339,
    hazards: ["H318"],
    sources: { ...ormosilSources, density: SRC.supplierDensity, "precursor.residueRefractiveIndex": SRC.silsesquioxaneIndex, epoxyEquivalentWeight: "one epoxy group per molecule: EEW = molar mass (Lee & Neville, Handbook of Epoxy Resins, 1967)" },
  },
  {
    id: "maptms",
    name: "3-Methacryloxypropyltrimethoxysilane (MAPTMS)",
    kind: "precursor",
    casNumber: "2530-85-0",
    formula: "C10H20O5Si",
    molarMass: 248.35,
    density: 1.045,
    precursor: {
      residueRefractiveIndex: 1.49,
      // R = methacryloxypropyl C7H11O2; residue R-SiO1.5 = C7H11O3.5Si
      residueFormula: "(C7H11O2)SiO1.5",
      residueMolarMass: 179.2465,
      residuePerMolecule: 1,
      residueDensity: 1.3,
      networkAtomsPerMolecule: 1,
      hydrolysableGroupsPerMolecule: 3,
      leavingAlcohol: ALCOHOL.methanol,
    },
    hazards: [],
    sources: { ...ormosilSources, density: SRC.supplierDensity, hazards: SRC.ghsNone, "precursor.residueRefractiveIndex": SRC.silsesquioxaneIndex },
  },
  {
    id: "aptes",
    name: "3-Aminopropyltriethoxysilane (APTES)",
    kind: "precursor",
    casNumber: "919-30-2",
    formula: "H2N(CH2)3Si(OC2H5)3",
    molarMass: 221.372,
    density: 0.946,
    precursor: {
      residueRefractiveIndex: 1.49,
      // R = aminopropyl C3H8N; residue R-SiO1.5 = C3H8NO1.5Si
      residueFormula: "(C3H8N)SiO1.5",
      residueMolarMass: 110.1875,
      residuePerMolecule: 1,
      residueDensity: 1.3,
      networkAtomsPerMolecule: 1,
      hydrolysableGroupsPerMolecule: 3,
      leavingAlcohol: ALCOHOL.ethanol,
    },
    amineHydrogenEquivalentWeight: 110.686,
    hazards: ["H302", "H314", "H317"],
    sources: { ...ormosilSources, density: SRC.supplierDensity, "precursor.residueRefractiveIndex": SRC.silsesquioxaneIndex, amineHydrogenEquivalentWeight: "two amine hydrogens per primary amine: AHEW = 221.372 / 2 (Lee & Neville, Handbook of Epoxy Resins, 1967)" },
  },
  {
    id: "vtes",
    name: "Vinyltriethoxysilane (VTES)",
    kind: "precursor",
    casNumber: "78-08-0",
    formula: "CH2CHSi(OC2H5)3",
    molarMass: 190.314,
    density: 0.903,
    precursor: {
      residueRefractiveIndex: 1.45,
      // R = vinyl C2H3; residue R-SiO1.5 = C2H3O1.5Si
      residueFormula: "(C2H3)SiO1.5",
      residueMolarMass: 79.1295,
      residuePerMolecule: 1,
      residueDensity: 1.3,
      networkAtomsPerMolecule: 1,
      hydrolysableGroupsPerMolecule: 3,
      leavingAlcohol: ALCOHOL.ethanol,
    },
    hazards: ["H226", "H332"],
    sources: { ...ormosilSources, density: SRC.supplierDensity, "precursor.residueRefractiveIndex": SRC.silsesquioxaneIndex },
  },
  {
    id: "ti-isopropoxide",
    name: "Titanium(IV) isopropoxide",
    kind: "precursor",
    casNumber: "546-68-9",
    formula: "Ti(OC3H7)4",
    molarMass: 284.219,
    density: 0.96,
    precursor: {
      residueRefractiveIndex: 1.95,
      residueFormula: "TiO2",
      residueMolarMass: 79.865,
      residuePerMolecule: 1,
      residueDensity: 2.7,
      networkAtomsPerMolecule: 1,
      hydrolysableGroupsPerMolecule: 4,
      leavingAlcohol: ALCOHOL.propan2ol,
    },
    fastHydrolysing: true,
    hazards: ["H226", "H319", "H336"],
    sources: { ...alkoxideSources, density: SRC.supplierDensity, "precursor.residueDensity": SRC.amorphousTitania, fastHydrolysing: SRC.fastHydrolysis, "precursor.residueRefractiveIndex": SRC.amorphousTitaniaIndex },
  },
  {
    id: "ti-butoxide",
    name: "Titanium(IV) n-butoxide",
    kind: "precursor",
    casNumber: "5593-70-4",
    formula: "Ti(OC4H9)4",
    molarMass: 340.327,
    density: 1.0,
    precursor: {
      residueRefractiveIndex: 1.95,
      residueFormula: "TiO2",
      residueMolarMass: 79.865,
      residuePerMolecule: 1,
      residueDensity: 2.7,
      networkAtomsPerMolecule: 1,
      hydrolysableGroupsPerMolecule: 4,
      leavingAlcohol: ALCOHOL.butan1ol,
    },
    fastHydrolysing: true,
    hazards: ["H226", "H315", "H318", "H335", "H336"],
    sources: { ...alkoxideSources, density: SRC.supplierDensity, "precursor.residueDensity": SRC.amorphousTitania, fastHydrolysing: SRC.fastHydrolysis, "precursor.residueRefractiveIndex": SRC.amorphousTitaniaIndex },
  },
  {
    id: "zr-propoxide-70",
    name: "Zirconium(IV) n-propoxide, 70 wt% in 1-propanol",
    kind: "precursor",
    casNumber: "23519-77-9",
    formula: "Zr(OC3H7)4",
    molarMass: 327.576,
    density: 1.044,
    assay: 0.7,
    solventFraction: 0.3,
    precursor: {
      residueRefractiveIndex: 1.8,
      residueFormula: "ZrO2",
      residueMolarMass: 123.222,
      residuePerMolecule: 1,
      residueDensity: 3.6,
      networkAtomsPerMolecule: 1,
      hydrolysableGroupsPerMolecule: 4,
      leavingAlcohol: ALCOHOL.propan1ol,
    },
    solventId: "1-propanol",
    fastHydrolysing: true,
    hazards: ["H225", "H318", "H336"],
    sources: {
      "precursor.residueRefractiveIndex": SRC.amorphousZirconiaIndex,
      ...alkoxideSources,
      density: "supplier data sheet value for the 70 wt% solution, 25 °C (from memory)",
      assay: "nominal concentration of the commercial solution",
      solventFraction: "balance of the commercial solution is 1-propanol",
      solventId: "balance of the commercial solution is 1-propanol",
      "precursor.residueDensity": SRC.amorphousZirconia,
      fastHydrolysing: SRC.fastHydrolysis,
    },
  },
  {
    id: "al-sec-butoxide",
    name: "Aluminium tri-sec-butoxide",
    kind: "precursor",
    casNumber: "2269-22-9",
    formula: "Al(OC4H9)3",
    molarMass: 246.327,
    density: 0.967,
    precursor: {
      residueRefractiveIndex: 1.58,
      residueFormula: "Al2O3",
      residueMolarMass: 101.961,
      residuePerMolecule: 0.5,
      residueDensity: 2.8,
      networkAtomsPerMolecule: 1,
      hydrolysableGroupsPerMolecule: 3,
      leavingAlcohol: ALCOHOL.butan2ol,
    },
    fastHydrolysing: true,
    hazards: ["H226", "H315", "H318"],
    sources: { ...alkoxideSources, density: SRC.supplierDensity, "precursor.residueDensity": SRC.amorphousAlumina, fastHydrolysing: SRC.fastHydrolysis, "precursor.residueRefractiveIndex": SRC.amorphousAluminaIndex },
  },
  {
    id: "triethyl-phosphate",
    name: "Triethyl phosphate (TEP)",
    kind: "precursor",
    casNumber: "78-40-0",
    formula: "(C2H5O)3PO",
    molarMass: 182.156,
    density: 1.072,
    precursor: {
      residueRefractiveIndex: 1.5,
      residueFormula: "P2O5",
      residueMolarMass: 141.943,
      residuePerMolecule: 0.5,
      residueDensity: 2.39,
      networkAtomsPerMolecule: 1,
      hydrolysableGroupsPerMolecule: 3,
      leavingAlcohol: ALCOHOL.ethanol,
    },
    moistureSensitive: false,
    hazards: ["H302", "H319"],
    sources: {
      "precursor.residueRefractiveIndex": "vitreous P2O5, n_D ≈ 1.49–1.51 (from memory); in a silicate or hybrid network it mixes with the silica",
      ...alkoxideSources,
      density: SRC.crcOrganic,
      "precursor.residueDensity": SRC.phosphorusPentoxide,
      moistureSensitive: "a phosphate ester, hydrolyses only slowly in neutral or acid sols and is not pyrophoric or flammable like the metal alkoxides (from memory)",
    },
  },
  {
    id: "ca-nitrate-4h2o",
    name: "Calcium nitrate tetrahydrate",
    kind: "precursor",
    casNumber: "13477-34-4",
    formula: "Ca(NO3)2·4H2O",
    molarMass: 236.146,
    density: 1.896,
    crystalWaterPerFormula: 4,
    precursor: {
      residueRefractiveIndex: 1.838,
      residueFormula: "CaO",
      residueMolarMass: 56.077,
      residuePerMolecule: 1,
      residueDensity: 3.34,
      networkAtomsPerMolecule: 0,
      hydrolysableGroupsPerMolecule: 0,
      conversionTemperatureC: 600,
    },
    hazards: ["H272", "H302", "H318"],
    sources: {
      "precursor.residueRefractiveIndex": "CaO, n_D 1.838, CRC Handbook of Chemistry and Physics, Physical Constants of Inorganic Compounds (from memory)",
      formula: "composition of the tetrahydrate",
      molarMass: SRC.ciaaw,
      density: "CRC Handbook of Chemistry and Physics, Physical Constants of Inorganic Compounds (from memory)",
      crystalWaterPerFormula: "composition of the tetrahydrate",
      "precursor.residueFormula": "CaO left after nitrate decomposition",
      "precursor.residueMolarMass": SRC.ciaaw,
      "precursor.residuePerMolecule": "one Ca per formula unit",
      "precursor.residueDensity": SRC.calciumOxide,
      "precursor.networkAtomsPerMolecule": "Ca is a network modifier, not a network former (common practice, no source)",
      "precursor.hydrolysableGroupsPerMolecule": "no alkoxy groups",
      "precursor.conversionTemperatureC":
        "nitrate decomposition in sol-gel bioactive glasses is complete at about 600 °C (stabilisation at 600–700 °C in the usual 58S route; from memory)",
      hazards: SRC.ghs,
      casNumber: SRC.cas,
    },
  },
  {
    id: "colloidal-silica-30",
    name: "Colloidal silica, 30 wt% SiO2 in water",
    kind: "precursor",
    casNumber: "7631-86-9",
    formula: "SiO2",
    molarMass: 60.083,
    density: 1.21,
    assay: 0.3,
    waterFraction: 0.7,
    precursor: {
      residueRefractiveIndex: 1.4585,
      residueFormula: "SiO2",
      residueMolarMass: 60.083,
      residuePerMolecule: 1,
      residueDensity: 2.2,
      networkAtomsPerMolecule: 1,
      hydrolysableGroupsPerMolecule: 0,
    },
    hazards: [],
    sources: {
      "precursor.residueRefractiveIndex": SRC.silicaIndex,
      formula: "described per SiO2 unit (chemistry: colloidal and oligomeric precursors)",
      molarMass: SRC.ciaaw,
      density: "typical data sheet value of 30 wt% aqueous silica sols, 20 °C (from memory)",
      assay: "nominal SiO2 content of the commercial sol",
      waterFraction: "balance of the sol is water (the small alkali stabiliser is neglected)",
      "precursor.residueFormula": "the particles are amorphous silica already",
      "precursor.residueMolarMass": SRC.ciaaw,
      "precursor.residuePerMolecule": "one SiO2 unit per formula unit",
      "precursor.residueDensity": "colloidal silica ≈ 2.2 g/cm³ (Iler, The Chemistry of Silica, 1979, from memory)",
      "precursor.networkAtomsPerMolecule": "one Si per SiO2 unit",
      "precursor.hydrolysableGroupsPerMolecule": "no alkoxy groups: the particles condense through surface silanols",
      hazards: SRC.ghsNone,
      casNumber: SRC.cas,
    },
  },
  {
    id: "ethyl-silicate-40",
    name: "Ethyl silicate 40 (oligomer, 40 wt% SiO2 equivalent)",
    kind: "precursor",
    casNumber: "11099-06-2",
    formula: "C4.8H12O3.2Si",
    molarMass: 149.031,
    density: 1.05,
    precursor: {
      residueRefractiveIndex: 1.4585,
      residueFormula: "SiO2",
      residueMolarMass: 60.083,
      residuePerMolecule: 1,
      residueDensity: 2.2,
      networkAtomsPerMolecule: 1,
      hydrolysableGroupsPerMolecule: 2.4,
      leavingAlcohol: ALCOHOL.ethanol,
    },
    moistureSensitive: true,
    hazards: ["H226", "H319", "H332", "H335"],
    sources: {
      "precursor.residueRefractiveIndex": SRC.silicaIndex,
      formula:
        "average Si unit SiO0.8(OC2H5)2.4 of a 40 % grade: 2.4 ethoxy groups per Si (supplier figure, from memory); 60.083 / 149.03 = 40.3 wt% SiO2",
      molarMass: SRC.ciaaw,
      density: "typical supplier data sheet value, 20 °C (from memory)",
      "precursor.residueFormula": SRC.residueOxide,
      "precursor.residueMolarMass": SRC.ciaaw,
      "precursor.residuePerMolecule": "one SiO2 per Si unit",
      "precursor.residueDensity": SRC.fusedSilica,
      "precursor.networkAtomsPerMolecule": "described per Si unit",
      "precursor.hydrolysableGroupsPerMolecule": "≈ 2.4 ethoxy groups per Si for a 40 % grade (supplier figure, from memory)",
      "precursor.leavingAlcohol": "ethoxy groups release ethanol; Brinker & Scherer, Sol-Gel Science (1990), ch. 3",
      moistureSensitive: "an ethoxysilane oligomer: hydrolyses in moist air and is flammable (from memory)",
      hazards: SRC.ghs,
      casNumber: SRC.cas,
    },
  },
];

/** Sources shared by polymer organic phases. */
const polymerSources = {
  formula: SRC.repeatUnit,
  density: SRC.polymerHandbook,
  "thermal.glassTransitionC": SRC.polymerHandbook,
  "thermal.meltingC": SRC.polymerHandbook,
  "thermal.degradationOnsetC": SRC.tga,
  hazards: SRC.ghsNone,
  casNumber: SRC.cas,
} as const;

const pvaThermal = { glassTransitionC: 85, meltingC: 228, degradationOnsetC: 230 };

const organics: Material[] = [
  {
    id: "peg-2000",
    name: "Poly(ethylene glycol), Mn ≈ 2000",
    kind: "organic",
    casNumber: "25322-68-3",
    formula: "C2H4O",
    density: 1.2,
    thermal: { glassTransitionC: -67, meltingC: 52, degradationOnsetC: 180, degradationOnsetInertC: 340 },
    refractiveIndex: 1.46,
    hazards: [],
    sources: {
      refractiveIndex: SRC.polymerIndex,
      ...polymerSources,
      density: "solid PEG 2000, typical value (from memory)",
      "thermal.glassTransitionC": "poly(ethylene oxide), " + SRC.polymerHandbook,
      "thermal.meltingC": "PEG 2000, typical supplier value (from memory)",
      "thermal.degradationOnsetC":
        "thermo-oxidative degradation of PEG in air starts far below its pyrolysis: onset ≈ 150–200 °C in air (from memory)",
      "thermal.degradationOnsetInertC": "onset of mass loss of PEG in nitrogen ≈ 340–380 °C, thermogravimetry (from memory)",
    },
  },
  {
    id: "pva",
    name: "Poly(vinyl alcohol), fully hydrolysed",
    kind: "organic",
    casNumber: "9002-89-5",
    formula: "C2H4O",
    density: 1.27,
    thermal: pvaThermal,
    refractiveIndex: 1.5,
    hazards: [],
    sources: { ...polymerSources, refractiveIndex: SRC.polymerIndex },
  },
  {
    id: "pva-10-aq",
    name: "Poly(vinyl alcohol), 10 wt% in water",
    kind: "organic",
    formula: "C2H4O",
    density: 1.02,
    assay: 0.1,
    waterFraction: 0.9,
    phaseDensity: 1.27,
    thermal: pvaThermal,
    refractiveIndex: 1.5,
    hazards: [],
    sources: {
      refractiveIndex: "dry PVA, " + SRC.polymerIndex,
      ...polymerSources,
      casNumber: "none: a solution prepared in the lab",
      density: "10 wt% aqueous PVA solution, typical value (from memory)",
      assay: "prepared concentration",
      waterFraction: "balance of the prepared solution is water",
      phaseDensity: "dry PVA, " + SRC.polymerHandbook,
    },
  },
  {
    id: "pcl",
    name: "Poly(ε-caprolactone)",
    kind: "organic",
    casNumber: "24980-41-4",
    formula: "C6H10O2",
    density: 1.145,
    thermal: { glassTransitionC: -60, meltingC: 60, degradationOnsetC: 350 },
    refractiveIndex: 1.465,
    hazards: [],
    sources: { ...polymerSources, refractiveIndex: SRC.polymerIndex },
  },
  {
    id: "pdms-silanol",
    name: "Poly(dimethylsiloxane), silanol-terminated",
    kind: "organic",
    casNumber: "70131-67-8",
    formula: "C2H6OSi",
    density: 0.97,
    // No melting point given: the silanol-terminated oil is an amorphous liquid above its
    // crystallisation range (about −40 °C), so a melting caution would flag every step.
    thermal: { glassTransitionC: -125, degradationOnsetC: 300 },
    refractiveIndex: 1.403,
    hazards: [],
    sources: { ...polymerSources, density: SRC.supplierDensity, refractiveIndex: SRC.polymerIndex },
  },
  {
    id: "chitosan",
    name: "Chitosan",
    kind: "organic",
    casNumber: "9012-76-4",
    formula: "C6H11NO4",
    density: 1.35,
    thermal: { degradationOnsetC: 220 },
    refractiveIndex: 1.52,
    hazards: [],
    sources: {
      refractiveIndex: "dry chitosan film, n_D ≈ 1.52–1.54 (from memory)",
      ...polymerSources,
      formula: "glucosamine repeat unit (fully deacetylated)",
      density: "typical value for dry chitosan (from memory)",
    },
  },
  {
    id: "gelatin",
    name: "Gelatin (type A or B)",
    kind: "organic",
    casNumber: "9000-70-8",
    density: 1.35,
    thermal: { meltingC: 35, degradationOnsetC: 220 },
    refractiveIndex: 1.54,
    hazards: [],
    sources: {
      refractiveIndex: "dry gelatin film, n_D ≈ 1.53–1.54 (from memory)",
      casNumber: SRC.cas,
      density: "typical value for dry gelatin (from memory)",
      "thermal.meltingC": "helix–coil transition of hydrated gelatin gels, about 35 °C (from memory)",
      "thermal.degradationOnsetC": SRC.tga,
      hazards: SRC.ghsNone,
    },
  },
  {
    id: "epoxy-dgeba",
    name: "Bisphenol A diglycidyl ether epoxy resin (DGEBA)",
    kind: "organic",
    casNumber: "1675-54-3",
    formula: "C21H24O4",
    molarMass: 340.419,
    density: 1.16,
    thermal: { degradationOnsetC: 300 },
    refractiveIndex: 1.57,
    epoxyEquivalentWeight: 170.21,
    hazards: ["H315", "H317", "H319", "H411"],
    sources: {
      refractiveIndex: "liquid DGEBA, n_D ≈ 1.57 at 25 °C, typical supplier value (from memory); cured networks 1.55–1.60",
      epoxyEquivalentWeight: "two glycidyl ether groups per molecule: EEW = 340.419 / 2 for the pure monomer (Lee & Neville, Handbook of Epoxy Resins, 1967); commercial liquid grades are 182–192 g/eq (from memory)",
      formula: "pure DGEBA monomer; commercial resins are slightly oligomerised",
      molarMass: SRC.ciaaw,
      density: SRC.supplierDensity,
      "thermal.degradationOnsetC": SRC.tga,
      hazards: SRC.ghs,
      casNumber: SRC.cas,
    },
  },
  {
    id: "polyetheramine-230",
    name: "Poly(propylene glycol) bis(2-aminopropyl ether), Mn ≈ 230 (amine curing agent)",
    kind: "organic",
    casNumber: "9046-10-0",
    formula: "C3H6O",
    density: 0.948,
    refractiveIndex: 1.447,
    amineHydrogenEquivalentWeight: 60,
    thermal: { degradationOnsetC: 200 },
    hazards: ["H302", "H314", "H412"],
    sources: {
      formula: "oxypropylene repeat unit of the polyether chain; two primary amine ends per molecule",
      density: "typical supplier data sheet value for the Mn ≈ 230 grade, 20 °C (from memory)",
      refractiveIndex: "typical supplier data sheet value for the Mn ≈ 230 grade, n_D at 20 °C (from memory)",
      amineHydrogenEquivalentWeight:
        "four amine hydrogens per molecule of Mn ≈ 230: ≈ 57.5, typical supplier figure ≈ 60 g/eq (from memory; Lee & Neville, Handbook of Epoxy Resins, 1967, for the definition)",
      "thermal.degradationOnsetC": "onset of mass loss of the liquid amine in thermogravimetry, typical value (from memory); in a cured network it stands higher",
      hazards: SRC.ghs,
      casNumber: SRC.cas,
    },
  },
  {
    id: "pmma",
    name: "Poly(methyl methacrylate)",
    kind: "organic",
    casNumber: "9011-14-7",
    formula: "C5H8O2",
    density: 1.18,
    thermal: { glassTransitionC: 105, degradationOnsetC: 250 },
    refractiveIndex: 1.49,
    hazards: [],
    sources: { ...polymerSources, refractiveIndex: SRC.polymerIndex },
  },
];

/** Sources shared by polymer substrates. */
const substrateSources = {
  ...polymerSources,
  "thermal.maxServiceC": SRC.gradeMax,
} as const;

// Opaque substrates (PEEK, UHMWPE, the aluminium alloy) carry no refractive index: the engine treats
// a substrate with an index as transparent, and only those get the interference-fringe check.
const substrates: Material[] = [
  {
    id: "polycarbonate",
    name: "Polycarbonate (bisphenol A)",
    kind: "substrate",
    casNumber: "25037-45-0",
    formula: "C16H14O3",
    density: 1.2,
    thermal: { glassTransitionC: 147, degradationOnsetC: 450, heatDeflectionC: 132, maxServiceC: 125 },
    refractiveIndex: 1.586,
    hazards: [],
    sources: { ...substrateSources, "thermal.heatDeflectionC": SRC.hdt, refractiveIndex: SRC.transparentSubstrate },
  },
  {
    id: "pmma-sheet",
    name: "PMMA sheet",
    kind: "substrate",
    casNumber: "9011-14-7",
    formula: "C5H8O2",
    density: 1.19,
    thermal: { glassTransitionC: 105, degradationOnsetC: 250, heatDeflectionC: 95, maxServiceC: 80 },
    refractiveIndex: 1.49,
    hazards: [],
    sources: { ...substrateSources, "thermal.heatDeflectionC": SRC.hdt, refractiveIndex: SRC.transparentSubstrate },
  },
  {
    id: "peek",
    name: "PEEK",
    kind: "substrate",
    casNumber: "29658-26-2",
    formula: "C19H12O3",
    density: 1.3,
    thermal: { glassTransitionC: 143, meltingC: 343, degradationOnsetC: 550, heatDeflectionC: 152, maxServiceC: 250 },
    hazards: [],
    sources: { ...substrateSources, density: SRC.markHandbook, "thermal.heatDeflectionC": SRC.hdt },
  },
  {
    id: "pet",
    name: "PET film",
    kind: "substrate",
    casNumber: "25038-59-9",
    formula: "C10H8O4",
    density: 1.38,
    thermal: { glassTransitionC: 75, meltingC: 255, degradationOnsetC: 400, maxServiceC: 105 },
    refractiveIndex: 1.64,
    hazards: [],
    sources: {
      refractiveIndex: "biaxially oriented PET film, in-plane n_D ≈ 1.64 (amorphous PET 1.575; from memory); treated as transparent for the fringe check",
      ...substrateSources,
      "thermal.maxServiceC":
        "oriented PET film, continuous use ≈ 105 °C (from memory); no heat deflection temperature is given: it is a moulded-bar test that does not describe a film",
    },
  },
  {
    id: "pla",
    name: "PLA",
    kind: "substrate",
    casNumber: "26100-51-6",
    formula: "C3H4O2",
    density: 1.24,
    thermal: { glassTransitionC: 58, meltingC: 170, degradationOnsetC: 300, heatDeflectionC: 55, maxServiceC: 50 },
    refractiveIndex: 1.45,
    hazards: [],
    sources: { ...substrateSources, density: SRC.markHandbook, "thermal.heatDeflectionC": SRC.hdt, refractiveIndex: SRC.transparentSubstrate },
  },
  {
    id: "uhmwpe",
    name: "UHMWPE",
    kind: "substrate",
    casNumber: "9002-88-4",
    formula: "C2H4",
    density: 0.93,
    thermal: { glassTransitionC: -120, meltingC: 135, degradationOnsetC: 400, heatDeflectionC: 47, maxServiceC: 80 },
    hazards: [],
    sources: { ...substrateSources, "thermal.heatDeflectionC": SRC.hdt },
  },
  {
    id: "aluminium-6061",
    name: "Aluminium alloy 6061-T6",
    kind: "substrate",
    density: 2.7,
    thermal: { meltingC: 582, maxServiceC: 150 },
    hazards: [],
    sources: {
      density: "ASM Handbook, aluminium alloy 6061 (from memory)",
      "thermal.meltingC": "solidus of alloy 6061, ASM Handbook (from memory)",
      "thermal.maxServiceC": "the T6 temper over-ages and loses strength above about 150–175 °C (from memory)",
      hazards: SRC.ghsNone,
    },
  },
  {
    id: "soda-lime-glass",
    name: "Soda-lime glass",
    kind: "substrate",
    casNumber: "65997-17-3",
    density: 2.5,
    thermal: { glassTransitionC: 564, maxServiceC: 500 },
    refractiveIndex: 1.52,
    hazards: [],
    sources: {
      refractiveIndex: SRC.transparentSubstrate,
      density: "CRC Handbook of Chemistry and Physics, soda-lime glass ≈ 2.5 g/cm³ (from memory)",
      "thermal.glassTransitionC": "typical soda-lime float glass (from memory)",
      "thermal.maxServiceC": "kept below the strain point (≈ 510 °C) to avoid distortion (from memory)",
      hazards: SRC.ghsNone,
      casNumber: SRC.cas,
    },
  },
];

/** Sources shared by solvents. */
const solventSources = {
  formula: "composition of the compound",
  molarMass: SRC.ciaaw,
  density: SRC.crcOrganic,
  hazards: SRC.ghs,
  casNumber: SRC.cas,
} as const;

const solvents: Material[] = [
  {
    id: "ethanol",
    name: "Ethanol, absolute",
    kind: "solvent",
    casNumber: "64-17-5",
    formula: "C2H5OH",
    molarMass: 46.069,
    density: 0.7893,
    boilingPointC: 78.3,
    hazards: ["H225", "H319"],
    sources: { ...solventSources, boilingPointC: SRC.boilingPoint },
  },
  {
    id: "methanol",
    name: "Methanol",
    kind: "solvent",
    casNumber: "67-56-1",
    formula: "CH3OH",
    molarMass: 32.042,
    density: 0.7914,
    boilingPointC: 64.7,
    hazards: ["H225", "H301", "H311", "H331", "H370"],
    sources: { ...solventSources, boilingPointC: SRC.boilingPoint },
  },
  {
    id: "1-propanol",
    name: "1-Propanol",
    kind: "solvent",
    casNumber: "71-23-8",
    formula: "C3H7OH",
    molarMass: 60.096,
    density: 0.8035,
    boilingPointC: 97.2,
    hazards: ["H225", "H318", "H336"],
    sources: { ...solventSources, boilingPointC: SRC.boilingPoint },
  },
  {
    id: "2-propanol",
    name: "2-Propanol",
    kind: "solvent",
    casNumber: "67-63-0",
    formula: "C3H7OH",
    molarMass: 60.096,
    density: 0.7855,
    boilingPointC: 82.3,
    hazards: ["H225", "H319", "H336"],
    sources: { ...solventSources, boilingPointC: SRC.boilingPoint },
  },
  {
    id: "1-butanol",
    name: "1-Butanol",
    kind: "solvent",
    casNumber: "71-36-3",
    formula: "C4H9OH",
    molarMass: 74.123,
    density: 0.8095,
    boilingPointC: 117.7,
    hazards: ["H226", "H302", "H315", "H318", "H335", "H336"],
    sources: { ...solventSources, boilingPointC: SRC.boilingPoint },
  },
  {
    id: "1-methoxy-2-propanol",
    name: "1-Methoxy-2-propanol",
    kind: "solvent",
    casNumber: "107-98-2",
    formula: "C4H10O2",
    molarMass: 90.122,
    density: 0.922,
    boilingPointC: 120,
    hazards: ["H226", "H336"],
    sources: { ...solventSources, boilingPointC: SRC.boilingPoint },
  },
];

const waters: Material[] = [
  {
    id: "water-di",
    name: "Deionised water",
    kind: "water",
    casNumber: "7732-18-5",
    formula: "H2O",
    molarMass: 18.015,
    density: 0.9982,
    hazards: [],
    sources: {
      formula: "composition of the compound",
      molarMass: SRC.ciaaw,
      density: SRC.water20,
      hazards: "not hazardous",
      casNumber: SRC.cas,
    },
  },
];

/** Sources shared by catalyst stocks. */
const catalystSources = {
  formula: "active compound",
  molarMass: SRC.ciaaw,
  density: SRC.crcAqueous,
  assay: SRC.stock,
  waterFraction: SRC.stock,
  hazards: SRC.ghs,
  casNumber: "CAS Registry Number of the active compound (from memory; check digit verified in tests)",
} as const;

const catalysts: Material[] = [
  {
    id: "hcl-37",
    name: "Hydrochloric acid, 37 wt%",
    kind: "catalyst",
    casNumber: "7647-01-0",
    formula: "HCl",
    molarMass: 36.458,
    density: 1.18,
    assay: 0.37,
    waterFraction: 0.63,
    hazards: ["H290", "H314", "H335"],
    sources: { ...catalystSources },
  },
  {
    id: "hno3-65",
    name: "Nitric acid, 65 wt%",
    kind: "catalyst",
    casNumber: "7697-37-2",
    formula: "HNO3",
    molarMass: 63.012,
    density: 1.39,
    assay: 0.65,
    waterFraction: 0.35,
    hazards: ["H272", "H290", "H314", "H331"],
    sources: { ...catalystSources },
  },
  {
    id: "acetic-acid-glacial",
    name: "Acetic acid, glacial",
    kind: "catalyst",
    casNumber: "64-19-7",
    formula: "CH3COOH",
    molarMass: 60.052,
    density: 1.049,
    boilingPointC: 118,
    hazards: ["H226", "H314"],
    sources: {
      boilingPointC: SRC.boilingPoint,
      formula: "composition of the compound",
      molarMass: SRC.ciaaw,
      density: SRC.crcOrganic,
      hazards: SRC.ghs,
      casNumber: SRC.cas,
    },
  },
  {
    id: "ammonia-25",
    name: "Aqueous ammonia, 25 wt%",
    kind: "catalyst",
    casNumber: "1336-21-6",
    formula: "NH3",
    molarMass: 17.031,
    density: 0.907,
    assay: 0.25,
    waterFraction: 0.75,
    hazards: ["H290", "H314", "H335", "H400"],
    sources: { ...catalystSources, casNumber: "CAS Registry Number of ammonium hydroxide solution (from memory; check digit verified in tests)" },
  },
];

/** Property paths a material defines ("density", "precursor.residueDensity", "thermal.meltingC" …). */
function definedProperties(material: Material): Set<string> {
  const paths = new Set<string>();
  for (const [key, value] of Object.entries(material)) {
    if (value === undefined || value === null || ["id", "name", "kind", "sources"].includes(key)) continue;
    if (key === "precursor" || key === "thermal" || key === "modifier") {
      for (const [inner, innerValue] of Object.entries(value as object)) {
        if (innerValue !== undefined) paths.add(`${key}.${inner}`);
      }
    } else {
      paths.add(key);
    }
  }
  return paths;
}

/** Keeps only the sources of properties the material actually defines (the shared source maps are broader). */
function keepRelevantSources(material: Material): Material {
  const defined = definedProperties(material);
  const sources = Object.fromEntries(Object.entries(material.sources ?? {}).filter(([key]) => defined.has(key)));
  return { ...material, sources };
}

/**
 * The reference materials library: precursors, organic phases, substrates,
 * solvents, water and catalyst stocks, with stable slug ids.
 *
 * @example
 * ```ts
 * referenceMaterials.find((m) => m.id === "teos")?.molarMass; // 208.329 g/mol
 * ```
 */
/** Sources shared by modifiers (chelating and exchanging ligands). */
const modifierSources = {
  formula: "composition of the compound",
  molarMass: SRC.ciaaw,
  density: SRC.crcOrganic,
  "modifier.groupsReplacedPerMolecule":
    "one alkoxy group per β-diketonate, β-ketoesterate or carboxylate ligand; Livage, Henry & Sanchez, Prog. Solid State Chem. 18 (1988) 259",
  "modifier.bondedFormula": "the ligand anion less half an oxygen atom, as it stays in the oxide network (chemistry: modifiers)",
  "modifier.bondedMolarMass": SRC.ciaaw,
  "modifier.bondedDensity": "estimate for a bonded organic ligand phase, ≈ 1.2–1.3 g/cm³ (from memory)",
  "modifier.removalTemperatureC": "chelating ligands burn out of titania and zirconia gels at about 300–400 °C in air, thermogravimetry (from memory)",
  hazards: SRC.ghs,
  casNumber: SRC.cas,
} as const;

const modifierMaterials: Material[] = [
  {
    id: "acac",
    name: "Acetylacetone (2,4-pentanedione)",
    kind: "modifier",
    casNumber: "123-54-6",
    formula: "C5H8O2",
    molarMass: 100.117,
    density: 0.975,
    modifier: { groupsReplacedPerMolecule: 1, bondedFormula: "C5H7O1.5", bondedMolarMass: 91.11, bondedDensity: 1.25, removalTemperatureC: 350 },
    boilingPointC: 140.4,
    refractiveIndex: 1.452,
    hazards: ["H226", "H302", "H311", "H331"],
    sources: { ...modifierSources, boilingPointC: SRC.boilingPoint, refractiveIndex: SRC.ligandIndex },
  },
  {
    id: "ethyl-acetoacetate",
    name: "Ethyl acetoacetate",
    kind: "modifier",
    casNumber: "141-97-9",
    formula: "C6H10O3",
    molarMass: 130.143,
    density: 1.029,
    modifier: { groupsReplacedPerMolecule: 1, bondedFormula: "C6H9O2.5", bondedMolarMass: 121.136, bondedDensity: 1.25, removalTemperatureC: 350 },
    boilingPointC: 180.8,
    refractiveIndex: 1.419,
    hazards: ["H319"],
    sources: { ...modifierSources, boilingPointC: SRC.boilingPoint, refractiveIndex: SRC.ligandIndex },
  },
  {
    id: "methacrylic-acid",
    name: "Methacrylic acid",
    kind: "modifier",
    casNumber: "79-41-4",
    formula: "C4H6O2",
    molarMass: 86.09,
    density: 1.015,
    modifier: { groupsReplacedPerMolecule: 1, bondedFormula: "C4H5O1.5", bondedMolarMass: 77.083, bondedDensity: 1.2, removalTemperatureC: 300 },
    boilingPointC: 161,
    refractiveIndex: 1.431,
    hazards: ["H302", "H312", "H314", "H332", "H335"],
    sources: { ...modifierSources, boilingPointC: SRC.boilingPoint, refractiveIndex: SRC.ligandIndex },
  },
];

export const referenceMaterials: Material[] = [
  ...precursors,
  ...organics,
  ...substrates,
  ...solvents,
  ...waters,
  ...catalysts,
  ...modifierMaterials,
].map(keepRelevantSources);

/**
 * Looks up a reference material by its slug id.
 *
 * @example
 * ```ts
 * referenceMaterial("ethanol").density; // 0.7893 g/cm³
 * ```
 */
export function referenceMaterial(id: string): Material {
  const found = referenceMaterials.find((material) => material.id === id);
  if (!found) throw new Error(`no reference material "${id}"`);
  return found;
}
