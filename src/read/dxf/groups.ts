// Walks a DXF file's groups on its bytes, one at a time and without an object per group: its code and the ranges
// of its lines and value; and finds the highest handle. The scan checks structure with it; the annotator splices by it.

/** Space, tab or carriage return: blanks around a group's code or value. */
export const isBlank = (c: number) => c === 32 || c === 9 || c === 13;

/**
 * Lines end at the byte 0x0A, on bytes before decoding: no code page a DXF may use puts 0x0A, 0x0D, a space or
 * a tab inside a character (Shift_JIS, GBK, Big5 and EUC-KR trail bytes are 0x40 and above; from memory, the
 * WHATWG Encoding Standard's indexes).
 */
const NEWLINE = 10;

/** Offset of the next line break at or after `from`, or the end of the bytes. */
function lineEnd(bytes: Uint8Array, from: number): number {
  const n = bytes.length;
  let i = from;
  while (i < n && bytes[i] !== NEWLINE) i++;
  return i;
}

/**
 * The group code on the line bytes[start, end): an integer and nothing else, blanks around it allowed, or NaN
 * ("1e308" or "10.5" is damage, not code 1 or 10).
 */
function groupCode(bytes: Uint8Array, start: number, end: number): number {
  let i = start;
  let e = end;
  while (i < e && isBlank(bytes[i]!)) i++;
  while (e > i && isBlank(bytes[e - 1]!)) e--;
  let sign = 1;
  if (i < e && (bytes[i] === 45 || bytes[i] === 43)) {
    sign = bytes[i] === 45 ? -1 : 1;
    i++;
  }
  if (i === e || e - i > 6) return Number.NaN;
  let v = 0;
  for (; i < e; i++) {
    const d = bytes[i]! - 48;
    if (d < 0 || d > 9) return Number.NaN;
    v = v * 10 + d;
  }
  return sign * v;
}

/** A UTF-8 byte order mark, which some programs write before the first group. */
const bomLength = (bytes: Uint8Array): number => (bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf ? 3 : 0);

/** The current group of a walk through the file; `next` moves it on. */
export class GroupCursor {
  /** The group code; NaN when its line is not an integer and nothing else, for the caller to reject. */
  code = Number.NaN;
  /** Where the group's code line starts, and just after its value line ends. */
  start = 0;
  end = 0;
  /** The value's range, without the line break and the blanks around it. */
  valueStart = 0;
  valueEnd = 0;

  constructor(readonly bytes: Uint8Array) {
    this.end = bomLength(bytes);
  }

  /** Moves to the next group; false at the end of the file (a last line of blanks is no group). */
  next(): boolean {
    const b = this.bytes;
    const n = b.length;
    const cs = this.end;
    if (cs >= n) return false;
    const ce = lineEnd(b, cs);
    const code = groupCode(b, cs, ce);
    if (Number.isNaN(code) && ce >= n && isBlankLine(b, cs, ce)) return false;
    let vs = Math.min(ce + 1, n);
    let ve = lineEnd(b, vs);
    this.code = code;
    this.start = cs;
    this.end = Math.min(ve + 1, n);
    while (vs < ve && isBlank(b[vs]!)) vs++;
    while (ve > vs && isBlank(b[ve - 1]!)) ve--;
    this.valueStart = vs;
    this.valueEnd = ve;
    return true;
  }

  /** Whether the value is exactly `word` (ASCII). */
  valueIs(word: string): boolean {
    if (this.valueEnd - this.valueStart !== word.length) return false;
    for (let i = 0; i < word.length; i++) if (this.bytes[this.valueStart + i] !== word.charCodeAt(i)) return false;
    return true;
  }

  /** The value byte for byte as Latin-1 (exact for ASCII: names, numbers, handles). */
  latin1(): string {
    return latin1(this.bytes, this.valueStart, this.valueEnd);
  }

