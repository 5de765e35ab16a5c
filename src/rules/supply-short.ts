// Rule supply-short: the water supply (flow test, through its path) must cover each design area's demand: source pressure at the
// design flow plus the hose allowance; a margin under 10 psi is a warning (common practice).

import { flowAtZeroSupply, supplyOf } from '../hydraulics/supply-path.js';
import { finding, type Rule } from './types.js';

/** Customary safety margin between supply and demand, psi (common practice: several psi, often 10). */
const SAFETY_MARGIN_PSI = 10;

export const supplyShort: Rule<'supply-short'> = {
  meta: {
    id: 'supply-short',
    title: 'Water supply against the demand',
    severity: 'error',
    reference:
      'NFPA 13 (2019 edition), 28.2.1: supply at the demand point with hose allowance (from memory); NFPA 291 supply curve (confirmed)',
  },
  check({ design, settings }) {
    if (!settings.supply) {
      const any = design.areas.find((a) => a.hydraulics);
      return any ? [finding(this.meta, { severity: 'info', params: { kind: 'no-supply' }, handles: [], at: any.at })] : [];
    }
    const supply = supplyOf(settings)!;
    return design.areas
      .filter((a) => a.hydraulics && a.hydraulics.margin !== null)
      .flatMap((a) => {
        const h = a.hydraulics!;
        const margin = h.margin!;
        if (margin >= SAFETY_MARGIN_PSI) return [];
        const params = {
          kind: margin < 0 ? ('short' as const) : ('low-margin' as const),
          area: a.rank ?? ('drawn' as const),
          place: a.place,
          pressure: h.sourcePressure,
          demand: h.totalDemand,
          available: h.supplyAvailable!,
          dryAt: h.supplyAvailable === 0 ? flowAtZeroSupply(supply, h.totalDemand) : null,
          margin,
        };
        const handles = a.handle ? [a.handle] : [];
        return [
          margin < 0
            ? finding(this.meta, {
                params,
                handles,
                at: a.at,
                measured: h.sourcePressure,
                limit: h.supplyAvailable,
                quantity: 'pressure',
              })
            : finding(this.meta, {
                severity: 'warning',
                params,
                handles,
                at: a.at,
                measured: margin,
                limit: SAFETY_MARGIN_PSI,
                quantity: 'pressure',
                reference: 'common practice, no source: a safety margin of several psi, often 10',
              }),
        ];
      });
  },
};
