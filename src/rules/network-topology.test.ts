// network-topology: says whether the piping is a tree, a loop or a grid (common practice, no source); counts by
// the cycle rank (pipes − nodes + 1 of the part fed from the source).

import { ruleTester } from '../../test/support/rule-tester.js';
import { networkTopology } from './network-topology.js';

ruleTester(networkTopology, {
  valid: [
    { name: 'nothing said without a source on the piping', layout: { s: 12, l: 10, heads: 3, lines: 2, sourceOffset: { x: 0, y: -4 } } },
  ],
  invalid: [
    {
      name: 'a tree: three lines, no loop',
      layout: { s: 12, l: 10, heads: 3, lines: 3 },
      count: 1,
      severity: 'info',
      params: { topology: 'tree', loops: 0, lines: 3 },
    },
    // three lines joined at both ends by two cross mains: two independent loops
    {
      name: 'a grid of three lines: two loops',
      layout: { s: 12, l: 10, heads: 3, lines: 3, gridded: true },
      count: 1,
      params: { topology: 'grid', loops: 2 },
    },
  ],
});
