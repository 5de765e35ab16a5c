// Walks a DXF file's group structure once on its bytes, decoding only the values it needs: the sections, the
// layer table, and each block and entity with its type, layer and byte range, so that only what matters is parsed.

import { DEFAULT_INPUT_LIMITS, type InputLimits } from '../config/settings.js';
import { fail, InputError } from './errors.js';
import { GroupCursor } from './groups.js';

/** One entity with the ATTRIB, VERTEX and SEQEND records that belong to it. */
export interface EntityEntry {
  type: string;
  /** Layer name as written (\U+ escapes not yet decoded); "0" when none is given. */
  layer: string;
  /** Byte range of the entity and its trailing records. */
  start: number;
  end: number;
  /** INSERT: the block name, and how many copies a MINSERT array places (columns × rows). */
  block: string | null;
  copies: number;
  /** Closed LWPOLYLINE or POLYLINE. */
  closed: boolean;
  paperSpace: boolean;
  /** TEXT and MTEXT: byte range of the value as written (MTEXT: its last chunk, group 1); -1 for other entities. */
  textStart: number;
  textEnd: number;
}

export interface BlockEntry {
  name: string;
  /** Byte range from its BLOCK record to the end of its ENDBLK record. */
  start: number;
  end: number;
  entities: EntityEntry[];
}

export interface Section {
  name: string;
  /** Byte range from "0 SECTION" to the end of "0 ENDSEC". */
  start: number;
  end: number;
}

export interface ScannedDxf {
  sections: Section[];
  /** Layer names of the LAYER table. */
  layerNames: string[];
  blocks: BlockEntry[];
  entities: EntityEntry[];
}

/** Text of a byte range in the drawing's encoding. */
export type Decode = (bytes: Uint8Array) => string;

/**
 * Scans a drawing's bytes; names are decoded with `decode`. A group code line must hold an integer and nothing
 * else ("1e308" or "10.5" is damage, not code 1 or 10): anything else is a one-line error naming the line.
 */
