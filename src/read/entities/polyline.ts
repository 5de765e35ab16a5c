// POLYLINE with its VERTEX records and SEQEND: 2D polylines in object coordinates, 3D ones in world coordinates
// (taken as plan); polygon and polyface meshes are surfaces, not linework, and are skipped.

import { takeCommon } from './common.js';
import { expandPolyline, type PolylineShape, type Vertex } from './polyline-shape.js';
import type { EntityKind } from './types.js';

export interface Polyline extends PolylineShape {
  is3d: boolean;
  mesh: boolean;
}

/** POLYLINE flags (DXF reference): 1 closed, 8 3D polyline, 16 polygon mesh, 64 polyface mesh. */
const CLOSED = 1;
const POLYLINE_3D = 8;
const MESH = 16 | 64;

export const POLYLINE: EntityKind<Polyline> = {
  type: 'POLYLINE',
  shape: 'stroke',
  closedOutline: true,
  scan: { closedBit: true },
  decode(r, base) {
    const vertices: Vertex[] = [];
    const e: Polyline = { vertices, closed: false, is3d: false, mesh: false, ...base };
    let vertex: Vertex | null = null;
    let done = false;
    while (r.next()) {
      if (r.code === 0) {
        vertex = r.record('VERTEX') ? { x: 0, y: 0, bulge: 0 } : null;
        if (vertex) vertices.push(vertex);
        done ||= r.record('SEQEND');
        continue;
      }
      if (done) continue;
      if (vertex) {
        if (r.code === 10) vertex.x = r.number(Number.NaN);
        else if (r.code === 20) vertex.y = r.number(Number.NaN);
        else if (r.code === 42) vertex.bulge = r.number();
        continue;
      }
      if (takeCommon(r, e)) continue;
      if (r.code === 70) {
        const f = r.number();
        e.closed = (f & CLOSED) !== 0;
        e.is3d = (f & POLYLINE_3D) !== 0;
        e.mesh = (f & MESH) !== 0;
      }
    }
    return e;
  },
  expand(e, ctx) {
    if (!e.mesh) expandPolyline(e, ctx, e.is3d ? ctx.m : ctx.ocs);
  },
};
