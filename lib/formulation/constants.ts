/**
 * Named constants of the formulation engine, each with its unit and source.
 */

/** Engine version, reported with every stored result (semantic versioning). */
export const ENGINE_VERSION = "1.0.0";

/**
 * Molar mass of water, g/mol: 2 × 1.008 + 15.999 = 18.015.
 * Source: IUPAC/CIAAW 2021 standard atomic weights, abridged values.
 */
export const WATER_MOLAR_MASS_G_PER_MOL = 18.015;

/**
 * Allowed deviation of the sum of weight fractions from 1 (dimensionless).
 * Common practice, no source: a tolerance well below any balance's resolution.
 */
export const WEIGHT_FRACTION_SUM_TOLERANCE = 1e-6;

/**
 * Default safety margin below a hard thermal limit, °C.
 * Common practice, no source.
 */
export const DEFAULT_THERMAL_MARGIN_C = 20;

/** Millilitres per litre (exact). */
export const ML_PER_L = 1000;
