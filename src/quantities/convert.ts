// Unit conversion factors between the US units used inside the tool and the SI units of configs and reports.
// Exact by definition where a definition exists (inch, gallon, pound-force); the rest derived from those.

/** Metres per foot (international foot, exact). */
export const M_PER_FT = 0.3048;
/** Square metres per square foot. */
export const M2_PER_FT2 = M_PER_FT * M_PER_FT;
/** Litres per US gallon (exact: 231 in³). */
export const L_PER_GAL = 3.785411784;
/** Bar per psi (1 lbf/in² = 6894.757293168 Pa; 1 bar = 10⁵ Pa). */
export const BAR_PER_PSI = 0.06894757293168;
/** mm/min per gpm/ft²: a density of 1 gpm/ft² is 40.746 L/min per m², i.e. mm/min. */
export const MMMIN_PER_GPMFT2 = L_PER_GAL / M2_PER_FT2;
/** SI K-factor (L/min/bar^½) per US K-factor (gpm/psi^½): 14.4163. */
export const KSI_PER_KUS = L_PER_GAL / Math.sqrt(BAR_PER_PSI);

export type UnitSystem = 'us' | 'si';

export interface ReportUnits {
  length: 'ft' | 'm';
  area: 'ft2' | 'm2';
  flow: 'gpm' | 'L/min';
  pressure: 'psi' | 'bar';
}

export const REPORT_UNITS: Record<UnitSystem, ReportUnits> = {
  us: { length: 'ft', area: 'ft2', flow: 'gpm', pressure: 'psi' },
  si: { length: 'm', area: 'm2', flow: 'L/min', pressure: 'bar' },
};

/** Converters from internal US values to the chosen system. */
export interface Converter {
  length(ft: number): number;
  area(ft2: number): number;
  flow(gpm: number): number;
  pressure(psi: number): number;
  density(gpmPerFt2: number): number;
  kFactor(kUs: number): number;
  velocity(ftPerS: number): number;
  /** Pipe inside diameters stay in inches (US) or become millimetres (SI). */
  diameter(inches: number): number;
}

export function converterFor(system: UnitSystem): Converter {
  if (system === 'us') {
    const id = (v: number) => v;
    return { length: id, area: id, flow: id, pressure: id, density: id, kFactor: id, velocity: id, diameter: id };
  }
  return {
    length: (v) => v * M_PER_FT,
    area: (v) => v * M2_PER_FT2,
    flow: (v) => v * L_PER_GAL,
    pressure: (v) => v * BAR_PER_PSI,
    density: (v) => v * MMMIN_PER_GPMFT2,
    kFactor: (v) => v * KSI_PER_KUS,
    velocity: (v) => v * M_PER_FT,
    diameter: (v) => v * 25.4,
  };
}
