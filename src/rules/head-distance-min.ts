// Rule head-distance-min: two standard-spray heads closer than 6 ft wet each other (cold soldering)
// unless baffles separate them; reported once per pair (a symbol drawn twice at one point is one head).

import RBush from 'rbush';
import { distance } from '../geometry/point.js';
import { isStandardSpray } from './standard-heads.js';
import { finding, type Rule } from './types.js';

interface Box { minX: number; minY: number; maxX: number; maxY: number; i: number }

export const headDistanceMin: Rule = {
  meta: { id: 'head-distance-min', title: 'Distance between heads (minimum)', severity: 'error', reference: 'see limits.ts' },
  check({ plan, limits, fmt }) {
    const heads = plan.heads.filter(isStandardSpray);
    const tree = new RBush<Box>();
    tree.load(heads.map((h, i) => ({ minX: h.position.x, minY: h.position.y, maxX: h.position.x, maxY: h.position.y, i })));
    const r = limits.minHeadDistance;
    return heads.flatMap((h, i) =>
      tree
        .search({ minX: h.position.x - r, minY: h.position.y - r, maxX: h.position.x + r, maxY: h.position.y + r })
        .filter((b) => b.i > i && distance(h.position, heads[b.i]!.position) < r - 1e-6)
        .map((b) => {
          const o = heads[b.i]!;
          const d = distance(h.position, o.position);
          return finding(this.meta, {
            message: `heads ${h.id} and ${o.id} are ${fmt.length(d)} apart, under the ${fmt.length(r)} required`,
            handles: [...new Set([h.handle, o.handle])], at: h.position, measured: d, limit: r, quantity: 'length',
            reference: limits.sources.minHeadDistance,
          });
        }),
    );
  },
};
