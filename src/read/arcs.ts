// Sample points along circular arcs: DXF ARC entities and polyline bulges (bulge = tan(sweep / 4)).
// Samples are at most π/16 apart, so chord length is within 0.25% of the arc length.

import type { Point } from '../geometry/point.js';

const MAX_STEP = Math.PI / 16;

/** Points on a circle from `start` sweeping `sweep` radians (positive counter-clockwise), ends included. */
export function sampleArc(center: Point, radius: number, start: number, sweep: number): Point[] {
  const steps = Math.max(2, Math.min(256, Math.ceil(Math.abs(sweep) / MAX_STEP)));
  const out: Point[] = [];
  for (let k = 0; k <= steps; k++) {
    const t = start + (sweep * k) / steps;
    out.push({ x: center.x + radius * Math.cos(t), y: center.y + radius * Math.sin(t) });
  }
  return out;
}

/** The arc between two polyline vertices with bulge `bulge`, as sample points from p1 to p2 (ends included). */
export function sampleBulge(p1: Point, p2: Point, bulge: number): Point[] {
  const c = Math.hypot(p2.x - p1.x, p2.y - p1.y);
  if (c === 0 || bulge === 0 || !Number.isFinite(bulge)) return [p1, p2];
  const dx = (p2.x - p1.x) / c;
  const dy = (p2.y - p1.y) / c;
  const offset = (c * (1 - bulge * bulge)) / (4 * bulge);
  const center = { x: (p1.x + p2.x) / 2 - dy * offset, y: (p1.y + p2.y) / 2 + dx * offset };
  const radius = (c * (1 + bulge * bulge)) / (4 * Math.abs(bulge));
  const start = Math.atan2(p1.y - center.y, p1.x - center.x);
  const pts = sampleArc(center, radius, start, 4 * Math.atan(bulge));
  pts[0] = p1;
  pts[pts.length - 1] = p2;
  return pts;
}

/** Counter-clockwise sweep from `start` to `end`, in (0, 2π]. */
export function ccwSweep(start: number, end: number): number {
  let s = end - start;
  while (s <= 0) s += 2 * Math.PI;
  while (s > 2 * Math.PI) s -= 2 * Math.PI;
  return s;
}
