// protection-area at its limits. Limits: NFPA 13 (2019 edition), Table 10.2.4.2.1(a)-(c): 225 ft² light
// hazard, 130 ft² ordinary, 100 ft² extra (130 ft² below 0.25 gpm/ft²) — confirmed per shared/TRADE.md.

import { describe, expect, it } from 'vitest';
import { checkLayout, findingsOf } from '../../test/support/check.js';

describe('protection-area', () => {
  it('S × L = 12 × 10 = 120 ft² per head (the standard\'s S × L method; common practice worked value)', () => {
    const r = checkLayout({ s: 12, l: 10, heads: 4, lines: 3 });
    for (const c of r.coverage.values()) expect(c.area).toBeCloseTo(120, 9);
    expect(findingsOf(r, 'protection-area')).toEqual([]);
  });

  it('ordinary hazard: 13 × 10 = 130 ft² passes, 13.1 × 10 = 131 ft² fails on every head', () => {
    expect(findingsOf(checkLayout({ s: 13, l: 10, heads: 4, lines: 3 }), 'protection-area')).toEqual([]);
    const over = findingsOf(checkLayout({ s: 13.1, l: 10, heads: 4, lines: 3 }), 'protection-area');
    expect(over).toHaveLength(12);
    expect(over[0]!.measured).toBeCloseTo(131, 9);
    expect(over[0]!.limit).toBe(130);
    expect(over[0]!.reference).toMatch(/NFPA 13 \(2019 edition\)/);
  });

  it('light hazard: 15 × 15 = 225 ft² passes, 15 × 15.04 fails', () => {
    const lh = { design: { hazard: 'LH' } };
    expect(findingsOf(checkLayout({ s: 15, l: 15, heads: 3, lines: 3 }, lh), 'protection-area')).toEqual([]);
    expect(findingsOf(checkLayout({ s: 15, l: 15.04, heads: 3, lines: 3 }, lh), 'protection-area').length).toBeGreaterThan(0);
  });

  it('extra hazard: 10 × 10 = 100 ft² passes, 10 × 10.5 fails; below 0.25 gpm/ft² 130 ft² applies', () => {
    const eh = { design: { hazard: 'EH1', density: 0.3 } };
    expect(findingsOf(checkLayout({ s: 10, l: 10, heads: 3, lines: 3 }, eh), 'protection-area')).toEqual([]);
    expect(findingsOf(checkLayout({ s: 10, l: 10.5, heads: 3, lines: 3 }, eh), 'protection-area')).toHaveLength(9);
    expect(findingsOf(checkLayout({ s: 10, l: 10.5, heads: 3, lines: 3 }, { design: { hazard: 'EH1', density: 0.2 } }), 'protection-area')).toEqual([]);
  });

  it('a config limit overrides the table (an adopted edition)', () => {
    const r = checkLayout({ s: 12, l: 10, heads: 3, lines: 3 }, { limits: { maxArea: 110 } });
    expect(findingsOf(r, 'protection-area')).toHaveLength(9);
    expect(findingsOf(r, 'protection-area')[0]!.reference).toMatch(/config override/);
  });

  it('an end head counts twice its wall distance: 12 ft spacing, 7 ft to the wall → S = 14', () => {
    const r = checkLayout({ s: 12, l: 9, heads: 3, lines: 2, wallAlong: 7 });
    const ends = [...r.coverage.values()].filter((c) => c.s! > 12.5);
    expect(ends).toHaveLength(4);
    for (const c of ends) expect(c.s).toBeCloseTo(14, 9);
  });
});
