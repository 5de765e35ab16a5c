// Where the annotator's additions go, found in one walk: sections, tables and their entries, block names,
// $HANDSEED and the next free handle (a stale seed is not trusted; handles beyond 2^53 stay exact).
// Expected values are worked by hand from the DXF rules (from memory: DXF reference, $HANDSEED holds the next
// available handle; handles are hexadecimal strings of up to 16 digits).

import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { describeWith } from '../../test/support/external.js';
import { textDecoder } from '../read/dxf/decode.js';
import { scanDxf } from '../read/dxf/scan.js';
import { dxfStructure } from './dxf-structure.js';

const dxf = (...pairs: (string | number)[]) => {
  let s = '';
  for (let i = 0; i < pairs.length; i += 2) s += `${String(pairs[i]).padStart(3)}\n${pairs[i + 1]}\n`;
  return new TextEncoder().encode(s);
};

const header = (seed: string) => [0, 'SECTION', 2, 'HEADER', 9, '$ACADVER', 1, 'AC1015', 9, '$HANDSEED', 5, seed, 0, 'ENDSEC'];
const tables = [
  0,
  'SECTION',
  2,
  'TABLES',
  0,
  'TABLE',
  2,
  'LAYER',
  5,
  '2',
  70,
  2,
  0,
  'LAYER',
  5,
  '10',
  2,
  '0',
  70,
  0,
  390,
  'F',
  0,
  'LAYER',
  5,
  '11',
  2,
  'fp-pipe',
  70,
  0,
  0,
  'ENDTAB',
  0,
  'ENDSEC',
];
const blocks = [0, 'SECTION', 2, 'BLOCKS', 0, 'BLOCK', 5, '20', 8, '0', 2, 'Head', 70, 0, 0, 'ENDBLK', 5, '21', 0, 'ENDSEC'];

/** Every DXF the read takes in `dir` (at least `atLeast`) has the same structure with and without the read's notes. */
function sameOnEvery(dir: string, atLeast: number): void {
  let compared = 0;
  for (const name of readdirSync(dir).filter((f) => /\.dxf$/i.test(f))) {
    const bytes = new Uint8Array(readFileSync(join(dir, name)));
    let read: ReturnType<typeof scanDxf>;
    try {
      read = scanDxf(bytes, textDecoder('windows-1252'));
    } catch {
      continue; // binary or damaged: the read refuses it, and nothing is annotated
    }
    expect(dxfStructure(bytes, read.entityHandles), name).toEqual(dxfStructure(bytes));
    compared++;
  }
  expect(compared).toBeGreaterThanOrEqual(atLeast);
}

const CORPUS = '../shared/real-dxf/files';

