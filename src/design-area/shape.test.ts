// Design-area shape against the trade's worked values: 1.2·√1500 = 46.48 ft, and 46.48 / 12 = 3.87 → 4
// heads along the line (common practice, a training source); 1500 / 120 = 12.5 → 13 heads (fractions round up).

import { describe, expect, it } from 'vitest';
import { areaShape } from './shape.js';

describe('areaShape', () => {
  it('1500 ft², S 12 ft, 120 ft² per head: 46.48 ft, 4 along, 13 heads = 3 lines + 1', () => {
    const s = areaShape(1500, 12, 120);
    expect(s.minLength).toBeCloseTo(46.476, 3);
    expect(s.headsAlong).toBe(4);
    expect(s.totalHeads).toBe(13);
    expect([s.fullLines, s.remainder]).toEqual([3, 1]);
  });
  it('exact quotients do not round up: 1500 / 125 = 12 heads; 1.2·√2500 = 60 ft / 12 = 5 along', () => {
    expect(areaShape(1500, 12.5, 125).totalHeads).toBe(12);
    expect(areaShape(2500, 12, 100).headsAlong).toBe(5);
  });
  it('1950 ft² (dry system), S 12, 130 ft² per head: 53.0 ft → 5 along, 15 heads = 3 lines', () => {
    const s = areaShape(1950, 12, 130);
    expect(s.headsAlong).toBe(5);
    expect(s.totalHeads).toBe(15);
    expect(s.remainder).toBe(0);
  });
});
