// Rule head-spacing-max: distance between neighbouring standard-spray heads on a branch line must not
// exceed the hazard's maximum spacing (15 ft light and ordinary, 12 ft extra; see limits.ts).

import { isStandardSpray } from './standard-heads.js';
import { finding, type Rule } from './types.js';

export const headSpacingMax: Rule = {
  meta: { id: 'head-spacing-max', title: 'Spacing between heads on a branch line', severity: 'error', reference: 'see limits.ts' },
  check({ plan, coverage, limits, fmt }) {
    return plan.heads.filter(isStandardSpray).flatMap((h) => {
      const after = coverage.get(h.id)?.headAlong[1];
      if (after === null || after === undefined || after <= limits.maxSpacing + 1e-6) return [];
      return [finding(this.meta, {
        message: `head ${h.id} is ${fmt.length(after)} from the next head on its branch line, over the ${fmt.length(limits.maxSpacing)} allowed`,
        handles: [h.handle], at: h.position, measured: after, limit: limits.maxSpacing, quantity: 'length', reference: limits.sources.maxSpacing,
      })];
    });
  },
};
