// Wall geometry for the rules: wall segments from room outlines and wall linework, a spatial index over
// them, the nearest wall in a direction (a ray cast), the nearest wall at all, and the room a point is in.

import RBush from 'rbush';
import { cross, distanceToSegment, sub, type Point } from '../geometry/point.js';
import { segmentBox, type SegmentBox } from '../geometry/boxes.js';
import { containsPoint, signedArea } from '../geometry/polygon.js';
import type { Outline, Stroke } from '../read/types.js';

export interface Walls {
  /** Distance from `p` to the first wall along unit direction `d`, or null within `maxRange`. */
  along(p: Point, d: Point, maxRange: number): number | null;
  /** Distance from `p` to the nearest wall within `maxRange`, or null. */
  nearest(p: Point, maxRange: number): number | null;
  /** The smallest room outline containing `p`, or null. */
  roomOf(p: Point): Outline | null;
  readonly count: number;
}

export function indexWalls(rooms: Outline[], strokes: Stroke[]): Walls {
  const boxes: SegmentBox[] = [];
  const add = (a: Point, b: Point) => boxes.push(segmentBox(a, b));
  for (const r of rooms)
    r.points.forEach((p, i) => {
      add(p, r.points[(i + 1) % r.points.length]!);
    });
  for (const s of strokes) {
    const pts = [s.a, ...s.via, s.b];
    for (let k = 1; k < pts.length; k++) add(pts[k - 1]!, pts[k]!);
  }
  const tree = new RBush<SegmentBox>();
  tree.load(boxes);
  const roomsBySize = rooms.map((r) => ({ r, area: Math.abs(signedArea(r.points)) })).sort((x, y) => x.area - y.area);
  return {
    count: boxes.length,
    along(p, d, maxRange) {
      const q = { x: p.x + d.x * maxRange, y: p.y + d.y * maxRange };
      let best: number | null = null;
      for (const w of tree.search({
        minX: Math.min(p.x, q.x),
        minY: Math.min(p.y, q.y),
        maxX: Math.max(p.x, q.x),
        maxY: Math.max(p.y, q.y),
      })) {
        const t = rayHit(p, d, w.a, w.b);
        if (t !== null && t <= maxRange && (best === null || t < best)) best = t;
      }
      return best;
    },
    nearest(p, maxRange) {
      let best: number | null = null;
      for (const w of tree.search({ minX: p.x - maxRange, minY: p.y - maxRange, maxX: p.x + maxRange, maxY: p.y + maxRange })) {
        const dist = distanceToSegment(p, w.a, w.b);
        if (dist <= maxRange && (best === null || dist < best)) best = dist;
      }
      return best;
    },
    roomOf(p) {
      return roomsBySize.find(({ r }) => containsPoint(r.points, p))?.r ?? null;
    },
  };
}

/** Distance along the ray p + t·d (d unit) to segment a–b, or null when it misses. */
function rayHit(p: Point, d: Point, a: Point, b: Point): number | null {
  const e = sub(b, a);
  const denom = cross(d, e);
  if (Math.abs(denom) < 1e-12) return null;
  const ap = sub(a, p);
  const t = cross(ap, e) / denom;
  const s = cross(ap, d) / denom;
  return t >= 0 && s >= -1e-9 && s <= 1 + 1e-9 ? t : null;
}
