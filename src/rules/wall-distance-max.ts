// Rule wall-distance-max: an end head (along its line) or a head of an outer line (across) must be no
// farther from the wall than half the allowed spacing, measured in that direction to the wall segment.

import { isStandardSpray } from './standard-heads.js';
import { finding, type Rule } from './types.js';

export const wallDistanceMax: Rule = {
  meta: { id: 'wall-distance-max', title: 'Distance from head to wall (maximum)', severity: 'error', reference: 'see limits.ts' },
  check({ plan, coverage, limits, fmt }) {
    return plan.heads.filter(isStandardSpray).flatMap((h) => {
      const c = coverage.get(h.id);
      if (!c) return [];
      const d = Math.max(...[...c.wallAlong, ...c.wallAcross].filter((x): x is number => x !== null), -Infinity);
      if (!(d > limits.maxWallDistance + 1e-6)) return [];
      return [finding(this.meta, {
        message: `head ${h.id} is ${fmt.length(d)} from the wall, over the ${fmt.length(limits.maxWallDistance)} allowed`,
        handles: [h.handle], at: h.position, measured: d, limit: limits.maxWallDistance, quantity: 'length',
        reference: limits.sources.maxWallDistance,
      })];
    });
  },
};
