/**
 * What an exploration varies, what it shows and what it searches for: the
 * zod schemas shared by the explorer page, its Web Worker and the API that
 * stores explorations. Pure TypeScript (no framework, database or auth).
 */
import { z } from "zod";

/** Most points one exploration may compute (sweep, map or ternary grid). */
export const EXPLORE_MAX_POINTS = 20_000;

/** Candidates a target search lists. */
export const SEARCH_CANDIDATES = 10;

/** Longest exploration name, characters. */
export const EXPLORATION_NAME_MAX = 120;

const finite = (what: string) => z.number({ error: `${what} must be a number` }).refine(Number.isFinite, { error: `${what} must be a finite number` });

/** A range from → to in steps of `step` (same units as the variable); from may exceed to (a falling sweep). */
const range = {
  from: finite("range start"),
  to: finite("range end"),
  step: finite("step").refine((v) => v > 0, { error: "step must be greater than 0" }),
};

/**
 * One thing an exploration varies:
 * - weightFraction: a component's weight fraction (0–1); the other components keep their proportions;
 * - waterRatio: the water ratio's value (R, h or per precursor, as the revision sets it);
 * - solidsContent: the solids fraction of a solids-content basis (0–1);
 * - modifierRatio: mol modifier per mol metal of the modifier at `index` in `modifiers`;
 * - stepTemperature: °C of the process step at `index` in `steps`;
 * - withdrawalSpeed: mm/s of a dip coat.
 */
export const variableSchema = z.discriminatedUnion(
  "kind",
  [
    z.object({ kind: z.literal("weightFraction"), materialId: z.string().min(1, "choose the component").max(200), ...range }),
    z.object({ kind: z.literal("waterRatio"), ...range }),
    z.object({ kind: z.literal("solidsContent"), ...range }),
    z.object({ kind: z.literal("modifierRatio"), index: z.number().int().min(0).max(99), ...range }),
    z.object({ kind: z.literal("stepTemperature"), index: z.number().int().min(0).max(99), ...range }),
    z.object({ kind: z.literal("withdrawalSpeed"), ...range }),
  ],
  { error: "choose what varies: a weight fraction, the water ratio, the solids content, a modifier ratio, a step temperature or the withdrawal speed" },
);
export type Variable = z.infer<typeof variableSchema>;
export type VariableKind = Variable["kind"];

/**
 * The grid of an exploration:
 * - sweep: one variable (a line) or two (a map), every combination of their steps;
 * - ternary: three components' weight fractions on a triangle; they share the total they have in the
 *   revision (the other components are fixed), in steps of `step` of that total (0.05 → 21 steps a side).
 */
export const gridSchema = z.discriminatedUnion(
  "kind",
  [
    z.object({ kind: z.literal("sweep"), variables: z.array(variableSchema).min(1, "choose one or two things to vary").max(2, "choose at most two things to vary (or a ternary map)") }),
    z.object({
      kind: z.literal("ternary"),
      materialIds: z.tuple([z.string().min(1).max(200), z.string().min(1).max(200), z.string().min(1).max(200)], { error: "choose three components" }),
      step: finite("step").refine((v) => v > 0 && v <= 0.5, { error: "step must be above 0 and at most 0.5 of the total" }),
    }),
  ],
  { error: "the grid must be a sweep or a ternary map" },
);
export type Grid = z.infer<typeof gridSchema>;

/**
 * A figure an exploration can show or search on: a key of NumericFigures
 * (lib/formulation/numeric/figures.ts) other than `phases` and `thermalStatus`,
 * "absIndexMismatch" (|coat − substrate|), or "phaseVolumeFraction:<materialId>" /
 * "phaseWeightFraction:<materialId>" for one phase. lib/explore/outputs.ts lists them with labels and units.
 */
export const outputKeySchema = z.string().min(1, "choose a figure").max(240);
export type OutputKey = string;

/** min ≤ figure ≤ max (either may be left out). */
export const constraintSchema = z
  .object({ output: outputKeySchema, min: finite("minimum").optional(), max: finite("maximum").optional() })
  .refine((c) => c.min !== undefined || c.max !== undefined, { error: "give a minimum, a maximum or both" })
  .refine((c) => c.min === undefined || c.max === undefined || c.min <= c.max, { error: "the minimum must not exceed the maximum" });
export type Constraint = z.infer<typeof constraintSchema>;

/** What the search optimises: the lowest, the highest, or the closest to a value. */
export const objectiveSchema = z.discriminatedUnion(
  "goal",
  [
    z.object({ goal: z.literal("min"), output: outputKeySchema }),
    z.object({ goal: z.literal("max"), output: outputKeySchema }),
    z.object({ goal: z.literal("closest"), output: outputKeySchema, value: finite("value to come closest to") }),
  ],
  { error: "the aim must be lowest, highest or closest to a value" },
);
export type Objective = z.infer<typeof objectiveSchema>;

/** Worst thermal verdict a candidate may have: "clear" only, or "caution" allowed. */
export const THERMAL_ALLOWANCES = ["clear", "caution", "any"] as const;

/** A target search over the grid's points. */
export const searchSchema = z.object({
  constraints: z.array(constraintSchema).max(20, "at most 20 limits"),
  thermal: z.enum(THERMAL_ALLOWANCES, { error: 'thermal must be "clear", "caution" or "any"' }),
  objective: objectiveSchema,
});
export type Search = z.infer<typeof searchSchema>;

/** One listed candidate: the variable values of its point and the figures shown. */
export const candidateSchema = z.object({
  /** Index of the point in the grid's order. */
  point: z.number().int().min(0),
  /** The values of the grid's variables (ternary: the three weight fractions), in order. */
  values: z.array(finite("value")).max(3),
  /** The objective's figure at this point. */
  score: finite("score"),
  /** Figures by output key (finite values only). */
  figures: z.record(z.string().max(240), finite("figure")),
  thermalStatus: z.enum(["clear", "caution", "fail"]),
});
export type Candidate = z.infer<typeof candidateSchema>;

/** The body that saves an exploration (POST /api/formulations/:id/explorations). */
export const explorationBodySchema = z.object({
  revisionId: z.string().min(1, "choose the revision explored").max(64),
  name: z.string().trim().min(1, "give the exploration a name").max(EXPLORATION_NAME_MAX, `the name may have at most ${EXPLORATION_NAME_MAX} characters`),
  grid: gridSchema,
  /** Figures shown, in order. */
  outputs: z.array(outputKeySchema).min(1, "choose at least one figure to show").max(20, "at most 20 figures"),
  search: searchSchema.optional(),
  /** Points computed (after the cap check). */
  pointCount: z.number().int().min(1).max(EXPLORE_MAX_POINTS),
  /** The best candidates found, when a search ran. */
  candidates: z.array(candidateSchema).max(SEARCH_CANDIDATES).optional(),
});
export type ExplorationBody = z.infer<typeof explorationBodySchema>;
