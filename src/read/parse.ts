// Parses DXF text with dxf-parser, adding what its stock handlers drop: ATTRIB values (tag, value) that
// follow a block reference. Any parser failure becomes a one-line InputError.

import * as dxfParserModule from 'dxf-parser';
import type { IDxf, IEntity } from 'dxf-parser';
import { InputError } from './errors.js';

export interface AttribEntity extends IEntity {
  tag: string;
  value: string;
}

interface Group {
  code: number;
  value: number | string | boolean;
}
interface Scanner {
  next(): Group;
  isEOF(): boolean;
}

/** dxf-parser handler for ATTRIB: the stock parser skips these, losing head K-factors and elevations. */
class AttribHandler {
  readonly ForEntityName = 'ATTRIB';
  parseEntity(scanner: Scanner, curr: Group): IEntity {
    const entity = { type: 'ATTRIB', tag: '', value: '' } as unknown as AttribEntity;
    curr = scanner.next();
    while (!scanner.isEOF() && curr.code !== 0) {
      if (curr.code === 1) entity.value = String(curr.value);
      else if (curr.code === 2) entity.tag = String(curr.value);
      else if (curr.code === 5) entity.handle = curr.value as unknown as number;
      else if (curr.code === 8) entity.layer = String(curr.value);
      else if (curr.code === 330) entity.ownerHandle = String(curr.value);
      else if (curr.code === 67) entity.inPaperSpace = curr.value === 1 || curr.value === true;
      curr = scanner.next();
    }
    return entity;
  }
}

/** The parser class: a named export from its ES build (bundlers), the CommonJS default under Node. */
const DxfParser: typeof dxfParserModule.DxfParser =
  (dxfParserModule as { DxfParser?: typeof dxfParserModule.DxfParser }).DxfParser ??
  (dxfParserModule as unknown as { default: typeof dxfParserModule.DxfParser }).default;

export function parseDxfText(text: string): IDxf {
  const parser = new DxfParser();
  parser.registerEntityHandler(AttribHandler as never);
  let dxf: IDxf | null;
  try {
    dxf = parser.parseSync(text);
  } catch (err) {
    const detail = err instanceof Error ? err.message.split('\n')[0] : String(err);
    throw new InputError(`the DXF could not be parsed: ${detail}`);
  }
  if (!dxf) throw new InputError('the DXF could not be parsed');
  return dxf;
}
