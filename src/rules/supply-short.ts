// Rule supply-short: the water supply (flow test) must cover each design area's demand — source pressure
// at the design flow plus the hose allowance; a margin under 10 psi is a warning (common practice).

import { flowAtZeroPressure } from '../hydraulics/water-supply.js';
import { finding, type Rule } from './types.js';

/** Customary safety margin between supply and demand, psi (common practice: several psi, often 10). */
export const SAFETY_MARGIN_PSI = 10;

export const supplyShort: Rule = {
  meta: {
    id: 'supply-short', title: 'Water supply against the demand', severity: 'error',
    reference: 'NFPA 13 (2019 edition), 28.2.1: supply at the demand point with hose allowance (from memory); NFPA 291 supply curve (confirmed)',
  },
  check({ design, fmt, settings }) {
    if (!settings.supply) {
      const any = design.areas.find((a) => a.hydraulics);
      return any ? [finding(this.meta, { severity: 'info', message: 'no flow test given (config "supply"): the supply was not compared with the demand', handles: [], at: any.outline[0]! })] : [];
    }
    return design.areas.filter((a) => a.hydraulics && a.hydraulics.margin !== null).flatMap((a) => {
      const h = a.hydraulics!;
      const what = a.source === 'drawn' ? 'the drawn design area' : a.rank === 'runner-up' ? 'the runner-up area' : 'the most demanding area';
      const dry = h.supplyAvailable === 0 ? ` (its flow test reaches zero pressure at ${fmt.flow(flowAtZeroPressure(settings.supply!))})` : '';
      const text = `${what} needs ${fmt.pressure(h.sourcePressure)} at ${fmt.flow(h.totalDemand)} with hose streams; the supply gives ${fmt.pressure(h.supplyAvailable!)}${dry}`;
      if (h.margin! < 0) {
        return [finding(this.meta, { message: `${text}: short by ${fmt.pressure(-h.margin!)}`, handles: a.handle ? [a.handle] : [], at: a.outline[0]!, measured: h.sourcePressure, limit: h.supplyAvailable, quantity: 'pressure' })];
      }
      if (h.margin! < SAFETY_MARGIN_PSI) {
        return [finding(this.meta, { severity: 'warning', message: `${text}: a margin of only ${fmt.pressure(h.margin!)}`, handles: a.handle ? [a.handle] : [], at: a.outline[0]!, measured: h.margin, limit: SAFETY_MARGIN_PSI, quantity: 'pressure', reference: 'common practice, no source: a safety margin of several psi, often 10' })];
      }
      return [];
    });
  },
};
