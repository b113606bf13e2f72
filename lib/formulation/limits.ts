/**
 * Plausibility limits on input values. They keep every intermediate and
 * every result inside the range of a JS number (no Infinity, no underflow to
 * 0) while admitting any real laboratory value. Common practice, no source,
 * except where noted.
 */

/** Densities, g/cm³: from the lightest aerogels (≈ 0.001) to above the densest element (osmium 22.59, CRC Handbook). */
export const DENSITY_G_PER_CM3 = { min: 0.001, max: 30 } as const;

/** Molar masses, g/mol: from hydrogen (1.008) to ultra-high-molar-mass polymers. */
export const MOLAR_MASS_G_PER_MOL = { min: 1, max: 1e7 } as const;

/** Counts per molecule (network atoms, hydrolysable groups, water of crystallisation): 0, or 0.01 to 100. */
export const PER_MOLECULE = { min: 0.01, max: 100 } as const;

/** Weight fraction of a component: 0, or 1 ppm to 1 (dimensionless). */
export const WEIGHT_FRACTION = { min: 1e-6, max: 1 } as const;

/** Residue formula units per molecule: at least 0.01 (e.g. 0.5 for Al(OR)3 → ½ Al2O3). */
export const RESIDUE_UNITS_PER_MOLECULE = { min: 0.01, max: 100 } as const;

/** Assay (mass fraction of the active compound), dimensionless: 0.1 % to 100 %. */
export const ASSAY = { min: 0.001, max: 1 } as const;

/** Batch sizes: dry mass or sol mass in g, mould volume in mL (1 µg to 1000 t). */
export const BATCH_AMOUNT = { min: 1e-6, max: 1e9 } as const;

/** Molar ratios (water R or h, solvent and catalyst per network atom), mol/mol. */
export const MOLAR_RATIO = { min: 0, max: 1e4 } as const;

/** Temperatures, °C: absolute zero (−273.15 °C, exact) to 5000 °C. */
export const TEMPERATURE_C = { min: -273.15, max: 5000 } as const;

/** Step durations, h (about 11 years at most). */
export const DURATION_H = { min: 0, max: 1e5 } as const;

/** Thermal safety margin, °C. */
export const MARGIN_C = { min: 0, max: 1000 } as const;
