// Parses DXF text with dxf-parser, adding what its stock handlers drop (ATTRIB values) and avoiding what hangs
// it on damaged files (its POLYLINE and LWPOLYLINE loops; its table-record loops never see a TABLES section,
// which the scan reads instead). Failures become one InputError.

import * as dxfParserModule from 'dxf-parser';
import type { IDxf } from 'dxf-parser';
import { ENTITY_HANDLERS } from './entity-handlers.js';
import { InputError } from '../input-error.js';

/** The parser class: a named export from its ES build (bundlers), the CommonJS default under Node. */
const DxfParser: typeof dxfParserModule.DxfParser =
  (dxfParserModule as { DxfParser?: typeof dxfParserModule.DxfParser }).DxfParser ??
  (dxfParserModule as unknown as { default: typeof dxfParserModule.DxfParser }).default;

/** Parses DXF text (as `selectedText` cuts it: header, blocks and entities) into dxf-parser's model. */
export function parseDxfText(text: string): IDxf {
  const parser = new DxfParser();
  for (const handler of ENTITY_HANDLERS) parser.registerEntityHandler(handler as never);
  let dxf: IDxf | null;
  // dxf-parser logs every group it cannot type to the console; the reader reports problems itself.
  const saved = { log: console.log, warn: console.warn, error: console.error };
  console.log = console.warn = console.error = () => undefined;
  try {
    dxf = parser.parseSync(text);
  } catch (err) {
    const detail = err instanceof Error ? err.message.split('\n')[0] : String(err);
    throw new InputError(`the DXF could not be parsed: ${detail}`);
  } finally {
    Object.assign(console, saved);
  }
  if (!dxf) throw new InputError('the DXF could not be parsed');
  return dxf;
}
