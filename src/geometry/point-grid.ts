// Points found again by position, inserted one at a time: a hash of square cells as wide as the search reach, so
// that the points within that reach of a place lie in the few cells its reach covers (a tree grows slowly point by point).

import type { Point } from './point.js';

/**
 * The reach searched, a hair over the one asked: a distance computed ≤ reach (its subtraction and square root each
 * rounded) holds the true offset in each axis within reach × (1 + 2⁻⁵⁰).
 */
const MARGIN = 1 + 1e-9;

export class PointGrid {
  private readonly buckets = new Map<number, number[]>();

  constructor(private readonly reach: number) {}

  /** A hash of a cell (coordinates wrap to 32 bits: far cells may share a bucket, which costs only a distance test). */
  private static keyOf(cx: number, cy: number): number {
    return Math.imul(cx | 0, 0x9e3779b1) ^ Math.imul(cy | 0, 0x85ebca6b);
  }

  /** The cell of a coordinate: rounding and floor are monotone, so a coordinate between two others has a cell between theirs. */
  private cellOf(v: number): number {
    return Math.floor(v / this.reach);
  }

  insert(p: Point, i: number): void {
    const key = PointGrid.keyOf(this.cellOf(p.x), this.cellOf(p.y));
    const bucket = this.buckets.get(key);
    if (bucket) bucket.push(i);
    else this.buckets.set(key, [i]);
  }

  /**
   * Calls `visit` with the index of every point inserted within the reach of `p` in x and in y, as a distance
   * computed to `p` would find it, at any magnitude of coordinates (and perhaps with others, or twice past 2⁵³
   * cells: the caller measures), until it returns true; returns whether it did.
   */
  visitNear(p: Point, visit: (i: number) => boolean): boolean {
    const r = this.reach * MARGIN;
    const x0 = this.cellOf(p.x - r);
    const y0 = this.cellOf(p.y - r);
    // Counted steps, not `cx++`: past 2⁵³ a cell number plus one is itself, and an infinite one stays infinite.
    // The cells between hold at most 8 steps (where a coordinate's own spacing passes the reach, p ± r is p).
    // An infinite cell number (a coordinate near the largest double) is one cell, as `insert` hashes it.
    const nx = this.cellOf(p.x + r) - x0 || 0;
    const ny = this.cellOf(p.y + r) - y0 || 0;
    for (let dx = 0; dx <= nx; dx++)
      for (let dy = 0; dy <= ny; dy++) {
        const bucket = this.buckets.get(PointGrid.keyOf(x0 + dx, y0 + dy));
        if (bucket) for (const i of bucket) if (visit(i)) return true;
      }
    return false;
  }
}
