// head-distance-min at the limit: 6 ft between heads unless baffled (from memory: NFPA 13 (2019 edition),
// 10.2.5.3.1); duplicates drawn at one point are reported as such.

import { describe, expect, it } from 'vitest';
import { checkLayout, findingsOf } from '../../test/support/check.js';

describe('head-distance-min', () => {
  it('an extra head 6.0 ft from its neighbours passes, 5.9 ft fails', () => {
    // Line at y = 5 with heads at x = 6 and 18 (S = 12); the extra head sits on the line between them.
    expect(findingsOf(checkLayout({ s: 12, l: 10, heads: 2, lines: 2, extraHeads: [{ x: 12, y: 5 }] }), 'head-distance-min')).toEqual([]);
    const near = findingsOf(checkLayout({ s: 12, l: 10, heads: 2, lines: 2, extraHeads: [{ x: 11.9, y: 5 }] }), 'head-distance-min');
    expect(near).toHaveLength(1);
    expect(near[0]!.measured).toBeCloseTo(5.9, 9);
    expect(near[0]!.limit).toBe(6);
  });
  it('reports two heads drawn at the same point as a duplicate', () => {
    const dup = findingsOf(checkLayout({ s: 12, l: 10, heads: 2, lines: 2, extraHeads: [{ x: 6, y: 5 }] }), 'head-distance-min');
    expect(dup).toHaveLength(1);
    expect(dup[0]!.message).toMatch(/same point/);
  });
});
