// A drawing as the reader sees it before any geometry: an entity table (type, layer, block, copies, flags per row),
// its blocks and model space, and a way to decode one row. A byte scan of the DXF builds it (a DWG converted first).

import type { Point } from '../geometry/point.js';
import type { EntityBase } from './entities/types.js';
import { decodeUnicodeEscapes } from './dxf/text-codes.js';

/**
 * The entities, one row each (with the records that belong to it), in columns of typed arrays: a drawing's
 * background of hundreds of thousands of entities puts no object on the JS heap.
 */
export interface EntityTable {
  count: number;
  /** Index into `names` of its type, and of its layer as written (\U+ escapes not yet decoded; -1: none given, layer "0"). */
  type: Int32Array;
  layer: Int32Array;
  /** INSERT: index into `names` of the block name (-1: none), and how many copies a MINSERT array places. */
  block: Int32Array;
  copies: Float64Array;
  /** CLOSED and PAPER_SPACE bits. */
  flags: Uint8Array;
  /** DXF: byte range of the entity and its trailing records. */
  start: Float64Array;
  end: Float64Array;
  /** TEXT and MTEXT: byte range of the value as written (MTEXT: its last chunk, group 1); -1 for other entities. */
  textStart: Float64Array;
  textEnd: Float64Array;
}

/** Closed LWPOLYLINE or POLYLINE. */
export const CLOSED = 1;
export const PAPER_SPACE = 2;

/** Rows [first, end) of the entity table. */
export interface Rows {
  first: number;
  end: number;
}

export interface BlockEntry {
  name: string;
  /** DXF: byte range from its BLOCK record to the end of its ENDBLK record. */
  start: number;
  end: number;
  /** Its entities' rows. */
  rows: Rows;
}

/**
 * The entity sections' places and the highest handle written in them (groups 5 and 105; the blocks' entities are
 * among those counted): the annotated drawing's fresh handles go above it, and its walk of the file need not pass
 * those sections again.
 */
export interface EntityHandles {
  /** Each ENTITIES section: where its "0 SECTION" group starts, and its "0 ENDSEC" group. */
  sections: { begin: number; endsec: number }[];
  /** The highest handle there in upper-case hex without leading zeros ("0" where only zero or non-hex ones were); null: none. */
  top: string | null;
}

/** What the header says that the reader uses. */
export interface HeaderFacts {
  /** $ACADVER, AC1009 (R12) when not stated. */
  version: string;
  /** $INSUNITS as written, or null. */
  insunits: number | null;
  handseed: string | null;
}

export interface DrawingSource {
  format: 'dxf' | 'dwg';
  /** WHATWG label of the text encoding the drawing was read with. */
  encoding: string;
  header: HeaderFacts;
  entityHandles: EntityHandles;
  /** Layer names of the LAYER table. */
  layerNames: string[];
  /** Each distinct type, layer and block name, as the entity table refers to them. */
  names: string[];
  table: EntityTable;
  blocks: BlockEntry[];
  /** Model-space rows. */
  modelSpace: Rows[];
  /** The entity of a row as plain data, or null for a type the reader does not decode. */
  entity(row: number): EntityBase | null;
  /** A label's text as written (TEXT and MTEXT), for deciding whether it is worth decoding. */
  labelText(row: number): string;
  /** A block's base point (block units). */
  blockBase(block: BlockEntry): Point;
}

export interface BlockLookup {
  /** The block a reference names (exact name first, then case-insensitively), or null. */
  find(name: string): BlockEntry | null;
  /** Whether the block holds further block references. */
  hasNestedRefs(block: BlockEntry): boolean;
  /** The block a row references, or null. */
  of(row: number): BlockEntry | null;
}

export function blockLookup(source: Pick<DrawingSource, 'blocks' | 'names' | 'table'>): BlockLookup {
  const exact = new Map<string, BlockEntry>();
  const upper = new Map<string, BlockEntry>();
  for (const b of source.blocks) {
    const name = decodeUnicodeEscapes(b.name);
    exact.set(name, b);
    if (!upper.has(name.toUpperCase())) upper.set(name.toUpperCase(), b);
  }
  const { names, table } = source;
  const isInsert = (row: number) => names[table.type[row]!] === 'INSERT';
  const nesting = new Set(
    source.blocks.filter((b) => {
      for (let i = b.rows.first; i < b.rows.end; i++) if (isInsert(i)) return true;
      return false;
    }),
  );
  const named = nameDecoder();
  const find = (name: string) => exact.get(name) ?? upper.get(name.toUpperCase()) ?? null;
  // The block of each name a reference gives (an index into `names`), found once: a drawing places few blocks many times.
  const byName = new Map<number, BlockEntry | null>();
  const ofName = (index: number): BlockEntry | null => {
    let block = byName.get(index);
    if (block === undefined) byName.set(index, (block = find(named(names[index]!))));
    return block;
  };
  return {
    find,
    hasNestedRefs: (block) => nesting.has(block),
    of: (row) => (isInsert(row) && table.block[row]! >= 0 ? ofName(table.block[row]!) : null),
  };
}

/** Decodes layer and block names' \U+ escapes, each distinct name once (a drawing repeats a few names). */
export function nameDecoder(): (raw: string) => string {
  const known = new Map<string, string>();
  return (raw) => {
    let name = known.get(raw);
    if (name === undefined) known.set(raw, (name = decodeUnicodeEscapes(raw)));
    return name;
  };
}

/** Each row's layer name, \U+ escapes decoded (each distinct name once). */
export function rowLayers(source: Pick<DrawingSource, 'names' | 'table'>): (row: number) => string {
  const decoded = source.names.map(decodeUnicodeEscapes);
  return (row) => {
    const k = source.table.layer[row]!;
    return k < 0 ? '0' : decoded[k]!;
  };
}

/** The layer an entity counts on: its own, or the reference's for an entity on layer 0 inside a block. */
export const effectiveLayer = (own: string, inherited: string | null): string => (own === '0' && inherited !== null ? inherited : own);
