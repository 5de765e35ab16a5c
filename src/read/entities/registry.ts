// Every entity type the reader decodes, in one table that the scan, the layer summary, the decoder and the
// expansion all read. A type not here is counted on its layer and otherwise passed over.

import { ARC } from './arc.js';
import { ATTDEF } from './attdef.js';
import { CIRCLE } from './circle.js';
import { INSERT } from './insert.js';
import { LINE } from './line.js';
import { LWPOLYLINE } from './lwpolyline.js';
import { MTEXT } from './mtext.js';
import { POINT } from './point.js';
import { POLYLINE } from './polyline.js';
import { TEXT } from './text.js';
import type { EntityKind } from './types.js';

const ENTITY_KINDS: ReadonlyMap<string, EntityKind> = new Map(
  ([LINE, LWPOLYLINE, POLYLINE, ARC, CIRCLE, POINT, TEXT, MTEXT, INSERT, ATTDEF] as EntityKind[]).map((k) => [k.type, k]),
);

export const kindOf = (type: string): EntityKind | undefined => ENTITY_KINDS.get(type);
