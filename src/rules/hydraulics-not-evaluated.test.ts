// hydraulics-not-evaluated: a layout without piping, or without a source on it, is checked for its heads only and
// says why there is no hydraulic calculation (common practice, no source).

import { expect } from 'vitest';
import { ruleTester } from '../../test/support/rule-tester.js';
import { hydraulicsNotEvaluated } from './hydraulics-not-evaluated.js';

const layout = { s: 12, l: 10, heads: 4, lines: 3 };

ruleTester(hydraulicsNotEvaluated, {
  valid: [{ name: 'piped and fed from its riser', layout }],
  invalid: [
    {
      name: 'heads and walls only, no piping yet',
      layout: { ...layout, noPipes: true },
      count: 1,
      severity: 'warning',
      params: { kind: 'no-pipes', layers: [] },
    },
    { name: 'piped, but no riser drawn', layout: { ...layout, noSource: true }, count: 1, params: { kind: 'no-source' } },
    {
      name: 'the riser 4 ft off its pipe (over the 2 ft reach)',
      layout: { ...layout, sourceOffset: { x: 0, y: -4 } },
      count: 1,
      params: { kind: 'source-off-piping', sources: 1 },
      also: (f) => expect(f[0]!.handles).toHaveLength(1),
    },
  ],
});
