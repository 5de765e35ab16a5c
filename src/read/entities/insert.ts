// INSERT (and MINSERT arrays): a reference placing a block, with its ATTRIB records (tag and value) up to SEQEND.
// The reader expands it through the block's own entities; this module reads it and builds each copy's placement.

import { insertPlacement, type Affine } from '../../geometry/affine.js';
import type { Point } from '../../geometry/point.js';
import { plainText } from '../dxf/text-codes.js';
import { origin, takeCommon } from './common.js';
import type { EntityBase, EntityKind } from './types.js';

export interface Insert extends EntityBase {
  block: string;
  at: Point;
  scaleX: number;
  scaleY: number;
  rotationDeg: number;
  /** MINSERT array: columns and rows, and their spacing (block units along the rotated axes). */
  columns: number;
  rows: number;
  columnSpacing: number;
  rowSpacing: number;
  /** Attribute values by upper-case tag, plain text. */
  attributes: Record<string, string>;
}

export const INSERT: EntityKind<Insert> = {
  type: 'INSERT',
  shape: 'reference',
  scan: { block: true, copies: true },
  decode(r, base) {
    const at = origin();
    const e: Insert = {
      block: '',
      at,
      scaleX: 1,
      scaleY: 1,
      rotationDeg: 0,
      columns: 1,
      rows: 1,
      columnSpacing: 0,
      rowSpacing: 0,
      attributes: {},
      ...base,
    };
    // After the first ATTRIB record, groups belong to attributes: a tag (2) and a value (1) each.
    let attribute: { tag: string; value: string } | null = null;
    let inAttributes = false;
    const keep = () => {
      if (attribute?.tag) e.attributes[attribute.tag.toUpperCase()] = plainText(attribute.value);
    };
    while (r.next()) {
      if (r.code === 0) {
        keep();
        attribute = r.record('ATTRIB') ? { tag: '', value: '' } : null;
        inAttributes = true;
        continue;
      }
      if (inAttributes) {
        if (attribute && r.code === 2) attribute.tag = r.text();
        else if (attribute && r.code === 1) attribute.value = r.text();
        continue;
      }
      if (takeCommon(r, e)) continue;
      switch (r.code) {
        case 2:
          e.block = r.name();
          break;
        case 10:
          at.x = r.number();
          break;
        case 20:
          at.y = r.number();
          break;
        case 41:
          e.scaleX = r.number(1);
          break;
        case 42:
          e.scaleY = r.number(1);
          break;
        case 50:
          e.rotationDeg = r.number();
          break;
        case 70:
          e.columns = Math.max(1, Math.floor(r.number(1)));
          break;
        case 71:
          e.rows = Math.max(1, Math.floor(r.number(1)));
          break;
        case 44:
          e.columnSpacing = r.number();
          break;
        case 45:
          e.rowSpacing = r.number();
          break;
      }
    }
    keep();
    return e;
  },
};

/** The placement of each copy of a reference (one, or columns × rows for an array), block base point `base`. */
export function* placements(e: Insert, base: Point): Generator<Affine> {
  const rot = (e.rotationDeg * Math.PI) / 180;
  for (let row = 0; row < e.rows; row++) {
    for (let col = 0; col < e.columns; col++) {
      const dx = col * e.columnSpacing;
      const dy = row * e.rowSpacing;
      const insertion = { x: e.at.x + dx * Math.cos(rot) - dy * Math.sin(rot), y: e.at.y + dx * Math.sin(rot) + dy * Math.cos(rot) };
      yield insertPlacement({
        insertion,
        base,
        scaleX: e.scaleX,
        scaleY: e.scaleY,
        rotationDeg: e.rotationDeg,
        ocsMirror: e.extrusionZ < 0,
      });
    }
  }
}
