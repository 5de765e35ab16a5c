// head-k-factor: K-factors of listed sprinklers run from 1.3 to 34.8 gpm/psi½ (NFPA 13 (2019 edition), Table
// 7.2.2.1, from memory). 5.6 L/min/bar½ is 5.6 / 14.42 = 0.39 gpm/psi½ (1 gal = 3.785 L, 1 psi = 0.06895 bar: NIST
// SP 811); 80 gpm/psi½ read in L/min/bar½ would be 80 / 14.42 = 5.55. Heads with one wrong K are one finding.

import { expect } from 'vitest';
import { ruleTester } from '../../test/support/rule-tester.js';
import { headKFactor } from './head-k-factor.js';

const withK = (k: string) => ({ s: 12, l: 10, heads: 3, lines: 2, headAttribs: [{ tag: 'K', value: k }] });

ruleTester(headKFactor, {
  valid: [
    { name: 'K 5.6 in a US config', layout: withK('5.6') },
    { name: 'K 80.7 in an SI config (5.6 gpm/psi½)', layout: withK('80.7'), config: { unitSystem: 'si' } },
  ],
  invalid: [
    {
      name: 'a US drawing checked with an SI config: K "5.6" read as L/min/bar½, all six heads in one finding',
      layout: withK('5.6'),
      config: { unitSystem: 'si' },
      count: 1,
      measured: 5.6 / (3.785411784 / Math.sqrt(0.0689475729)),
      limit: 1.3,
      also: (f) => {
        expect(f[0]!.params).toMatchObject({ attribute: '5.6', system: 'si', looksLike: 'gpm/psi½' });
        expect(f[0]!.handles).toHaveLength(6);
      },
    },
    {
      name: 'K "80" in a US drawing: above every listed head, looks like L/min/bar½',
      layout: withK('80'),
      count: 1,
      limit: 34.8,
      params: { looksLike: 'L/min/bar½' },
    },
  ],
});
