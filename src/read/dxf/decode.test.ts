// Decoding and refusing input: binary DXF, empty, non-DXF and truncated files each get a one-line
// error; R2004-and-older text decodes by $DWGCODEPAGE (DXF reference), R2007+ as UTF-8.

import { describe, expect, it } from 'vitest';
import { readDrawing } from '../read-drawing.js';
import { drawingEncoding, textDecoder } from './decode.js';
import { InputError } from '../../input-error.js';

const bytes = (s: string) => new TextEncoder().encode(s);
const minimal = (acadver: string, codepage: string, extra = '') =>
  `  0\nSECTION\n  2\nHEADER\n  9\n$ACADVER\n  1\n${acadver}\n  9\n$DWGCODEPAGE\n  3\n${codepage}\n  0\nENDSEC\n${extra}  0\nEOF\n`;

/** The whole file as text, the way the reader decodes it. */
const decodeDrawing = (b: Uint8Array) => {
  const { encoding } = drawingEncoding(b);
  return { encoding, text: textDecoder(encoding)(b) };
};

describe('drawingEncoding and textDecoder', () => {
  it('refuses binary DXF by its sentinel (DXF reference: "AutoCAD Binary DXF" CR LF SUB NUL)', () => {
    const b = new Uint8Array([...bytes('AutoCAD Binary DXF\r\n'), 0x1a, 0x00, 1, 2, 3]);
    expect(() => decodeDrawing(b)).toThrow(/binary DXF is not supported/);
  });
  it('refuses an empty file', () => expect(() => decodeDrawing(new Uint8Array())).toThrow(/empty/));
  it('refuses a file that is not DXF', () => {
    expect(() => decodeDrawing(bytes('%PDF-1.7\n...'))).toThrow(/not a DXF file/);
    expect(() => decodeDrawing(bytes('{"json": true}'))).toThrow(InputError);
  });
  it('reads past nothing after the EOF group: a DOS end-of-file byte, blank lines, text (as ezdxf and dxf-parser do)', () => {
    const body = `  0\nSECTION\n  2\nENTITIES\n  0\nCIRCLE\n  8\nFP-HEAD\n 10\n1.0\n 20\n2.0\n 40\n0.25\n  0\nENDSEC\n  0\nEOF\n`;
    for (const tail of ['\x1a', '\r\n\n\n', 'ignore\ninvalid\ndata\n', '1e308\nNaN']) {
      const d = readDrawing(bytes(body + tail), { units: 'ft', layers: { walls: ['FP-HEAD'] } });
      expect(d.outlines).toHaveLength(1);
    }
  });
  it('refuses a file cut inside a section as truncated, naming the section', () => {
    const cut = `  0\nSECTION\n  2\nENTITIES\n  0\nLINE\n  8\nP\n 10\n0\n`;
    expect(() => readDrawing(bytes(cut), { units: 'ft' })).toThrow(
      /the ENTITIES section is not closed by ENDSEC \(the file is truncated or damaged\)/,
    );
  });
  it('decodes windows-1252 bytes 0x80-0x9F as browsers do (WHATWG index: 0x96 → U+2013, 0x80 → U+20AC)', () => {
    const head = bytes(minimal('AC1015', 'ANSI_1252', '999\nX'));
    const withBytes = new Uint8Array([...head.slice(0, head.length - 8), 0x96, 0x80, 0xbd, ...bytes('\n  0\nEOF\n')]);
    const out = decodeDrawing(withBytes);
    expect(out.encoding).toBe('windows-1252');
    expect(out.text).toContain('X\u2013\u20ac\u00bd');
  });
  it('decodes by another code page (ANSI_1251: 0xC4 → U+0414)', () => {
    const head = bytes(minimal('AC1015', 'ANSI_1251', '999\n'));
    const b = new Uint8Array([...head.slice(0, head.length - 8), 0xc4, ...bytes('\n  0\nEOF\n')]);
    expect(decodeDrawing(b).text).toContain('\u0414');
  });
  it('reads R2007 and later as UTF-8 whatever the code page says', () => {
    const out = decodeDrawing(bytes(minimal('AC1032', 'ANSI_1252', '999\n\u00d8\u2013\n')));
    expect(out.encoding).toBe('utf-8');
    expect(out.text).toContain('\u00d8\u2013');
  });
  it("maps the DOS code pages CAD writes (dos850: 0x99 → Ö, 0x82 → é by Python's cp850 codec; dos932 is Shift_JIS)", () => {
    const head = bytes(minimal('AC1012', 'dos850', '999\n'));
    const b = new Uint8Array([...head.slice(0, head.length - 8), 0x99, 0x82, ...bytes('\n  0\nEOF\n')]);
    const out = decodeDrawing(b);
    expect(out.encoding).toBe('cp850');
    expect(out.text).toContain('\u00d6\u00e9');
    expect(decodeDrawing(bytes(minimal('AC1012', 'dos932'))).encoding).toBe('shift_jis');
    expect(decodeDrawing(bytes(minimal('AC1015', 'ansi_1250'))).encoding).toBe('windows-1250');
  });
  it("a drawing naming no code page: Shift_JIS when its non-ASCII bytes are (配管 = 94 7A 8A C7, Python's codec), else windows-1252", () => {
    const r12 = (...extra: number[]) =>
      new Uint8Array([
        ...bytes('  0\nSECTION\n  2\nHEADER\n  9\n$ACADVER\n  1\nAC1009\n  0\nENDSEC\n999\n'),
        ...extra,
        ...bytes('\n  0\nEOF\n'),
      ]);
    expect(decodeDrawing(r12(0x94, 0x7a, 0x8a, 0xc7)).encoding).toBe('shift_jis');
    // "Größe" in windows-1252 (47 72 F6 DF 65): 0xF6 leads no JIS X 0208 character (those lead with 0x81-0x9F, 0xE0-0xEF)
    expect(decodeDrawing(r12(0x47, 0x72, 0xf6, 0xdf, 0x65)).encoding).toBe('windows-1252');
    expect(decodeDrawing(r12(0x41)).encoding).toBe('windows-1252');
  });
  it('a drawing naming no code page: its non-ASCII lines are found wherever they sit (each offset, the last line)', () => {
    // "Größe" as UTF-8 (C3 B6, C3 9F): valid UTF-8, so the drawing is read as UTF-8 (WHATWG Encoding, UTF-8 decoder).
    const head = bytes('  0\nSECTION\n  2\nHEADER\n  9\n$ACADVER\n  1\nAC1009\n  0\nENDSEC\n');
    for (let pad = 0; pad < 9; pad++) {
      const comment = bytes(`999\n${'x'.repeat(40 + pad)}Größe\n`);
      const inMiddle = new Uint8Array([...head, ...comment, ...bytes('  0\nEOF\n')]);
      expect(decodeDrawing(inMiddle).encoding).toBe('utf-8');
      // The same text on a last line without its newline; a subarray at an odd offset of a larger buffer.
      const atEnd = new Uint8Array([0, ...head, ...bytes('  0\nEOF\n999\n'), ...bytes(`${'y'.repeat(pad)}Größe`)]);
      expect(decodeDrawing(atEnd.subarray(1)).encoding).toBe('utf-8');
    }
  });
  it('reads the group order of AC1003 drawings (x codes before y codes), as ezdxf does', () => {
    const old =
      '  0\nSECTION\n  2\nHEADER\n  9\n$ACADVER\n  1\nAC1003\n  0\nENDSEC\n  0\nSECTION\n  2\nENTITIES\n' +
      '  0\nLINE\n  8\nP\n  6\nCONTINUOUS\n 10\n1.5\n 11\n2.0\n 20\n0.5\n 21\n0.75\n  0\nENDSEC\n  0\nEOF\n';
    const d = readDrawing(bytes(old), { units: 'ft', layers: { pipes: ['P'] } });
    expect(d.version).toBe('AC1003');
    expect(d.strokes.map((x) => [x.a, x.b])).toEqual([
      [
        { x: 1.5, y: 0.5 },
        { x: 2, y: 0.75 },
      ],
    ]);
  });
});
