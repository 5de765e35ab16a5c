// Group lists of the DXF records headcheck writes, for R12 and for R2000 and later (subclass markers,
// owner handles, LWPOLYLINE): lines, circles, text, polylines, block references, layers and blocks.

import type { Point } from '../geometry/point.js';

export type Pairs = (string | number)[];

/** Hands out fresh handles (hex) from the drawing's seed upward. */
export class HandleSource {
  private nextValue: bigint;
  constructor(seed: bigint) {
    this.nextValue = seed;
  }
  next(): string {
    const h = this.nextValue.toString(16).toUpperCase();
    this.nextValue += 1n;
    return h;
  }
  /** The new `$HANDSEED`: the next free handle. */
  get seed(): string {
    return this.nextValue.toString(16).toUpperCase();
  }
}

export interface RecordContext {
  /** R12 writes no subclass markers and old-style polylines. */
  modern: boolean;
  /** Null where the drawing carries no handles (R12 with $HANDLING 0). */
  handles: HandleSource | null;
  /** Owner of new entities: the model-space block record (modern drawings). */
  owner: string | null;
}

function head(ctx: RecordContext, type: string, layer: string, subclass: string, color?: number): Pairs {
  const out: Pairs = [0, type];
  if (ctx.handles) out.push(5, ctx.handles.next());
  if (ctx.modern && ctx.owner) out.push(330, ctx.owner);
  if (ctx.modern) out.push(100, 'AcDbEntity');
  out.push(8, layer);
  if (color !== undefined) out.push(62, color);
  if (ctx.modern) out.push(100, subclass);
  return out;
}

export const line = (ctx: RecordContext, layer: string, a: Point, b: Point, color?: number): Pairs => [
  ...head(ctx, 'LINE', layer, 'AcDbLine', color),
  10,
  a.x,
  20,
  a.y,
  30,
  0,
  11,
  b.x,
  21,
  b.y,
  31,
  0,
];

export const circle = (ctx: RecordContext, layer: string, c: Point, r: number, color?: number): Pairs => [
  ...head(ctx, 'CIRCLE', layer, 'AcDbCircle', color),
  10,
  c.x,
  20,
  c.y,
  30,
  0,
  40,
  r,
];

export function text(ctx: RecordContext, layer: string, at: Point, height: number, value: string, color?: number): Pairs {
  const out = [...head(ctx, 'TEXT', layer, 'AcDbText', color), 10, at.x, 20, at.y, 30, 0, 40, height, 1, value];
  if (ctx.modern) out.push(100, 'AcDbText');
  return out;
}

export function polyline(ctx: RecordContext, layer: string, pts: Point[], closed: boolean, color?: number): Pairs {
  if (ctx.modern) {
    const out = [...head(ctx, 'LWPOLYLINE', layer, 'AcDbPolyline', color), 90, pts.length, 70, closed ? 1 : 0];
    for (const p of pts) out.push(10, p.x, 20, p.y);
    return out;
  }
  const out = [...head(ctx, 'POLYLINE', layer, 'AcDb2dPolyline', color), 66, 1, 10, 0, 20, 0, 30, 0, 70, closed ? 1 : 0];
  for (const p of pts) out.push(...head(ctx, 'VERTEX', layer, 'AcDbVertex'), 10, p.x, 20, p.y, 30, 0);
  out.push(...head(ctx, 'SEQEND', layer, 'AcDbEntity').slice(0, ctx.modern ? -2 : undefined));
  return out;
}

export interface InsertOptions {
  rotation?: number;
  sx?: number;
  sy?: number;
  attribs?: { tag: string; value: string }[];
  /** A MINSERT array: columns and rows, and their spacing. */
  grid?: { columns: number; rows: number; columnSpacing: number; rowSpacing: number };
}

export function insert(ctx: RecordContext, layer: string, block: string, at: Point, o: InsertOptions = {}): Pairs {
  const attribs = o.attribs ?? [];
  const out = [...head(ctx, 'INSERT', layer, 'AcDbBlockReference')];
  if (attribs.length) out.push(66, 1);
  out.push(2, block, 10, at.x, 20, at.y, 30, 0, 41, o.sx ?? 1, 42, o.sy ?? 1, 50, o.rotation ?? 0);
  if (o.grid) out.push(70, o.grid.columns, 71, o.grid.rows, 44, o.grid.columnSpacing, 45, o.grid.rowSpacing);
  for (const a of attribs) {
    out.push(...head(ctx, 'ATTRIB', layer, 'AcDbText'), 10, at.x, 20, at.y, 30, 0, 40, 1, 1, a.value);
    if (ctx.modern) out.push(100, 'AcDbAttribute');
    out.push(2, a.tag, 70, 1);
  }
  if (attribs.length) out.push(...head(ctx, 'SEQEND', layer, 'AcDbEntity').slice(0, ctx.modern ? -2 : undefined));
  return out;
}

/** A LAYER table entry; `extra` carries the plot-style and material handles modern readers expect. */
export function layerRecord(ctx: RecordContext, name: string, color: number, tableHandle: string | null, extra: Pairs = []): Pairs {
  const out: Pairs = [0, 'LAYER'];
  if (ctx.handles) out.push(5, ctx.handles.next());
  if (ctx.modern) {
    if (tableHandle) out.push(330, tableHandle);
    out.push(100, 'AcDbSymbolTableRecord', 100, 'AcDbLayerTableRecord');
  }
  out.push(2, name, 70, 0, 62, color, 6, 'CONTINUOUS');
  if (ctx.modern) out.push(370, -3, ...extra);
  return out;
}

/** A block definition: its BLOCK_RECORD entry (modern drawings) and its BLOCK … ENDBLK groups. */
export function blockDefinition(
  ctx: RecordContext,
  name: string,
  base: Point,
  recordTable: string | null,
  body: (inner: RecordContext) => Pairs,
): { record: Pairs | null; block: Pairs } {
  let record: Pairs | null = null;
  let recordHandle: string | null = null;
  if (ctx.modern) {
    recordHandle = ctx.handles ? ctx.handles.next() : null;
    record = [
      0,
      'BLOCK_RECORD',
      ...(recordHandle ? [5, recordHandle] : []),
      ...(recordTable ? [330, recordTable] : []),
      100,
      'AcDbSymbolTableRecord',
      100,
      'AcDbBlockTableRecord',
      2,
      name,
    ];
  }
  const inner: RecordContext = { ...ctx, owner: recordHandle };
  const begin: Pairs = [0, 'BLOCK'];
  if (ctx.handles) begin.push(5, ctx.handles.next());
  if (ctx.modern) begin.push(...(recordHandle ? [330, recordHandle] : []), 100, 'AcDbEntity');
  begin.push(8, '0');
  if (ctx.modern) begin.push(100, 'AcDbBlockBegin');
  begin.push(2, name, 70, 0, 10, base.x, 20, base.y, 30, 0, 3, name, 1, '');
  const content = body(inner);
  const end: Pairs = [0, 'ENDBLK'];
  if (ctx.handles) end.push(5, ctx.handles.next());
  if (ctx.modern) end.push(...(recordHandle ? [330, recordHandle] : []), 100, 'AcDbEntity');
  end.push(8, '0');
  if (ctx.modern) end.push(100, 'AcDbBlockEnd');
  return { record, block: [...begin, ...content, ...end] };
}
