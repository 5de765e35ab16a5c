// Damaged files that once hung the reader (found by the fuzz test, kept as regression cases): a POLYLINE
// whose vertex run is not closed by SEQEND, a LAYER table not closed by ENDTAB, and a non-numeric group code.

import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { InputError } from './errors.js';
import { parseDxfText } from './parse.js';
import { readDrawing } from './read-drawing.js';

const dxf = (...pairs: (string | number)[]) => {
  let s = '';
  for (let i = 0; i < pairs.length; i += 2) s += `${pairs[i]}\n${pairs[i + 1]}\n`;
  return s;
};

describe('damaged structure', () => {
  it('a POLYLINE followed by a LINE without SEQEND is read, not spun on', () => {
    const text = dxf(0, 'SECTION', 2, 'ENTITIES', 0, 'POLYLINE', 8, 'P', 66, 1, 70, 0, 0, 'VERTEX', 8, 'P', 10, 0, 20, 0, 0, 'VERTEX', 8, 'P', 10, 5, 20, 0,
      0, 'LINE', 8, 'P', 10, 0, 20, 1, 11, 5, 21, 1, 0, 'ENDSEC', 0, 'EOF');
    const parsed = parseDxfText(text);
    expect(parsed.dxf.entities.map((e) => e.type)).toEqual(['POLYLINE', 'LINE']);
    expect((parsed.dxf.entities[0] as unknown as { vertices: unknown[] }).vertices).toHaveLength(2);
  });

  it('a LAYER table without ENDTAB still gives its layer names and the entities', () => {
    const text = dxf(0, 'SECTION', 2, 'TABLES', 0, 'TABLE', 2, 'LAYER', 70, 2, 0, 'LAYER', 2, 'FP-PIPE', 70, 0, 0, 'TABLE', 2, 'LTYPE', 0, 'ENDTAB', 0, 'ENDSEC',
      0, 'SECTION', 2, 'ENTITIES', 0, 'LINE', 8, 'FP-PIPE', 10, 0, 20, 0, 11, 1, 21, 0, 0, 'ENDSEC', 0, 'EOF');
    const parsed = parseDxfText(text);
    expect(parsed.layerNames).toEqual(['FP-PIPE']);
    expect(parsed.dxf.entities).toHaveLength(1);
  });

  it.each([
    ['fixtures/fuzz/nan-group-code.dxf', /line 2279: "NaN" is not a group code/],
    ['fixtures/fuzz/truncated-tables.dxf', /line 1463: "ENDTAB" is not a group code/],
  ])('%s: a one-line error naming the line', (file, message) => {
    const read = () => readDrawing(new Uint8Array(readFileSync(file)), { units: 'in' });
    expect(read).toThrow(InputError);
    expect(read).toThrow(message);
  });
});
