// A DXF drawing as a DrawingSource: the byte scan's entity table, and a row decoded on demand by its entity
// module, straight from the file's bytes (no text of the whole file is made, no other parser is involved).

import { kindOf } from '../entities/registry.js';
import type { EntityBase } from '../entities/types.js';
import type { InputLimits } from '../../config/settings.js';
import type { DrawingSource } from '../source.js';
import { drawingEncoding, textDecoder } from './decode.js';
import { EntityReader } from './entity-reader.js';
import { GroupCursor } from './groups.js';
import { scanDxf } from './scan.js';

export function dxfSource(bytes: Uint8Array, limits: Pick<InputLimits, 'entities' | 'textLength'>): DrawingSource {
  const { encoding, version } = drawingEncoding(bytes);
  const decode = textDecoder(encoding);
  const scan = scanDxf(bytes, decode, limits);
  const reader = new EntityReader(bytes, decode);
  const { table, names } = scan;
  return {
    format: 'dxf',
    encoding,
    header: { version, insunits: scan.insunits, handseed: scan.handseed },
    entityHandles: scan.entityHandles,
    layerNames: scan.layerNames,
    names,
    table,
    blocks: scan.blocks,
    modelSpace: scan.modelSpace,
    entity(row) {
      const type = names[table.type[row]!]!;
      const kind = kindOf(type);
      if (!kind) return null;
      reader.enter(table.start[row]!, table.end[row]!);
      const base: EntityBase = { type, handle: '', layer: '0', paperSpace: false, extrusionZ: 1 };
      return kind.decode(reader, base);
    },
    labelText: (row) => (table.textStart[row]! < 0 ? '' : decode(bytes.subarray(table.textStart[row]!, table.textEnd[row]!))),
    blockBase(block) {
      // The BLOCK record's own groups: its base point is 10/20 (before its first entity).
      const c = new GroupCursor(bytes);
      c.end = block.start;
      const base = { x: 0, y: 0 };
      const stop = block.rows.end > block.rows.first ? table.start[block.rows.first]! : block.end;
      while (c.next() && c.start < stop) {
        if (c.code === 0 && c.start > block.start) break;
        const v = c.number();
        if (c.code === 10 && Number.isFinite(v)) base.x = v;
        else if (c.code === 20 && Number.isFinite(v)) base.y = v;
      }
      return base;
    },
  };
}
