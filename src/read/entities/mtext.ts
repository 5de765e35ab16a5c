// MTEXT: a paragraph label in world coordinates, its value split over code 3 chunks and a last code 1;
// formatting codes are removed, paragraph breaks become line breaks.

import type { Point } from '../../geometry/point.js';
import { plainMText } from '../dxf/text-codes.js';
import { origin, takeCommon } from './common.js';
import type { EntityBase, EntityKind } from './types.js';

export interface MText extends EntityBase {
  at: Point;
  height: number;
  text: string;
}

export const MTEXT: EntityKind<MText> = {
  type: 'MTEXT',
  shape: 'text',
  scan: { label: true },
  decode(r, base) {
    const at = origin();
    let raw = '';
    const e: MText = { at, height: 0, text: '', ...base };
    while (r.next()) {
      if (takeCommon(r, e)) continue;
      if (r.code === 10) at.x = r.number();
      else if (r.code === 20) at.y = r.number();
      else if (r.code === 40) e.height = r.number();
      else if (r.code === 3 || r.code === 1) raw += r.text();
    }
    e.text = plainMText(raw);
    return e;
  },
  expand(e, ctx) {
    ctx.text(e.at, ctx.m, e.text, e.height);
  },
};
