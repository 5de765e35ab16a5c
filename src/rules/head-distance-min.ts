// Rule head-distance-min: two standard-spray heads closer than 6 ft wet each other (cold soldering) unless baffles
// separate them. Heads too close together form clusters (pairs joined through shared heads): one finding a
// cluster, naming every head, with the least distance in it (27 heads packed together are one cause, not 351).

import { PointGrid } from '../geometry/point-grid.js';
import { distance } from '../geometry/point.js';
import type { Head } from '../read/plan.js';
import { isStandardSpray } from './standard-heads.js';
import { basisOfHead } from '../zones/zones.js';
import { finding, type Rule } from './types.js';

export const headDistanceMin: Rule<'head-distance-min'> = {
  meta: {
    id: 'head-distance-min',
    title: 'Distance between heads (minimum)',
    severity: 'error',
    reference: 'NFPA 13 (2019 edition), 10.2.5.3.1: 6 ft between heads unless baffles separate them (from memory)',
  },
  check({ plan, zoning }) {
    const heads = plan.heads.filter(isStandardSpray);
    const limitsOf = heads.map((h) => basisOfHead(zoning, h).limits);
    const clusters = tooClose(heads, (i) => limitsOf[i]!.minHeadDistance);
    return clusters.map(({ members, least }) => {
      const first = heads[members[0]!]!;
      const limits = limitsOf[members[0]!]!;
      const r = Math.max(...members.map((i) => limitsOf[i]!.minHeadDistance));
      return finding(this.meta, {
        params: { heads: members.map((i) => heads[i]!.id), least, limit: r },
        handles: [...new Set(members.map((i) => heads[i]!.handle))],
        at: first.position,
        measured: least,
        limit: r,
        quantity: 'length',
        reference: limits.sources.minHeadDistance,
      });
    });
  },
};

/**
 * Groups of heads joined by pairs closer than the larger of their two least distances (each group in drawing
 * order), with the least distance of each.
 */
function tooClose(heads: Head[], rOf: (i: number) => number): { members: number[]; least: number }[] {
  const r = heads.reduce((m, _, i) => Math.max(m, rOf(i)), 0);
  if (!(r > 0)) return [];
  // Heads found again by position in cells as wide as the largest distance (20,000 heads: 60-80 → 36-46 ms against
  // a tree of boxes).
  const near = new PointGrid(r);
  for (const [i, h] of heads.entries()) near.insert(h.position, i);
  const parent = heads.map((_, i) => i);
  const root = (i: number) => {
    while (parent[i] !== i) i = parent[i] = parent[parent[i]!]!;
    return i;
  };
  const least = new Map<number, number>();
  heads.forEach((h, i) => {
    near.visitNear(h.position, (j) => {
      if (j <= i) return false;
      const d = distance(h.position, heads[j]!.position);
      if (d >= Math.max(rOf(i), rOf(j)) - 1e-6) return false;
      const [a, c] = [root(i), root(j)];
      if (a !== c) parent[Math.max(a, c)] = Math.min(a, c);
      least.set(i, Math.min(least.get(i) ?? Infinity, d));
      return false;
    });
  });
  const groups = new Map<number, { members: number[]; least: number }>();
  heads.forEach((_, i) => {
    const g = root(i);
    let group = groups.get(g);
    if (!group) groups.set(g, (group = { members: [], least: Infinity }));
    group.members.push(i);
    group.least = Math.min(group.least, least.get(i) ?? Infinity);
  });
  return [...groups.values()].filter((g) => g.members.length > 1);
}
