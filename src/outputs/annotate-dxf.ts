// The annotated drawing: the original file's bytes kept as they are, with new HC- layers, a legend block and
// annotation entities spliced in, fresh handles above $HANDSEED, and the seed and table counts updated.

import type { Point } from '../geometry/point.js';
import type { LengthUnit } from '../read/types.js';
import { FEET_PER_UNIT } from '../read/units.js';
import type { Annotations, Primitive } from './annotations.js';
import { byteView, lineBreakOf, readGroups, type Group } from '../read/groups.js';
import { formatGroups } from './dxf-format.js';
import * as rec from './dxf-records.js';

interface Splice { at: number; end: number; text: string }

interface TableInfo { handle: string | null; countGroup: Group | null; endTab: Group; names: Set<string>; entries: Group[][] }

export function annotateDxf(bytes: Uint8Array, version: string, units: LengthUnit, notes: Annotations): Uint8Array {
  const view = byteView(bytes);
  const groups = readGroups(view);
  const eol = lineBreakOf(view);
  const modern = version >= 'AC1015';
  const utf8 = version >= 'AC1021';
  const perFoot = 1 / FEET_PER_UNIT[units];
  const sections = findSections(groups);
  const tables = sections.get('TABLES') ? findTables(groups, sections.get('TABLES')!) : new Map<string, TableInfo>();
  // Fresh handles start above both $HANDSEED and every handle in use (a stale seed is not trusted).
  const header = sections.get('HEADER');
  const outsideHeader = (i: number) => !header || i < header.from || i > header.to;
  const hasHandles = groups.some((g, i) => (g.code === 5 || g.code === 105) && outsideHeader(i));
  const seedAt = groups.findIndex((g, i) => g.code === 9 && g.value.toUpperCase() === '$HANDSEED' && groups[i + 1]?.code === 5);
  let seed = seedAt >= 0 ? hexOrZero(groups[seedAt + 1]!.value) : 0n;
  groups.forEach((g, i) => {
    if ((g.code === 5 || g.code === 105) && outsideHeader(i)) {
      const next = hexOrZero(g.value) + 1n;
      if (next > seed) seed = next;
    }
  });
  const handles = hasHandles ? new rec.HandleSource(seed) : null;
  const modelSpace = modern ? modelSpaceRecord(tables.get('BLOCK_RECORD')) : null;
  const ctx: rec.RecordContext = { modern, handles, owner: modelSpace };
  const put = (p: Point): Point => ({ x: p.x * perFoot, y: p.y * perFoot });
  const splices: Splice[] = [];
  const encode = (s: string) => encodeText(s, utf8);
  const insertBefore = (g: Group, pairs: rec.Pairs) => splices.push({ at: g.start, end: g.start, text: encode(formatGroups(pairs, eol)) });

  // Layers (in the LAYER table, or a new TABLES section if the drawing has none).
  const layerTable = tables.get('LAYER');
  const newLayers = notes.layers.filter((l) => !layerTable?.names.has(l.name.toUpperCase()));
  const layerExtra = layerTable ? plotStyleOf(layerTable) : [];
  const layerPairs = newLayers.flatMap((l) => rec.layerRecord(ctx, l.name, l.color, layerTable?.handle ?? null, layerExtra));
  if (layerTable) {
    insertBefore(layerTable.endTab, layerPairs);
    bumpCount(layerTable, newLayers.length, splices, encode);
  } else {
    const before = sections.get('BLOCKS')?.begin ?? sections.get('ENTITIES')?.begin;
    if (before) splices.push({ at: before.start, end: before.start, text: encode(formatGroups([0, 'SECTION', 2, 'TABLES', 0, 'TABLE', 2, 'LAYER', 70, newLayers.length, ...layerPairs, 0, 'ENDTAB', 0, 'ENDSEC'], eol)) });
  }

  // The legend block and its block record.
  const legendBlock = uniqueName(notes.legend.block, tables.get('BLOCK_RECORD')?.names, groups);
  const recordTable = tables.get('BLOCK_RECORD');
  const def = rec.blockDefinition(ctx, legendBlock, { x: 0, y: 0 }, recordTable?.handle ?? null, (inner) =>
    notes.legend.primitives.flatMap((p) => primitive(inner, p, put)));
  if (def.record && recordTable) {
    insertBefore(recordTable.endTab, def.record);
    bumpCount(recordTable, 1, splices, encode);
  }
  const blocks = sections.get('BLOCKS');
  const entities = sections.get('ENTITIES');
  if (!entities) throw new Error('the drawing has no ENTITIES section');
  if (blocks) insertBefore(blocks.endsec, def.block);
  else splices.push({ at: entities.begin.start, end: entities.begin.start, text: encode(formatGroups([0, 'SECTION', 2, 'BLOCKS', ...def.block, 0, 'ENDSEC'], eol)) });

  // Annotation entities and the legend's reference.
  const body = [
    ...notes.primitives.flatMap((p) => primitive(ctx, p, put)),
    ...rec.insert(ctx, notes.legend.layer, legendBlock, put(notes.legend.at)),
  ];
  insertBefore(entities.endsec, body);

  if (handles && seedAt >= 0) {
    const g = groups[seedAt + 1]!;
    splices.push({ at: g.valueStart, end: g.valueEnd, text: handles.seed });
  }
  return applySplices(bytes, splices);
}

const hexOrZero = (v: string): bigint => (/^[0-9A-F]+$/i.test(v) ? BigInt(`0x${v}`) : 0n);

