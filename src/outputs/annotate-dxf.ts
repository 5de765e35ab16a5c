// The annotated drawing: the original file's bytes kept as they are, with new HC- layers, a legend block and
// annotation entities spliced in, fresh handles above $HANDSEED, and the seed and table counts updated.

import type { Point } from '../geometry/point.js';
import type { LengthUnit } from '../read/types.js';
import { FEET_PER_UNIT } from '../read/units.js';
import type { Annotations, Primitive } from './annotations.js';
import { lineBreakOf } from '../read/dxf/groups.js';
import { formatGroups } from './dxf-format.js';
import * as rec from './dxf-records.js';
import { dxfStructure, type TableEntry, type TableInfo } from './dxf-structure.js';
import type { EntityHandles } from '../read/source.js';

/** Bytes [at, end) of the original replaced by `bytes` (at = end: an insertion). */
interface Splice {
  at: number;
  end: number;
  bytes: Uint8Array;
}

/**
 * The annotated drawing in pieces, to be written one after another: ranges of the original bytes (views, not
 * copies) between the new bytes. `read`: what the read noted of the entity sections, which spares walking them.
 */
export function annotateDxf(
  bytes: Uint8Array,
  version: string,
  units: LengthUnit,
  notes: Annotations,
  read: EntityHandles | null = null,
): Uint8Array[] {
  const { sections, tables, blockNames, handseed, nextHandle } = dxfStructure(bytes, read);
  const eol = lineBreakOf(bytes);
  const modern = version >= 'AC1015';
  const utf8 = version >= 'AC1021';
  const perFoot = 1 / FEET_PER_UNIT[units];
  const handles = nextHandle !== null ? new rec.HandleSource(nextHandle) : null;
  const modelSpace = modern ? modelSpaceRecord(tables.get('BLOCK_RECORD')) : null;
  const ctx: rec.RecordContext = { modern, handles, owner: modelSpace };
  const put = (p: Point): Point => ({ x: p.x * perFoot, y: p.y * perFoot });
  const splices: Splice[] = [];
  const encode = (s: string) => encodeText(s, utf8);
  const insertAt = (at: number, pairs: rec.Pairs) => splices.push({ at, end: at, bytes: encode(formatGroups(pairs, eol)) });

  // Layers (in the LAYER table, or a new TABLES section if the drawing has none).
  const layerTable = tables.get('LAYER');
  const newLayers = notes.layers.filter((l) => !layerTable?.names.has(l.name.toUpperCase()));
  const layerExtra = layerTable ? plotStyleOf(layerTable) : [];
  const layerPairs = newLayers.flatMap((l) => rec.layerRecord(ctx, l.name, l.color, layerTable?.handle ?? null, layerExtra));
  if (layerTable) {
    insertAt(layerTable.endTab, layerPairs);
    bumpCount(layerTable, newLayers.length, splices, encode);
  } else {
    const before = sections.get('BLOCKS')?.begin ?? sections.get('ENTITIES')?.begin;
    if (before !== undefined)
      insertAt(before, [0, 'SECTION', 2, 'TABLES', 0, 'TABLE', 2, 'LAYER', 70, newLayers.length, ...layerPairs, 0, 'ENDTAB', 0, 'ENDSEC']);
  }

  // The legend block and its block record.
  const recordTable = tables.get('BLOCK_RECORD');
  const legendBlock = uniqueName(notes.legend.block, new Set([...(recordTable?.names ?? []), ...blockNames]));
  const def = rec.blockDefinition(ctx, legendBlock, { x: 0, y: 0 }, recordTable?.handle ?? null, (inner) =>
    notes.legend.primitives.flatMap((p) => primitive(inner, p, put)),
  );
  if (def.record && recordTable) {
    insertAt(recordTable.endTab, def.record);
    bumpCount(recordTable, 1, splices, encode);
  }
  const blocks = sections.get('BLOCKS');
  const entities = sections.get('ENTITIES');
  if (!entities) throw new Error('the drawing has no ENTITIES section');
  if (blocks) insertAt(blocks.endsec, def.block);
  else insertAt(entities.begin, [0, 'SECTION', 2, 'BLOCKS', ...def.block, 0, 'ENDSEC']);

  // Annotation entities and the legend's reference.
  insertAt(entities.endsec, [
    ...notes.primitives.flatMap((p) => primitive(ctx, p, put)),
    ...rec.insert(ctx, notes.legend.layer, legendBlock, put(notes.legend.at)),
  ]);

  if (handles && handseed) splices.push({ at: handseed.valueStart, end: handseed.valueEnd, bytes: encode(handles.seed) });
  return applySplices(bytes, splices);
}

