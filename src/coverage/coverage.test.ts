// The lines beside each head, found through the index by direction, against a brute-force search over every line
// (random layouts: a few directions, near-parallel and opposite ones, far coordinates); the tests themselves are
// the project's (parallel within 10°, spanning the head within ¾ spacing, within 60 ft: common practice, no source).

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { Point } from '../geometry/point.js';
import type { BranchLine, Network } from '../network/types.js';
import type { Head } from '../read/plan.js';
import { computeCoverage } from './coverage.js';
import type { Walls } from './walls.js';

const noWalls: Walls = { along: () => null, nearest: () => null, roomOf: () => null, count: 0 };

/** Nearest line each side of a head over every line, the tests written out plainly. */
function bruteForce(p: Point, own: BranchLine, lines: BranchLine[], pos: Map<string, Point>): [number | null, number | null] {
  const u = own.direction;
  const v = { x: -u.y, y: u.x };
  let left: number | null = null;
  let right: number | null = null;
  for (const other of lines) {
    const d = other.direction;
    if (other === own || Math.abs(d.x * u.y - d.y * u.x) > Math.sin((10 * Math.PI) / 180)) continue;
    const pts = other.headIds.map((id) => pos.get(id)!);
    const ts = pts.map((q) => q.x * u.x + q.y * u.y);
    const spacing =
      (Math.max(...pts.map((q) => q.x * d.x + q.y * d.y)) - Math.min(...pts.map((q) => q.x * d.x + q.y * d.y))) /
      Math.max(1, pts.length - 1);
    const slack = Math.max(spacing, 1) * 0.75;
    const tp = p.x * u.x + p.y * u.y;
    // the extent along u from the two end heads along the other line's own direction
    const byOwn = pts.map((q, i) => ({ i, t: q.x * d.x + q.y * d.y })).sort((a, b) => a.t - b.t);
    const t0 = ts[byOwn[0]!.i]!;
    const t1 = ts[byOwn.at(-1)!.i]!;
    if (tp < Math.min(t0, t1) - slack || tp > Math.max(t0, t1) + slack) continue;
    const cx = pts.reduce((a, q) => a + q.x, 0) / pts.length;
    const cy = pts.reduce((a, q) => a + q.y, 0) / pts.length;
    const off = (cx - p.x) * v.x + (cy - p.y) * v.y;
    if (Math.abs(off) < 1e-6 || Math.abs(off) > 60) continue;
    if (off > 0 && (left === null || off < left)) left = off;
    if (off < 0 && (right === null || -off < right)) right = -off;
  }
  return [left, right];
}

/** One branch line: one of three directions, maybe 3° off or reversed, its first head, its head count. */
const lineSpec = fc.record({
  direction: fc.constantFrom(0, Math.PI / 2, Math.PI / 6),
  tilted: fc.boolean(),
  reversed: fc.boolean(),
  x: fc.double({ min: 0, max: 200, noNaN: true }),
  y: fc.double({ min: 0, max: 200, noNaN: true }),
  n: fc.integer({ min: 1, max: 8 }),
});

type LineSpec = typeof lineSpec extends fc.Arbitrary<infer T> ? T : never;

/** The lines' heads 12 ft apart, all moved far from the origin. */
function layout(specs: LineSpec[], origin: Point): { heads: Head[]; network: Network } {
  const heads: Head[] = [];
  const lines: BranchLine[] = [];
  for (const [k, spec] of specs.entries()) {
    const angle = spec.direction + (spec.tilted ? (3 * Math.PI) / 180 : 0) + (spec.reversed ? Math.PI : 0);
    const u = { x: Math.cos(angle), y: Math.sin(angle) };
    const start = { x: origin.x + spec.x, y: origin.y + spec.y };
    const n = spec.n;
    const ids: string[] = [];
    for (let i = 0; i < n; i++) {
      const id = `H${heads.length}`;
      ids.push(id);
      const position = { x: start.x + u.x * 12 * i, y: start.y + u.y * 12 * i };
      heads.push({ id, handle: id, layer: 'S', block: 'H', position, kFactor: 5.6, elevation: 0, kind: 'standard', attributes: {} });
    }
    lines.push({ id: `L${k}`, pipeIds: [], headIds: ids, direction: u, feedNodeIds: [] });
  }
  return { heads, network: { branchLines: lines } as unknown as Network };
}

describe('lines beside each head', () => {
  it('the index finds what a search over every line finds (random layouts)', () => {
    let beside = 0;
    fc.assert(
      fc.property(
        fc.array(lineSpec, { minLength: 2, maxLength: 60 }),
        fc.record({ x: fc.double({ min: -1e5, max: 1e5, noNaN: true }), y: fc.double({ min: -1e5, max: 1e5, noNaN: true }) }),
        (specs, origin) => {
          const { heads, network } = layout(specs, origin);
          const pos = new Map(heads.map((h) => [h.id, h.position]));
          const coverage = computeCoverage(heads, network, noWalls);
          for (const line of network.branchLines) {
            for (const id of line.headIds) {
              const expected = bruteForce(pos.get(id)!, line, network.branchLines, pos);
              expect(coverage.get(id)!.lineAcross).toEqual(expected);
              if (expected[0] !== null || expected[1] !== null) beside++;
            }
          }
        },
      ),
      { numRuns: 60 },
    );
    // the layouts put lines beside lines: the comparison is not only of nulls
    expect(beside).toBeGreaterThan(100);
  });
});
