// Decoding and refusing input: binary DXF, empty, non-DXF and truncated files each get a one-line
// error; R2004-and-older text decodes by $DWGCODEPAGE (DXF reference), R2007+ as UTF-8.

import { describe, expect, it } from 'vitest';
import { drawingEncoding, textDecoder } from './decode.js';
import { InputError } from '../input-error.js';

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
  it('refuses a truncated file (no EOF group)', () => {
    expect(() => decodeDrawing(bytes(minimal('AC1015', 'ANSI_1252').replace('  0\nEOF\n', '')))).toThrow(/truncated/);
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
});
