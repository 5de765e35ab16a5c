// network-disconnected: piping with no path to the source; with heads on it an error, bare pipe a warning (a
// crossing drawn without a joint, common practice, no source).

import { layoutWith, lineGroups } from '../../test/support/check.js';
import { ruleTester } from '../../test/support/rule-tester.js';
import { networkDisconnected } from './network-disconnected.js';

const layout = { s: 12, l: 10, heads: 3, lines: 2 };

ruleTester(networkDisconnected, {
  valid: [{ name: 'every pipe reached from the source', layout }],
  invalid: [
    // lines at y = 5 and 15; a pipe from (20, 8) to (20, 12) crosses nothing and joins nothing
    {
      name: 'a stray pipe between the lines: a warning',
      dxf: layoutWith(layout, lineGroups('FP-PIPE', 20, 8, 20, 12)),
      count: 1,
      severity: 'warning',
      params: { pipes: 1, heads: [] },
    },
    // a second run of pipe from (6, 40) to (30, 40) carrying two heads, not joined to the cross main
    {
      name: 'a run carrying heads, not joined: an error naming the heads',
      count: 1,
      severity: 'error',
      dxf: layoutWith(
        {
          ...layout,
          extraHeads: [
            { x: 12, y: 40 },
            { x: 24, y: 40 },
          ],
        },
        lineGroups('FP-PIPE', 6, 40, 30, 40),
      ),
      params: { heads: ['H7', 'H8'] },
    },
  ],
});
