// Polygon clipping against hand-worked overlaps (common practice, no source).

import { describe, expect, it } from 'vitest';
import { signedArea } from './polygon.js';
import { clipPolygon } from './clip.js';

const square = (x: number, y: number, s: number) => [
  { x, y },
  { x: x + s, y },
  { x: x + s, y: y + s },
  { x, y: y + s },
];

describe('clipPolygon', () => {
  it('keeps the overlap of two squares: 10 × 10 and 10 × 10 offset by (5, 5) share 25', () => {
    expect(Math.abs(signedArea(clipPolygon(square(0, 0, 10), square(5, 5, 10))))).toBeCloseTo(25, 9);
  });
  it('returns a polygon inside the clip unchanged in area', () => {
    expect(Math.abs(signedArea(clipPolygon(square(2, 2, 3), square(0, 0, 10))))).toBeCloseTo(9, 9);
  });
  it('returns the subject when they do not overlap', () => {
    expect(clipPolygon(square(0, 0, 1), square(5, 5, 1))).toEqual(square(0, 0, 1));
  });
});
