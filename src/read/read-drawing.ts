// The read stage: drawing bytes to a Drawing (world geometry in feet, layers, units, encoding).
// Pure: no file access, so it runs the same in the CLI, a worker and the browser.

import { decodeDrawing } from './decode.js';
import { fail } from './errors.js';
import { DEFAULT_FLATTEN_LIMITS, flattenDxf, type FlattenLimits } from './flatten.js';
import { parseDxfText } from './parse.js';
import { decodeUnicodeEscapes } from './text-codes.js';
import type { Drawing, LayerSummary, LengthUnit } from './types.js';
import { FEET_PER_UNIT, unitFromInsunits } from './units.js';

export interface ReadOptions {
  /** The drawing's length unit; overrides `$INSUNITS`. */
  units?: LengthUnit;
  limits?: FlattenLimits;
}

export function readDrawing(bytes: Uint8Array, options: ReadOptions = {}): Drawing {
  const decoded = decodeDrawing(bytes);
  const { dxf, layerNames } = parseDxfText(decoded.text);
  const header = dxf.header ?? {};
  const fromHeader = unitFromInsunits(header['$INSUNITS']);
  const units = options.units ?? fromHeader;
  if (!units) {
    fail('the drawing does not state its length unit ($INSUNITS is missing or unitless); set "units" in the config (in, ft, mm, cm or m)');
  }
  const flat = flattenDxf(dxf, FEET_PER_UNIT[units!], options.limits ?? DEFAULT_FLATTEN_LIMITS);
  const tableLayers = layerNames.map(decodeUnicodeEscapes);
  const names = new Set([...tableLayers, ...flat.counts.keys()]);
  const layers: LayerSummary[] = [...names]
    .sort((a, b) => a.localeCompare(b))
    .map((name) => ({ name, counts: flat.counts.get(name) ?? {} }));
  const handseed = header['$HANDSEED'];
  return {
    version: decoded.version,
    units: units!,
    unitsFrom: options.units ? 'config' : 'header',
    encoding: decoded.encoding,
    handseed: typeof handseed === 'string' ? handseed : handseed === undefined ? null : String(handseed),
    layers,
    refs: flat.refs,
    strokes: flat.strokes,
    outlines: flat.outlines,
    texts: flat.texts,
    points: flat.points,
  };
}
