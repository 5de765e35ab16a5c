// Walks a DXF file's group structure once on its bytes, decoding only the values it needs: sections, layer table,
// each block and entity with its type, layer and byte range (only what matters is parsed), the highest entity handle.

import { DEFAULT_INPUT_LIMITS, type InputLimits } from '../../config/settings.js';
import { fail, InputError } from '../../input-error.js';
import { kindOf } from '../entities/registry.js';
import { CLOSED, PAPER_SPACE, type BlockEntry, type EntityHandles, type EntityTable, type Rows } from '../source.js';
import { GroupCursor, HighestHandle } from './groups.js';
import { NameTable } from './name-table.js';

export interface Section {
  name: string;
  /** Byte range from "0 SECTION" to the end of "0 ENDSEC". */
  start: number;
  end: number;
}

export interface ScannedDxf {
  sections: Section[];
  /** Header variables the reader uses, as written: $INSUNITS and $HANDSEED. */
  insunits: number | null;
  handseed: string | null;
  /** Layer names of the LAYER table. */
  layerNames: string[];
  /** Each distinct type, layer and block name, as the entity table refers to them. */
  names: string[];
  table: EntityTable;
  blocks: BlockEntry[];
  /** Model-space rows: one run per ENTITIES section. */
  modelSpace: Rows[];
  entityHandles: EntityHandles;
}

function tableWithRoom(capacity: number, from?: EntityTable): EntityTable {
  const grow = <T extends Int32Array | Float64Array | Uint8Array>(make: new (n: number) => T, old: T | undefined): T => {
    const t = new make(capacity);
    if (old) t.set(old);
    return t;
  };
  return {
    count: from?.count ?? 0,
    type: grow(Int32Array, from?.type),
    layer: grow(Int32Array, from?.layer),
    block: grow(Int32Array, from?.block),
    copies: grow(Float64Array, from?.copies),
    flags: grow(Uint8Array, from?.flags),
    start: grow(Float64Array, from?.start),
    end: grow(Float64Array, from?.end),
    textStart: grow(Float64Array, from?.textStart),
    textEnd: grow(Float64Array, from?.textEnd),
  };
}

/** Text of a byte range in the drawing's encoding. */
export type Decode = (bytes: Uint8Array) => string;

/**
 * Scans a drawing's bytes; names are decoded with `decode`. A group code line must hold an integer and nothing
 * else ("1e308" or "10.5" is damage, not code 1 or 10): anything else is a one-line error naming the line.
 */
export type { BlockEntry, EntityTable, Rows };

