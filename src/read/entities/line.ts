// LINE: a straight piece of linework between two points, given in world (not object) coordinates.

import type { Point } from '../../geometry/point.js';
import { origin, takeCommon } from './common.js';
import type { EntityBase, EntityKind } from './types.js';

export interface Line extends EntityBase {
  a: Point;
  b: Point;
}

export const LINE: EntityKind<Line> = {
  type: 'LINE',
  shape: 'stroke',
  decode(r, base) {
    const a = origin();
    const b = origin();
    const e: Line = { a, b, ...base };
    while (r.next()) {
      if (takeCommon(r, e)) continue;
      if (r.code === 10) a.x = r.number();
      else if (r.code === 20) a.y = r.number();
      else if (r.code === 11) b.x = r.number();
      else if (r.code === 21) b.y = r.number();
    }
    return e;
  },
  expand(e, ctx) {
    ctx.stroke([e.a, e.b], ctx.m, Math.hypot(e.b.x - e.a.x, e.b.y - e.a.y));
  },
};
