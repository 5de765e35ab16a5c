// head-spacing-max: 15 ft between heads on a line for light and ordinary hazard, 12 ft for extra (from memory:
// NFPA 13 (2019 edition), Table 10.2.4.2.1(a)-(c)); a finding names both heads of the gap.

import { expect } from 'vitest';
import { ruleTester } from '../../test/support/rule-tester.js';
import { headSpacingMax } from './head-spacing-max.js';

ruleTester(headSpacingMax, {
  valid: [
    { name: 'ordinary hazard: 15 ft between heads', layout: { s: 15, l: 8, heads: 3, lines: 2 } },
    { name: 'extra hazard: 12 ft between heads', layout: { s: 12, l: 8, heads: 3, lines: 2 }, config: { design: { hazard: 'EH2' } } },
  ],
  invalid: [
    {
      name: 'ordinary hazard: 15.05 ft, once per gap, both heads named',
      layout: { s: 15.05, l: 8, heads: 3, lines: 2 },
      count: 4,
      measured: 15.05,
      limit: 15,
      also: (f) => {
        expect(f[0]!.handles).toHaveLength(2);
        expect(f[0]!.params.next).not.toBe(f[0]!.params.head);
      },
    },
    {
      name: 'extra hazard: 12.1 ft',
      layout: { s: 12.1, l: 8, heads: 3, lines: 2 },
      config: { design: { hazard: 'EH2' } },
      count: 4,
      limit: 12,
    },
  ],
});
