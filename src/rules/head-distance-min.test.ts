// head-distance-min: 6 ft between heads unless baffled (from memory: NFPA 13 (2019 edition), 10.2.5.3.1); heads
// too close together are one finding a cluster, a pair names both heads; a head drawn twice at one point is one
// head (head-duplicate), not two heads 0 ft apart.

import { expect } from 'vitest';
import { ruleTester } from '../../test/support/rule-tester.js';
import { headDistanceMin } from './head-distance-min.js';

// Line at y = 5 with heads at x = 6 and 18 (S = 12); extra heads sit on the line between them.
const line = { s: 12, l: 10, heads: 2, lines: 2 };

ruleTester(headDistanceMin, {
  valid: [
    { name: 'an extra head 6.0 ft from its neighbours', layout: { ...line, extraHeads: [{ x: 12, y: 5 }] } },
    {
      name: 'a head drawn twice at one point (1/200 ft apart): one head',
      layout: {
        ...line,
        extraHeads: [
          { x: 6, y: 5 },
          { x: 6 + 1 / 200, y: 5 },
        ],
      },
    },
  ],
  invalid: [
    {
      name: 'an extra head 5.9 ft from one neighbour: a pair, both heads named',
      layout: { ...line, extraHeads: [{ x: 11.9, y: 5 }] },
      count: 1,
      measured: 5.9,
      limit: 6,
      also: (f) => {
        expect(f[0]!.params.heads).toHaveLength(2);
        expect(f[0]!.handles).toHaveLength(2);
      },
    },
    {
      // x = 9, 10, 11, 12, 13 on the line: each within 6 ft of its neighbours and of the heads at 6 and 18
      name: 'five heads packed between two: one cluster of seven, the closest 1 ft apart',
      layout: { ...line, extraHeads: [9, 10, 11, 12, 13].map((x) => ({ x, y: 5 })) },
      count: 1,
      measured: 1,
      also: (f) => expect(f[0]!.params.heads).toHaveLength(7),
    },
  ],
});
