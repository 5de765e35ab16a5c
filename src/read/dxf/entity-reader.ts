// Reads one entity's groups from the file's bytes, within the byte range the scan gave it (trailing VERTEX,
// ATTRIB and SEQEND records included): numbers, handles and decoded texts, every call advancing, none looping.

import { GroupCursor } from './groups.js';
import type { Decode } from './scan.js';
import { decodeUnicodeEscapes } from './text-codes.js';

export class EntityReader {
  private readonly c: GroupCursor;
  private end = 0;
  /** Names decoded so far, by a hash of their bytes, with where those bytes were first read. */
  private readonly names = new Map<number, { start: number; end: number; name: string }>();

  constructor(
    readonly bytes: Uint8Array,
    private readonly decode: Decode,
  ) {
    this.c = new GroupCursor(bytes);
  }

  /** Stands on the first group after the "0 / TYPE" group that starts at `start`; groups end at `end`. */
  enter(start: number, end: number): void {
    this.c.end = start;
    this.end = end;
    this.c.next();
  }

  /** Moves to the next group of the entity; false at its end. */
  next(): boolean {
    return this.c.end < this.end && this.c.next() && this.c.start < this.end;
  }

  get code(): number {
    return this.c.code;
  }

  /** Whether the group is "0 / word" (a trailing record such as VERTEX). */
  record(word: string): boolean {
    return this.c.code === 0 && this.c.valueIs(word);
  }

  /** The value as a number; a value that is no number reads as `fallback`. */
  number(fallback = 0): number {
    const v = this.c.number();
    return Number.isFinite(v) ? v : fallback;
  }

  /** The value byte for byte (ASCII values: handles, numbers, type names). */
  ascii(): string {
    return this.c.latin1();
  }

  /** The value as text in the drawing's encoding. */
  text(): string {
    return this.decode(this.bytes.subarray(this.c.valueStart, this.c.valueEnd));
  }

  /**
   * A layer or block name: text with \U+ escapes decoded. A drawing repeats a few names on every entity, so each
   * is decoded once and found again by a hash of its bytes, compared byte for byte with where it was first read.
   */
  name(): string {
    const { bytes } = this;
    const start = this.c.valueStart;
    const end = this.c.valueEnd;
    let hash = end - start;
    for (let i = start; i < end; i++) hash = (Math.imul(hash, 31) + bytes[i]!) | 0;
    const known = this.names.get(hash);
    if (known && sameBytes(bytes, known.start, start, end - start, known.end - known.start)) return known.name;
    const name = decodeUnicodeEscapes(this.text());
    if (!known && this.names.size < MAX_NAMES) this.names.set(hash, { start, end, name });
    return name;
  }
}

/** How many distinct names a reader keeps decoded (a drawing has a few dozen; a hostile one is only slower). */
const MAX_NAMES = 4096;

/** Whether the `length` bytes at `a` equal the `other` bytes at `b`. */
function sameBytes(bytes: Uint8Array, a: number, b: number, length: number, other: number): boolean {
  if (length !== other) return false;
  for (let i = 0; i < length; i++) if (bytes[a + i] !== bytes[b + i]) return false;
  return true;
}
