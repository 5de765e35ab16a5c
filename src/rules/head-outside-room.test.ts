// head-outside-room: a head outside every room outline cannot be checked against its walls (common practice, no
// source); a drawing without room outlines is said once.

import { DxfWriter } from '../demo/dxf-writer.js';
import { ruleTester } from '../../test/support/rule-tester.js';
import { headOutsideRoom } from './head-outside-room.js';

/** One line of three heads and no walls at all. */
function noWalls(): string {
  const w = new DxfWriter(2);
  w.block('H', { x: 0, y: 0 }, (b) => {
    w.circle('0', { x: 0, y: 0 }, 0.2, b);
  });
  w.block('R', { x: 0, y: 0 }, (b) => {
    w.circle('0', { x: 0, y: 0 }, 0.5, b);
  });
  w.insert('FP-SOURCE', 'R', { x: 0, y: 5 });
  w.line('FP-PIPE', { x: 0, y: 5 }, { x: 30, y: 5 });
  for (const x of [6, 18, 30]) w.insert('FP-HEAD', 'H', { x, y: 5 });
  return w.toString();
}

ruleTester(headOutsideRoom, {
  valid: [{ name: 'every head inside the room', layout: { s: 12, l: 10, heads: 4, lines: 3 } }],
  invalid: [
    {
      name: 'a head outside the room outline',
      layout: { s: 12, l: 10, heads: 3, lines: 2, extraHeads: [{ x: 60, y: 40 }] },
      count: 1,
      severity: 'warning',
      params: { kind: 'head' },
    },
    { name: 'no walls at all: said once', dxf: noWalls(), count: 1, severity: 'info', params: { kind: 'no-rooms', walls: false } },
  ],
});
