// A drawing's model-space entities as headcheck's reader returns them (handle, type, layer, defining point), in
// the shape ezdxf's listing has (scripts/ezdxf-entities.py), so that the two can be compared entity by entity.

import { inspectDrawing } from '../../src/read/read-drawing.js';
import { nameDecoder, PAPER_SPACE } from '../../src/read/source.js';

export interface ListedEntity {
  /** '' for a type the reader does not decode (it keeps only its type and layer). */
  handle: string;
  type: string;
  layer: string;
  at: [number, number] | null;
  /** Vertex count of a polyline, else null. */
  vertices: number | null;
}

export function readerEntities(dxf: Uint8Array): { layers: string[]; entities: ListedEntity[] } {
  const { source } = inspectDrawing(dxf, { units: 'in' });
  const named = nameDecoder();
  const entities: ListedEntity[] = [];
  for (const rows of source.modelSpace) {
    for (let row = rows.first; row < rows.end; row++) {
      if (source.table.flags[row]! & PAPER_SPACE) continue;
      const type = source.names[source.table.type[row]!]!;
      const layerIndex = source.table.layer[row]!;
      const e = source.entity(row) as (Record<string, unknown> & { handle: string; layer: string }) | null;
      const vertices = e?.['vertices'] as unknown[] | undefined;
      const p = (e?.['at'] ?? e?.['a'] ?? e?.['center'] ?? vertices?.[0] ?? null) as { x: number; y: number } | null;
      entities.push({
        handle: e?.handle ?? '',
        type,
        layer: e ? e.layer : layerIndex < 0 ? '0' : named(source.names[layerIndex]!),
        at: p ? [p.x, p.y] : null,
        vertices: vertices ? vertices.length : null,
      });
    }
  }
  return { layers: [...source.layerNames].map(named).sort(), entities };
}
