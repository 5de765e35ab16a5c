// The supply path the contract writes as its example (CONTRACT.md, "Supply path"): an underground pipe, a backflow
// preventer's loss curve and a fire pump's curve, in order from the flow-test point (invented equipment).

import type { PathPart } from '../../src/hydraulics/supply-path.js';

/** The contract's three parts; `rise` of the pipe as given (the contract's own is 0). */
export const contractPath = (rise = 0): PathPart[] => [
  { type: 'pipe', length: 300, size: '6', cFactor: 140, schedule: '40', rise },
  {
    type: 'device',
    name: 'backflow preventer',
    loss: [
      [0, 4],
      [500, 7],
      [1500, 12],
    ],
  },
  {
    type: 'pump',
    name: 'fire pump',
    curve: [
      [0, 120],
      [750, 110],
      [1000, 100],
      [1500, 65],
    ],
  },
];
