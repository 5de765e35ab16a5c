// Plain polygon measures: the signed area (shoelace formula) and whether a point lies inside (even-odd rule).
// Rooms, drawn design areas and clipped outlines are measured with them.

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
