// Rule wall-distance-min: a standard-spray head must be at least 4 in from any wall (the nearest wall segment in any
// direction), so its spray pattern develops.

import { isStandardSpray } from './standard-heads.js';
import { basisOfHead } from '../zones/zones.js';
import { finding, type Rule } from './types.js';

export const wallDistanceMin: Rule<'wall-distance-min'> = {
  meta: {
    id: 'wall-distance-min',
    title: 'Distance from head to wall (minimum)',
    severity: 'error',
    reference: 'NFPA 13 (2019 edition), 10.2.5.2.3: 4 in (confirmed)',
  },
  check({ plan, walls, zoning }) {
    return plan.heads.filter(isStandardSpray).flatMap((h) => {
      const { limits } = basisOfHead(zoning, h);
      const d = walls.nearest(h.position, limits.minWallDistance * 2);
      if (d === null || d >= limits.minWallDistance - 1e-6) return [];
      return [
        finding(this.meta, {
          params: { head: h.id, distance: d, limit: limits.minWallDistance },
          handles: [h.handle],
          at: h.position,
          measured: d,
          limit: limits.minWallDistance,
          quantity: 'length',
          reference: limits.sources.minWallDistance,
        }),
      ];
    });
  },
};