export function scanDxf(
  bytes: Uint8Array,
  decode: Decode,
  limits: Pick<InputLimits, 'entities' | 'textLength'> = DEFAULT_INPUT_LIMITS,
): ScannedDxf {
  const c = new GroupCursor(bytes);
  /**
   * The handles of every entity and of whatever else the ENTITIES sections hold, noted where those groups are read
   * (a test in `next` for every group of the file cost the scan 8-10% on a 25 MB drawing).
   */
  const handles = new HighestHandle(bytes);
  const isHandle = () => c.code === 5 || c.code === 105;
  const next = (): boolean => {
    if (!c.next()) return false;
    if (Number.isNaN(c.code)) {
      const line = new TextDecoder('latin1').decode(bytes.subarray(c.start, c.valueStart)).split('\n')[0]!.trim();
      throw new InputError(`line ${c.line()}: "${line.slice(0, 20)}" is not a group code (the file is damaged)`);
    }
    if (c.valueEnd - c.valueStart > limits.textLength) {
      fail(
        `line ${c.line() + 1}: a value of ${c.valueEnd - c.valueStart} bytes, over the limit of ${limits.textLength} (inputLimits.textLength)`,
      );
    }
    return true;
  };
  const nameTable = new NameTable(bytes, decode);
  const { names } = nameTable;
  const nameIndex = (): number => nameTable.indexOf(c.valueStart, c.valueEnd);
  const sharedName = () => names[nameIndex()]!;
  const value = () => c.latin1();
  /** The current code (a call, so that TypeScript does not narrow it across `next`). */
  const codeIs = (n: number) => c.code === n;
  const valueIs = (word: string) => c.valueIs(word);

  let table = tableWithRoom(1024);
  const out: Omit<ScannedDxf, 'names' | 'table'> = {
    entityHandles: { sections: [], top: null },
    sections: [],
    insunits: null,
    handseed: null,
    layerNames: [],
    blocks: [],
    modelSpace: [],
  };
  let more = next();
  /** Reads one entity whose "0 TYPE" group is current, with its trailing records, into the next row; leaves the next code 0 current. */
  const readEntity = (): void => {
    const row = table.count;
    if (row >= limits.entities) fail(`line ${c.line()}: more than ${limits.entities} entities (inputLimits.entities)`);
    if (row === table.type.length) table = tableWithRoom(2 * row, table);
    const typeIndex = nameIndex();
    const kept = kindOf(names[typeIndex]!)?.scan;
    const isInsert = kept?.block === true;
    const isText = kept?.label === true;
    const isPolyline = kept?.closedBit === true;
    table.type[row] = typeIndex;
    table.start[row] = c.start;
    let layer = -1;
    let block = -1;
    let flags = 0;
    let textStart = -1;
    let textEnd = -1;
    let columns = 1;
    let rows = 1;
    while ((more = next()) && c.code !== 0) {
      if (c.code === 8) layer = nameIndex();
      else if (isHandle()) handles.note(c.valueStart, c.valueEnd);
      else if (c.code === 67) flags = value() === '1' ? flags | PAPER_SPACE : flags & ~PAPER_SPACE;
      else if (isInsert && c.code === 2) block = nameIndex();
      else if (isInsert && c.code === 70) columns = Math.max(1, Math.floor(Number(value())) || 1);
      else if (isInsert && c.code === 71) rows = Math.max(1, Math.floor(Number(value())) || 1);
      else if (isPolyline && c.code === 70) flags = (Number(value()) & 1) === 1 ? flags | CLOSED : flags & ~CLOSED;
      else if (isText && c.code === 1) {
        textStart = c.valueStart;
        textEnd = c.valueEnd;
      }
    }
    // Trailing records (they continue the entity rather than start one) up to the next entity or the end of the section or block.
    while (more && c.code === 0 && (valueIs('ATTRIB') || valueIs('VERTEX') || valueIs('SEQEND'))) {
      while ((more = next()) && c.code !== 0) if (isHandle()) handles.note(c.valueStart, c.valueEnd);
    }
    table.layer[row] = layer;
    table.block[row] = block;
    table.copies[row] = columns * rows;
    table.flags[row] = flags;
    table.textStart[row] = textStart;
    table.textEnd[row] = textEnd;
    table.end[row] = more ? c.start : bytes.length;
    table.count = row + 1;
  };
  /** Inside section `name`: true until its ENDSEC; another section or the file's end before it is damage. */
  const within = (name: string) => {
    if (!more) fail(`line ${c.line()}: the ${name} section is not closed by ENDSEC (the file is truncated or damaged)`);
    if (c.code !== 0) return true;
    if (valueIs('ENDSEC')) return false;
    if (valueIs('SECTION') || valueIs('EOF'))
      fail(`line ${c.line()}: the ${name || 'unnamed'} section is not closed by ENDSEC before this ${c.latin1()} (the file is damaged)`);
    return true;
  };

  // Bytes after the EOF group (a DOS end-of-file byte, blank lines, trailing text) are no part of the drawing.
  while (more && !(c.code === 0 && valueIs('EOF'))) {
    if (!(c.code === 0 && valueIs('SECTION'))) {
      more = next();
      continue;
    }
    const start = c.start;
    more = next();
    const name = codeIs(2) ? value().toUpperCase() : '';
    if (codeIs(2)) more = next();
    if (name === 'ENTITIES' || name === 'BLOCKS') {
      const model: Rows = { first: table.count, end: table.count };
      while (within(name)) {
        if (c.code !== 0) {
          if (name === 'ENTITIES' && isHandle()) handles.note(c.valueStart, c.valueEnd);
          more = next();
          continue;
        }
        if (name === 'BLOCKS' && valueIs('BLOCK')) {
          const block: BlockEntry = { name: '', start: c.start, end: 0, rows: { first: table.count, end: table.count } };
          // Its name is group 2 (a block without one cannot be referenced, and is not decoded).
          while ((more = next()) && c.code !== 0) if (c.code === 2) block.name = sharedName();
          while (more && c.code === 0 && !valueIs('ENDBLK') && !valueIs('ENDSEC') && !valueIs('SECTION') && !valueIs('EOF')) readEntity();
          block.rows.end = table.count;
          if (more && valueIs('ENDBLK')) while ((more = next()) && c.code !== 0);
          block.end = more ? c.start : bytes.length;
          out.blocks.push(block);
        } else if (name === 'ENTITIES') {
          readEntity();
        } else {
          more = next();
        }
      }
      model.end = table.count;
      if (name === 'ENTITIES') {
        out.modelSpace.push(model);
        out.entityHandles.sections.push({ begin: start, endsec: c.start });
      }
    } else if (name === 'TABLES') {
      while (within(name)) {
        const isLayer = c.code === 0 && valueIs('LAYER');
        more = next();
        if (!isLayer) continue;
        while (more && !codeIs(0) && !codeIs(2)) more = next();
        if (more && codeIs(2)) out.layerNames.push(sharedName());
      }
    } else if (name === 'HEADER') {
      let variable = '';
      while (within(name)) {
        if (codeIs(9)) variable = value();
        else if (variable === '$INSUNITS' && codeIs(70)) out.insunits = Number(value());
        else if (variable === '$HANDSEED' && codeIs(5)) out.handseed = value();
        more = next();
      }
    } else {
      while (within(name)) more = next();
    }
    more = next();
    out.sections.push({ name, start, end: more ? c.start : bytes.length });
  }
  out.entityHandles.top = handles.text();
  return { ...out, names, table };
}
