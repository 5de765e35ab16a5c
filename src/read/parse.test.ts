// Damaged files that once hung the reader (found by the fuzz test, kept as regression cases): a POLYLINE
// whose vertex run is not closed by SEQEND, an unknown code among LWPOLYLINE vertices, a LAYER table not
// closed by ENDTAB, group codes that are not integers, and a section not closed by ENDSEC.

import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { DEFAULT_INPUT_LIMITS } from '../config/settings.js';
import { InputError } from '../input-error.js';
import { textDecoder } from './dxf/decode.js';
import { dxfSource } from './dxf/dxf-source.js';
import { scanDxf } from './dxf/scan.js';
import { readDrawing } from './read-drawing.js';
import { decodeSelected } from './select.js';

const dxf = (...pairs: (string | number)[]) => {
  let s = '';
  for (let i = 0; i < pairs.length; i += 2) s += `${pairs[i]}\n${pairs[i + 1]}\n`;
  return s;
};
/** A drawing's groups written as "code value code value ..." (values without spaces). */
const groups = (text: string) => dxf(...text.trim().split(/\s+/));

/** The reader's decoding, every layer wanted. */
const utf8 = textDecoder('utf-8');
const scan = (text: string) => scanDxf(new TextEncoder().encode(text), utf8);
const parseAll = (text: string) =>
  decodeSelected(dxfSource(new TextEncoder().encode(text), DEFAULT_INPUT_LIMITS), { layer: () => true, label: () => true });

