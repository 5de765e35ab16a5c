// ARC: a curved piece of linework (sampled), counter-clockwise from its start angle to its end angle, in object
// coordinates; its true length is the radius times the sweep.

import type { Point } from '../../geometry/point.js';
import { ccwSweep, sampleArc } from '../arcs.js';
import { origin, takeCommon } from './common.js';
import type { EntityBase, EntityKind } from './types.js';

export interface Arc extends EntityBase {
  center: Point;
  radius: number;
  startDeg: number;
  endDeg: number;
}

export const ARC: EntityKind<Arc> = {
  type: 'ARC',
  shape: 'stroke',
  decode(r, base) {
    const center = origin();
    const e: Arc = { center, radius: 0, startDeg: 0, endDeg: 0, ...base };
    while (r.next()) {
      if (takeCommon(r, e)) continue;
      if (r.code === 10) center.x = r.number();
      else if (r.code === 20) center.y = r.number();
      else if (r.code === 40) e.radius = r.number();
      else if (r.code === 50) e.startDeg = r.number();
      else if (r.code === 51) e.endDeg = r.number();
    }
    return e;
  },
  expand(e, ctx) {
    if (!(e.radius > 0)) return;
    const start = (e.startDeg * Math.PI) / 180;
    const sweep = ccwSweep(start, (e.endDeg * Math.PI) / 180);
    ctx.stroke(sampleArc(e.center, e.radius, start, sweep), ctx.ocs, e.radius * sweep);
  },
};
