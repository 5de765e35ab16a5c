// Rule head-spacing-max: distance between neighbouring standard-spray heads on a branch line must not exceed the
// hazard's maximum spacing (15 ft light and ordinary, 12 ft extra); the finding names both heads.

import { isStandardSpray } from './standard-heads.js';
import { basisOfHead } from '../zones/zones.js';
import { finding, type Rule } from './types.js';

export const headSpacingMax: Rule<'head-spacing-max'> = {
  meta: {
    id: 'head-spacing-max',
    title: 'Spacing between heads on a branch line',
    severity: 'error',
    reference: 'NFPA 13 (2019 edition), Table 10.2.4.2.1(a)-(c): 15 ft LH/OH, 12 ft EH (from memory)',
  },
  check({ plan, coverage, zoning }) {
    const handleOf = new Map(plan.heads.map((h) => [h.id, h.handle]));
    return plan.heads.filter(isStandardSpray).flatMap((h) => {
      const c = coverage.get(h.id);
      const after = c?.headAlong[1];
      const next = c?.neighbours[1];
      if (after === null || after === undefined || !next) return [];
      // A gap between two zones is held to the stricter of the two.
      const [mine, theirs] = [basisOfHead(zoning, h).limits, basisOfHead(zoning, { id: next }).limits];
      const limits = theirs.maxSpacing < mine.maxSpacing ? theirs : mine;
      if (after <= limits.maxSpacing + 1e-6) return [];
      return [
        finding(this.meta, {
          params: { head: h.id, next, distance: after, limit: limits.maxSpacing },
          handles: [...new Set([h.handle, handleOf.get(next)!])],
          at: h.position,
          measured: after,
          limit: limits.maxSpacing,
          quantity: 'length',
          reference: limits.sources.maxSpacing,
        }),
      ];
    });
  },
};
