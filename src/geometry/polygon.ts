// Plain polygon measures: the signed area (shoelace formula), whether a point lies inside (even-odd rule), and
// whether a convex polygon holds a ring. Rooms, drawn design areas and clipped outlines are measured with them.

import { cross, type Point } from './point.js';

/** Area enclosed by the vertices in order, positive when counter-clockwise (the shoelace formula). */
export function signedArea(points: Point[]): number {
  let s = 0;
  for (let i = 0; i < points.length; i++) s += cross(points[i]!, points[(i + 1) % points.length]!);
  return s / 2;
}

/** Even-odd point-in-polygon test. */
export function containsPoint(points: Point[], p: Point): boolean {
  let inside = false;
  for (let i = 0, j = points.length - 1; i < points.length; j = i++) {
    const a = points[i]!;
    const b = points[j]!;
    if (a.y > p.y !== b.y > p.y && p.x < ((b.x - a.x) * (p.y - a.y)) / (b.y - a.y) + a.x) inside = !inside;
  }
  return inside;
}

/**
 * Whether `polygon` is convex and holds every point of `ring` (on its boundary counts, within `tol` ft): then it
 * holds the whole ring, and clipping the ring to it would give the ring back.
 */
export function convexHolds(polygon: Point[], ring: Point[], tol = 1e-9): boolean {
  const n = polygon.length;
  if (n < 3) return false;
  const turn = Math.sign(signedArea(polygon));
  if (turn === 0) return false;
  // Every turn one way, and once round in all (a star turns one way too, twice round).
  let turning = 0;
  for (let i = 0; i < n; i++) {
    const a = polygon[i]!;
    const b = polygon[(i + 1) % n]!;
    const c = polygon[(i + 2) % n]!;
    const edge = { x: b.x - a.x, y: b.y - a.y };
    const next = { x: c.x - b.x, y: c.y - b.y };
    const bend = cross(edge, next);
    if (turn * bend < 0) return false;
    turning += Math.atan2(bend, edge.x * next.x + edge.y * next.y);
    const length = Math.hypot(edge.x, edge.y);
    for (const p of ring) if (turn * cross(edge, { x: p.x - a.x, y: p.y - a.y }) < -tol * length) return false;
  }
  return Math.abs(Math.abs(turning) - 2 * Math.PI) < 1e-6;
}
