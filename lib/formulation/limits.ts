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

/** Refractive index n_D: from vacuum (1) to above the highest known solids (rutile ≈ 2.9, diamond 2.42; CRC Handbook). */
export const REFRACTIVE_INDEX = { min: 1, max: 5 } as const;

/** Equivalent weights (EEW, AHEW), g/eq: from small amines (≈ 15) to long prepolymers. */
export const EQUIVALENT_WEIGHT_G_PER_EQ = { min: 1, max: 1e6 } as const;

/** Price per kg as supplied, in the team's currency: 0 (free sample) to 10⁹. */
export const PRICE_PER_KG = { min: 0, max: 1e9 } as const;

/** Sol viscosity, mPa·s: below the thinnest solvents (diethyl ether 0.22) to a paste. */
export const VISCOSITY_MPA_S = { min: 0.01, max: 1e6 } as const;

/** Surface tension, mN/m: from fluorinated liquids (≈ 10) to mercury (485); 1 to 1000 admitted. */
export const SURFACE_TENSION_MN_PER_M = { min: 1, max: 1000 } as const;

/** Dip-coating withdrawal speed, mm/s (0.1 µm/s to 10 m/s). */
export const WITHDRAWAL_MM_PER_S = { min: 1e-4, max: 1e4 } as const;

/** Spin speed, rpm. */
export const SPIN_RPM = { min: 1, max: 1e5 } as const;

/** Dry film thickness, nm (a monolayer to 10 mm). */
export const DRY_THICKNESS_NM = { min: 0.1, max: 1e7 } as const;

/** Wet film thickness, µm (10 nm to 100 mm). */
export const WET_THICKNESS_UM = { min: 0.01, max: 1e5 } as const;

/** Coated area, m². */
export const AREA_M2 = { min: 1e-6, max: 1e6 } as const;
