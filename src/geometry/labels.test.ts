// Label placement (common practice, no source): labels at one point spread out without overlapping, none covers
// a kept-clear box, a label with room stays at its first spot, and a crowd in a closed space still ends.

import { describe, expect, it } from 'vitest';
import { placeLabels, type Box } from './labels.js';

const overlap = (a: Box, b: Box) => a.minX < b.maxX - 1e-9 && b.minX < a.maxX - 1e-9 && a.minY < b.maxY - 1e-9 && b.minY < a.maxY - 1e-9;

describe('placeLabels', () => {
  it('twenty labels about one point: no two overlap, none covers the kept-clear box', () => {
    const keep = { minX: 5, minY: -1, maxX: 9, maxY: 8 };
    const placed = placeLabels(
      Array.from({ length: 20 }, () => ({ at: { x: 0, y: 0 }, width: 6, height: 1.4, clear: 1 })),
      [keep],
      0.3,
    );
    for (const [i, a] of placed.entries()) {
      expect(overlap(a, keep)).toBe(false);
      for (const b of placed.slice(i + 1)) expect(overlap(a, b)).toBe(false);
    }
    expect(placed.some((p) => p.moved)).toBe(true);
  });

  it('a label with room takes its first spot, right above its point, past its clearance', () => {
    const [p] = placeLabels([{ at: { x: 10, y: 10 }, width: 4, height: 1, clear: 2 }], [], 0.5);
    expect(p).toEqual({ minX: 12.5, minY: 12.5, maxX: 16.5, maxY: 13.5, moved: false });
  });

  it('a crowd in a closed space ends, the last ones overlapping', () => {
    const walls = [
      { minX: -1e6, minY: -1e6, maxX: 0, maxY: 1e6 },
      { minX: 10, minY: -1e6, maxX: 1e6, maxY: 1e6 },
      { minX: -1e6, minY: -1e6, maxX: 1e6, maxY: 0 },
      { minX: -1e6, minY: 10, maxX: 1e6, maxY: 1e6 },
    ];
    const placed = placeLabels(
      Array.from({ length: 40 }, () => ({ at: { x: 5, y: 5 }, width: 4, height: 2 })),
      walls,
      0.2,
    );
    expect(placed).toHaveLength(40);
  });
});
