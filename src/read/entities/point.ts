// POINT: a single point (a riser may be drawn as one; an exploded head symbol may be one).

import type { Point } from '../../geometry/point.js';
import { origin, takeCommon } from './common.js';
import type { EntityBase, EntityKind } from './types.js';

export interface PointEntity extends EntityBase {
  at: Point;
}

export const POINT: EntityKind<PointEntity> = {
  type: 'POINT',
  shape: 'point',
  decode(r, base) {
    const at = origin();
    const e: PointEntity = { at, ...base };
    while (r.next()) {
      if (takeCommon(r, e)) continue;
      if (r.code === 10) at.x = r.number();
      else if (r.code === 20) at.y = r.number();
    }
    return e;
  },
  expand(e, ctx) {
    ctx.point(e.at, ctx.m);
  },
};
