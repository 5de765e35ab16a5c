// ATTDEF: an attribute's definition inside a block (a tag and its default value); a reference without its own
// ATTRIB of that tag takes the default. Not drawn.

import { plainText } from '../dxf/text-codes.js';
import { takeCommon } from './common.js';
import type { EntityBase, EntityKind } from './types.js';

export interface AttDef extends EntityBase {
  tag: string;
  value: string;
}

export const ATTDEF: EntityKind<AttDef> = {
  type: 'ATTDEF',
  shape: 'other',
  decode(r, base) {
    const e: AttDef = { tag: '', value: '', ...base };
    while (r.next()) {
      if (takeCommon(r, e)) continue;
      if (r.code === 2) e.tag = r.text();
      else if (r.code === 1) e.value = plainText(r.text());
    }
    return e;
  },
};
