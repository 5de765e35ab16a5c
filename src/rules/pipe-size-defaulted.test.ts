// pipe-size-defaulted: pipe with no size label within 3 ft takes the configured default, said once per drawn
// entity (common practice, no source); a label that reads like a size but names none is quoted.

import { expect } from 'vitest';
import { layoutWith, lineGroups, textGroups } from '../../test/support/check.js';
import { ruleTester } from '../../test/support/rule-tester.js';
import { pipeSizeDefaulted } from './pipe-size-defaulted.js';

const layout = { s: 12, l: 10, heads: 3, lines: 2 };
// A capped stub off the cross main, from (1, 15) to (1, 20): the layout labels the cross main 2" at (1.4, 8.3).
const stub = lineGroups('FP-PIPE', 1, 15, 1, 20);

ruleTester(pipeSizeDefaulted, {
  valid: [{ name: 'every pipe labelled', layout }],
  invalid: [
    {
      name: 'an unlabelled stub: 1" assumed',
      dxf: layoutWith(layout, stub),
      count: 1,
      severity: 'warning',
      params: { size: '1', unreadLabels: [] },
    },
    {
      name: 'a stub labelled 99": quoted, 1" assumed',
      dxf: layoutWith(layout, stub + textGroups('FP-PIPE', 1.3, 18, '99"')),
      count: 1,
      also: (f) => expect(f[0]!.params.unreadLabels).toEqual(['99"']),
    },
  ],
});
