/**
 * The kinds of material a formulation can reference. A module of its own so
 * that pages listing materials need not load the engine or zod.
 *
 * @example
 * ```ts
 * MATERIAL_KINDS.includes("precursor"); // true
 * ```
 */
export const MATERIAL_KINDS = ["precursor", "organic", "substrate", "solvent", "water", "catalyst", "modifier"] as const;

/** A material's kind. */
export type MaterialKind = (typeof MATERIAL_KINDS)[number];
