// head-distance-min at the limit: 6 ft between heads unless baffled (from memory: NFPA 13 (2019 edition),
// 10.2.5.3.1); a head drawn twice at one point is one head (head-duplicate), not two heads 0 ft apart.

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
  it('counts a head drawn twice at one point once, and reports the copy (head-duplicate)', () => {
    const once = checkLayout({ s: 12, l: 10, heads: 2, lines: 2 });
    const twice = checkLayout({ s: 12, l: 10, heads: 2, lines: 2, extraHeads: [{ x: 6, y: 5 }, { x: 6 + 1 / 200, y: 5 }] });
    expect(findingsOf(twice, 'head-distance-min')).toEqual([]);
    expect(twice.plan.heads).toHaveLength(once.plan.heads.length);
    const dup = findingsOf(twice, 'head-duplicate');
    expect(dup).toHaveLength(1);
    expect(dup[0]!.measured).toBe(3);
    expect(dup[0]!.handles).toHaveLength(3);
    expect(dup[0]!.severity).toBe('warning');
    // the same protection areas and hydraulics as the drawing without the copies
    expect(twice.report.summary.errors).toBe(once.report.summary.errors);
    const demand = (r: typeof once) => r.design.areas.find((a) => a.rank === 'most-demanding')!.hydraulics!.sourcePressure;
    expect(demand(twice)).toBeCloseTo(demand(once), 9);
  });
});
