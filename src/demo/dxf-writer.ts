// A small writer of ASCII DXF R12 drawings (HEADER, LAYER table, BLOCKS, ENTITIES, handles on), for the demo
// and generated test drawings, built on the same records the annotator writes.

import type { Point } from '../geometry/point.js';
import { formatGroups } from '../outputs/dxf-format.js';
import * as rec from '../outputs/dxf-records.js';

export class DxfWriter {
  private readonly ctx: rec.RecordContext = { modern: false, handles: new rec.HandleSource(0x100n), owner: null };
  private readonly layers = new Map<string, number>();
  private readonly blocks: string[] = [];
  private readonly entities: string[] = [];

  constructor(private readonly insunits: number) {}

  layer(name: string, color = 7): this {
    this.layers.set(name, color);
    return this;
  }

  private put(layer: string, pairs: rec.Pairs, into: string[]): this {
    if (!this.layers.has(layer)) this.layers.set(layer, 7);
    into.push(formatGroups(pairs));
    return this;
  }

  line(layer: string, a: Point, b: Point, into = this.entities): this {
    return this.put(layer, rec.line(this.ctx, layer, a, b), into);
  }

  polyline(layer: string, pts: Point[], closed = false, into = this.entities): this {
    return this.put(layer, rec.polyline(this.ctx, layer, pts, closed), into);
  }

  circle(layer: string, c: Point, r: number, into = this.entities): this {
    return this.put(layer, rec.circle(this.ctx, layer, c, r), into);
  }

  text(layer: string, at: Point, height: number, value: string, into = this.entities): this {
    return this.put(layer, rec.text(this.ctx, layer, at, height, value), into);
  }

  /** Defines a block; `draw` adds its content with the writer's methods and the given target list. */
  block(name: string, base: Point, draw: (into: string[]) => void): this {
    const body: string[] = [];
    draw(body);
    const { block } = rec.blockDefinition(this.ctx, name, base, null, () => []);
    // The block's own groups with the drawn body spliced in before ENDBLK.
    const text = formatGroups(block);
    const end = text.lastIndexOf('  0\nENDBLK\n');
    this.blocks.push(text.slice(0, end) + body.join('') + text.slice(end));
    return this;
  }

  insert(layer: string, block: string, at: Point, opts: rec.InsertOptions & { into?: string[] } = {}): this {
    return this.put(layer, rec.insert(this.ctx, layer, block, at, opts), opts.into ?? this.entities);
  }

  toString(): string {
    const header = formatGroups([
      0,
      'SECTION',
      2,
      'HEADER',
      9,
      '$ACADVER',
      1,
      'AC1009',
      9,
      '$INSUNITS',
      70,
      this.insunits,
      9,
      '$HANDLING',
      70,
      1,
      9,
      '$HANDSEED',
      5,
      this.ctx.handles!.seed,
      0,
      'ENDSEC',
    ]);
    const layerRows = [...this.layers]
      .map(([name, color]) => formatGroups(rec.layerRecord({ ...this.ctx, handles: null }, name, color, null)))
      .join('');
    const tables =
      formatGroups([0, 'SECTION', 2, 'TABLES', 0, 'TABLE', 2, 'LAYER', 70, this.layers.size]) +
      layerRows +
      formatGroups([0, 'ENDTAB', 0, 'ENDSEC']);
    const blocks = formatGroups([0, 'SECTION', 2, 'BLOCKS']) + this.blocks.join('') + formatGroups([0, 'ENDSEC']);
    const entities = formatGroups([0, 'SECTION', 2, 'ENTITIES']) + this.entities.join('') + formatGroups([0, 'ENDSEC']);
    return header + tables + blocks + entities + formatGroups([0, 'EOF']);
  }
}