describe('damaged structure', () => {
  it('a POLYLINE followed by a LINE without SEQEND is read, not spun on', () => {
    const text = groups(
      '0 SECTION 2 ENTITIES 0 POLYLINE 8 P 66 1 70 0 0 VERTEX 8 P 10 0 20 0 0 VERTEX 8 P 10 5 20 0 0 LINE 8 P 10 0 20 1 11 5 21 1 0 ENDSEC 0 EOF',
    );
    const parsed = parseAll(text);
    expect(parsed.entities.map((e) => e.type)).toEqual(['POLYLINE', 'LINE']);
    expect((parsed.entities[0] as unknown as { vertices: unknown[] }).vertices).toHaveLength(2);
  });

  it('an unknown code among LWPOLYLINE vertices is passed over, not read again forever', () => {
    const text = groups(
      '0 SECTION 2 ENTITIES 0 LWPOLYLINE 5 4A 8 A-WALL 90 3 70 1 10 0 20 0 10 5 -5 0.0 20 0 10 5 20 4 0 LINE 8 P 10 0 20 1 11 5 21 1 0 ENDSEC 0 EOF',
    );
    const parsed = parseAll(text);
    expect(parsed.entities.map((e) => e.type)).toEqual(['LWPOLYLINE', 'LINE']);
    const poly = parsed.entities[0] as unknown as { vertices: { x: number; y: number }[]; closed: boolean; layer: string };
    expect(poly.vertices.map(({ x, y }) => ({ x, y }))).toEqual([
      { x: 0, y: 0 },
      { x: 5, y: 0 },
      { x: 5, y: 4 },
    ]);
    expect(poly.closed).toBe(true);
    expect(poly.layer).toBe('A-WALL');
  });

  it('fixtures/fuzz/lwpolyline-stray-code.dxf: read whole, the damaged vertex with the value its code 10 gives', () => {
    const read = (file: string) => readDrawing(new Uint8Array(readFileSync(file)), { units: 'in' });
    const damaged = read('fixtures/fuzz/lwpolyline-stray-code.dxf');
    const original = read('fixtures/bay2-r2000.dxf');
    // The file's wall outline 4A reads "10 / -5 / -5 / 0.0 / 20 / 360.0" for its last vertex: x = -5 in.
    const [wall, ...rest] = damaged.outlines;
    expect(wall!.points.slice(0, 3)).toEqual(original.outlines[0]!.points.slice(0, 3));
    expect(wall!.points[3]!.x).toBeCloseTo(-5 / 12, 12);
    expect(wall!.points[3]!.y).toBe(30);
    expect(rest).toEqual(original.outlines.slice(1));
    expect(damaged.refs).toEqual(original.refs);
    expect(damaged.strokes.length).toBe(original.strokes.length);
  });

  it('types no stage reads are not decoded but keep their layer for the layer counts', () => {
    const text = groups('0 SECTION 2 ENTITIES 0 SPLINE 8 A-DETAIL 10 0 20 0 10 1 -7 x 0 DIMENSION 8 A-DIMS 0 ENDSEC 0 EOF');
    expect(parseAll(text).entities).toEqual([]);
    const drawing = readDrawing(new TextEncoder().encode(text), { units: 'ft' });
    expect(drawing.layers.map((l) => [l.name, l.counts])).toEqual([
      ['A-DETAIL', { SPLINE: 1 }],
      ['A-DIMS', { DIMENSION: 1 }],
    ]);
  });

  it('a LAYER table without ENDTAB still gives its layer names and the entities', () => {
    const text = groups(
      '0 SECTION 2 TABLES 0 TABLE 2 LAYER 70 2 0 LAYER 2 FP-PIPE 70 0 0 TABLE 2 LTYPE 0 ENDTAB 0 ENDSEC 0 SECTION 2 ENTITIES 0 LINE 8 FP-PIPE 10 0 20 0 11 1 21 0 0 ENDSEC 0 EOF',
    );
    expect(scan(text).layerNames).toEqual(['FP-PIPE']);
    expect(parseAll(text).entities).toHaveLength(1);
  });

  it('layer names whose bytes hash alike stay distinct, beyond what one hash keeps', () => {
    // "Aa" and "BB" hash alike under h·31 + byte (65·31 + 97 = 66·31 + 66), so any mix of 6 such pairs gives
    // 64 names of one hash: a file could be built to make every name collide.
    const layers = Array.from({ length: 64 }, (_, k) => Array.from({ length: 6 }, (_, bit) => ((k >> bit) & 1 ? 'Aa' : 'BB')).join(''));
    const text = dxf(
      0,
      'SECTION',
      2,
      'ENTITIES',
      ...layers.flatMap((l) => [0, 'LINE', 8, l, 10, 0, 20, 0, 11, 1, 21, 0]),
      ...layers.slice(0, 10).flatMap((l) => [0, 'POINT', 8, l]),
      0,
      'ENDSEC',
      0,
      'EOF',
    );
    const scanned = scan(text);
    const rowLayer = (row: number) => scanned.names[scanned.table.layer[row]!];
    expect(Array.from({ length: 64 }, (_, row) => rowLayer(row))).toEqual(layers);
    expect(Array.from({ length: 10 }, (_, k) => rowLayer(64 + k))).toEqual(layers.slice(0, 10));
    expect(new Set(scanned.names).size).toBe(scanned.names.length); // each name numbered once
  });

  it("a layer name in a double-byte code page is read whole (ANSI_932: 配管 is 94 7A 8A C7 in Shift_JIS, by Python's codec)", () => {
    const head = new TextEncoder().encode(
      groups(
        '0 SECTION 2 HEADER 9 $ACADVER 1 AC1015 9 $DWGCODEPAGE 3 ANSI_932 9 $INSUNITS 70 2 0 ENDSEC 0 SECTION 2 ENTITIES 0 LINE 8 FP-',
      ),
    );
    const tail = new TextEncoder().encode(`\n 10\n0\n 20\n0\n 11\n10\n 21\n0\n  0\nENDSEC\n  0\nEOF\n`);
    const bytes = new Uint8Array([...head.slice(0, head.length - 1), 0x94, 0x7a, 0x8a, 0xc7, ...tail]);
    const drawing = readDrawing(bytes, { layers: { pipes: ['FP-\u914d\u7ba1'] } });
    expect(drawing.encoding).toBe('shift_jis');
    expect(drawing.layers.map((l) => l.name)).toEqual(['FP-\u914d\u7ba1']);
    expect(drawing.strokes).toHaveLength(1);
    expect(drawing.strokes[0]!.layer).toBe('FP-\u914d\u7ba1');
  });

  it('a drawing of more entities than the scan first makes room for keeps every one, blocks included', () => {
    // 3000 lines (the scan's table starts with room for 1024 and grows) and a block defined after them.
    const lines = Array.from({ length: 3000 }, (_, i) => [0, 'LINE', 8, i % 2 ? 'FP-PIPE' : 'A-GRID', 10, i, 20, 0, 11, i, 21, 5]).flat();
    const text = dxf(
      0,
      'SECTION',
      2,
      'BLOCKS',
      0,
      'BLOCK',
      2,
      'HEAD',
      70,
      0,
      10,
      0,
      20,
      0,
      0,
      'CIRCLE',
      8,
      '0',
      10,
      0,
      20,
      0,
      40,
      0.25,
      0,
      'ENDBLK',
      0,
      'ENDSEC',
      0,
      'SECTION',
      2,
      'ENTITIES',
      ...lines,
      0,
      'INSERT',
      8,
      'FP-HEAD',
      2,
      'HEAD',
      10,
      1,
      20,
      1,
      0,
      'ENDSEC',
      0,
      'EOF',
    );
    const scanned = scan(text);
    expect(scanned.table.count).toBe(3002);
    expect(scanned.modelSpace).toEqual([{ first: 1, end: 3002 }]);
    expect(scanned.blocks.map((b) => [b.name, b.rows])).toEqual([['HEAD', { first: 0, end: 1 }]]);
    const drawing = readDrawing(new TextEncoder().encode(text), { units: 'ft', layers: { pipes: ['FP-PIPE'], heads: ['FP-HEAD'] } });
    expect(drawing.layers.find((l) => l.name === 'FP-PIPE')!.counts).toEqual({ LINE: 1500 });
    expect(drawing.layers.find((l) => l.name === 'A-GRID')!.counts).toEqual({ LINE: 1500 });
    expect(drawing.strokes.filter((x) => x.layer === 'FP-PIPE')).toHaveLength(1500);
    expect(drawing.refs.map((r) => r.block)).toEqual(['HEAD']);
  });

  it('a section not closed by ENDSEC is a one-line error naming it', () => {
    const text = groups('0 SECTION 2 BLOCKS 0 BLOCK 2 B 0 ENDBLK 0 SECTION 2 ENTITIES 0 LINE 8 P 0 ENDSEC 0 EOF');
    expect(() => scan(text)).toThrow(/the BLOCKS section is not closed by ENDSEC/);
  });

  it.each([
    ['fixtures/fuzz/nan-group-code.dxf', /line 2279: "NaN" is not a group code/],
    ['fixtures/fuzz/truncated-tables.dxf', /line 1461: "0.0" is not a group code/],
    ['fixtures/fuzz/float-group-code.dxf', /line 2979: "-1e308" is not a group code/],
  ])('%s: a one-line error naming the line', (file, message) => {
    const read = () => readDrawing(new Uint8Array(readFileSync(file)), { units: 'in' });
    expect(read).toThrow(InputError);
    expect(read).toThrow(message);
  });
});
