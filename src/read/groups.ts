// Reads a DXF file's group structure without changing it: every group's code, value and character range,
// on a text or a 1:1 byte-to-char view. The reader checks structure with it; the annotator splices by it.

export interface Group {
  code: number;
  value: string;
  /** Byte offset where the group's code line starts, and just after its value line ends. */
  start: number;
  end: number;
  /** Byte range of the value text alone (without the line break). */
  valueStart: number;
  valueEnd: number;
}

/**
 * One char per byte, so that string offsets are byte offsets. Windows-1252 is a single-byte encoding: every
 * byte decodes to exactly one character (WHATWG index; bytes 0x80-0x9F may not keep their Latin-1 code points,
 * which only non-ASCII values notice). Native decoding: ten times faster than building the string by hand.
 */
export function byteView(bytes: Uint8Array): string {
  return new TextDecoder('windows-1252').decode(bytes);
}

/** Space, tab or carriage return: blanks around a group's code or value. */
export const isBlank = (c: number) => c === 32 || c === 9 || c === 13;

/**
 * The group code on the line text[start, end): an integer and nothing else, blanks around it allowed, or NaN
 * ("1e308" or "10.5" is damage, not code 1 or 10).
 */
export function groupCode(text: string, start: number, end: number): number {
  let i = start;
  let e = end;
  while (i < e && isBlank(text.charCodeAt(i))) i++;
  while (e > i && isBlank(text.charCodeAt(e - 1))) e--;
  let sign = 1;
  if (i < e && (text.charCodeAt(i) === 45 || text.charCodeAt(i) === 43)) { sign = text.charCodeAt(i) === 45 ? -1 : 1; i++; }
  if (i === e || e - i > 6) return Number.NaN;
  let v = 0;
  for (; i < e; i++) {
    const d = text.charCodeAt(i) - 48;
    if (d < 0 || d > 9) return Number.NaN;
    v = v * 10 + d;
  }
  return sign * v;
}

/** Every group of the file; a code line that is not an integer gives code NaN, for the caller to reject. */
export function readGroups(view: string): Group[] {
  const groups: Group[] = [];
  let i = 0;
  const n = view.length;
  const line = (): [number, number, number] => {
    const s = i;
    let e = view.indexOf('\n', i);
    if (e < 0) e = n;
    i = e + 1;
    const valueEnd = e > s && view.charCodeAt(e - 1) === 13 ? e - 1 : e;
    return [s, valueEnd, Math.min(i, n)];
  };
  while (i < n) {
    const [cs, ce] = line();
    if (i >= n && view.slice(cs, ce).trim() === '') break;
    const [vs, ve, next] = line();
    groups.push({ code: groupCode(view, cs, ce), value: view.slice(vs, ve).trim(), start: cs, end: next, valueStart: vs, valueEnd: ve });
  }
  return groups;
}

/** The line break the file uses. */
export const lineBreakOf = (view: string): string => (view.indexOf('\r\n') >= 0 && view.indexOf('\r\n') <= view.indexOf('\n') ? '\r\n' : '\n');

