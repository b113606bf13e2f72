/**
 * Standard atomic weights, g/mol, for the elements that occur in sol-gel
 * precursors, organic phases, solvents, catalysts and substrates.
 *
 * Source: IUPAC/CIAAW 2021 standard atomic weights, abridged values
 * (five significant figures; for elements whose standard atomic weight is an
 * interval, the conventional value, e.g. H 1.008, C 12.011, O 15.999).
 */
export const ATOMIC_WEIGHTS_SOURCE = "IUPAC/CIAAW 2021 standard atomic weights, abridged values";

/**
 * Element symbol → standard atomic weight (g/mol).
 * Source: IUPAC/CIAAW 2021 standard atomic weights, abridged values.
 *
 * @example
 * ```ts
 * ATOMIC_WEIGHTS.Si; // 28.085
 * ```
 */
export const ATOMIC_WEIGHTS: Readonly<Record<string, number>> = Object.freeze({
  H: 1.008,
  Li: 6.94,
  B: 10.81,
  C: 12.011,
  N: 14.007,
  O: 15.999,
  F: 18.998,
  Na: 22.99,
  Mg: 24.305,
  Al: 26.982,
  Si: 28.085,
  P: 30.974,
  S: 32.06,
  Cl: 35.45,
  K: 39.098,
  Ca: 40.078,
  Ti: 47.867,
  V: 50.942,
  Cr: 51.996,
  Mn: 54.938,
  Fe: 55.845,
  Co: 58.933,
  Ni: 58.693,
  Cu: 63.546,
  Zn: 65.38,
  Ge: 72.63,
  Br: 79.904,
  Sr: 87.62,
  Y: 88.906,
  Zr: 91.224,
  Nb: 92.906,
  Ag: 107.87,
  Sn: 118.71,
  Ba: 137.33,
  Ce: 140.12,
  Hf: 178.49,
  Ta: 180.95,
  W: 183.84,
});
