// TEXT: a one-line label in object coordinates, placed at its first point, or at its alignment point when it is
// aligned otherwise than left on the baseline; specials (%%c, %%d, \U+ escapes) become plain characters.

import type { Point } from '../../geometry/point.js';
import { plainText } from '../dxf/text-codes.js';
import { origin, takeCommon } from './common.js';
import type { EntityBase, EntityKind } from './types.js';

export interface Text extends EntityBase {
  at: Point;
  alignAt: Point | null;
  aligned: boolean;
  height: number;
  text: string;
}

export const TEXT: EntityKind<Text> = {
  type: 'TEXT',
  shape: 'text',
  scan: { label: true },
  decode(r, base) {
    const at = origin();
    const e: Text = { at, alignAt: null, aligned: false, height: 0, text: '', ...base };
    while (r.next()) {
      if (takeCommon(r, e)) continue;
      switch (r.code) {
        case 10:
          at.x = r.number();
          break;
        case 20:
          at.y = r.number();
          break;
        case 11:
          e.alignAt = { x: r.number(), y: e.alignAt?.y ?? 0 };
          break;
        case 21:
          e.alignAt = { x: e.alignAt?.x ?? 0, y: r.number() };
          break;
        case 40:
          e.height = r.number();
          break;
        case 1:
          e.text = plainText(r.text());
          break;
        case 72:
        case 73:
          e.aligned ||= r.number() !== 0;
          break;
      }
    }
    return e;
  },
  expand(e, ctx) {
    ctx.text(e.aligned && e.alignAt ? e.alignAt : e.at, ctx.ocs, e.text, e.height);
  },
};
