// head-spacing-max: 15 ft between heads on a line for light and ordinary hazard, 12 ft for extra (from memory:
// NFPA 13 (2019 edition), Table 10.2.4.2.1(a)-(c)); a finding names both heads of the gap.

import { expect } from 'vitest';
import { ruleTester } from '../../test/support/rule-tester.js';
import { headSpacingMax } from './head-spacing-max.js';

ruleTester(headSpacingMax, {
  valid: [
    { name: 'ordinary hazard: 15 ft between heads', layout: { s: 15, l: 8, heads: 3, lines: 2 } },
    { name: 'extra hazard: 12 ft between heads', layout: { s: 12, l: 8, heads: 3, lines: 2 }, config: { design: { hazard: 'EH2' } } },
    { name: 'a layout without piping: rows of heads 15 ft apart', layout: { s: 15, l: 8, heads: 3, lines: 2, noPipes: true } },
    {
      name: 'an ordinary-hazard zone at 15 ft beside an extra-hazard design',
      layout: {
        s: 15,
        l: 8,
        heads: 3,
        lines: 2,
        zones: [
          {
            outline: [
              { x: -1, y: -1 },
              { x: 50, y: -1 },
              { x: 50, y: 20 },
              { x: -1, y: 20 },
            ],
            label: 'SHOP',
          },
        ],
      },
      config: { design: { hazard: 'EH2' }, zones: { SHOP: { hazard: 'OH1' } } },
    },
  ],
  invalid: [
    {
      name: 'ordinary hazard: 15.05 ft, once per gap, both heads named',
      layout: { s: 15.05, l: 8, heads: 3, lines: 2 },
      count: 4,
      measured: 15.05,
      limit: 15,
      also: (f) => {
        expect(f[0]!.handles).toHaveLength(2);
        expect(f[0]!.params.next).not.toBe(f[0]!.params.head);
      },
    },
    {
      // without piping the rows run the way the nearest heads lie: along the 15.05 ft, across the 15.5 ft
      name: 'a layout without piping, drawn turned 30°: rows of heads 15.05 ft apart',
      layout: { s: 15.05, l: 15.5, heads: 3, lines: 2, noPipes: true, rotationDeg: 30 },
      count: 4,
      measured: 15.05,
    },
    {
      name: 'extra hazard: 12.1 ft',
      layout: { s: 12.1, l: 8, heads: 3, lines: 2 },
      config: { design: { hazard: 'EH2' } },
      count: 4,
      limit: 12,
    },
    {
      name: 'an extra-hazard zone (12 ft) in an ordinary-hazard design: its heads only',
      layout: {
        s: 13,
        l: 8,
        heads: 4,
        lines: 2,
        zones: [
          {
            outline: [
              { x: 0, y: 0 },
              { x: 26, y: 0 },
              { x: 26, y: 16 },
              { x: 0, y: 16 },
            ],
            label: 'Paint booth',
          },
        ],
      },
      config: { zones: { 'PAINT*': { hazard: 'EH2' } } },
      // heads at x = 6.5, 19.5 (zone) and 32.5, 45.5: the gap inside the zone and the one leaving it, on each line
      count: 4,
      limit: 12,
      params: { limit: 12 },
    },
  ],
});
