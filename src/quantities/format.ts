// Formats internal values (ft, ft², gpm, psi) for messages in the report's unit system.
// Rules call these so a finding reads the same units as the numbers beside it.

import { converterFor, REPORT_UNITS, type UnitSystem } from './convert.js';

export interface Formatter {
  system: UnitSystem;
  length(ft: number): string;
  /** Short distances: inches (US) or millimetres (SI). */
  short(ft: number): string;
  area(ft2: number): string;
  flow(gpm: number): string;
  pressure(psi: number): string;
  density(gpmPerFt2: number): string;
  kFactor(kUs: number): string;
}

export function formatterFor(system: UnitSystem): Formatter {
  const c = converterFor(system);
  const u = REPORT_UNITS[system];
  const areaUnit = system === 'us' ? 'ft²' : 'm²';
  return {
    system,
    length: (v) => `${c.length(v).toFixed(2)} ${u.length}`,
    short: (v) => (system === 'us' ? `${(v * 12).toFixed(1)} in` : `${(v * 304.8).toFixed(0)} mm`),
    area: (v) => `${c.area(v).toFixed(system === 'us' ? 1 : 2)} ${areaUnit}`,
    flow: (v) => `${c.flow(v).toFixed(1)} ${u.flow}`,
    pressure: (v) => `${c.pressure(v).toFixed(system === 'us' ? 1 : 3)} ${u.pressure}`,
    density: (v) => (system === 'us' ? `${v.toFixed(2)} gpm/ft²` : `${c.density(v).toFixed(2)} mm/min`),
    kFactor: (v) => (system === 'us' ? `K ${v.toFixed(1)} gpm/psi½` : `K ${c.kFactor(v).toFixed(1)} L/min/bar½`),
  };
}
