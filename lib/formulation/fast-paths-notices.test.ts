/**
 * The loops that replaced array chains in line ordering, the hard thermal
 * limit and the safety notices give the results of the chains they
 * replaced: each is checked on random input against the earlier
 * definition, kept below as the reference. Hazard codes are GHS hazard
 * statements (UN GHS, annex 3).
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { Dec } from "./decimal";
import { orderLines } from "./line-order";
import { fastHydrolysisNotices, MIN_MODIFIER_RATIO, type ModifierPlan } from "./modifiers";
import { compareSum } from "./sum-compare";
import type { Material } from "./material-schema";
import type { AlcoholRelease, LineRole, Notice, RecipeLine } from "./result-types";
import { safetyNotices } from "./safety";
import { checkThermal, hardLimit, type NamedLimit, type StepAtmosphere, type ThermalSubject } from "./thermal";

// ---- the earlier definitions, as they were ----

const ROLE_ORDER: Record<LineRole, number> = { precursor: 0, modifier: 1, organic: 2, solvent: 3, water: 4, catalyst: 5 };

function referenceOrderLines(lines: readonly RecipeLine[], additionOrder?: readonly string[]): RecipeLine[] {
  const position = new Map<string, number>();
  additionOrder?.forEach((id, index) => {
    if (!position.has(id)) position.set(id, index);
  });
  const unlisted = additionOrder ? additionOrder.length : 0;
  return lines
    .map((line, index) => ({ line, index }))
    .sort((a, b) => {
      const pa = position.get(a.line.materialId) ?? unlisted + ROLE_ORDER[a.line.role];
      const pb = position.get(b.line.materialId) ?? unlisted + ROLE_ORDER[b.line.role];
      return pa - pb || a.index - b.index;
    })
    .map(({ line }) => line);
}

function referenceHardLimit(subject: ThermalSubject, atmosphere: StepAtmosphere): NamedLimit | undefined {
  const t = subject.thermal;
  if (!t) return undefined;
  const candidates: NamedLimit[] = [];
  if (atmosphere === "inert" && t.degradationOnsetInertC !== undefined) {
    candidates.push({ limit: "degradationOnsetInert", limitC: t.degradationOnsetInertC });
  } else if (t.degradationOnsetC !== undefined) {
    candidates.push({ limit: "degradationOnset", limitC: t.degradationOnsetC });
  }
  if (subject.role === "substrate") {
    if (t.heatDeflectionC !== undefined) candidates.push({ limit: "heatDeflection", limitC: t.heatDeflectionC });
    else if (t.maxServiceC !== undefined) candidates.push({ limit: "maxService", limitC: t.maxServiceC });
    if (t.meltingC !== undefined) candidates.push({ limit: "melting", limitC: t.meltingC });
  }
  let lowest: NamedLimit | undefined;
  for (const candidate of candidates) if (!lowest || candidate.limitC < lowest.limitC) lowest = candidate;
  return lowest;
}

const SDS = "Check the supplier's safety data sheet and follow local regulations.";
const hasHazard = (m: Material, codes: readonly string[]): boolean => (m.hazards ?? []).some((code) => codes.some((w) => code.startsWith(w)));
const names = (ms: readonly Material[]): string => ms.map((m) => m.name).join(", ");

function referenceSafetyNotices(dispensed: readonly Material[], alcohols: readonly AlcoholRelease[]): Notice[] {
  const notices: Notice[] = [];
  const alkoxides = dispensed.filter((m) => m.moistureSensitive ?? (m.kind === "precursor" && (m.precursor?.hydrolysableGroupsPerMolecule ?? 0) > 0));
  if (alkoxides.length > 0) {
    notices.push({
      level: "caution",
      code: "alkoxide_handling",
      message: `Alkoxides (${names(alkoxides)}) are moisture-sensitive and flammable: keep containers closed, dispense dry, away from ignition sources. ${SDS}`,
    });
  }
  if (alcohols.find((a) => a.name.trim().toLowerCase() === "methanol" && a.mol > 0)) {
    const sources = dispensed.filter((m) => m.precursor?.leavingAlcohol?.name.trim().toLowerCase() === "methanol");
    notices.push({
      level: "caution",
      code: "methanol_released",
      message: `Hydrolysis of methoxy precursors (${names(sources)}) releases methanol, toxic by inhalation, skin contact and ingestion: work in a fume hood. ${SDS}`,
    });
  }
  const toxic = dispensed.filter((m) => hasHazard(m, ["H330", "H331"]));
  if (toxic.length > 0) {
    const eyes = toxic.filter((m) => hasHazard(m, ["H318"]));
    notices.push({
      level: "caution",
      code: "toxic_by_inhalation",
      message:
        `${names(toxic)}: acutely toxic by inhalation` +
        (eyes.length > 0 ? `; ${names(eyes)} also cause${eyes.length === 1 ? "s" : ""} severe eye damage` : "") +
        `. Handle only in a fume hood with eye protection. ${SDS}`,
    });
  }
  const corrosive = dispensed.filter((m) => hasHazard(m, ["H314"]));
  if (corrosive.length > 0) {
    notices.push({
      level: "caution",
      code: "corrosive",
      message: `${names(corrosive)}: corrosive, causes severe skin burns and eye damage; wear gloves and eye protection. ${SDS}`,
    });
  }
  return notices;
}

function referenceFastHydrolysisNotices(fast: readonly { id: string; name: string; path: string }[], plans: readonly ModifierPlan[], effectiveR: Dec): Notice[] {
  if (fast.length === 0 || !effectiveR.greaterThan(1)) return [];
  const notices: Notice[] = [];
  for (const precursor of fast) {
    const ratios: number[] = [];
    for (const plan of plans) if (plan.spec.precursorId === precursor.id) ratios.push(plan.spec.molPerMetal);
    if (ratios.length > 0 && compareSum(ratios, new Dec(MIN_MODIFIER_RATIO)) >= 0) continue;
    notices.push({
      level: "caution",
      code: "fast_hydrolysis_unmodified",
      field: "modifiers",
      message:
        `${precursor.name} hydrolyses far faster than the silicon alkoxides and, at an effective R of ${Number(effectiveR.toPrecision(4))}, ` +
        `will precipitate unless it is modified first: add a chelating modifier (acetylacetone, ethyl acetoacetate or a carboxylic acid) ` +
        `at ${MIN_MODIFIER_RATIO}–2 mol per mol metal before any water.`,
    });
  }
  return notices;
}

// ---- random input ----

const ROLES: LineRole[] = ["precursor", "organic", "modifier", "solvent", "water", "catalyst"];
const ids = fc.constantFrom("teos", "gptms", "ethanol", "water-di", "hcl-37", "acac", "peg");
const line: fc.Arbitrary<RecipeLine> = fc.record({ materialId: ids, role: fc.constantFrom(...ROLES), massGrams: fc.double({ noNaN: true }), volumeMl: fc.constant(1) });

const temperature = fc.option(fc.integer({ min: -50, max: 500 }), { nil: undefined });
const subject: fc.Arbitrary<ThermalSubject> = fc.record({
  materialId: ids,
  name: fc.string(),
  role: fc.constantFrom("organic" as const, "substrate" as const),
  path: fc.constant("materials.0"),
  thermal: fc.option(
    fc.record({
      glassTransitionC: temperature,
      meltingC: temperature,
      degradationOnsetC: temperature,
      degradationOnsetInertC: temperature,
      heatDeflectionC: temperature,
      maxServiceC: temperature,
    }),
    { nil: undefined },
  ),
});

const hazardCode = fc.constantFrom("H225", "H314", "H318", "H319", "H330", "H331", "H3311", "H31", "H3", "", "h330", "X330", "EUH014", "H330F", "H314H318");
const material: fc.Arbitrary<Material> = fc.record(
  {
    id: ids,
    name: fc.string({ minLength: 1, maxLength: 6 }),
    kind: fc.constantFrom("precursor" as const, "organic" as const, "solvent" as const, "catalyst" as const),
    moistureSensitive: fc.boolean(),
    hazards: fc.array(hazardCode, { maxLength: 3 }),
    precursor: fc.record({
      residueFormula: fc.constant("SiO2"),
      residueMolarMass: fc.constant(60.083),
      residuePerMolecule: fc.constant(1),
      residueDensity: fc.constant(2.2),
      networkAtomsPerMolecule: fc.constant(1),
      hydrolysableGroupsPerMolecule: fc.constantFrom(0, 3, 4),
      leavingAlcohol: fc.option(fc.record({ name: fc.constantFrom("methanol", " Methanol ", "ethanol"), molarMass: fc.constant(32.042) }), { nil: undefined }),
    }),
  },
  { requiredKeys: ["id", "name", "kind"] },
);
const alcohol: fc.Arbitrary<AlcoholRelease> = fc.record({ name: fc.constantFrom("methanol", "METHANOL ", "ethanol"), mol: fc.constantFrom(0, 0.5), grams: fc.constant(1) });

describe("orderLines", () => {
  it("orders lines as the sort of wrapped lines did, with and without an addition order", () => {
    fc.assert(
      fc.property(fc.array(line, { maxLength: 12 }), fc.option(fc.array(ids, { maxLength: 8 }), { nil: undefined }), (lines, order) => {
        const ordered = orderLines(lines, order);
        expect(ordered).toEqual(referenceOrderLines(lines, order));
        // the very same line objects, in a new array
        expect(ordered.every((l, i) => l === referenceOrderLines(lines, order)[i])).toBe(true);
        expect(ordered).not.toBe(lines);
      }),
      { numRuns: 5000 },
    );
  });
});

describe("hardLimit", () => {
  it("picks the limit the list of candidates did, the first of equal ones kept", () => {
    fc.assert(
      fc.property(subject, fc.constantFrom("air" as const, "inert" as const), (s, atmosphere) => {
        expect(hardLimit(s, atmosphere)).toEqual(referenceHardLimit(s, atmosphere));
      }),
      { numRuns: 10000 },
    );
  });
});

describe("safetyNotices", () => {
  it("gives the notices, texts and order of the filter chains", () => {
    fc.assert(
      fc.property(fc.array(material, { maxLength: 6 }), fc.array(alcohol, { maxLength: 3 }), (dispensed, alcohols) => {
        expect(safetyNotices(dispensed, alcohols)).toEqual(referenceSafetyNotices(dispensed, alcohols));
      }),
      { numRuns: 5000 },
    );
  });
});

describe("fastHydrolysisNotices", () => {
  const precursorIds = fc.constantFrom("ti", "zr", "al");
  // only the fields the notice reads; the rest of a plan does not enter it
  const plan = fc
    .record({ precursorId: precursorIds, molPerMetal: fc.constantFrom(0.1, 0.2, 0.25, 0.3, 0.4, 0.5, 1) })
    .map(({ precursorId, molPerMetal }) => ({ spec: { materialId: "acac", precursorId, molPerMetal } }) as unknown as ModifierPlan);
  const fast = fc.array(fc.record({ id: precursorIds, name: fc.string({ maxLength: 5 }), path: fc.constant("materials.0") }), { maxLength: 4 });
  const effectiveR = fc.constantFrom("0.5", "1", "1.00001", "4", "3.14159265", "12.345678").map((text) => new Dec(text));

  it("raises the cautions, with the same words, that the notice built per precursor did", () => {
    fc.assert(
      fc.property(fast, fc.array(plan, { maxLength: 5 }), effectiveR, (f, plans, r) => {
        expect(fastHydrolysisNotices(f, plans, r)).toEqual(referenceFastHydrolysisNotices(f, plans, r));
      }),
      { numRuns: 5000 },
    );
  });
});

describe("checkThermal's row text", () => {
  it("names a material by the last subject with its id, as a map built from the subjects did", () => {
    // PEG melts at 52 °C (data/materials.ts); a drying step at 60 °C is past it: a caution row for each subject
    const peg = { materialId: "peg", role: "organic" as const, thermal: { meltingC: 52, degradationOnsetC: 180 }, path: "materials.0" };
    const { notices } = checkThermal([{ ...peg, name: "first" }, { ...peg, name: "second" }], [], [{ name: "Dry", temperatureC: 60, durationH: 1, stage: "drying" }], 20);
    expect(notices.map((n) => n.message)).toEqual([
      "Process steps within the 20 °C margin of a limit, past a glass transition or melting point, or above a service rating: " +
        '"Dry" at 60 °C vs second melting point 52 °C; "Dry" at 60 °C vs second melting point 52 °C.',
    ]);
  });
});
