// A pipe of a hand-built hydraulic model for tests: its ends and resistance given, the rest plain (10 ft of 1 in.
// schedule 40, C 120) unless a test spreads its own fields over it.

import type { ModelPipe } from '../../src/hydraulics/model.js';

export const modelPipe = (from: number, to: number, r: number): ModelPipe => ({
  id: `P${from}-${to}`,
  from,
  to,
  length: 10,
  fittingsLength: 0,
  fittings: [],
  nominalSize: '1',
  diameter: 1.049,
  c: 120,
  r,
  run: 0,
});
