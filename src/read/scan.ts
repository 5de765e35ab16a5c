// Walks a DXF file's group structure once, reading only the values it needs: the sections, the layer table,
// and each block and entity with its type, layer and text range, so that only what matters is parsed.

import { DEFAULT_INPUT_LIMITS, type InputLimits } from '../config/settings.js';
import { fail, InputError } from './errors.js';
import { groupCode, isBlank } from './groups.js';

/** One entity with the ATTRIB, VERTEX and SEQEND records that belong to it. */
export interface EntityEntry {
  type: string;
  /** Layer name as written (\U+ escapes not yet decoded); "0" when none is given. */
  layer: string;
  /** Text range of the entity and its trailing records. */
  start: number;
  end: number;
  /** INSERT: the block name, and how many copies a MINSERT array places (columns × rows). */
  block: string | null;
  copies: number;
  /** Closed LWPOLYLINE or POLYLINE. */
  closed: boolean;
  paperSpace: boolean;
  /** TEXT and MTEXT: the value as written (MTEXT: its last chunk, group 1), else null. */
  text: string | null;
}

export interface BlockEntry {
  name: string;
  /** Text range from its BLOCK record to the end of its ENDBLK record. */
  start: number;
  end: number;
  entities: EntityEntry[];
}

export interface Section {
  name: string;
  /** Text range from "0 SECTION" to the end of "0 ENDSEC". */
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

/** Records that continue the entity before them rather than start one. */
const TRAILING = new Set(['ATTRIB', 'VERTEX', 'SEQEND']);

/**
 * Scans `text`. A group code line must hold an integer and nothing else ("1e308" or "10.5" is damage, not code
 * 1 or 10): anything else is a one-line error naming the line.
 */
export function scanDxf(text: string, limits: Pick<InputLimits, 'entities' | 'textLength'> = DEFAULT_INPUT_LIMITS): ScannedDxf {
  const n = text.length;
  let at = 0;
  // The current group: code, and the value's range (without line break and surrounding blanks).
  let code = 0;
  let groupStart = 0;
  let valueStart = 0;
  let valueEnd = 0;
  const lineEnd = (from: number) => { const e = text.indexOf('\n', from); return e < 0 ? n : e; };
  /** Reads the next group; false at the end of the text. */
  const next = (): boolean => {
    if (at >= n) return false;
    groupStart = at;
    const ce = lineEnd(at);
    code = groupCode(text, at, ce);
    if (Number.isNaN(code)) {
      if (ce >= n && text.slice(at, ce).trim() === '') return false;
      const line = text.slice(0, at).split('\n').length;
      throw new InputError(`line ${line}: "${text.slice(at, ce).trim().slice(0, 20)}" is not a group code (the file is damaged)`);
    }
    const vs = Math.min(ce + 1, n);
    const ve = lineEnd(vs);
    at = Math.min(ve + 1, n);
    valueStart = vs;
    valueEnd = ve;
    while (valueStart < valueEnd && isBlank(text.charCodeAt(valueStart))) valueStart++;
    while (valueEnd > valueStart && isBlank(text.charCodeAt(valueEnd - 1))) valueEnd--;
    if (valueEnd - valueStart > limits.textLength) {
      fail(`line ${text.slice(0, vs).split('\n').length}: a value of ${valueEnd - valueStart} characters, over the limit of ${limits.textLength} (inputLimits.textLength)`);
    }
    return true;
  };
  const value = () => text.slice(valueStart, valueEnd);
  // Entity types, layer and block names repeat across a drawing: one copy of each, not a slice of the file's
  // text per entity (a slice would also keep the whole text alive for as long as any name is in use).
  const names = new Map<string, string>();
  const sharedName = () => {
    const v = value();
    let kept = names.get(v);
    if (kept === undefined) names.set(v, (kept = [...v].join('')));
    return kept;
  };
  /** The current code (a call, so that TypeScript does not narrow it across `next`). */
  const codeIs = (c: number) => code === c;
  const valueIs = (word: string) => valueEnd - valueStart === word.length && text.startsWith(word, valueStart);

  const out: ScannedDxf = { sections: [], layerNames: [], blocks: [], entities: [] };
  let more = next();
  /** Reads one entity whose "0 TYPE" group is current, with its trailing records; leaves the next code 0 current. */
  let entityCount = 0;
  const readEntity = (): EntityEntry => {
    if (++entityCount > limits.entities) fail(`more than ${limits.entities} entities (inputLimits.entities)`);
    const e: EntityEntry = { type: sharedName(), layer: '0', start: groupStart, end: 0, block: null, copies: 1, closed: false, paperSpace: false, text: null };
    const isInsert = e.type === 'INSERT';
    const isText = e.type === 'TEXT' || e.type === 'MTEXT';
    const isPolyline = e.type === 'LWPOLYLINE' || e.type === 'POLYLINE';
    let columns = 1;
    let rows = 1;
    while ((more = next()) && code !== 0) {
      if (code === 8) e.layer = sharedName();
      else if (code === 67) e.paperSpace = value() === '1';
      else if (isInsert && code === 2) e.block = sharedName();
      else if (isInsert && code === 70) columns = Math.max(1, Math.floor(Number(value())) || 1);
      else if (isInsert && code === 71) rows = Math.max(1, Math.floor(Number(value())) || 1);
      else if (isPolyline && code === 70) e.closed = (Number(value()) & 1) === 1;
      else if (isText && code === 1) e.text = value();
    }
    // Trailing records up to the next entity or the end of the section or block.
    while (more && code === 0 && TRAILING.has(value())) {
      while ((more = next()) && code !== 0);
    }
    e.copies = columns * rows;
    e.end = more ? groupStart : n;
    return e;
  };
  /** Inside section `name`: true until its ENDSEC; another section or the file's end before it is damage. */
  const within = (name: string) => {
    if (!more) fail(`the ${name} section is not closed by ENDSEC (the file is truncated or damaged)`);
    if (code !== 0) return true;
    if (valueIs('ENDSEC')) return false;
    if (valueIs('SECTION') || valueIs('EOF')) fail(`the ${name || 'unnamed'} section is not closed by ENDSEC (the file is damaged)`);
    return true;
  };

  while (more) {
    if (!(code === 0 && valueIs('SECTION'))) { more = next(); continue; }
    const start = groupStart;
    more = next();
    const name = codeIs(2) ? value().toUpperCase() : '';
    if (codeIs(2)) more = next();
    if (name === 'ENTITIES' || name === 'BLOCKS') {
      while (within(name)) {
        if (code !== 0) { more = next(); continue; }
        if (name === 'BLOCKS' && valueIs('BLOCK')) {
          const block: BlockEntry = { name: '', start: groupStart, end: 0, entities: [] };
          while ((more = next()) && code !== 0) if (code === 2 || (code === 3 && !block.name)) block.name = sharedName();
          while (more && code === 0 && !valueIs('ENDBLK') && !valueIs('ENDSEC') && !valueIs('SECTION') && !valueIs('EOF')) block.entities.push(readEntity());
          if (more && valueIs('ENDBLK')) while ((more = next()) && code !== 0);
          block.end = more ? groupStart : n;
          out.blocks.push(block);
        } else if (name === 'ENTITIES') {
          out.entities.push(readEntity());
        } else {
          more = next();
        }
      }
    } else if (name === 'TABLES') {
      while (within(name)) {
        const isLayer = code === 0 && valueIs('LAYER');
        more = next();
        if (!isLayer) continue;
        while (more && !codeIs(0) && !codeIs(2)) more = next();
        if (more && codeIs(2)) out.layerNames.push(sharedName());
      }
    } else {
      while (within(name)) more = next();
    }
    more = next();
    out.sections.push({ name, start, end: more ? groupStart : n });
  }
  return out;
}
