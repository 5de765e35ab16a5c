// Reads one entity's groups from the file's bytes, within the byte range the scan gave it (trailing VERTEX,
// ATTRIB and SEQEND records included): numbers, handles and decoded texts, every call advancing, none looping.

import { GroupCursor } from './groups.js';
import { NameTable } from './name-table.js';
import type { Decode } from './scan.js';
import { decodeUnicodeEscapes } from './text-codes.js';

export class EntityReader {
  private readonly c: GroupCursor;
  private end = 0;
  private readonly nameTable: NameTable;
  /** Each numbered name with its \U+ escapes decoded, once asked for. */
  private readonly decodedNames: string[] = [];

  constructor(
    readonly bytes: Uint8Array,
    private readonly decode: Decode,
  ) {
    this.c = new GroupCursor(bytes);
    this.nameTable = new NameTable(bytes, decode);
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

  /** A layer or block name: text with \U+ escapes decoded (each distinct name once: a drawing repeats a few on every entity). */
  name(): string {
    const k = this.nameTable.indexOf(this.c.valueStart, this.c.valueEnd);
    return (this.decodedNames[k] ??= decodeUnicodeEscapes(this.nameTable.names[k]!));
  }
}
