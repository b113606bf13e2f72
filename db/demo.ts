/**
 * The invented demo scenario: "Larkspur Coatings Lab", a small contract lab.
 * Material ids below are reference ids from data/materials.ts; the seed maps
 * them to the team's own copies. All numbers here are invented for the demo.
 */
import type { FormulationInput } from "@/lib/formulation";
import type { RoleName } from "@/lib/permissions";

export const DEMO_TEAM = { name: "Larkspur Coatings Lab", slug: "larkspur-coatings-lab" } as const;
export const DEMO_PASSWORD = "larkspur-demo-2026";

export const DEMO_USERS: { email: string; name: string; role: RoleName }[] = [
  { email: "admin@larkspur.example", name: "Ada Admin", role: "admin" },
  { email: "formulator@larkspur.example", name: "Flora Formulator", role: "formulator" },
  { email: "reviewer@larkspur.example", name: "Rhys Reviewer", role: "reviewer" },
  { email: "production@larkspur.example", name: "Pat Production", role: "production" },
];

/**
 * Demo prices per kg as supplied, in the team's currency, by reference id: invented for the
 * demo (demo data, not market prices), so that the demo formulations show a cost. The seed
 * sets them on the team's copies that have no price yet.
 */
export const DEMO_PRICES: Record<string, number> = {
  teos: 42,
  gptms: 165,
  "ti-isopropoxide": 120,
  acac: 58,
  ethanol: 6.5,
  "1-propanol": 9,
  "water-di": 0.8,
  "hcl-37": 14,
  "hno3-65": 18,
  "pdms-silanol": 95,
  "zr-propoxide-70": 210,
  "ethyl-acetoacetate": 35,
  "polyetheramine-230": 28,
};

/** Source written beside a demo price in the material's sources. */
export const DEMO_PRICE_SOURCE = "invented demo price (demo data)";

/** A demo input before material ids are mapped (materials are filled in by the seed). */
export type DemoInput = Omit<FormulationInput, "materials">;

/** Reference ids of every material a demo input uses, each once, in order of first use. */
export function demoMaterialRefs(input: DemoInput): string[] {
  return [
    ...new Set<string>([
      ...input.components.map((c) => c.materialId),
      ...(input.modifiers ?? []).map((m) => m.materialId),
      input.water.materialId,
      ...(input.solvent ? [input.solvent.materialId] : []),
      ...(input.catalyst ? [input.catalyst.materialId] : []),
      ...(input.substrateId ? [input.substrateId] : []),
    ]),
  ];
}

export interface DemoFormulation {
  name: string;
  project: string;
  description: string;
  /** Each revision's input and the state it should be in, oldest first. */
  revisions: { input: DemoInput; state: "draft" | "in_review" | "approved" | "released" | "archived"; comment?: string }[];
}

const visorSteps: DemoInput["steps"] = [
  { name: "Hydrolysis, stirred", temperatureC: 25, durationH: 2, stage: "sol" },
  { name: "Ageing of the sol", temperatureC: 25, durationH: 24, stage: "sol" },
  { name: "Flash-off after dip coating", temperatureC: 60, durationH: 0.25, stage: "drying" },
  { name: "Thermal cure", temperatureC: 120, durationH: 2, stage: "curing" },
];

const hardCoat = (titania: number): DemoInput => ({
  basis: { type: "solidsContent", solMassGrams: 500, solidsFraction: 0.2 },
  components: [
    { materialId: "gptms", weightFraction: 0.7 },
    { materialId: "teos", weightFraction: Number((0.3 - titania).toFixed(4)) },
    { materialId: "ti-isopropoxide", weightFraction: titania },
  ],
  // Titanium isopropoxide chelated 1:1 with acetylacetone before any water, as a lab would.
  modifiers: [{ materialId: "acac", precursorId: "ti-isopropoxide", molPerMetal: 1 }],
  water: { materialId: "water-di", ratio: "R", value: 1.5 },
  solvent: { materialId: "ethanol", mode: "fill" },
  catalyst: { materialId: "hcl-37", molPerNetworkAtom: 0.01 },
  substrateId: "polycarbonate",
  steps: visorSteps,
  marginC: 20,
});

