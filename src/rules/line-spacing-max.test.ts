// line-spacing-max: 15 ft between branch lines for light and ordinary hazard (from memory: NFPA 13 (2019
// edition), Table 10.2.4.2.1(a)-(c)); once per line pair.

import { ruleTester } from '../../test/support/rule-tester.js';
import { lineSpacingMax } from './line-spacing-max.js';

ruleTester(lineSpacingMax, {
  valid: [{ name: 'ordinary hazard: lines 15 ft apart', layout: { s: 8, l: 15, heads: 3, lines: 3 } }],
  invalid: [
    {
      name: 'ordinary hazard: lines 15.05 ft apart, once per pair',
      layout: { s: 8, l: 15.05, heads: 3, lines: 3 },
      count: 2,
      measured: 15.05,
      limit: 15,
    },
  ],
});
