// head-spacing-max and line-spacing-max at the limit: 15 ft light/ordinary hazard, 12 ft extra hazard
// (from memory: NFPA 13 (2019 edition), Table 10.2.4.2.1(a)-(c) maximum spacing).

import { describe, expect, it } from 'vitest';
import { checkLayout, findingsOf } from '../../test/support/check.js';

describe('head-spacing-max', () => {
  it('ordinary hazard: 15 ft between heads passes, 15.05 ft fails once per gap', () => {
    expect(findingsOf(checkLayout({ s: 15, l: 8, heads: 3, lines: 2 }), 'head-spacing-max')).toEqual([]);
    const over = findingsOf(checkLayout({ s: 15.05, l: 8, heads: 3, lines: 2 }), 'head-spacing-max');
    expect(over).toHaveLength(4);
    expect(over[0]!.measured).toBeCloseTo(15.05, 9);
    expect(over[0]!.limit).toBe(15);
  });
  it('extra hazard: 12 ft passes, 12.1 ft fails', () => {
    const eh = { design: { hazard: 'EH2' } };
    expect(findingsOf(checkLayout({ s: 12, l: 8, heads: 3, lines: 2 }, eh), 'head-spacing-max')).toEqual([]);
    expect(findingsOf(checkLayout({ s: 12.1, l: 8, heads: 3, lines: 2 }, eh), 'head-spacing-max')).toHaveLength(4);
  });
});

describe('line-spacing-max', () => {
  it('ordinary hazard: 15 ft between lines passes, 15.05 ft fails once per line pair', () => {
    expect(findingsOf(checkLayout({ s: 8, l: 15, heads: 3, lines: 3 }), 'line-spacing-max')).toEqual([]);
    const over = findingsOf(checkLayout({ s: 8, l: 15.05, heads: 3, lines: 3 }), 'line-spacing-max');
    expect(over).toHaveLength(2);
    expect(over[0]!.measured).toBeCloseTo(15.05, 9);
  });
});
