// Polygon clipping against hand-worked overlaps, and the test that spares it where the room holds the ring
// (common practice, no source).

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { convexHolds, signedArea } from './polygon.js';
import { clipPolygon } from './clip.js';

const square = (x: number, y: number, s: number) => [
  { x, y },
  { x: x + s, y },
  { x: x + s, y: y + s },
  { x, y: y + s },
];

/** A room of two 4-wide arms rising from a 4-deep base, 10 × 10 in all. */
const twoArms = [
  { x: 0, y: 0 },
  { x: 10, y: 0 },
  { x: 10, y: 10 },
  { x: 6, y: 10 },
  { x: 6, y: 4 },
  { x: 4, y: 4 },
  { x: 4, y: 10 },
  { x: 0, y: 10 },
];

describe('clipPolygon', () => {
  it('keeps the overlap of two squares: 10 × 10 and 10 × 10 offset by (5, 5) share 25', () => {
    expect(clipPolygon(square(0, 0, 10), square(5, 5, 10)).map((p) => Math.abs(signedArea(p)))).toEqual([expect.closeTo(25, 9)]);
  });
  it('returns a polygon inside the clip unchanged in area', () => {
    expect(clipPolygon(square(2, 2, 3), square(0, 0, 10)).map((p) => Math.abs(signedArea(p)))).toEqual([expect.closeTo(9, 9)]);
  });
  it('returns no piece when they do not overlap', () => {
    expect(clipPolygon(square(0, 0, 1), square(5, 5, 1))).toEqual([]);
  });
  it('returns both pieces of a bar across two arms: a 10 × 2 bar over two 4-wide arms keeps 4 × 2 twice', () => {
    const bar = [
      { x: -1, y: 6 },
      { x: 11, y: 6 },
      { x: 11, y: 8 },
      { x: -1, y: 8 },
    ];
    const pieces = clipPolygon(bar, twoArms).map((p) => Math.abs(signedArea(p)));
    expect(pieces.sort()).toEqual([expect.closeTo(8, 9), expect.closeTo(8, 9)]);
  });
});

describe('convexHolds: when a clip would give the ring back', () => {
  const star = Array.from({ length: 5 }, (_, k) => ({ x: Math.cos((4 * Math.PI * k) / 5), y: Math.sin((4 * Math.PI * k) / 5) }));
  it('a convex room holding the ring, its boundary included; not one it sticks out of', () => {
    expect(convexHolds(square(0, 0, 10), square(2, 2, 3))).toBe(true);
    expect(convexHolds(square(0, 0, 10), square(0, 0, 10))).toBe(true);
    expect(convexHolds(square(0, 0, 10), square(8, 8, 3))).toBe(false);
    expect(convexHolds([...square(0, 0, 10)].reverse(), square(2, 2, 3))).toBe(true);
  });
  it('never for a room that is not convex (two arms, a star whose turns all go one way), nor a degenerate one', () => {
    expect(convexHolds(twoArms, square(1, 1, 2))).toBe(false);
    expect(convexHolds(star, [{ x: 0, y: 0 }])).toBe(false);
    expect(convexHolds([square(0, 0, 1)[0]!, square(0, 0, 1)[1]!], [{ x: 0, y: 0 }])).toBe(false);
  });
  it('where it holds, the clip gives the ring back (random rings in random convex rooms)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 3, max: 9 }),
        fc.double({ min: 5, max: 50, noNaN: true }),
        fc.record({ x: fc.double({ min: -40, max: 40, noNaN: true }), y: fc.double({ min: -40, max: 40, noNaN: true }) }),
        fc.double({ min: 1, max: 30, noNaN: true }),
        (sides, radius, at, size) => {
          const room = Array.from({ length: sides }, (_, k) => ({
            x: radius * Math.cos((2 * Math.PI * k) / sides),
            y: radius * Math.sin((2 * Math.PI * k) / sides),
          }));
          const ring = square(at.x, at.y, size);
          const area = clipPolygon(ring, room).reduce((s, p) => s + Math.abs(signedArea(p)), 0);
          if (convexHolds(room, ring)) expect(area).toBeCloseTo(size * size, 6);
          else expect(area).toBeLessThan(size * size * (1 + 1e-9));
        },
      ),
      { numRuns: 300 },
    );
  });
});
