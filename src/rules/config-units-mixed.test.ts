// config-units-mixed: values inside the config's hard ranges but far from what designs use in its unit system, and
// usual in the other (1 bar = 14.504 psi, 1 m² = 10.764 ft², 1 gpm/ft² = 40.746 mm/min: NIST SP 811); the usual
// values are common practice, no source.

import { ruleTester } from '../../test/support/rule-tester.js';
import { configUnitsMixed } from './config-units-mixed.js';

const layout = { s: 12, l: 10, heads: 3, lines: 2 };

ruleTester(configUnitsMixed, {
  valid: [
    { name: 'usual US values', layout, config: { design: { density: 0.2, area: 1500 }, supply: { static: 80, residual: 60, flow: 1000 } } },
    {
      name: 'usual SI values',
      layout,
      config: { unitSystem: 'si', design: { density: 8.1, area: 139 }, supply: { static: 5.5, residual: 4.1, flow: 3800 } },
    },
    { name: 'a head pressure of 15 psi', layout, config: { design: { minHeadPressure: 15 } } },
  ],
  invalid: [
    // 5 psi is no city main; 5 bar = 72.5 psi is one (static and residual both)
    {
      name: 'a supply of 5 "psi"',
      layout,
      config: { supply: { static: 5, residual: 4, flow: 1000 } },
      count: 2,
      severity: 'error',
      params: { key: 'supply.static', written: 5, unit: 'psi', otherUnit: 'bar', otherSystem: 'si' },
    },
    // 139 ft² is under any design area; 139 m² = 1496 ft² is the usual 1500 ft²
    {
      name: 'an area of 139 "ft²"',
      layout,
      config: { design: { area: 139, density: 0.2 } },
      count: 1,
      params: { key: 'design.area', otherUnit: 'm²' },
    },
    // 1500 m² = 16,146 ft², past twice the curves' end; 1500 ft² is usual
    {
      name: 'an area of 1500 "m²" in an SI config',
      layout,
      config: { unitSystem: 'si', design: { area: 1500 } },
      count: 1,
      params: { key: 'design.area', written: 1500, unit: 'm²', otherSystem: 'us' },
    },
    // 7 bar = 101.5 psi at every head is no design minimum; 7 psi is the usual one (from memory)
    {
      name: 'a head pressure of 7 "bar" in an SI config',
      layout,
      config: { unitSystem: 'si', design: { minHeadPressure: 7 } },
      count: 1,
      params: { key: 'design.minHeadPressure', unit: 'bar', otherUnit: 'psi' },
    },
  ],
});
