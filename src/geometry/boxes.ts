// Bounding boxes in the shape the spatial index (rbush) keeps them: a segment's, and an indexed item's (a point
// or a polyline of a list, found again by its index).

import type { Point } from './point.js';

export interface SegmentBox {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
  a: Point;
  b: Point;
}

export const segmentBox = (a: Point, b: Point): SegmentBox => ({
  minX: Math.min(a.x, b.x),
  minY: Math.min(a.y, b.y),
  maxX: Math.max(a.x, b.x),
  maxY: Math.max(a.y, b.y),
  a,
  b,
});

/** The box of item `i` of a list. */
export interface IndexedBox {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
  i: number;
}

export const pointBox = (p: Point, i: number): IndexedBox => ({ minX: p.x, minY: p.y, maxX: p.x, maxY: p.y, i });
