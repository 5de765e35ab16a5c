// A small writer of ASCII DXF R12 drawings (HEADER, LAYER table, BLOCKS, ENTITIES, handles on), enough
// for the demo and generated test drawings: lines, polylines, circles, text, block references with attributes.

import type { Point } from '../geometry/point.js';

export interface AttribValue { tag: string; value: string }

export class DxfWriter {
  private handle = 0x100;
  private readonly layers = new Map<string, number>();
  private readonly blocks: string[] = [];
  private readonly entities: string[] = [];

  constructor(private readonly insunits: number) {}

  private next(): string {
    return (this.handle++).toString(16).toUpperCase();
  }

  layer(name: string, color = 7): this {
    this.layers.set(name, color);
    return this;
  }

  private use(layer: string) {
    if (!this.layers.has(layer)) this.layers.set(layer, 7);
  }

  line(layer: string, a: Point, b: Point, into = this.entities): this {
    this.use(layer);
    into.push(g(0, 'LINE', 5, this.next(), 8, layer, 10, a.x, 20, a.y, 30, 0, 11, b.x, 21, b.y, 31, 0));
    return this;
  }

  polyline(layer: string, pts: Point[], closed = false, into = this.entities): this {
    this.use(layer);
    const parts = [g(0, 'POLYLINE', 5, this.next(), 8, layer, 66, 1, 10, 0, 20, 0, 30, 0, 70, closed ? 1 : 0)];
    for (const p of pts) parts.push(g(0, 'VERTEX', 5, this.next(), 8, layer, 10, p.x, 20, p.y, 30, 0));
    parts.push(g(0, 'SEQEND', 5, this.next(), 8, layer));
    into.push(parts.join(''));
    return this;
  }

  circle(layer: string, c: Point, r: number, into = this.entities): this {
    this.use(layer);
    into.push(g(0, 'CIRCLE', 5, this.next(), 8, layer, 10, c.x, 20, c.y, 30, 0, 40, r));
    return this;
  }

  text(layer: string, at: Point, height: number, value: string, into = this.entities): this {
    this.use(layer);
    into.push(g(0, 'TEXT', 5, this.next(), 8, layer, 10, at.x, 20, at.y, 30, 0, 40, height, 1, value));
    return this;
  }

  /** Defines a block; `draw` adds its content with the writer's methods and the given target list. */
  block(name: string, base: Point, draw: (into: string[]) => void): this {
    const body: string[] = [];
    draw(body);
    this.blocks.push(g(0, 'BLOCK', 5, this.next(), 8, '0', 2, name, 70, 0, 10, base.x, 20, base.y, 30, 0, 3, name) + body.join('') + g(0, 'ENDBLK', 5, this.next(), 8, '0'));
    return this;
  }

  insert(
    layer: string, block: string, at: Point,
    opts: { rotation?: number; sx?: number; sy?: number; attribs?: AttribValue[]; into?: string[] } = {},
  ): this {
    this.use(layer);
    const attribs = opts.attribs ?? [];
    const parts = [g(0, 'INSERT', 5, this.next(), 8, layer, ...(attribs.length ? [66, 1] : []), 2, block, 10, at.x, 20, at.y, 30, 0,
      41, opts.sx ?? 1, 42, opts.sy ?? 1, 50, opts.rotation ?? 0)];
    for (const a of attribs) parts.push(g(0, 'ATTRIB', 5, this.next(), 8, layer, 10, at.x, 20, at.y, 30, 0, 40, 1, 1, a.value, 2, a.tag, 70, 1));
    if (attribs.length) parts.push(g(0, 'SEQEND', 5, this.next(), 8, layer));
    (opts.into ?? this.entities).push(parts.join(''));
    return this;
  }

  toString(): string {
    const header = g(0, 'SECTION', 2, 'HEADER', 9, '$ACADVER', 1, 'AC1009', 9, '$INSUNITS', 70, this.insunits, 9, '$HANDLING', 70, 1,
      9, '$HANDSEED', 5, (this.handle + 0x1000).toString(16).toUpperCase(), 0, 'ENDSEC');
    const layerRows = [...this.layers].map(([name, color]) => g(0, 'LAYER', 2, name, 70, 0, 62, color, 6, 'CONTINUOUS')).join('');
    const tables = g(0, 'SECTION', 2, 'TABLES', 0, 'TABLE', 2, 'LAYER', 70, this.layers.size) + layerRows + g(0, 'ENDTAB', 0, 'ENDSEC');
    const blocks = g(0, 'SECTION', 2, 'BLOCKS') + this.blocks.join('') + g(0, 'ENDSEC');
    const entities = g(0, 'SECTION', 2, 'ENTITIES') + this.entities.join('') + g(0, 'ENDSEC');
    return header + tables + blocks + entities + g(0, 'EOF');
  }
}

/** Group code/value pairs as DXF lines. */
function g(...pairs: (string | number)[]): string {
  let s = '';
  for (let i = 0; i < pairs.length; i += 2) {
    const v = pairs[i + 1]!;
    s += `${String(pairs[i]).padStart(3)}\n${typeof v === 'number' ? fmt(v) : v}\n`;
  }
  return s;
}

/** Plain decimal notation with ten decimals at most (readers differ on exponents; ten keep 1e-10 units). */
const fmt = (v: number): string =>
  Number.isInteger(v) ? String(v) : Math.abs(v) < 1e-10 ? '0' : v.toFixed(10).replace(/0+$/, '').replace(/\.$/, '');
