// Rule wall-distance-max: an end head (along its line) or a head of an outer line (across) must be no farther from
// the wall than half the allowed spacing, measured in that direction to the wall segment.

import { maxOf } from '../arrays.js';
import { isStandardSpray } from './standard-heads.js';
import { basisOfHead } from '../zones/zones.js';
import { finding, type Rule } from './types.js';

export const wallDistanceMax: Rule<'wall-distance-max'> = {
  meta: {
    id: 'wall-distance-max',
    title: 'Distance from head to wall (maximum)',
    severity: 'error',
    reference: 'NFPA 13 (2019 edition), 10.2.5.2.1: half the allowed maximum spacing (confirmed)',
  },
  check({ plan, coverage, zoning }) {
    return plan.heads.filter(isStandardSpray).flatMap((h) => {
      const { limits } = basisOfHead(zoning, h);
      const c = coverage.get(h.id);
      if (!c) return [];
      const d = maxOf([...c.wallAlong, ...c.wallAcross].filter((x): x is number => x !== null));
      if (!(d > limits.maxWallDistance + 1e-6)) return [];
      return [
        finding(this.meta, {
          params: { head: h.id, distance: d, limit: limits.maxWallDistance },
          handles: [h.handle],
          at: h.position,
          measured: d,
          limit: limits.maxWallDistance,
          quantity: 'length',
          reference: limits.sources.maxWallDistance,
        }),
      ];
    });
  },
};
