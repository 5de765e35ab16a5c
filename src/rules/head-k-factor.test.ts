// head-k-factor: heads whose K-factor no listed sprinkler has (NFPA 13 (2019 edition), Table 7.2.2.1, from
// memory: 1.3 to 34.8 gpm/psi½), most often a K attribute written in one unit system and read in the other.

import { describe, expect, it } from 'vitest';
import { checkLayout, findingsOf } from '../../test/support/check.js';

const withK = (value: string) => ({ s: 12, l: 10, heads: 3, lines: 2, headAttribs: [{ tag: 'K', value }] });

describe('head-k-factor', () => {
  it('accepts K 5.6 gpm/psi½ in a US config and K 80 L/min/bar½ in an SI one (80 / 14.42 = 5.55: the usual SI naming of K 5.6, from memory)', () => {
    expect(findingsOf(checkLayout(withK('5.6')), 'head-k-factor')).toEqual([]);
    expect(findingsOf(checkLayout(withK('80'), { unitSystem: 'si' }), 'head-k-factor')).toEqual([]);
  });

  it('flags every head of a US drawing (K 5.6) read with an SI config, naming the unit it was read in', () => {
    const r = checkLayout(withK('5.6'), { unitSystem: 'si' });
    const found = findingsOf(r, 'head-k-factor');
    expect(found).toHaveLength(6);
    expect(found[0]!.severity).toBe('error');
    expect(found[0]!.message).toMatch(/K attribute "5\.6" is read in L\/min\/bar½, as the config is SI/);
    // 5.6 L/min/bar½ is 5.6 / 14.42 = 0.39 gpm/psi½ (1 gal = 3.785 L, 1 psi = 0.06895 bar: NIST SP 811), below 1.3.
    expect(found[0]!.measured).toBeCloseTo(5.6 / (3.785411784 / Math.sqrt(0.0689475729)), 6);
    expect(found[0]!.limit).toBe(1.3);
    expect(r.report.summary.pass).toBe(false);
  });

  it('flags a K above every listed sprinkler; a config default that is no K-factor is refused with the config', () => {
    const high = findingsOf(checkLayout(withK('80')), 'head-k-factor');
    expect(high).toHaveLength(6);
    expect(high[0]!.limit).toBe(34.8);
    expect(() => checkLayout({ s: 12, l: 10, heads: 3, lines: 2 }, { defaults: { kFactor: 0.5 } })).toThrow(/"defaults\.kFactor" must be at least 1\.3 gpm\/psi½, not 0\.5/);
  });
});
