// design-area-missing: says when no design area is drawn and when an area could not be calculated (common
// practice, no source); velocity pressure asked for is used, so it is no finding.

import { ruleTester } from '../../test/support/rule-tester.js';
import { designAreaMissing } from './design-area-missing.js';

const layout = { s: 12, l: 10, heads: 4, lines: 3 };

ruleTester(designAreaMissing, {
  valid: [
    { name: 'a searched area only, by choice', layout, config: { design: { areaMode: 'search' } } },
    { name: 'velocity pressure asked for: used, no finding', layout, config: { design: { areaMode: 'search', velocityPressure: true } } },
  ],
  invalid: [
    { name: 'no drawn area (mode both): said as information', layout, count: 1, severity: 'info', params: { kind: 'not-drawn' } },
    { name: 'no drawn area in drawn mode: a warning', layout, config: { design: { areaMode: 'drawn' } }, count: 1, severity: 'warning' },
  ],
});
