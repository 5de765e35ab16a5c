// Tells how a DXF drawing's bytes are to be read: rejects binary DXF and non-DXF input, and decodes text by the
// drawing's code page (R2004 and older: `$DWGCODEPAGE`, every value CAD writes; R2007 and later: UTF-8).

import { fail } from '../../input-error.js';
import { DOS_CODE_PAGES } from './code-page-tables.js';
import { GroupCursor } from './groups.js';

const BINARY_SENTINEL = 'AutoCAD Binary DXF';

/**
 * `$DWGCODEPAGE` values (as CAD programs write them, any case) and the encoding that decodes them: a WHATWG
 * label, or a DOS code page of our own tables. From memory of the DXF reference's list, checked against the
 * values found in the real-drawing corpus (ANSI_1250, ANSI_1252, dos850, dos932).
 */
const CODE_PAGES: Record<string, string> = {
  ASCII: 'windows-1252',
  ANSI_874: 'windows-874',
  ANSI_932: 'shift_jis',
  ANSI_936: 'gbk',
  ANSI_949: 'euc-kr',
  ANSI_950: 'big5',
  ANSI_1250: 'windows-1250',
  ANSI_1251: 'windows-1251',
  ANSI_1252: 'windows-1252',
  ANSI_1253: 'windows-1253',
  ANSI_1254: 'windows-1254',
  ANSI_1255: 'windows-1255',
  ANSI_1256: 'windows-1256',
  ANSI_1257: 'windows-1257',
  ANSI_1258: 'windows-1258',
  ISO8859_1: 'iso-8859-1',
  ISO8859_2: 'iso-8859-2',
  ISO8859_3: 'iso-8859-3',
  ISO8859_4: 'iso-8859-4',
  ISO8859_5: 'iso-8859-5',
  ISO8859_6: 'iso-8859-6',
  ISO8859_7: 'iso-8859-7',
  ISO8859_8: 'iso-8859-8',
  ISO8859_9: 'windows-1254',
  ISO8859_10: 'iso-8859-10',
  DOS437: 'cp437',
  DOS850: 'cp850',
  DOS852: 'cp852',
  DOS855: 'cp855',
  DOS857: 'cp857',
  DOS860: 'cp860',
  DOS861: 'cp861',
  DOS863: 'cp863',
  DOS864: 'cp864',
  DOS865: 'cp865',
  DOS866: 'ibm866',
  DOS869: 'cp869',
  DOS932: 'shift_jis',
  MAC_ROMAN: 'macintosh',
  BIG5: 'big5',
  KSC5601: 'euc-kr',
  GB2312: 'gbk',
};

/**
 * Windows-1252 characters at bytes 0x80-0x9F (WHATWG Encoding Standard, index windows-1252). Node's
 * TextDecoder decodes this label as ISO-8859-1 there, browsers do not; remapping keeps both identical.
 */
const CP1252_HIGH =
  '\u20AC\u0081\u201A\u0192\u201E\u2026\u2020\u2021\u02C6\u2030\u0160\u2039\u0152\u008D\u017D\u008F' +
  '\u0090\u2018\u2019\u201C\u201D\u2022\u2013\u2014\u02DC\u2122\u0161\u203A\u0153\u009D\u017E\u0178';

/** Decodes byte ranges of a drawing written in `label` (a WHATWG label or a DOS code page); a UTF-8 byte order mark is dropped. */
export function textDecoder(label: string): (bytes: Uint8Array) => string {
  const table = DOS_CODE_PAGES[label];
  if (table) {
    return (bytes) => {
      let s = '';
      for (let i = 0; i < bytes.length; i++) s += bytes[i]! < 0x80 ? String.fromCharCode(bytes[i]!) : table[bytes[i]! - 0x80]!;
      return s;
    };
  }
  const decoder = new TextDecoder(label);
  if (label !== 'windows-1252') return (bytes) => decoder.decode(bytes);
  return (bytes) => decoder.decode(bytes).replace(/[\u0080-\u009f]/g, (ch) => CP1252_HIGH[ch.charCodeAt(0) - 0x80]!);
}

export interface DrawingEncoding {
  /** The label the text decodes by. */
  encoding: string;
  /** `$ACADVER`, AC1009 (R12) when not stated. */
  version: string;
}

/** Reads a header variable's first value from the start of the file (ASCII-safe view). */
function headerValue(head: string, name: string): string | null {
  const m = new RegExp(`\\$${name}\\s*\\r?\\n\\s*\\d+\\s*\\r?\\n([^\\r\\n]*)`).exec(head);
  return m ? m[1]!.trim() : null;
}

