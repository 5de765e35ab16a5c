// design-area-not-remote: the drawn design area must be the hydraulically most demanding one (from memory: NFPA 13
// (2019 edition), 28.2.4.1); differences under 0.5 psi at the source count as equal (common practice, no source).

import { expect } from 'vitest';
import { areaConfig, areaLayout, nearRiser, remoteOutline } from '../../test/support/design-area-layout.js';
import { ruleTester } from '../../test/support/rule-tester.js';
import { designAreaNotRemote } from './design-area-not-remote.js';

const layout = areaLayout;
const config = areaConfig;

ruleTester(designAreaNotRemote, {
  valid: [
    {
      name: 'the remote area drawn, its 13th head under the rectangle (0.04 psi short of the searched one)',
      layout: { ...layout, drawnArea: remoteOutline },
      config,
    },
    { name: 'no drawn area', layout, config },
  ],
  invalid: [
    {
      // the drawn area takes the 12 heads on the riser side (x ≤ 48, y = 25..45)
      name: 'a drawn area near the riser: the more demanding area and the difference at the source',
      config,
      layout: {
        ...layout,
        drawnArea: nearRiser,
      },
      count: 1,
      severity: 'error',
      also: (f) => {
        expect(f[0]!.params.bestPressure).toBeGreaterThan(f[0]!.params.drawnPressure + 0.5);
        expect(f[0]!.measured).toBeCloseTo(f[0]!.params.drawnPressure, 9);
        expect(f[0]!.limit).toBeCloseTo(f[0]!.params.bestPressure, 9);
        expect(f[0]!.params.heads).toHaveLength(13);
      },
    },
  ],
});
