// Numbers the names a drawing repeats on its entities (types, layers, blocks): each distinct one decoded once and
// found again by a hash of its bytes, with no string made per lookup. The scan and the entity reader each keep one.

import type { Decode } from './scan.js';

/**
 * Names kept per hash before the rest are found by their text: names colliding on purpose (a hostile file) then
 * cost a decode each, not a growing list to compare.
 */
const BUCKET_SIZE = 8;

export class NameTable {
  /** Each distinct name, decoded, in the order first met; a name's number is its place here. */
  readonly names: string[] = [];
  private readonly byHash = new Map<number, { start: number; end: number; index: number }[]>();
  private readonly crowded = new Map<string, number>();

  constructor(
    private readonly bytes: Uint8Array,
    private readonly decode: Decode,
  ) {}

  /** The number of the name written in bytes `start` … `end` − 1. */
  indexOf(start: number, end: number): number {
    const { bytes, names } = this;
    let h = end - start;
    for (let i = start; i < end; i++) h = (Math.imul(h, 31) + bytes[i]!) | 0;
    let bucket = this.byHash.get(h);
    if (!bucket) this.byHash.set(h, (bucket = []));
    for (const k of bucket) if (sameBytes(bytes, k.start, k.end, start, end)) return k.index;
    const text = this.decode(bytes.subarray(start, end));
    if (bucket.length >= BUCKET_SIZE) {
      let index = this.crowded.get(text);
      if (index === undefined) this.crowded.set(text, (index = names.push(text) - 1));
      return index;
    }
    bucket.push({ start, end, index: names.length });
    return names.push(text) - 1;
  }
}

function sameBytes(b: Uint8Array, s1: number, e1: number, s2: number, e2: number): boolean {
  if (e1 - s1 !== e2 - s2) return false;
  for (let i = 0; i < e1 - s1; i++) if (b[s1 + i] !== b[s2 + i]) return false;
  return true;
}
