// wall-distance-min: at least 4 in from any wall (NFPA 13 (2019 edition), 10.2.5.2.3, confirmed).

import { ruleTester } from '../../test/support/rule-tester.js';
import { wallDistanceMin } from './wall-distance-min.js';

ruleTester(wallDistanceMin, {
  valid: [{ name: '4 in from the end walls', layout: { s: 10, l: 10, heads: 3, lines: 2, wallAlong: 4 / 12 } }],
  invalid: [
    {
      name: '3.9 in from the end walls: each end head',
      layout: { s: 10, l: 10, heads: 3, lines: 2, wallAlong: 3.9 / 12 },
      count: 4,
      measured: 3.9 / 12,
      limit: 4 / 12,
    },
  ],
});
