// design-area-size: the drawn area holds ceil(A / area per head) heads covering A (1500 / 120 = 12.5 → 13 heads:
// NFPA 13 (2019 edition), 19.3.3, confirmed; whole heads rounded up, common practice).

import { checkLayout } from '../../test/support/check.js';
import { ruleTester } from '../../test/support/rule-tester.js';
import { designAreaSize } from './design-area-size.js';

const layout = { s: 12, l: 10, heads: 8, lines: 6 };
const config = { design: { density: 0.2, area: 1500 } };
const searched = checkLayout(layout, config).design.areas.find((a) => a.rank === 'most-demanding')!;

ruleTester(designAreaSize, {
  valid: [{ name: 'the searched area drawn: 13 heads, 1560 ft²', layout: { ...layout, drawnArea: searched.outline }, config }],
  invalid: [
    {
      name: '12 heads × 120 ft² = 1440 ft², under 1500',
      config,
      layout: {
        ...layout,
        drawnArea: [
          { x: 0, y: 20 },
          { x: 48, y: 20 },
          { x: 48, y: 50 },
          { x: 0, y: 50 },
        ],
      },
      count: 1,
      severity: 'error',
      measured: 1440,
      limit: 1500,
      params: { kind: 'area', heads: 12 },
    },
  ],
});
