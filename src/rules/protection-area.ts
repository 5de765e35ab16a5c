// Rule protection-area: each standard-spray head's protection area S × L must not exceed the hazard's
// maximum (130 ft² ordinary hazard, 225 ft² light, 100 ft² extra; see limits.ts for sources).

import { isStandardSpray } from './standard-heads.js';
import { finding, type Rule } from './types.js';

export const protectionArea: Rule = {
  meta: { id: 'protection-area', title: 'Protection area per head', severity: 'error', reference: 'see limits.ts' },
  check({ plan, coverage, limits, fmt }) {
    return plan.heads.filter(isStandardSpray).flatMap((h) => {
      const c = coverage.get(h.id);
      if (!c || c.area === null || c.area <= limits.maxArea + 1e-6) return [];
      return [finding(this.meta, {
        message: `head ${h.id} protects ${fmt.area(c.area)} (S ${fmt.length(c.s!)} × L ${fmt.length(c.l!)}), over the ${fmt.area(limits.maxArea)} allowed`,
        handles: [h.handle], at: h.position, measured: c.area, limit: limits.maxArea, quantity: 'area', reference: limits.sources.maxArea,
      })];
    });
  },
};