describe('dxfStructure', () => {
  it('finds the sections, the LAYER table with its count and entries, and the block names', () => {
    const bytes = dxf(
      ...header('30'),
      ...tables,
      ...blocks,
      0,
      'SECTION',
      2,
      'ENTITIES',
      0,
      'LINE',
      5,
      '22',
      8,
      'FP-PIPE',
      0,
      'ENDSEC',
      0,
      'EOF',
    );
    const s = dxfStructure(bytes);
    expect([...s.sections.keys()]).toEqual(['HEADER', 'TABLES', 'BLOCKS', 'ENTITIES']);
    const text = new TextDecoder().decode(bytes);
    expect(text.slice(s.sections.get('ENTITIES')!.endsec)).toBe('  0\nENDSEC\n  0\nEOF\n');
    const layer = s.tables.get('LAYER')!;
    expect(layer.handle).toBe('2');
    expect(layer.count?.value).toBe('2');
    expect(text.slice(layer.count!.valueStart, layer.count!.valueEnd)).toBe('2');
    expect([...layer.names]).toEqual(['0', 'FP-PIPE']);
    expect(layer.entries[0]).toContainEqual({ code: 390, value: 'F' });
    expect(text.slice(layer.endTab).startsWith('  0\nENDTAB\n')).toBe(true);
    expect([...s.blockNames]).toEqual(['HEAD']);
    expect(s.handseed?.value).toBe('30');
    expect(s.nextHandle).toBe(0x30n); // the seed is above every handle in use (0x22)
  });

  it('does not trust a stale seed: the next handle is above the highest in use', () => {
    const s = dxfStructure(dxf(...header('5'), ...blocks, 0, 'SECTION', 2, 'ENTITIES', 0, 'LINE', 5, 'A0', 0, 'ENDSEC', 0, 'EOF'));
    expect(s.nextHandle).toBe(0xa1n);
  });

  it('keeps handles of 16 hex digits exact (beyond 2^53)', () => {
    const s = dxfStructure(dxf(...header('1'), 0, 'SECTION', 2, 'ENTITIES', 0, 'LINE', 5, 'FFFFFFFFFFFFFFF0', 0, 'ENDSEC', 0, 'EOF'));
    expect(s.nextHandle).toBe(0xfffffffffffffff1n);
  });

  it('gives no handles to a drawing whose entities have none, and skips the byte order mark', () => {
    const plain = dxf(0, 'SECTION', 2, 'ENTITIES', 0, 'LINE', 8, '0', 0, 'ENDSEC', 0, 'EOF');
    const s = dxfStructure(new Uint8Array([0xef, 0xbb, 0xbf, ...plain]));
    expect(s.nextHandle).toBeNull();
    expect([...s.sections.keys()]).toEqual(['ENTITIES']);
  });

  // Passing over the entity sections with what the read noted of them must change nothing: the same structure as
  // the walk of the whole file (common practice, no source), on handles written every way a file may write them.
  const passedOver = (bytes: Uint8Array) => dxfStructure(bytes, scanDxf(bytes, textDecoder('windows-1252')).entityHandles);

  it('passes over the entity sections the read walked and finds what the whole walk finds', () => {
    const bytes = dxf(
      ...header('10'),
      ...blocks,
      ...[0, 'SECTION', 2, 'ENTITIES', 5, '7F', 0, 'LINE', 5, '00a2', 8, '0', 0, 'POLYLINE', 5, 'A1', 0, 'VERTEX', 5, 'a3', 0, 'SEQEND'],
      ...[5, 'A4', 0, 'TEXT', 5, 'not hex', 0, 'ENDSEC'],
      ...[0, 'SECTION', 2, 'ENTITIES', 0, 'LINE', 5, '0000', 0, 'LINE', 105, 'C', 0, 'ENDSEC', 0, 'EOF'],
    );
    const whole = dxfStructure(bytes);
    expect(whole.nextHandle).toBe(0xa5n); // a4 in the first section's SEQEND record is the highest in use
    const scan = scanDxf(bytes, textDecoder('windows-1252'));
    expect(scan.entityHandles.top).toBe('A4');
    expect(scan.entityHandles.sections).toHaveLength(2);
    expect(passedOver(bytes)).toEqual(whole);
    // Handles beyond 2^53 only in the entities, and entities with no handles at all.
    const big = dxf(
      ...header('1'),
      0,
      'SECTION',
      2,
      'ENTITIES',
      0,
      'LINE',
      5,
      'FFFFFFFFFFFFFFF0',
      0,
      'LINE',
      5,
      'FFFFFFFFFFFFFFE',
      0,
      'ENDSEC',
      0,
      'EOF',
    );
    expect(passedOver(big)).toEqual(dxfStructure(big));
    expect(passedOver(big).nextHandle).toBe(0xfffffffffffffff1n);
    const none = dxf(...header('1'), 0, 'SECTION', 2, 'ENTITIES', 0, 'LINE', 8, '0', 0, 'ENDSEC', 0, 'EOF');
    expect(passedOver(none)).toEqual(dxfStructure(none));
  });

  // 9: the text DXF fixtures the project generates (counted; common practice, no source).
  it('finds the same structure with and without the read on every fixture', () => sameOnEvery('fixtures', 9));
});

describeWith('../shared/real-dxf (the real-drawing corpus)', existsSync(CORPUS), 'dxfStructure on the real-drawing corpus', () => {
  // 55: the read takes 56 of the corpus's 60 files, the other 4 being binary DXF (counted in ../shared/real-dxf;
  // common practice, no source), less one for a corpus that changes.
  it('finds the same structure with and without the read on every text DXF of the corpus', () => sameOnEvery(CORPUS, 55));
});
