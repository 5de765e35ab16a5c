// head-duplicate: a head symbol drawn again within 1/8 in of another is one head drawn twice (common practice, no
// source): counted once everywhere, the copies listed; the calculation is that of the drawing without them.

import { expect } from 'vitest';
import { checkLayout } from '../../test/support/check.js';
import { ruleTester } from '../../test/support/rule-tester.js';
import { headDuplicate } from './head-duplicate.js';

const line = { s: 12, l: 10, heads: 2, lines: 2 };

ruleTester(headDuplicate, {
  valid: [{ name: 'heads 6 ft apart are two heads', layout: { ...line, extraHeads: [{ x: 12, y: 5 }] } }],
  invalid: [
    {
      name: 'a head drawn three times at one point: one head, the copies listed, the same demand',
      layout: {
        ...line,
        extraHeads: [
          { x: 6, y: 5 },
          { x: 6 + 1 / 200, y: 5 },
        ],
      },
      count: 1,
      severity: 'warning',
      measured: 3,
      params: { drawn: 3 },
      also: (f) => {
        expect(f[0]!.handles).toHaveLength(3);
        const once = checkLayout(line);
        const twice = checkLayout({
          ...line,
          extraHeads: [
            { x: 6, y: 5 },
            { x: 6 + 1 / 200, y: 5 },
          ],
        });
        expect(twice.plan.heads).toHaveLength(once.plan.heads.length);
        const demand = (r: typeof once) => r.design.areas.find((a) => a.rank === 'most-demanding')!.hydraulics!.sourcePressure;
        expect(demand(twice)).toBeCloseTo(demand(once), 9);
      },
    },
  ],
});
