// head-unattached: a head on no pipe (nothing within 6 in) cannot be fed (common practice, no source).

import { ruleTester } from '../../test/support/rule-tester.js';
import { headUnattached } from './head-unattached.js';

ruleTester(headUnattached, {
  valid: [
    { name: 'every head on its branch line', layout: { s: 12, l: 10, heads: 4, lines: 3 } },
    {
      name: 'a head 5 in off its line (within the 6 in attach tolerance)',
      layout: { s: 12, l: 10, heads: 2, lines: 2, extraHeads: [{ x: 12, y: 5 + 5 / 12 }] },
    },
  ],
  invalid: [
    {
      name: 'a head 8 ft from any pipe',
      layout: { s: 12, l: 10, heads: 3, lines: 2, extraHeads: [{ x: 30, y: 40 }] },
      count: 1,
      severity: 'error',
      params: { reach: 0.5 },
    },
  ],
});
