// design-area-size: the drawn area holds ceil(A / area per head) heads covering A (1500 / 120 = 12.5 → 13 heads:
// NFPA 13 (2019 edition), 19.3.3, confirmed; whole heads rounded up, common practice).

import { areaConfig, areaLayout, nearRiser, remoteOutline } from '../../test/support/design-area-layout.js';
import { ruleTester } from '../../test/support/rule-tester.js';
import { designAreaSize } from './design-area-size.js';

const layout = areaLayout;
const config = areaConfig;

ruleTester(designAreaSize, {
  valid: [{ name: 'the searched area drawn: 13 heads, 1560 ft²', layout: { ...layout, drawnArea: remoteOutline }, config }],
  invalid: [
    {
      name: '12 heads × 120 ft² = 1440 ft², under 1500',
      config,
      layout: {
        ...layout,
        drawnArea: nearRiser,
      },
      count: 1,
      severity: 'error',
      measured: 1440,
      limit: 1500,
      params: { kind: 'area', heads: 12 },
    },
  ],
});
