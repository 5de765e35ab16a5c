// The union of rectangles against hand-worked shapes (common practice, no source): areas add up, shared edges
// vanish, straight vertices are dropped, and rectangles touching at a corner stay two rings.

import { describe, expect, it } from 'vitest';
import { signedArea } from './polygon.js';
import { unionOfRects } from './rect-union.js';

const area = (rings: { x: number; y: number }[][]) => rings.reduce((s, r) => s + signedArea(r), 0);

describe('unionOfRects', () => {
  it('four 12 × 10 cells in a row are one 48 × 10 rectangle of four corners, counter-clockwise', () => {
    const rings = unionOfRects([0, 12, 24, 36].map((x) => ({ x0: x, y0: 0, x1: x + 12, y1: 10 })));
    expect(rings).toHaveLength(1);
    expect(rings[0]).toHaveLength(4);
    expect(signedArea(rings[0]!)).toBeCloseTo(480, 9);
  });

  it('a staircase: 4 cells on two lines and 1 on the third is one ring of 6 corners, 9 × 120 ft²', () => {
    const cells = [
      ...[0, 1].flatMap((j) => [48, 60, 72, 84].map((x) => ({ x0: x, y0: j * 10, x1: x + 12, y1: j * 10 + 10 }))),
      { x0: 48, y0: 20, x1: 60, y1: 30 },
    ];
    const rings = unionOfRects(cells);
    expect(rings).toHaveLength(1);
    expect(rings[0]).toHaveLength(6);
    expect(area(rings)).toBeCloseTo(9 * 120, 9);
  });

  it('overlapping rectangles count their overlap once: 10 × 10 twice, offset by 5, is 150', () => {
    expect(
      area(
        unionOfRects([
          { x0: 0, y0: 0, x1: 10, y1: 10 },
          { x0: 5, y0: 0, x1: 15, y1: 10 },
        ]),
      ),
    ).toBeCloseTo(150, 9);
  });

  it('two rectangles touching at a corner, and two apart, stay two rings', () => {
    expect(
      unionOfRects([
        { x0: 0, y0: 0, x1: 1, y1: 1 },
        { x0: 1, y0: 1, x1: 2, y1: 2 },
      ]),
    ).toHaveLength(2);
    expect(
      unionOfRects([
        { x0: 0, y0: 0, x1: 1, y1: 1 },
        { x0: 3, y0: 0, x1: 4, y1: 1 },
      ]),
    ).toHaveLength(2);
  });

  it('a frame keeps its hole as a clockwise ring: 3 × 3 less the middle is 8', () => {
    const frame = [
      { x0: 0, y0: 0, x1: 3, y1: 1 },
      { x0: 0, y0: 2, x1: 3, y1: 3 },
      { x0: 0, y0: 1, x1: 1, y1: 2 },
      { x0: 2, y0: 1, x1: 3, y1: 2 },
    ];
    const rings = unionOfRects(frame);
    expect(rings).toHaveLength(2);
    expect(area(rings)).toBeCloseTo(8, 9);
    expect(rings.map((r) => Math.sign(signedArea(r))).sort()).toEqual([-1, 1]);
  });
});
