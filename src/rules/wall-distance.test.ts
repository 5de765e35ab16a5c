// wall-distance-max (half the allowed spacing, confirmed per shared/TRADE.md) and wall-distance-min
// (4 in, confirmed), measured to the wall segment in the direction that matters, in irregular rooms too.

import { describe, expect, it } from 'vitest';
import { DxfWriter } from '../demo/dxf-writer.js';
import { checkLayout, checkText, findingsOf } from '../../test/support/check.js';

describe('wall-distance-max', () => {
  it('ordinary hazard: 7.5 ft from the end wall passes, 7.6 ft fails on each end head', () => {
    expect(findingsOf(checkLayout({ s: 10, l: 10, heads: 3, lines: 2, wallAlong: 7.5 }), 'wall-distance-max')).toEqual([]);
    const over = findingsOf(checkLayout({ s: 10, l: 10, heads: 3, lines: 2, wallAlong: 7.6 }), 'wall-distance-max');
    expect(over).toHaveLength(4);
    expect(over[0]!.measured).toBeCloseTo(7.6, 9);
    expect(over[0]!.limit).toBe(7.5);
  });
  it('across the lines: outer lines 7.6 ft from the side walls fail', () => {
    expect(findingsOf(checkLayout({ s: 10, l: 10, heads: 3, lines: 2, wallAcross: 7.6 }), 'wall-distance-max')).toHaveLength(6);
  });
  it('in an L-shaped room the distance is to the wall in that direction, not to the bounding box', () => {
    // Room: 0..40 × 0..10 plus 0..10 × 10..30 (an L). One line at y = 5 with heads at x = 5, 15, 25, 35.
    // Across the line, the heads at x = 15, 25, 35 are 5 ft from the wall at y = 10; the head at x = 5 stands
    // under the L's leg and is 25 ft from the wall at y = 30. The bounding box (0..40 × 0..30) would say 25 for all.
    const w = new DxfWriter(2);
    w.block('H', { x: 0, y: 0 }, (b) => { w.circle('0', { x: 0, y: 0 }, 0.2, b); });
    w.block('R', { x: 0, y: 0 }, (b) => { w.circle('0', { x: 0, y: 0 }, 0.5, b); });
    w.polyline('A-WALL', [{ x: 0, y: 0 }, { x: 40, y: 0 }, { x: 40, y: 10 }, { x: 10, y: 10 }, { x: 10, y: 30 }, { x: 0, y: 30 }], true);
    w.insert('FP-SOURCE', 'R', { x: -5, y: 5 });
    w.line('FP-PIPE', { x: -5, y: 5 }, { x: 35, y: 5 });
    for (const x of [5, 15, 25, 35]) w.insert('FP-HEAD', 'H', { x, y: 5 });
    const r = checkText(w.toString(), { defaults: { pipeSize: '1-1/4' } });
    const byX = new Map(r.plan.heads.map((h) => [h.position.x, r.coverage.get(h.id)!]));
    const across = (x: number) => [...byX.get(x)!.wallAcross].sort((a, b) => a! - b!);
    expect(across(15)).toEqual([5, 5]);
    expect(across(35)).toEqual([5, 5]);
    expect(across(5)).toEqual([5, 25]);
    const far = findingsOf(r, 'wall-distance-max');
    expect(far).toHaveLength(1);
    expect(far[0]!.handles).toEqual([r.plan.heads.find((h) => h.position.x === 5)!.handle]);
  });
});

describe('wall-distance-min', () => {
  it('4 in from the wall passes, 3.9 in fails', () => {
    expect(findingsOf(checkLayout({ s: 10, l: 10, heads: 3, lines: 2, wallAlong: 4 / 12 }), 'wall-distance-min')).toEqual([]);
    const near = findingsOf(checkLayout({ s: 10, l: 10, heads: 3, lines: 2, wallAlong: 3.9 / 12 }), 'wall-distance-min');
    expect(near).toHaveLength(4);
    expect(near[0]!.measured! * 12).toBeCloseTo(3.9, 9);
  });
});