  /**
   * The value as `Number(text)` reads it, without making the text where it is a plain decimal: its digits as an
   * integer below 2^53 divided by a power of ten up to 10^22, both exact doubles, so the one correctly rounded
   * division gives the correctly rounded value (the classic fast path of decimal conversion; from memory).
   */
  number(): number {
    const b = this.bytes;
    const e = this.valueEnd;
    let i = this.valueStart;
    let sign = 1;
    if (i < e && (b[i] === MINUS || b[i] === PLUS)) sign = b[i++] === MINUS ? -1 : 1;
    let digits = 0;
    let decimals = 0;
    let point = false;
    let m = 0;
    for (; i < e; i++) {
      const c = b[i]!;
      if (c === POINT && !point) {
        point = true;
        continue;
      }
      const d = c - 48;
      if (d < 0 || d > 9 || m > EXACT_BEFORE_DIGIT) return Number(this.latin1());
      m = m * 10 + d;
      digits++;
      if (point) decimals++;
    }
    if (digits === 0 || decimals >= POWERS_OF_TEN.length) return Number(this.latin1());
    return sign * (m / POWERS_OF_TEN[decimals]!);
  }

  /** The line number (from 1) of the current group's code. */
  line(): number {
    let count = 1;
    for (let i = 0; i < this.start; i++) if (this.bytes[i] === NEWLINE) count++;
    return count;
  }
}

function isBlankLine(b: Uint8Array, start: number, end: number): boolean {
  for (let i = start; i < end; i++) if (!isBlank(b[i]!)) return false;
  return true;
}

const MINUS = 45;
const PLUS = 43;
const POINT = 46;
/** Below this an integer times ten plus a digit stays under 2^53, exact. */
const EXACT_BEFORE_DIGIT = 9e14;
/** 10^0 … 10^22: the powers of ten a double holds exactly. */
const POWERS_OF_TEN = Array.from({ length: 23 }, (_, k) => Number(`1e${k}`));

/** Values up to this many bytes are made character by character (a spread of a view costs more for them). */
const SHORT_VALUE = 64;

/** Bytes [start, end) as Latin-1 text, one character per byte. */
export function latin1(bytes: Uint8Array, start: number, end: number): string {
  let s = '';
  if (end - start <= SHORT_VALUE) {
    for (let i = start; i < end; i++) s += String.fromCharCode(bytes[i]!);
    return s;
  }
  for (let i = start; i < end; i += 4096) s += String.fromCharCode(...bytes.subarray(i, Math.min(end, i + 4096)));
  return s;
}

/** The line break the file uses. */
export function lineBreakOf(bytes: Uint8Array): string {
  const lf = bytes.indexOf(NEWLINE);
  return lf > 0 && bytes[lf - 1] === 13 ? '\r\n' : '\n';
}

/** Each byte's value as a hex digit (either case), or −1. */
const HEX_DIGIT = Int8Array.from({ length: 256 }, (_, c) =>
  c >= 48 && c <= 57 ? c - 48 : c >= 65 && c <= 70 ? c - 55 : c >= 97 && c <= 102 ? c - 87 : -1,
);

/** The value of a hex digit's byte (either case), or −1. */
export const hexDigit = (c: number): number => HEX_DIGIT[c]!;

/** Compares two ranges of hex digits without leading zeros as numbers: negative, zero or positive. */
function compareHex(bytes: Uint8Array, s1: number, e1: number, s2: number, e2: number): number {
  if (e1 - s1 !== e2 - s2) return e1 - s1 - (e2 - s2);
  for (let i = 0; i < e1 - s1; i++) {
    const d = hexDigit(bytes[s1 + i]!) - hexDigit(bytes[s2 + i]!);
    if (d !== 0) return d;
  }
  return 0;
}

/**
 * The highest of the handles noted, each a value's byte range read as hex (one that is not hex, or empty, counts
 * as zero: a handle that cannot be read), kept as a range of the bytes: no string or number per handle, and exact
 * beyond 2^53.
 */
export class HighestHandle {
  private start = -1;
  private end = -1;
  private seen = false;

  constructor(private readonly bytes: Uint8Array) {}

  note(valueStart: number, valueEnd: number): void {
    this.seen = true;
    const b = this.bytes;
    let s = valueStart;
    while (s < valueEnd && b[s] === 48) s++;
    if (s === valueEnd || (this.start >= 0 && compareHex(b, s, valueEnd, this.start, this.end) <= 0)) return;
    // Only a value above the highest so far is checked to be hex (one that is not counts as zero).
    for (let i = s; i < valueEnd; i++) if (hexDigit(b[i]!) < 0) return;
    this.start = s;
    this.end = valueEnd;
  }

  /** In upper-case hex without leading zeros ("0" where only zero or unreadable handles were noted); null: none noted. */
  text(): string | null {
    if (!this.seen) return null;
    return this.start < 0 ? '0' : latin1(this.bytes, this.start, this.end).toUpperCase();
  }
}
