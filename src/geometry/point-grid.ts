// Points found again by position, inserted one at a time: a hash of square cells as wide as the search reach, so
// that every point within that reach of a place lies in the 3 × 3 cells around it (a tree grows slowly point by point).

import type { Point } from './point.js';

export class PointGrid {
  private readonly buckets = new Map<number, number[]>();
  /** A hair wider than the reach, so that rounding in the division cannot put a point within reach two cells away. */
  private readonly cell: number;

  constructor(reach: number) {
    this.cell = reach * (1 + 1e-9);
  }

  /** A hash of a cell (coordinates wrap to 32 bits: far cells may share a bucket, which costs only a distance test). */
  private static keyOf(cx: number, cy: number): number {
    return Math.imul(cx | 0, 0x9e3779b1) ^ Math.imul(cy | 0, 0x85ebca6b);
  }

  insert(p: Point, i: number): void {
    const key = PointGrid.keyOf(Math.floor(p.x / this.cell), Math.floor(p.y / this.cell));
    const bucket = this.buckets.get(key);
    if (bucket) bucket.push(i);
    else this.buckets.set(key, [i]);
  }

  /**
   * Calls `visit` with the index of every point inserted within the reach of `p` in x and in y (and perhaps with
   * others: the caller measures), until it returns true; returns whether it did.
   */
  visitNear(p: Point, visit: (i: number) => boolean): boolean {
    const cx = Math.floor(p.x / this.cell);
    const cy = Math.floor(p.y / this.cell);
    for (let dx = -1; dx <= 1; dx++)
      for (let dy = -1; dy <= 1; dy++) {
        const bucket = this.buckets.get(PointGrid.keyOf(cx + dx, cy + dy));
        if (bucket) for (const i of bucket) if (visit(i)) return true;
      }
    return false;
  }
}