/** The drawing's version and text encoding; a file that is not ASCII DXF is an error. */
export function drawingEncoding(bytes: Uint8Array): DrawingEncoding {
  if (bytes.length === 0) fail('the file is empty');
  const start = new TextDecoder('latin1').decode(bytes.subarray(0, Math.min(bytes.length, 65536)));
  if (start.startsWith(BINARY_SENTINEL)) fail('binary DXF is not supported; save the drawing as ASCII DXF');
  // The first group after any 999 comments must be 0/SECTION (a byte order mark before it is skipped).
  const first = new GroupCursor(bytes);
  let more = first.next();
  while (more && first.code === 999) more = first.next();
  if (!more || first.code !== 0 || first.latin1().toUpperCase() !== 'SECTION')
    fail('not a DXF file (it does not start with a DXF section)');
  const version = headerValue(start, 'ACADVER') ?? 'AC1009';
  if (version >= 'AC1021' || bytes[0] === 0xef) return { encoding: 'utf-8', version };
  const codePage = headerValue(start, 'DWGCODEPAGE');
  const declared = codePage ? CODE_PAGES[codePage.toUpperCase()] : undefined;
  return { encoding: declared ?? undeclaredEncoding(bytes), version };
}

/**
 * A drawing that names no code page (or one no table has) is read as windows-1252, the DXF default, unless its
 * non-ASCII bytes are valid UTF-8 or valid Shift_JIS with double-byte characters in it (an R12 file written by a
 * Japanese program often names none): strict decoders decide, on the lines that hold such bytes.
 */
function undeclaredEncoding(bytes: Uint8Array): string {
  const sample = nonAsciiLines(bytes, 1 << 16);
  if (sample.length === 0) return 'windows-1252';
  const valid = (label: string) => {
    try {
      new TextDecoder(label, { fatal: true }).decode(sample);
      return true;
    } catch {
      return false;
    }
  };
  if (valid('utf-8')) return 'utf-8';
  if (valid('shift_jis') && hasShiftJisPairs(sample)) return 'shift_jis';
  return 'windows-1252';
}

/** The lines holding a byte of 0x80 or more, joined, up to `limit` bytes. */
function nonAsciiLines(bytes: Uint8Array, limit: number): Uint8Array {
  const parts: Uint8Array[] = [];
  let size = 0;
  for (let i = firstHighByte(bytes, 0); i >= 0 && size < limit; ) {
    const start = bytes.lastIndexOf(10, i) + 1;
    const newline = bytes.indexOf(10, i);
    const end = newline < 0 ? bytes.length : newline + 1;
    parts.push(bytes.subarray(start, end));
    size += end - start;
    i = firstHighByte(bytes, end);
  }
  const out = new Uint8Array(size);
  let at = 0;
  for (const p of parts) {
    out.set(p, at);
    at += p.length;
  }
  return out;
}

/**
 * The index of the first byte of 0x80 or more from `from` on, or −1: four bytes a test where they are aligned
 * (a 25 MB drawing with none: 121 ms a byte at a time, 11 ms so).
 */
function firstHighByte(bytes: Uint8Array, from: number): number {
  let i = from;
  for (; i < bytes.length && (bytes.byteOffset + i) % 4 !== 0; i++) if (bytes[i]! >= 0x80) return i;
  if (i >= bytes.length) return -1;
  const words = new Uint32Array(bytes.buffer, bytes.byteOffset + i, (bytes.length - i) >> 2);
  let w = 0;
  while (w < words.length && (words[w]! & 0x80808080) === 0) w++;
  for (i += 4 * w; i < bytes.length; i++) if (bytes[i]! >= 0x80) return i;
  return -1;
}

/** Whether the bytes hold Shift_JIS lead bytes (0x81-0x9F, 0xE0-0xEF) followed by trail bytes (0x40-0xFC). */
function hasShiftJisPairs(b: Uint8Array): boolean {
  let pairs = 0;
  for (let i = 0; i + 1 < b.length; i++) {
    const lead = b[i]!;
    if (((lead >= 0x81 && lead <= 0x9f) || (lead >= 0xe0 && lead <= 0xef)) && b[i + 1]! >= 0x40 && b[i + 1]! <= 0xfc) {
      pairs++;
      i++;
    }
  }
  return pairs >= 2;
}
