// Parses DXF text with dxf-parser, adding what its stock handlers drop (ATTRIB values) and avoiding what hangs
// it on damaged files (its POLYLINE, LWPOLYLINE and table-record loops can spin forever). Failures become one InputError.

import * as dxfParserModule from 'dxf-parser';
import type { IDxf } from 'dxf-parser';
import { ENTITY_HANDLERS } from './entity-handlers.js';
import { InputError } from './errors.js';
import { readGroups } from './groups.js';

/** The parser class: a named export from its ES build (bundlers), the CommonJS default under Node. */
const DxfParser: typeof dxfParserModule.DxfParser =
  (dxfParserModule as { DxfParser?: typeof dxfParserModule.DxfParser }).DxfParser ??
  (dxfParserModule as unknown as { default: typeof dxfParserModule.DxfParser }).default;

export interface ParsedDxf {
  dxf: IDxf;
  /** Layer names of the LAYER table, read here: dxf-parser is not given the TABLES section. */
  layerNames: string[];
}

/**
 * dxf-parser's table-record loops (VPORT, LTYPE, LAYER; 1.1.2) stop advancing at any record of another type, so a
 * damaged TABLES section would hang it, and its API cannot replace them. headcheck needs only the layer names
 * from TABLES: they are read from the group structure, and dxf-parser gets the file without that section.
 */
function splitTables(text: string): { rest: string; layerNames: string[] } {
  const groups = readGroups(text);
  const bad = groups.find((g) => !Number.isInteger(g.code));
  if (bad) {
    const line = text.slice(0, bad.start).split('\n').length;
    throw new InputError(`line ${line}: "${text.slice(bad.start, bad.valueStart).trim().slice(0, 20)}" is not a group code (the file is damaged)`);
  }
  const start = groups.findIndex((g, i) => g.code === 0 && g.value === 'SECTION' && groups[i + 1]?.code === 2 && groups[i + 1]!.value.toUpperCase() === 'TABLES');
  if (start < 0) return { rest: text, layerNames: [] };
  let end = start + 2;
  while (end < groups.length && !(groups[end]!.code === 0 && (groups[end]!.value === 'ENDSEC' || groups[end]!.value === 'EOF'))) end++;
  const layerNames: string[] = [];
  for (let i = start; i < end; i++) {
    if (groups[i]!.code !== 0 || groups[i]!.value !== 'LAYER') continue;
    for (let j = i + 1; j < end && groups[j]!.code !== 0; j++) if (groups[j]!.code === 2) { layerNames.push(groups[j]!.value); break; }
  }
  const cutTo = end < groups.length && groups[end]!.value === 'ENDSEC' ? groups[end]!.end : groups[end - 1]?.end ?? text.length;
  return { rest: text.slice(0, groups[start]!.start) + text.slice(cutTo), layerNames };
}

export function parseDxfText(text: string): ParsedDxf {
  const { rest, layerNames } = splitTables(text);
  const parser = new DxfParser();
  for (const handler of ENTITY_HANDLERS) parser.registerEntityHandler(handler as never);
  let dxf: IDxf | null;
  // dxf-parser logs every group it cannot type to the console; the reader reports problems itself.
  const saved = { log: console.log, warn: console.warn, error: console.error };
  console.log = console.warn = console.error = () => undefined;
  try {
    dxf = parser.parseSync(rest);
  } catch (err) {
    const detail = err instanceof Error ? err.message.split('\n')[0] : String(err);
    throw new InputError(`the DXF could not be parsed: ${detail}`);
  } finally {
    Object.assign(console, saved);
  }
  if (!dxf) throw new InputError('the DXF could not be parsed');
  return { dxf, layerNames };
}
