// design-area-missing: says when no design area is drawn and when an area could not be calculated, and that
// velocity pressure is not modelled when asked for (common practice, no source).

import { ruleTester } from '../../test/support/rule-tester.js';
import { designAreaMissing } from './design-area-missing.js';

const layout = { s: 12, l: 10, heads: 4, lines: 3 };

ruleTester(designAreaMissing, {
  valid: [{ name: 'a searched area only, by choice', layout, config: { design: { areaMode: 'search' } } }],
  invalid: [
    { name: 'no drawn area (mode both): said as information', layout, count: 1, severity: 'info', params: { kind: 'not-drawn' } },
    { name: 'no drawn area in drawn mode: a warning', layout, config: { design: { areaMode: 'drawn' } }, count: 1, severity: 'warning' },
    {
      name: 'velocity pressure asked for: not modelled, said',
      layout,
      config: { design: { areaMode: 'search', velocityPressure: true } },
      count: 1,
      params: { kind: 'velocity-pressure' },
    },
  ],
});
