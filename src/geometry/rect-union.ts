// The union of axis-aligned rectangles as closed rings (outer rings counter-clockwise, holes clockwise), exact:
// the rectangles' edges cut the plane into a grid, covered grid cells are marked, and their outer edges chained.

import type { Point } from './point.js';

export interface Rect {
  x0: number;
  y0: number;
  x1: number;
  y1: number;
}

/** Coordinates closer than this are one (the cells of neighbouring heads meet at computed half-distances). */
const SAME = 1e-7;

export function unionOfRects(rects: Rect[]): Point[][] {
  const live = rects.filter((r) => r.x1 - r.x0 > SAME && r.y1 - r.y0 > SAME);
  if (live.length === 0) return [];
  const xs = distinct(live.flatMap((r) => [r.x0, r.x1]));
  const ys = distinct(live.flatMap((r) => [r.y0, r.y1]));
  const nx = xs.length - 1;
  const ny = ys.length - 1;
  const covered = new Uint8Array(nx * ny);
  for (const r of live) {
    const [i0, i1, j0, j1] = [indexOf(xs, r.x0), indexOf(xs, r.x1), indexOf(ys, r.y0), indexOf(ys, r.y1)];
    for (let i = i0; i < i1; i++) for (let j = j0; j < j1; j++) covered[i * ny + j] = 1;
  }
  const on = (i: number, j: number) => i >= 0 && j >= 0 && i < nx && j < ny && covered[i * ny + j] === 1;
  // Boundary edges with the covered side on their left, from grid vertex to grid vertex (vertex = i * (ny+1) + j).
  const next = new Map<number, number[]>();
  const vertex = (i: number, j: number) => i * (ny + 1) + j;
  const edge = (a: number, b: number) => next.set(a, [...(next.get(a) ?? []), b]);
  for (let i = 0; i < nx; i++) {
    for (let j = 0; j < ny; j++) {
      if (!on(i, j)) continue;
      if (!on(i, j - 1)) edge(vertex(i, j), vertex(i + 1, j));
      if (!on(i + 1, j)) edge(vertex(i + 1, j), vertex(i + 1, j + 1));
      if (!on(i, j + 1)) edge(vertex(i + 1, j + 1), vertex(i, j + 1));
      if (!on(i - 1, j)) edge(vertex(i, j + 1), vertex(i, j));
    }
  }
  const rings: Point[][] = [];
  const at = (v: number): Point => ({ x: xs[Math.floor(v / (ny + 1))]!, y: ys[v % (ny + 1)]! });
  for (const start of [...next.keys()]) {
    while ((next.get(start) ?? []).length) {
      const ring: number[] = [start];
      let from = start;
      let to = take(next, from, null, at);
      while (to !== start) {
        ring.push(to);
        const prev = from;
        from = to;
        to = take(next, from, prev, at);
      }
      rings.push(withoutStraightVertices(ring.map(at)));
    }
  }
  return rings;
}

/**
 * Takes the edge leaving `from`; where two leave (cells touching at a corner only), the one turning left of the
 * edge that arrived, so that the rings stay apart.
 */
function take(next: Map<number, number[]>, from: number, arrivedFrom: number | null, at: (v: number) => Point): number {
  const out = next.get(from)!;
  let k = 0;
  if (out.length > 1 && arrivedFrom !== null) {
    const a = at(arrivedFrom);
    const o = at(from);
    const turn = (v: number) => {
      const b = at(v);
      return (o.x - a.x) * (b.y - o.y) - (o.y - a.y) * (b.x - o.x);
    };
    k = turn(out[1]!) > turn(out[0]!) ? 1 : 0;
  }
  const [to] = out.splice(k, 1);
  return to!;
}

function withoutStraightVertices(ring: Point[]): Point[] {
  return ring.filter((p, i) => {
    const a = ring[(i + ring.length - 1) % ring.length]!;
    const b = ring[(i + 1) % ring.length]!;
    return Math.abs((p.x - a.x) * (b.y - p.y) - (p.y - a.y) * (b.x - p.x)) > 1e-12;
  });
}

/** Sorted values with those closer than SAME merged into the first. */
function distinct(values: number[]): number[] {
  const sorted = [...values].sort((a, b) => a - b);
  const out: number[] = [];
  for (const v of sorted) if (!out.length || v - out[out.length - 1]! > SAME) out.push(v);
  return out;
}

/** Index of the grid line at (within SAME of) v. */
function indexOf(lines: number[], v: number): number {
  let lo = 0;
  let hi = lines.length - 1;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (lines[mid]! < v - SAME) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}