function primitive(ctx: rec.RecordContext, p: Primitive, put: (p: Point) => Point): rec.Pairs {
  const color = p.color === 256 ? undefined : p.color;
  switch (p.kind) {
    case 'circle': return rec.circle(ctx, p.layer, put(p.center), put({ x: p.radius, y: 0 }).x, color);
    case 'text': return rec.text(ctx, p.layer, put(p.at), put({ x: p.height, y: 0 }).x, sanitize(p.text), color);
    case 'polyline': return rec.polyline(ctx, p.layer, p.points.map(put), p.closed, color);
  }
}

/** DXF text values are one line; control characters and the ^ escape are not wanted in labels. */
const sanitize = (s: string) => s.replace(/[\r\n\t]+/g, ' ').replace(/\^/g, ' ');

/** R2007 and later are UTF-8; older drawings take non-ASCII characters as \U+XXXX escapes. */
function encodeText(s: string, utf8: boolean): string {
  if (utf8) {
    const b = new TextEncoder().encode(s);
    let out = '';
    for (const c of b) out += String.fromCharCode(c);
    return out;
  }
  return s.replace(/[^\x00-\x7f]/g, (ch) => `\\U+${ch.charCodeAt(0).toString(16).toUpperCase().padStart(4, '0')}`);
}

interface Section { begin: Group; endsec: Group; from: number; to: number }

function findSections(groups: Group[]): Map<string, Section> {
  const out = new Map<string, Section>();
  for (let i = 0; i < groups.length; i++) {
    if (groups[i]!.code === 0 && groups[i]!.value === 'SECTION' && groups[i + 1]?.code === 2) {
      const name = groups[i + 1]!.value.toUpperCase();
      let j = i + 2;
      while (j < groups.length && !(groups[j]!.code === 0 && groups[j]!.value === 'ENDSEC')) j++;
      if (j < groups.length) out.set(name, { begin: groups[i]!, endsec: groups[j]!, from: i, to: j });
      i = j;
    }
  }
  return out;
}

function findTables(groups: Group[], tables: Section): Map<string, TableInfo> {
  const out = new Map<string, TableInfo>();
  for (let i = tables.from; i < tables.to; i++) {
    if (!(groups[i]!.code === 0 && groups[i]!.value === 'TABLE' && groups[i + 1]?.code === 2)) continue;
    const name = groups[i + 1]!.value.toUpperCase();
    let j = i + 2;
    let handle: string | null = null;
    let countGroup: Group | null = null;
    for (; j < tables.to && groups[j]!.code !== 0; j++) {
      if (groups[j]!.code === 5) handle = groups[j]!.value;
      if (groups[j]!.code === 70) countGroup = groups[j]!;
    }
    const entries: Group[][] = [];
    while (j < tables.to && !(groups[j]!.code === 0 && groups[j]!.value === 'ENDTAB')) {
      const entry = [groups[j]!];
      for (j++; j < tables.to && groups[j]!.code !== 0; j++) entry.push(groups[j]!);
      entries.push(entry);
    }
    const names = new Set(entries.map((e) => e.find((g) => g.code === 2)?.value.toUpperCase() ?? ''));
    out.set(name, { handle, countGroup, endTab: groups[j]!, names, entries });
    i = j;
  }
  return out;
}

function modelSpaceRecord(table: TableInfo | undefined): string | null {
  const entry = table?.entries.find((e) => e.find((g) => g.code === 2)?.value.toUpperCase() === '*MODEL_SPACE');
  return entry?.find((g) => g.code === 5)?.value ?? null;
}

/** Plot-style and material handles of layer 0, which modern readers expect on every layer. */
function plotStyleOf(table: TableInfo): rec.Pairs {
  const zero = table.entries.find((e) => e.find((g) => g.code === 2)?.value === '0');
  return (zero ?? []).filter((g) => g.code === 390 || g.code === 347).flatMap((g) => [g.code, g.value]);
}

function bumpCount(table: TableInfo, by: number, splices: Splice[], encode: (s: string) => string): void {
  const g = table.countGroup;
  if (!g || by === 0) return;
  const n = Number.parseInt(g.value, 10);
  if (Number.isFinite(n)) splices.push({ at: g.valueStart, end: g.valueEnd, text: encode(String(n + by)) });
}

function uniqueName(base: string, taken: Set<string> | undefined, groups: Group[]): string {
  const used = new Set(taken ?? []);
  for (let i = 0; i < groups.length; i++) if (groups[i]!.code === 0 && groups[i]!.value === 'BLOCK') {
    for (let j = i + 1; j < groups.length && groups[j]!.code !== 0; j++) if (groups[j]!.code === 2) used.add(groups[j]!.value.toUpperCase());
  }
  let name = base;
  for (let k = 2; used.has(name.toUpperCase()); k++) name = `${base}-${k}`;
  return name;
}

function applySplices(bytes: Uint8Array, splices: Splice[]): Uint8Array {
  const sorted = [...splices].sort((a, b) => a.at - b.at);
  const parts: Uint8Array[] = [];
  let pos = 0;
  let size = 0;
  for (const s of sorted) {
    parts.push(bytes.subarray(pos, s.at));
    const inserted = Uint8Array.from(s.text, (c) => c.charCodeAt(0));
    parts.push(inserted);
    size += s.at - pos + inserted.length;
    pos = s.end;
  }
  parts.push(bytes.subarray(pos));
  size += bytes.length - pos;
  const out = new Uint8Array(size);
  let o = 0;
  for (const p of parts) { out.set(p, o); o += p.length; }
  return out;
}
