// Rule wall-distance-min: a standard-spray head must be at least 4 in from any wall (the nearest wall
// segment in any direction), so its spray pattern develops.

import { isStandardSpray } from './standard-heads.js';
import { finding, type Rule } from './types.js';

export const wallDistanceMin: Rule = {
  meta: { id: 'wall-distance-min', title: 'Distance from head to wall (minimum)', severity: 'error', reference: 'see limits.ts' },
  check({ plan, walls, limits, fmt }) {
    return plan.heads.filter(isStandardSpray).flatMap((h) => {
      const d = walls.nearest(h.position, limits.minWallDistance * 2);
      if (d === null || d >= limits.minWallDistance - 1e-6) return [];
      return [finding(this.meta, {
        message: `head ${h.id} is ${fmt.short(d)} from a wall, under the ${fmt.short(limits.minWallDistance)} required`,
        handles: [h.handle], at: h.position, measured: d, limit: limits.minWallDistance, quantity: 'length',
        reference: limits.sources.minWallDistance,
      })];
    });
  },
};
