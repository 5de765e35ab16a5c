// Geometry a real drawing throws at the reader and the network: pipes drawn twice or with no length, ends a
// hair apart, a room outline that crosses itself, an arc of enormous radius, a head on the wall. Each ends in
// a report with the findings a reviewer would expect, never a crash. Limits: NFPA 13 (2019 edition) via
// src/rules/limits.ts; the snap tolerance of 1 in is the tool's default (common practice, no source).

import { describe, expect, it } from 'vitest';
import { layoutDxf, type LayoutSpec } from '../src/demo/generated-layout.js';
import { checkText, findingsOf } from './support/check.js';

const IN = 12; // the generated layouts are drawn in inches
const spec: LayoutSpec = { s: 12, l: 10, heads: 4, lines: 3 };

/** DXF groups as text, each code right-aligned in three columns as the layouts write them. */
const groups = (...pairs: (string | number)[]) => {
  let t = '';
  for (let i = 0; i < pairs.length; i += 2) t += `${String(pairs[i]).padStart(3)}\n${pairs[i + 1]}\n`;
  return t;
};
const line = (layer: string, x1: number, y1: number, x2: number, y2: number) =>
  groups(0, 'LINE', 8, layer, 10, x1 * IN, 20, y1 * IN, 30, 0, 11, x2 * IN, 21, y2 * IN, 31, 0);
/** The layout with extra model-space entities appended. */
const withExtra = (base: string, extra: string) => {
  const at = base.lastIndexOf('  0\nENDSEC\n  0\nEOF');
  return base.slice(0, at) + extra + base.slice(at);
};
const demand = (r: ReturnType<typeof checkText>) => r.design.areas.find((a) => a.rank === 'most-demanding')!.hydraulics!.sourcePressure;

describe('geometry edge cases', () => {
  const plain = checkText(layoutDxf(spec));

  it('a pipe drawn twice over one course is one pipe, not two in parallel', () => {
    // the layout's first branch line runs from the cross main (x = 1 ft) to the last head (x = 42 ft) at y = 5 ft
    const r = checkText(withExtra(layoutDxf(spec), line('FP-PIPE', 1, 5, 42, 5)));
    expect(r.network.pipes).toHaveLength(plain.network.pipes.length);
    expect(r.network.systems[0]!.topology).toBe('tree');
    expect(demand(r)).toBeCloseTo(demand(plain), 9);
  });

  it('a pipe of no length changes nothing', () => {
    const r = checkText(withExtra(layoutDxf(spec), line('FP-PIPE', 18, 5, 18, 5)));
    expect(r.network.pipes).toHaveLength(plain.network.pipes.length);
    expect(demand(r)).toBeCloseTo(demand(plain), 9);
  });

  it('pipe ends 0.5 in apart are joined (under the 1 in snap); 3 in apart they are not', () => {
    // An extra head beyond the end of the first line at x = 54 ft, fed by a pipe that stops short of the line's end.
    const near = checkText(withExtra(layoutDxf({ ...spec, extraHeads: [{ x: 54, y: 5 }] }), line('FP-PIPE', 42 + 0.5 / IN, 5, 54, 5)));
    expect(findingsOf(near, 'head-unattached')).toEqual([]);
    expect(findingsOf(near, 'network-disconnected')).toEqual([]);
    const far = checkText(withExtra(layoutDxf({ ...spec, extraHeads: [{ x: 54, y: 5 }] }), line('FP-PIPE', 42 + 3 / IN, 5, 54, 5)));
    expect(findingsOf(far, 'network-disconnected').length + findingsOf(far, 'head-unattached').length).toBeGreaterThan(0);
  });

  it('a room outline that crosses itself is read, and the check completes', () => {
    // a bow-tie over the layout, on the wall layer beside the real room
    const bowTie = groups(
      0,
      'LWPOLYLINE',
      8,
      'A-WALL',
      90,
      4,
      70,
      1,
      10,
      0,
      20,
      0,
      10,
      48 * IN,
      20,
      30 * IN,
      10,
      48 * IN,
      20,
      0,
      10,
      0,
      20,
      30 * IN,
    );
    const r = checkText(withExtra(layoutDxf(spec), bowTie));
    expect(r.plan.rooms.length).toBe(2);
    expect(r.plan.heads).toHaveLength(12);
    expect(r.report.summary.heads).toBe(12);
  });

  it('an arc of enormous radius is sampled into a bounded number of points', () => {
    const arc = groups(0, 'ARC', 8, 'A-WALL', 10, 0, 20, -1e9, 30, 0, 40, 1e9, 50, 89.9999, 51, 90.0001);
    const r = checkText(withExtra(layoutDxf(spec), arc));
    const drawn = r.plan.walls.find((w) => w.type === 'ARC')!;
    expect(drawn.via.length).toBeLessThanOrEqual(256);
    expect(drawn.length).toBeCloseTo((1e9 / IN) * ((0.0002 * Math.PI) / 180), 3);
    expect(r.report.summary.heads).toBe(12);
  });

  // 4 in from any wall: NFPA 13 (2019 edition), confirmed (src/rules/limits.ts)
  it('a head exactly on a wall is under the 4 in minimum distance, measured 0', () => {
    // the first head of the first line moved onto the west wall (x = 0)
    const r = checkText(layoutDxf({ ...spec, extraHeads: [{ x: 0, y: 25 }] }));
    const onWall = findingsOf(r, 'wall-distance-min').filter((f) => f.measured !== null && f.measured < 1e-9);
    expect(onWall).toHaveLength(1);
    expect(onWall[0]!.limit).toBeCloseTo(4 / IN, 9);
  });
});
