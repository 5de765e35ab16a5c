// Tells how a drawing's bytes are to be read: rejects binary DXF and non-DXF input, and decodes text by the
// drawing's code page (R2004 and older: `$DWGCODEPAGE`; R2007 and later: UTF-8), so non-ASCII names survive.

import { fail } from '../input-error.js';
import { GroupCursor } from './groups.js';

const BINARY_SENTINEL = 'AutoCAD Binary DXF';

/** `$DWGCODEPAGE` values and the WHATWG encoding label that decodes them. */
const CODE_PAGES: Record<string, string> = {
  ANSI_874: 'windows-874', ANSI_932: 'shift_jis', ANSI_936: 'gbk', ANSI_949: 'euc-kr', ANSI_950: 'big5',
  ANSI_1250: 'windows-1250', ANSI_1251: 'windows-1251', ANSI_1252: 'windows-1252', ANSI_1253: 'windows-1253',
  ANSI_1254: 'windows-1254', ANSI_1255: 'windows-1255', ANSI_1256: 'windows-1256', ANSI_1257: 'windows-1257',
  ANSI_1258: 'windows-1258', ISO8859_1: 'iso-8859-1', ISO8859_2: 'iso-8859-2', ISO8859_15: 'iso-8859-15',
};

/**
 * Windows-1252 characters at bytes 0x80-0x9F (WHATWG Encoding Standard, index windows-1252). Node's
 * TextDecoder decodes this label as ISO-8859-1 there, browsers do not; remapping keeps both identical.
 */
const CP1252_HIGH = '\u20AC\u0081\u201A\u0192\u201E\u2026\u2020\u2021\u02C6\u2030\u0160\u2039\u0152\u008D\u017D\u008F' +
  '\u0090\u2018\u2019\u201C\u201D\u2022\u2013\u2014\u02DC\u2122\u0161\u203A\u0153\u009D\u017E\u0178';

/** Decodes byte ranges of a drawing written in encoding `label` (a WHATWG label); a UTF-8 byte order mark is dropped. */
export function textDecoder(label: string): (bytes: Uint8Array) => string {
  const decoder = new TextDecoder(label);
  if (label !== 'windows-1252') return (bytes) => decoder.decode(bytes);
  return (bytes) => decoder.decode(bytes).replace(/[\u0080-\u009f]/g, (ch) => CP1252_HIGH[ch.charCodeAt(0) - 0x80]!);
}

export interface DrawingEncoding {
  /** WHATWG label of the text encoding. */
  encoding: string;
  /** `$ACADVER`, AC1009 (R12) when not stated. */
  version: string;
}

/** Reads a header variable's first value from the start of the file (ASCII-safe view). */
function headerValue(head: string, name: string): string | null {
  const m = new RegExp(`\\$${name}\\s*\\r?\\n\\s*\\d+\\s*\\r?\\n([^\\r\\n]*)`).exec(head);
  return m ? m[1]!.trim() : null;
}

/** The last non-blank group of a DXF file must be `0 / EOF`; a file cut short lacks it. */
function endsWithEof(bytes: Uint8Array): boolean {
  const tailStart = Math.max(0, bytes.length - 64);
  const tail = new TextDecoder('latin1').decode(bytes.subarray(tailStart));
  const lines = tail.split(/\r\n|\r|\n/).map((l) => l.trim()).filter((l) => l !== '');
  return lines.length >= 2 && lines[lines.length - 1]!.toUpperCase() === 'EOF' && lines[lines.length - 2] === '0';
}

/** The drawing's version and text encoding; a file that is not ASCII DXF, or is cut short, is an error. */
export function drawingEncoding(bytes: Uint8Array): DrawingEncoding {
  if (bytes.length === 0) fail('the file is empty');
  const start = new TextDecoder('latin1').decode(bytes.subarray(0, Math.min(bytes.length, 65536)));
  if (start.startsWith(BINARY_SENTINEL)) fail('binary DXF is not supported; save the drawing as ASCII DXF');
  // The first group after any 999 comments must be 0/SECTION (a byte order mark before it is skipped).
  const first = new GroupCursor(bytes);
  let more = first.next();
  while (more && first.code === 999) more = first.next();
  if (!more || first.code !== 0 || first.latin1().toUpperCase() !== 'SECTION') fail('not a DXF file (it does not start with a DXF section)');
  if (!endsWithEof(bytes)) fail('the DXF file is truncated (it does not end with an EOF group)');
  const version = headerValue(start, 'ACADVER') ?? 'AC1009';
  const codePage = headerValue(start, 'DWGCODEPAGE');
  const utf8 = version >= 'AC1021' || bytes[0] === 0xef;
  const label = utf8 ? 'utf-8' : (CODE_PAGES[(codePage ?? 'ANSI_1252').toUpperCase()] ?? 'windows-1252');
  return { encoding: label, version };
}
