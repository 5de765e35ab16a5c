// Rule protection-area: each standard-spray head's protection area S × L must not exceed the hazard's maximum
// (130 ft² ordinary hazard, 225 ft² light, 100 ft² extra; the limit table names the sources).

import { isStandardSpray } from './standard-heads.js';
import { basisOfHead } from '../zones/zones.js';
import { finding, type Rule } from './types.js';

export const protectionArea: Rule<'protection-area'> = {
  meta: {
    id: 'protection-area',
    title: 'Protection area per head',
    severity: 'error',
    reference: 'NFPA 13 (2019 edition), Table 10.2.4.2.1(a)-(c): 225 ft² LH, 130 ft² OH, 100 ft² EH (confirmed)',
  },
  check({ plan, coverage, zoning }) {
    return plan.heads.filter(isStandardSpray).flatMap((h) => {
      const { limits } = basisOfHead(zoning, h);
      const c = coverage.get(h.id);
      if (!c || c.area === null || c.area <= limits.maxArea + 1e-6) return [];
      return [
        finding(this.meta, {
          params: { head: h.id, area: c.area, s: c.s!, l: c.l!, limit: limits.maxArea },
          handles: [h.handle],
          at: h.position,
          measured: c.area,
          limit: limits.maxArea,
          quantity: 'area',
          reference: limits.sources.maxArea,
        }),
      ];
    });
  },
};
