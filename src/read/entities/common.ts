// Groups every entity shares (handle, layer, paper space, extrusion), read the same way by every entity module.

import type { EntityReader } from '../dxf/entity-reader.js';
import type { EntityBase } from './types.js';

/** Takes a group every entity shares into `e`; false when the group is the type's own. */
export function takeCommon(r: EntityReader, e: EntityBase): boolean {
  switch (r.code) {
    case 5:
      e.handle = r.ascii();
      return true;
    case 8:
      e.layer = r.name();
      return true;
    case 67:
      e.paperSpace = r.number() === 1;
      return true;
    case 230:
      e.extrusionZ = r.number(1);
      return true;
    default:
      return false;
  }
}

/** A point from a pair of groups (x code, x code + 10), filled in as they come. */
export interface MutablePoint {
  x: number;
  y: number;
}
export const origin = (): MutablePoint => ({ x: 0, y: 0 });
