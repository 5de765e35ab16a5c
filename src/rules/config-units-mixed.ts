// Rule config-units-mixed: a config value far from what designs use in the config's unit system, but usual when
// read in the other one (a density of 8.1 in a US config, a supply of 5 "psi"), is the likely mix-up, said.

import { QUANTITIES, type QuantityKind, type Settings } from '../config/settings.js';
import { finding, type Rule } from './types.js';

/**
 * Values designs use, in US units (common practice, no source): densities of the density/area method, design
 * areas from the quick-response floor to twice the curves' end, flow-test pressures of city mains and pumps,
 * head pressures from the usual minimum to well past what heads are run at.
 */
const USUAL: { key: string; kind: QuantityKind; value: (s: Settings) => number | undefined; low: number; high: number }[] = [
  { key: 'design.density', kind: 'density', value: (s) => s.design.density, low: 0.05, high: 0.6 },
  { key: 'design.area', kind: 'area', value: (s) => s.design.area, low: 700, high: 10_000 },
  { key: 'design.minHeadPressure', kind: 'pressure', value: (s) => s.design.minHeadPressure, low: 4, high: 60 },
  { key: 'supply.static', kind: 'pressure', value: (s) => s.supply?.static, low: 15, high: 250 },
  { key: 'supply.residual', kind: 'pressure', value: (s) => s.supply?.residual, low: 10, high: 250 },
];

export const configUnitsMixed: Rule<'config-units-mixed'> = {
  meta: {
    id: 'config-units-mixed',
    title: 'Config value that looks like the other unit system',
    severity: 'error',
    reference: 'common practice, no source: the values designs use in either unit system',
  },
  check({ settings, plan }) {
    const system = settings.unitSystem;
    const other = system === 'us' ? 'si' : 'us';
    const at = plan.heads[0]?.position ?? { x: 0, y: 0 };
    return USUAL.flatMap(({ key, kind, value, low, high }) => {
      const us = value(settings);
      if (us === undefined || (us >= low && us <= high)) return [];
      const { siPerUs } = QUANTITIES[kind];
      // The number as written, and what it means when read in the other system.
      const written = +(system === 'us' ? us : us * siPerUs).toPrecision(6);
      const meant = other === 'us' ? written : written / siPerUs;
      if (meant < low || meant > high) return [];
      const unit = QUANTITIES[kind];
      return [
        finding(this.meta, {
          params: { key, written, unit: unit[system], otherUnit: unit[other], otherSystem: other },
          handles: [],
          at,
          measured: us,
          limit: us < low ? low : high,
          quantity: kind === 'number' ? 'none' : kind,
        }),
      ];
    });
  },
};
