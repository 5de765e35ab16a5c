// Hazen-Williams friction loss, US and SI forms: p = 4.52·Q^1.85 / (C^1.85·d^4.87) psi per ft (Q gpm, d in);
// p = 6.05×10⁵·Q^1.85 / (C^1.85·d^4.87) bar per m (Q L/min, d mm). NFPA 13 (2019 edition), 28.2.2.1 (confirmed).

/** Exponent of flow in the Hazen-Williams formula as NFPA 13 writes it. */
export const HW_EXPONENT = 1.85;

/** Friction loss per foot of pipe, psi/ft. */
export function frictionPsiPerFt(flowGpm: number, c: number, insideDiameterIn: number): number {
  return (4.52 * Math.abs(flowGpm) ** HW_EXPONENT) / (c ** HW_EXPONENT * insideDiameterIn ** 4.87);
}

/** Friction loss per metre of pipe, bar/m (the SI form; derived from the US one). */
export function frictionBarPerM(flowLpm: number, c: number, insideDiameterMm: number): number {
  return (6.05e5 * Math.abs(flowLpm) ** HW_EXPONENT) / (c ** HW_EXPONENT * insideDiameterMm ** 4.87);
}

/** Resistance r of a pipe in p = r·Q^1.85 (psi, gpm), for a length in feet. */
export function resistance(lengthFt: number, c: number, insideDiameterIn: number): number {
  return (4.52 * lengthFt) / (c ** HW_EXPONENT * insideDiameterIn ** 4.87);
}

/** Static pressure of a water column, psi per ft of rise (common practice: 0.433). */
export const PSI_PER_FT = 0.433;