export function scanDxf(bytes: Uint8Array, decode: Decode, limits: Pick<InputLimits, 'entities' | 'textLength'> = DEFAULT_INPUT_LIMITS): ScannedDxf {
  const c = new GroupCursor(bytes);
  const next = (): boolean => {
    if (!c.next()) return false;
    if (Number.isNaN(c.code)) {
      const line = new TextDecoder('latin1').decode(bytes.subarray(c.start, c.valueStart)).split('\n')[0]!.trim();
      throw new InputError(`line ${c.line()}: "${line.slice(0, 20)}" is not a group code (the file is damaged)`);
    }
    if (c.valueEnd - c.valueStart > limits.textLength) {
      fail(`line ${c.line() + 1}: a value of ${c.valueEnd - c.valueStart} bytes, over the limit of ${limits.textLength} (inputLimits.textLength)`);
    }
    return true;
  };
  // Entity types, layer and block names repeat across a drawing: each distinct name is decoded once, found
  // again by a hash of its bytes (no string made per entity).
  const names = new Map<number, { start: number; end: number; name: string }[]>();
  const sharedName = () => {
    const { valueStart: s, valueEnd: e } = c;
    let h = e - s;
    for (let i = s; i < e; i++) h = (Math.imul(h, 31) + bytes[i]!) | 0;
    let bucket = names.get(h);
    if (!bucket) names.set(h, (bucket = []));
    for (const k of bucket) if (sameBytes(bytes, k.start, k.end, s, e)) return k.name;
    const name = decode(bytes.subarray(s, e));
    bucket.push({ start: s, end: e, name });
    return name;
  };
  const value = () => c.latin1();
  /** The current code (a call, so that TypeScript does not narrow it across `next`). */
  const codeIs = (n: number) => c.code === n;
  const valueIs = (word: string) => c.valueIs(word);

  const out: ScannedDxf = { sections: [], layerNames: [], blocks: [], entities: [] };
  let more = next();
  /** Reads one entity whose "0 TYPE" group is current, with its trailing records; leaves the next code 0 current. */
  let entityCount = 0;
  const readEntity = (): EntityEntry => {
    if (++entityCount > limits.entities) fail(`more than ${limits.entities} entities (inputLimits.entities)`);
    const e: EntityEntry = { type: sharedName(), layer: '0', start: c.start, end: 0, block: null, copies: 1, closed: false, paperSpace: false, textStart: -1, textEnd: -1 };
    const isInsert = e.type === 'INSERT';
    const isText = e.type === 'TEXT' || e.type === 'MTEXT';
    const isPolyline = e.type === 'LWPOLYLINE' || e.type === 'POLYLINE';
    let columns = 1;
    let rows = 1;
    while ((more = next()) && c.code !== 0) {
      if (c.code === 8) e.layer = sharedName();
      else if (c.code === 67) e.paperSpace = value() === '1';
      else if (isInsert && c.code === 2) e.block = sharedName();
      else if (isInsert && c.code === 70) columns = Math.max(1, Math.floor(Number(value())) || 1);
      else if (isInsert && c.code === 71) rows = Math.max(1, Math.floor(Number(value())) || 1);
      else if (isPolyline && c.code === 70) e.closed = (Number(value()) & 1) === 1;
      else if (isText && c.code === 1) { e.textStart = c.valueStart; e.textEnd = c.valueEnd; }
    }
    // Trailing records (they continue the entity rather than start one) up to the next entity or the end of the section or block.
    while (more && c.code === 0 && (valueIs('ATTRIB') || valueIs('VERTEX') || valueIs('SEQEND'))) {
      while ((more = next()) && c.code !== 0);
    }
    e.copies = columns * rows;
    e.end = more ? c.start : bytes.length;
    return e;
  };
  /** Inside section `name`: true until its ENDSEC; another section or the file's end before it is damage. */
  const within = (name: string) => {
    if (!more) fail(`the ${name} section is not closed by ENDSEC (the file is truncated or damaged)`);
    if (c.code !== 0) return true;
    if (valueIs('ENDSEC')) return false;
    if (valueIs('SECTION') || valueIs('EOF')) fail(`the ${name || 'unnamed'} section is not closed by ENDSEC (the file is damaged)`);
    return true;
  };

  while (more) {
    if (!(c.code === 0 && valueIs('SECTION'))) { more = next(); continue; }
    const start = c.start;
    more = next();
    const name = codeIs(2) ? value().toUpperCase() : '';
    if (codeIs(2)) more = next();
    if (name === 'ENTITIES' || name === 'BLOCKS') {
      while (within(name)) {
        if (c.code !== 0) { more = next(); continue; }
        if (name === 'BLOCKS' && valueIs('BLOCK')) {
          const block: BlockEntry = { name: '', start: c.start, end: 0, entities: [] };
          while ((more = next()) && c.code !== 0) if (c.code === 2 || (c.code === 3 && !block.name)) block.name = sharedName();
          while (more && c.code === 0 && !valueIs('ENDBLK') && !valueIs('ENDSEC') && !valueIs('SECTION') && !valueIs('EOF')) block.entities.push(readEntity());
          if (more && valueIs('ENDBLK')) while ((more = next()) && c.code !== 0);
          block.end = more ? c.start : bytes.length;
          out.blocks.push(block);
        } else if (name === 'ENTITIES') {
          out.entities.push(readEntity());
        } else {
          more = next();
        }
      }
    } else if (name === 'TABLES') {
      while (within(name)) {
        const isLayer = c.code === 0 && valueIs('LAYER');
        more = next();
        if (!isLayer) continue;
        while (more && !codeIs(0) && !codeIs(2)) more = next();
        if (more && codeIs(2)) out.layerNames.push(sharedName());
      }
    } else {
      while (within(name)) more = next();
    }
    more = next();
    out.sections.push({ name, start, end: more ? c.start : bytes.length });
  }
  return out;
}

function sameBytes(b: Uint8Array, s1: number, e1: number, s2: number, e2: number): boolean {
  if (e1 - s1 !== e2 - s2) return false;
  for (let i = 0; i < e1 - s1; i++) if (b[s1 + i] !== b[s2 + i]) return false;
  return true;
}
