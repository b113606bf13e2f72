/**
 * Named constants of the formulation engine, each with its unit and source.
 */

/** Engine version, reported with every stored result (semantic versioning). */
export const ENGINE_VERSION = "2.1.0";

/**
 * Molar mass of water, g/mol: 2 × 1.008 + 15.999 = 18.015.
 * Source: IUPAC/CIAAW 2021 standard atomic weights, abridged values.
 */
export const WATER_MOLAR_MASS_G_PER_MOL = 18.015;

/**
 * Default safety margin below a hard thermal limit, °C.
 * Common practice, no source.
 */
export const DEFAULT_THERMAL_MARGIN_C = 20;

/** Millilitres per litre (exact). */
export const ML_PER_L = 1000;

/**
 * Smallest mass a recipe line is written with, g: a solvent fill or water
 * addition below it is rounding left over from exact arithmetic, and the
 * line is left out. Common practice, no source: far below any balance.
 */
export const MIN_LINE_GRAMS = 1e-9;

/**
 * Weight fractions that sum to within this of 1 (0.5 %) are scaled to 1 with
 * a notice (33.3 / 33.3 / 33.3 %); beyond it they are refused. Common
 * practice, no source.
 */
export const WEIGHT_FRACTION_SCALE_TOLERANCE = 0.005;

/**
 * Catalyst ratio above which a caution is given, mol active per mol network
 * atom: acid or base catalysts are used at 0.001–0.1 (Brinker & Scherer,
 * Sol-Gel Science, 1990, ch. 3, from memory); above 1 is almost surely a
 * unit slip (mmol typed as mol, or percent as a fraction).
 */
export const CATALYST_RATIO_CAUTION = 1;

/**
 * Standard acceleration of gravity, m/s² (exact by definition: CGPM 1901,
 * BIPM SI Brochure, 9th ed.).
 */
export const STANDARD_GRAVITY_M_PER_S2 = 9.80665;

/**
 * Prefactor of the Landau–Levich thickness h = 0.94 (ηU)^(2/3) / (γ^(1/6) (ρg)^(1/2)),
 * dimensionless. Source: Landau & Levich, Acta Physicochim. URSS 17 (1942) 42;
 * Brinker et al., Thin Solid Films 201 (1991) 97.
 */
export const LANDAU_LEVICH_PREFACTOR = 0.94;

/**
 * Capillary number Ca = ηU/γ above which the Landau–Levich law is out of its
 * range (it holds for Ca ≪ 1), dimensionless. Common practice, from memory.
 */
export const CAPILLARY_NUMBER_LIMIT = 0.01;

/**
 * |n_coat − n_substrate| above which interference fringes show on a
 * transparent substrate, dimensionless. Common practice, from memory.
 */
export const FRINGE_INDEX_MISMATCH = 0.01;

/**
 * Highest initial boiling point of a volatile organic compound, °C at
 * 101.3 kPa. Source: EU Directive 2004/42/EC, art. 2(5).
 */
export const VOC_BOILING_POINT_MAX_C = 250;

/**
 * Amine-hydrogen to epoxy equivalent ratio outside which a caution is given
 * (stoichiometric cure is 1). Source: Lee & Neville, Handbook of Epoxy
 * Resins (1967), from memory.
 */
export const CURE_RATIO_RANGE = { min: 0.8, max: 1.2 } as const;
