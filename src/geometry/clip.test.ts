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
    expect(clipPolygon(square(0, 0, 10), square(5, 5, 10)).map((p) => Math.abs(signedArea(p)))).toEqual([expect.closeTo(25, 9)]);
  });
  it('returns a polygon inside the clip unchanged in area', () => {
    expect(clipPolygon(square(2, 2, 3), square(0, 0, 10)).map((p) => Math.abs(signedArea(p)))).toEqual([expect.closeTo(9, 9)]);
  });
  it('returns no piece when they do not overlap', () => {
    expect(clipPolygon(square(0, 0, 1), square(5, 5, 1))).toEqual([]);
  });
  it('returns both pieces of a bar across an L: a 10 × 2 bar over an L of two 4-wide arms keeps 4 × 2 twice', () => {
    const l = [
      { x: 0, y: 0 },
      { x: 10, y: 0 },
      { x: 10, y: 10 },
      { x: 6, y: 10 },
      { x: 6, y: 4 },
      { x: 4, y: 4 },
      { x: 4, y: 10 },
      { x: 0, y: 10 },
    ];
    const bar = [
      { x: -1, y: 6 },
      { x: 11, y: 6 },
      { x: 11, y: 8 },
      { x: -1, y: 8 },
    ];
    const pieces = clipPolygon(bar, l).map((p) => Math.abs(signedArea(p)));
    expect(pieces.sort()).toEqual([expect.closeTo(8, 9), expect.closeTo(8, 9)]);
  });
});
