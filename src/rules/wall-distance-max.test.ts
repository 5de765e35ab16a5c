// wall-distance-max: half the allowed spacing (7.5 ft ordinary hazard; NFPA 13 (2019 edition), 10.2.5.2.1,
// confirmed), measured to the wall in the direction that matters, in irregular rooms too.

import { expect } from 'vitest';
import { DxfWriter } from '../demo/dxf-writer.js';
import { ruleTester } from '../../test/support/rule-tester.js';
import { wallDistanceMax } from './wall-distance-max.js';

/** Room: 0..40 × 0..10 plus 0..10 × 10..30 (an L); one line at y = 5, heads at x = 5, 15, 25, 35. */
function lRoom(): string {
  const w = new DxfWriter(2);
  w.block('H', { x: 0, y: 0 }, (b) => {
    w.circle('0', { x: 0, y: 0 }, 0.2, b);
  });
  w.block('R', { x: 0, y: 0 }, (b) => {
    w.circle('0', { x: 0, y: 0 }, 0.5, b);
  });
  w.polyline(
    'A-WALL',
    [
      { x: 0, y: 0 },
      { x: 40, y: 0 },
      { x: 40, y: 10 },
      { x: 10, y: 10 },
      { x: 10, y: 30 },
      { x: 0, y: 30 },
    ],
    true,
  );
  w.insert('FP-SOURCE', 'R', { x: -5, y: 5 });
  w.line('FP-PIPE', { x: -5, y: 5 }, { x: 35, y: 5 });
  for (const x of [5, 15, 25, 35]) w.insert('FP-HEAD', 'H', { x, y: 5 });
  return w.toString();
}

ruleTester(wallDistanceMax, {
  valid: [
    { name: 'ordinary hazard: 7.5 ft from the end walls', layout: { s: 10, l: 10, heads: 3, lines: 2, wallAlong: 7.5 } },
    { name: 'and 7.5 ft from the side walls', layout: { s: 10, l: 10, heads: 3, lines: 2, wallAcross: 7.5 } },
  ],
  invalid: [
    {
      name: '7.6 ft from the end walls: each end head',
      layout: { s: 10, l: 10, heads: 3, lines: 2, wallAlong: 7.6 },
      count: 4,
      measured: 7.6,
      limit: 7.5,
    },
    {
      name: 'outer lines 7.6 ft from the side walls: every head of them',
      layout: { s: 10, l: 10, heads: 3, lines: 2, wallAcross: 7.6 },
      count: 6,
    },
    {
      // Across the line the heads at x = 15, 25, 35 are 5 ft from the wall at y = 10; the head at x = 5 stands under
      // the L's leg, 25 ft from the wall at y = 30. A bounding box (0..40 × 0..30) would say 25 for all.
      name: 'an L-shaped room: the wall in that direction, not the bounding box',
      dxf: lRoom(),
      config: { defaults: { pipeSize: '1-1/4' } },
      count: 1,
      measured: 25,
      also: (f) => expect(f[0]!.params.head).toBe('H1'),
    },
  ],
});
