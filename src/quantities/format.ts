// Formats internal values (ft, ft², gpm, psi) in the report's unit system, the one place that rounds them:
// with their unit for messages, and as bare numbers at stated places for tables (units in the column heads).

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
  /** Bare numbers for table cells, each at the places that show what matters of it. */
  cell: Record<CellQuantity, (v: number) => string>;
  /** The unit of each kind of cell, for column heads. */
  unit: Record<CellQuantity, string>;
}

export type CellQuantity = 'length' | 'area' | 'flow' | 'pressure' | 'perLength' | 'diameter' | 'velocity' | 'kFactor' | 'density';

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
    // Pressures to 0.01 psi (0.001 bar): a calculation's steps must visibly add up.
    cell: {
      length: (v) => c.length(v).toFixed(system === 'us' ? 1 : 2),
      area: (v) => c.area(v).toFixed(system === 'us' ? 0 : 1),
      flow: (v) => c.flow(v).toFixed(1),
      pressure: (v) => c.pressure(v).toFixed(system === 'us' ? 2 : 3),
      perLength: (v) => (system === 'us' ? v.toFixed(4) : (c.pressure(v) / c.length(1)).toFixed(5)),
      diameter: (v) => c.diameter(v).toFixed(system === 'us' ? 3 : 1),
      velocity: (v) => c.velocity(v).toFixed(1),
      kFactor: (v) => c.kFactor(v).toFixed(1),
      density: (v) => (system === 'us' ? v.toFixed(2) : c.density(v).toFixed(2)),
    },
    unit:
      system === 'us'
        ? {
            length: 'ft',
            area: 'ft²',
            flow: 'gpm',
            pressure: 'psi',
            perLength: 'psi/ft',
            diameter: 'in',
            velocity: 'ft/s',
            kFactor: 'gpm/psi½',
            density: 'gpm/ft²',
          }
        : {
            length: 'm',
            area: 'm²',
            flow: 'L/min',
            pressure: 'bar',
            perLength: 'bar/m',
            diameter: 'mm',
            velocity: 'm/s',
            kFactor: 'L/min/bar½',
            density: 'mm/min',
          },
  };
}