function primitive(ctx: rec.RecordContext, p: Primitive, put: (p: Point) => Point): rec.Pairs {
  const color = p.color === 256 ? undefined : p.color;
  switch (p.kind) {
    case 'circle':
      return rec.circle(ctx, p.layer, put(p.center), put({ x: p.radius, y: 0 }).x, color);
    case 'text':
      return rec.text(ctx, p.layer, put(p.at), put({ x: p.height, y: 0 }).x, sanitize(p.text), color);
    case 'polyline':
      return rec.polyline(ctx, p.layer, p.points.map(put), p.closed, color);
  }
}

/** DXF text values are one line; control characters and the ^ escape are not wanted in labels. */
const sanitize = (s: string) => s.replace(/[\r\n\t]+/g, ' ').replace(/\^/g, ' ');

/** R2007 and later are UTF-8; older drawings take non-ASCII characters as \U+XXXX escapes (then all ASCII). */
function encodeText(s: string, utf8: boolean): Uint8Array {
  if (utf8) return new TextEncoder().encode(s);
  // biome-ignore lint/suspicious/noControlCharactersInRegex: the range is every ASCII byte, NUL included
  const ascii = s.replace(/[^\x00-\x7f]/g, (ch) => `\\U+${ch.charCodeAt(0).toString(16).toUpperCase().padStart(4, '0')}`);
  const out = new Uint8Array(ascii.length);
  for (let i = 0; i < ascii.length; i++) out[i] = ascii.charCodeAt(i);
  return out;
}

const nameOf = (entry: TableEntry) => entry.find((g) => g.code === 2)?.value;

function modelSpaceRecord(table: TableInfo | undefined): string | null {
  const entry = table?.entries.find((e) => nameOf(e)?.toUpperCase() === '*MODEL_SPACE');
  return entry?.find((g) => g.code === 5)?.value ?? null;
}

/** Plot-style and material handles of layer 0, which modern readers expect on every layer. */
function plotStyleOf(table: TableInfo): rec.Pairs {
  const zero = table.entries.find((e) => nameOf(e) === '0');
  return (zero ?? []).filter((g) => g.code === 390 || g.code === 347).flatMap((g) => [g.code, g.value]);
}

function bumpCount(table: TableInfo, by: number, splices: Splice[], encode: (s: string) => Uint8Array): void {
  const g = table.count;
  if (!g || by === 0) return;
  const n = Number.parseInt(g.value, 10);
  if (Number.isFinite(n)) splices.push({ at: g.valueStart, end: g.valueEnd, bytes: encode(String(n + by)) });
}

/** `base`, or `base-2`, `base-3`... when a block of that name (any case) exists. */
function uniqueName(base: string, taken: Set<string>): string {
  let name = base;
  for (let k = 2; taken.has(name.toUpperCase()); k++) name = `${base}-${k}`;
  return name;
}

function applySplices(bytes: Uint8Array, splices: Splice[]): Uint8Array[] {
  const sorted = [...splices].sort((a, b) => a.at - b.at);
  const parts: Uint8Array[] = [];
  let pos = 0;
  for (const s of sorted) {
    parts.push(bytes.subarray(pos, s.at), s.bytes);
    pos = s.end;
  }
  parts.push(bytes.subarray(pos));
  return parts;
}
