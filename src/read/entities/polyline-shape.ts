// What LWPOLYLINE and POLYLINE share once decoded: vertices with bulges, a closed bit, and how they are handed on
// (one stroke per segment, so that the network can join pipes at vertices, and an outline when closed).

import type { Affine } from '../../geometry/affine.js';
import { distance } from '../../geometry/point.js';
import { sampleBulge } from '../arcs.js';
import type { EntityBase, ExpandContext } from './types.js';

export interface Vertex {
  x: number;
  y: number;
  bulge: number;
}

export interface PolylineShape extends EntityBase {
  vertices: Vertex[];
  closed: boolean;
}

/** Length of the arc between two vertices with bulge b (b = tan(sweep / 4)). */
function segmentLength(p1: Vertex, p2: Vertex): number {
  const chord = distance(p1, p2);
  if (!p1.bulge || !Number.isFinite(p1.bulge)) return chord;
  const b = Math.abs(p1.bulge);
  return ((chord * (1 + b * b)) / (4 * b)) * 4 * Math.atan(b);
}

/** Strokes of each segment and, for a closed polyline of three vertices or more, its outline, under `t`. */
export function expandPolyline(e: PolylineShape, ctx: ExpandContext, t: Affine): void {
  const verts = e.vertices.filter((v) => Number.isFinite(v.x) && Number.isFinite(v.y));
  const n = verts.length;
  const outline: { x: number; y: number }[] = [];
  for (let k = 0; k < (e.closed ? n : n - 1); k++) {
    const p1 = verts[k]!;
    const p2 = verts[(k + 1) % n]!;
    const pts = sampleBulge(p1, p2, p1.bulge);
    ctx.stroke(pts, t, segmentLength(p1, p2));
    for (let i = 0; i < pts.length - 1; i++) outline.push(pts[i]!);
  }
  if (e.closed && n >= 3) ctx.outline(() => outline, t);
}
