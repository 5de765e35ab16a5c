// config-units-header: a config "units" that contradicts $INSUNITS (1 = inches, 2 = feet; DXF reference, from
// memory) is said; the config still wins.

import { expect } from 'vitest';
import { checkLayout } from '../../test/support/check.js';
import { ruleTester } from '../../test/support/rule-tester.js';
import { configUnitsHeader } from './config-units-header.js';

const layout = { s: 12, l: 10, heads: 3, lines: 2 };

ruleTester(configUnitsHeader, {
  valid: [
    { name: 'no units in the config', layout },
    { name: 'the config agrees with the header (in)', layout, config: { units: 'in' } },
  ],
  invalid: [
    {
      name: 'a config in feet on a drawing whose header says inches: lengths read in feet',
      layout,
      config: { units: 'ft' },
      count: 1,
      severity: 'warning',
      params: { config: 'ft', header: 'in' },
      also: () => expect(checkLayout(layout, { units: 'ft' }).report.input.drawingUnits).toBe('ft'),
    },
  ],
});
