// CIRCLE: a closed outline (sampled), in object coordinates; on a head layer without head blocks, a head symbol.

import type { Point } from '../../geometry/point.js';
import { sampleArc } from '../arcs.js';
import { origin, takeCommon } from './common.js';
import type { EntityBase, EntityKind } from './types.js';

export interface Circle extends EntityBase {
  center: Point;
  radius: number;
}

/** Points a circle outline is sampled at. */
const CIRCLE_STEPS = 32;

export const CIRCLE: EntityKind<Circle> = {
  type: 'CIRCLE',
  shape: 'outline',
  decode(r, base) {
    const center = origin();
    const e: Circle = { center, radius: 0, ...base };
    while (r.next()) {
      if (takeCommon(r, e)) continue;
      if (r.code === 10) center.x = r.number();
      else if (r.code === 20) center.y = r.number();
      else if (r.code === 40) e.radius = r.number();
    }
    return e;
  },
  expand(e, ctx) {
    if (!(e.radius > 0)) return;
    ctx.outline(() => sampleArc(e.center, e.radius, 0, 2 * Math.PI).slice(0, CIRCLE_STEPS), ctx.ocs);
    ctx.symbol(e.center, ctx.ocs, e.radius);
  },
};
