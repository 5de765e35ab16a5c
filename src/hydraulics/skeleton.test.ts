// The skeleton of a model: anchors where pipes do not simply continue, chains of pipes in series between
// them with their resistances summed in order, loops on one anchor, and every pipe in exactly one chain.

import { describe, expect, it } from 'vitest';
import type { HydraulicModel } from './model.js';
import { modelPipe as pipe } from '../../test/support/model-pipe.js';
import { buildSkeleton } from './skeleton.js';

// S(0) — 1 — T(2) — 3 — 4 (end), and T(2) — 5 — 6 — back to T(2) (a loop), pipe 4 drawn backwards.
// Resistances 1 to 7 are invented for the test: only their sums along each chain are checked.
const model: HydraulicModel = {
  nodes: Array.from({ length: 7 }, (_, i) => ({ id: `N${i}`, elevation: 0 })),
  pipes: [pipe(0, 1, 1), pipe(1, 2, 2), pipe(2, 3, 3), pipe(4, 3, 4), pipe(2, 5, 5), pipe(5, 6, 6), pipe(6, 2, 7)],
  emitters: [],
  source: 0,
  riser: { modelled: 'none', length: 0, nominalSize: '1' },
};

describe('skeleton', () => {
  const sk = buildSkeleton(model);
  it('anchors the source, the junction and the dead end; the rest are chain interiors', () => {
    expect([...sk.anchorNode]).toEqual([0, 2, 4]);
    expect([1, 3, 5, 6].map((v) => sk.anchorOf[v])).toEqual([-1, -1, -1, -1]);
  });

  it('chains run anchor to anchor in order, with signs for pipes drawn the other way and summed resistances', () => {
    const byEnds = sk.chains.map((c) => ({
      a: sk.anchorNode[c.a],
      b: sk.anchorNode[c.b],
      nodes: [...c.nodes],
      pipes: [...c.pipes],
      sign: [...c.sign],
      cumR: [...c.cumR],
    }));
    expect(byEnds).toEqual([
      { a: 0, b: 2, nodes: [1], pipes: [0, 1], sign: [1, 1], cumR: [0, 1, 3] },
      { a: 2, b: 4, nodes: [3], pipes: [2, 3], sign: [1, -1], cumR: [0, 3, 7] },
      { a: 2, b: 2, nodes: [5, 6], pipes: [4, 5, 6], sign: [1, 1, 1], cumR: [0, 5, 11, 18] },
    ]);
    expect(sk.chainsAt.map((l) => l.length)).toEqual([1, 3, 1]);
  });

  it('places every interior node in its chain', () => {
    expect([sk.chainOf[5], sk.indexInChain[5], sk.chainOf[6], sk.indexInChain[6]]).toEqual([2, 0, 2, 1]);
  });
});