export const DEMO_FORMULATIONS: DemoFormulation[] = [
  {
    name: "Visor hard coat HC-3",
    project: "Scratch-resistant coat for polycarbonate visors",
    description: "GPTMS + TEOS with 5 wt% titania, HCl-catalysed in ethanol, dip coated, cured below the polycarbonate's limits.",
    revisions: [
      { input: { ...hardCoat(0.03), steps: visorSteps.slice(0, 3).concat({ name: "Thermal cure", temperatureC: 110, durationH: 3, stage: "curing" }) }, state: "archived" },
      { input: hardCoat(0.05), state: "released", comment: "Cure at 120 °C sits within 20 °C of the polycarbonate grade's limit; acceptable for 2 h on the visor grade, keep the oven calibrated." },
    ],
  },
  {
    name: "Visor hard coat HC-4",
    project: "Scratch-resistant coat for polycarbonate visors",
    description: "HC-3 with more titania for a higher refractive index.",
    revisions: [{ input: hardCoat(0.08), state: "in_review" }],
  },
  {
    name: "Visor hard coat HC-5 fast cure",
    project: "Scratch-resistant coat for polycarbonate visors",
    description: "Trial of a shorter, hotter cure; the thermal check shows why it cannot go ahead.",
    revisions: [
      {
        input: { ...hardCoat(0.05), steps: visorSteps.slice(0, 3).concat({ name: "Thermal cure", temperatureC: 150, durationH: 0.5, stage: "curing" }) },
        state: "draft",
      },
    ],
  },
  {
    name: "Silica–PDMS monolith M-1",
    project: "Flexible silica–PDMS monolith",
    description: "TEOS with silanol-terminated PDMS cast in a 50 mL mould, dried slowly.",
    revisions: [
      {
        input: {
          basis: { type: "gelBody", volumeMl: 50, bulkDensity: 0.5, linearShrinkage: 0.25 },
          components: [
            { materialId: "teos", weightFraction: 0.7 },
            { materialId: "pdms-silanol", weightFraction: 0.3 },
          ],
          water: { materialId: "water-di", ratio: "R", value: 4 },
          solvent: { materialId: "ethanol", mode: "fill" },
          catalyst: { materialId: "hcl-37", molPerNetworkAtom: 0.01 },
          steps: [
            { name: "Hydrolysis", temperatureC: 25, durationH: 1, stage: "sol" },
            { name: "Gelation and ageing, sealed", temperatureC: 40, durationH: 72, stage: "sol" },
            { name: "Slow drying", temperatureC: 60, durationH: 96, stage: "drying" },
            { name: "Final drying", temperatureC: 120, durationH: 12, stage: "drying" },
          ],
          marginC: 20,
        },
        state: "draft",
      },
    ],
  },
  {
    name: "Aluminium barrier coat AB-1",
    project: "Corrosion barrier for an aluminium alloy panel",
    description: "GPTMS + zirconium propoxide, nitric-acid catalysed, spray coated on 6061 panels.",
    revisions: [
      {
        input: {
          basis: { type: "solidMass", grams: 50 },
          components: [
            { materialId: "gptms", weightFraction: 0.75 },
            { materialId: "zr-propoxide-70", weightFraction: 0.25 },
          ],
          // Zirconium propoxide chelated 1:1 with ethyl acetoacetate before the water goes in.
          modifiers: [{ materialId: "ethyl-acetoacetate", precursorId: "zr-propoxide-70", molPerMetal: 1 }],
          water: { materialId: "water-di", ratio: "h", value: 0.5 },
          solvent: { materialId: "1-propanol", mode: "molPerNetworkAtom", value: 6 },
          catalyst: { materialId: "hno3-65", molPerNetworkAtom: 0.02 },
          substrateId: "aluminium-6061",
          steps: [
            { name: "Hydrolysis", temperatureC: 25, durationH: 1, stage: "sol" },
            { name: "Ageing of the sol", temperatureC: 25, durationH: 4, stage: "sol" },
            { name: "Cure", temperatureC: 110, durationH: 1, stage: "curing" },
          ],
          marginC: 20,
        },
        state: "approved",
      },
    ],
  },
];

/**
 * The quality demo (db/seed-quality.ts), all invented demo data: the visor
 * hard coat's specifications, supplier lots of its materials, and the batch
 * history generated with a seeded random generator (mulberry32, seed below).
 */
export const DEMO_QUALITY = {
  formulation: "Visor hard coat HC-3",
  seed: 17_2026,
  batches: 28,
  specifications: [
    {
      property: "Solids content",
      method: "Gravimetric: 2 g of sol dried 1 h at 120 °C (demo)",
      unit: "% w/w",
      numeric: true,
      // The revision's basis: 500 g of sol at 20 % solids.
      target: 20,
      lower: 19,
      upper: 21,
      requirement: null,
      origin: "computed",
    },
    {
      property: "Viscosity",
      method: "Rotational viscometer, spindle 1, 60 rpm, 25 °C",
      unit: "mPa·s",
      numeric: true,
      target: 4.5,
      lower: 3.5,
      upper: 5.5,
      requirement: null,
      origin: "entered",
    },
    {
      property: "Appearance",
      method: "Visual, against a black background",
      unit: "",
      numeric: false,
      target: null,
      lower: null,
      upper: null,
      requirement: "clear, no haze",
      origin: "entered",
    },
  ] as const,
  /** Solids content (% w/w): mean and spread, then a shift upwards from this batch (0-based) on. */
  solids: { mean: 20.0, sd: 0.12, shift: 0.35, shiftFrom: 16 },
  viscosity: { mean: 4.6, sd: 0.15, outOfSpecValue: 5.8 },
  /** The batch (0-based) with an out-of-specification viscosity, acknowledged and released under deviation. */
  outOfSpecBatch: 9,
  acknowledgement: "Viscosity above the upper limit: sol aged 6 h longer over a weekend. Coated test panels pass hardness and adhesion. (Demo data.)",
  deviationJustification:
    "Released under deviation: thicker sol gives a dry film within the thickness tolerance at the usual withdrawal speed; checked on two test visors. (Demo data.)",
  lots: [
    { material: "gptms", supplier: "Demo Silanes Ltd", lotPrefix: "GP", kilograms: 5, shelfLifeDays: 365, newExpiresInDays: 300 },
    { material: "teos", supplier: "Demo Silanes Ltd", lotPrefix: "TE", kilograms: 5, shelfLifeDays: 365, newExpiresInDays: 25 },
    { material: "ti-isopropoxide", supplier: "Demo Metal Organics", lotPrefix: "TI", kilograms: 1, shelfLifeDays: 180, newExpiresInDays: 12 },
    { material: "acac", supplier: "Demo Metal Organics", lotPrefix: "AA", kilograms: 1, shelfLifeDays: 365, newExpiresInDays: 200 },
    { material: "ethanol", supplier: "Demo Solvents", lotPrefix: "ET", kilograms: 10, shelfLifeDays: 730, newExpiresInDays: 600 },
    { material: "hcl-37", supplier: "Demo Solvents", lotPrefix: "HC", kilograms: 1, shelfLifeDays: 730, newExpiresInDays: 500 },
  ],
} as const;
