// The point grid against a search over every point: whatever lies within the reach of a place is visited, at any
// scale of coordinates and reach, and a visit that returns true ends the search.

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { PointGrid } from './point-grid.js';
import { distance, type Point } from './point.js';

describe('PointGrid', () => {
  it('visits every inserted point within the reach in x and y (property, against all points)', () => {
    // Coordinates far from the origin (state-plane feet run to 1e7, where x / reach loses the last digits a small
    // reach needs) and points exactly at the reach included (common practice, no source).
    const coordinate = fc.oneof(
      fc.double({ min: -50, max: 50, noNaN: true }),
      fc.double({ min: 1e6, max: 1e6 + 10, noNaN: true }),
      fc.double({ min: 3e7, max: 3e7 + 1, noNaN: true }),
    );
    const point = fc.record({ x: coordinate, y: coordinate });
    fc.assert(
      fc.property(
        fc.array(point, { maxLength: 60 }),
        point,
        fc.oneof(fc.double({ min: 1e-3, max: 5, noNaN: true }), fc.constantFrom(1 / 12, 1e-3)),
        (points, at, reach) => {
          const grid = new PointGrid(reach);
          for (const [i, p] of points.entries()) grid.insert(p, i);
          // Points at exactly the reach along one axis too.
          const edge: Point[] = [
            { x: at.x + reach, y: at.y },
            { x: at.x, y: at.y - reach },
          ];
          for (const [k, p] of edge.entries()) grid.insert(p, points.length + k);
          const all = [...points, ...edge];
          const visited = new Set<number>();
          grid.visitNear(at, (i) => {
            visited.add(i);
            return false;
          });
          for (const [i, p] of all.entries())
            if ((Math.abs(p.x - at.x) <= reach && Math.abs(p.y - at.y) <= reach) || distance(p, at) <= reach)
              expect(visited.has(i)).toBe(true);
        },
      ),
      { numRuns: 2000 },
    );
  });

  it('stops at the first visit that returns true, and says so', () => {
    const grid = new PointGrid(1);
    for (let i = 0; i < 5; i++) grid.insert({ x: 0.1 * i, y: 0 }, i);
    let visits = 0;
    expect(grid.visitNear({ x: 0, y: 0 }, () => ++visits === 2)).toBe(true);
    expect(visits).toBe(2);
    expect(grid.visitNear({ x: 10, y: 10 }, () => true)).toBe(false);
  });

  it('ends on extreme coordinates (the numbers of a hostile drawing) and still finds a point at the same place', () => {
    // Past 2^53 cells a cell number plus one is itself; an infinite coordinate stays infinite (common practice, no source).
    for (const v of [1e21, -1e21, 2 ** 53 / 12, 1e300, -1e300, Number.MAX_VALUE]) {
      const grid = new PointGrid(1 / 12);
      grid.insert({ x: v, y: v }, 7);
      const seen: number[] = [];
      grid.visitNear({ x: v, y: v }, (i) => {
        seen.push(i);
        return false;
      });
      expect(new Set(seen)).toEqual(new Set([7]));
    }
    // An infinite coordinate ends too (a distance to it is never within reach, so what it finds does not matter).
    const grid = new PointGrid(1 / 12);
    grid.insert({ x: Number.POSITIVE_INFINITY, y: 0 }, 0);
    expect(typeof grid.visitNear({ x: Number.POSITIVE_INFINITY, y: Number.NaN }, () => false)).toBe('boolean');
  });
});
