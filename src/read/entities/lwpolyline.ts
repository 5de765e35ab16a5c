// LWPOLYLINE: vertices in object coordinates, each code 10 starting one; a code 20 or 42 belongs to the last.
// An unknown code among the vertices is passed over (a damaged file once made another reader re-read forever).

import { takeCommon } from './common.js';
import { expandPolyline, type PolylineShape, type Vertex } from './polyline-shape.js';
import type { EntityKind } from './types.js';

export const LWPOLYLINE: EntityKind<PolylineShape> = {
  type: 'LWPOLYLINE',
  shape: 'stroke',
  closedOutline: true,
  scan: { closedBit: true },
  decode(r, base) {
    const vertices: Vertex[] = [];
    const e: PolylineShape = { vertices, closed: false, ...base };
    while (r.next()) {
      if (takeCommon(r, e)) continue;
      const last = vertices.at(-1);
      if (r.code === 10) vertices.push({ x: r.number(Number.NaN), y: 0, bulge: 0 });
      else if (r.code === 20 && last) last.y = r.number(Number.NaN);
      else if (r.code === 42 && last) last.bulge = r.number();
      else if (r.code === 70) e.closed = (r.number() & 1) === 1;
    }
    return e;
  },
  expand(e, ctx) {
    expandPolyline(e, ctx, ctx.ocs);
  },
};
