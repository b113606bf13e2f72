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
