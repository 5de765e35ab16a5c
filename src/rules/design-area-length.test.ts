// design-area-length: at least 1.2·√A along the branch lines (1.2·√1500 = 46.48 ft; confirmed in the NFPA 13
// handbook); a drawn area's length is its extent along the lines.

import { areaConfig, areaLayout, nearRiser } from '../../test/support/design-area-layout.js';
import { ruleTester } from '../../test/support/rule-tester.js';
import { designAreaLength } from './design-area-length.js';

const layout = areaLayout;
const config = areaConfig;

ruleTester(designAreaLength, {
  valid: [
    {
      name: '48 ft along the lines',
      config,
      layout: {
        ...layout,
        drawnArea: nearRiser,
      },
    },
  ],
  invalid: [
    {
      name: '46 ft along the lines, under 46.48',
      config,
      layout: {
        ...layout,
        drawnArea: [
          { x: 50, y: 20 },
          { x: 96, y: 20 },
          { x: 96, y: 60 },
          { x: 50, y: 60 },
        ],
      },
      count: 1,
      severity: 'error',
      measured: 46,
      limit: 1.2 * Math.sqrt(1500),
    },
  ],
});
