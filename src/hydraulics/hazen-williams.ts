// Hazen-Williams friction loss in the NFPA 13 form, p = 4.52·Q^1.85 / (C^1.85·d^4.87) psi per ft (Q gpm, d in):
// NFPA 13 (2019 edition), 28.2.2.1 (confirmed). Internal units are US; reports convert.

/** Exponent of flow in the Hazen-Williams formula as NFPA 13 writes it. */
export const HW_EXPONENT = 1.85;

/** Friction loss per foot of pipe, psi/ft. */
export function frictionPsiPerFt(flowGpm: number, c: number, insideDiameterIn: number): number {
  return (4.52 * Math.abs(flowGpm) ** HW_EXPONENT) / (c ** HW_EXPONENT * insideDiameterIn ** 4.87);
}

/** Resistance r of a pipe in p = r·Q^1.85 (psi, gpm), for a length in feet. */
export function resistance(lengthFt: number, c: number, insideDiameterIn: number): number {
  return (4.52 * lengthFt) / (c ** HW_EXPONENT * insideDiameterIn ** 4.87);
}

/** Static pressure of a water column, psi per ft of rise (common practice: 0.433). */
export const PSI_PER_FT = 0.433;
