// source-unattached: a water source symbol more than 2 ft from any pipe feeds nothing (common practice, no source).

import { ruleTester } from '../../test/support/rule-tester.js';
import { sourceUnattached } from './source-unattached.js';

const layout = { s: 12, l: 10, heads: 3, lines: 2 };

ruleTester(sourceUnattached, {
  valid: [
    { name: 'the riser at the end of the feed main', layout },
    { name: 'the riser 1.5 ft off it (within 2 ft)', layout: { ...layout, sourceOffset: { x: 0, y: -1.5 } } },
    { name: 'a layout without piping yet: said by hydraulics-not-evaluated', layout: { ...layout, noPipes: true } },
  ],
  invalid: [
    {
      name: 'the riser 4 ft off its pipe',
      layout: { ...layout, sourceOffset: { x: 0, y: -4 } },
      count: 1,
      severity: 'error',
      params: { kind: 'off-piping', reach: 2 },
    },
  ],
});
