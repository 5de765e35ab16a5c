// Groups' bounds summed window by window: the same bound as the plain walk of their heads where each line's water
// meets the others' only at or above its top, and the plain walk itself where a line hangs off another below that.

import { describe, expect, it } from 'vitest';
import { treeBound, type Demand } from './k-factor-walk.js';
import type { HydraulicModel } from './model.js';
import { modelPipe as pipe } from '../../test/support/model-pipe.js';

/**
 * A source (0) and a cross main 0 — 1 — 2; line A from junction 1: heads a1 (3), a2 (4), a3 (7) in a row; line B
 * of heads b1 (5), b2 (6) from `bAt`. Resistances (psi/gpm^1.85) are invented; heads K 5.6 at 7 psi (TRADE.md:
 * minimum head pressure 7 psi).
 */
function model(bAt: number): HydraulicModel {
  const ids = ['S', 'J1', 'J2', 'a1', 'a2', 'b1', 'b2', 'a3'];
  return {
    nodes: ids.map((id) => ({ id, elevation: 10 })),
    pipes: [pipe(0, 1, 2e-4), pipe(1, 2, 3e-4), pipe(1, 3, 4e-3), pipe(3, 4, 5e-3), pipe(4, 7, 6e-3), pipe(bAt, 5, 7e-3), pipe(5, 6, 8e-3)],
    emitters: [3, 4, 7, 5, 6].map((node) => ({ node, headId: ids[node]!, k: 5.6, required: 7 })),
    source: 0,
    riser: { modelled: 'none', length: 0, nominalSize: '1' },
  };
}

const A = ['a1', 'a2', 'a3'];
const B = ['b1', 'b2'];
// Two results agree to rounding: 1e-12 relative (common practice, no source).
const same = (x: Demand | null, y: Demand | null) => {
  expect(x).not.toBeNull();
  expect(Math.abs(x!.pressure - y!.pressure)).toBeLessThan(1e-12 * y!.pressure);
  expect(Math.abs(x!.flow - y!.flow)).toBeLessThan(1e-12 * y!.flow);
};

describe('boundOfGroup', () => {
  it.each([
    ['on the cross main, a junction of its own', 2],
    ['at the top of line A', 1],
  ])('line B %s: windows summed at their tops give the plain walk’s bound', (_, bAt) => {
    const bound = treeBound(model(bAt))!;
    const plain = treeBound(model(bAt))!;
    bound.knowLines([A, B]);
    same(bound.boundOfGroup([...A, ...B], null), plain.bound([...A, ...B]));
    same(bound.boundOfGroup(['a2', 'a3'], { heads: B, first: 0, last: 1, size: 1 }), plain.boundAlong(['a2', 'a3'], B, 0, 1, 1));
    same(bound.boundOfGroup(['a1', 'a2'], { heads: B, first: 0, last: 0, size: 2 }), plain.bound(['a1', 'a2', ...B]));
    // asked again, from the windows already summed
    same(bound.boundOfGroup([...A, ...B], null), plain.bound([...A, ...B]));
  });

  it("line B hanging off line A below its top (at a2): the plain walk (A's window alone misses B's water in A's pipes)", () => {
    const bound = treeBound(model(4))!;
    bound.knowLines([A, B]);
    same(bound.boundOfGroup([...A, ...B], null), treeBound(model(4))!.bound([...A, ...B]));
    same(
      bound.boundOfGroup(['a1', 'a2'], { heads: B, first: 0, last: 1, size: 1 }),
      treeBound(model(4))!.boundAlong(['a1', 'a2'], B, 0, 1, 1),
    );
  });

  it('a head on no known line: the plain walk', () => {
    const bound = treeBound(model(2))!;
    bound.knowLines([A]);
    same(bound.boundOfGroup([...A, 'b1'], null), treeBound(model(2))!.bound([...A, 'b1']));
  });
});
