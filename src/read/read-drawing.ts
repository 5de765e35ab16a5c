// The read stage: drawing bytes to a Drawing (every layer summarized, roles assigned, and in world geometry,
// feet, what the roles need: head and source symbols, pipe and wall linework, room and area outlines, labels). Pure: no file access, so it runs the same in the CLI, a worker and the browser.

import { DEFAULT_INPUT_LIMITS, LAYER_ROLES, type InputLimits, type LayerRole } from '../config/settings.js';
import { drawingEncoding, textDecoder } from './decode.js';
import { fail } from '../input-error.js';
import { flattenDxf } from './flatten.js';
import { assignLayerRoles, couldBeSizeLabel, isLabelLayer, onRoles } from './layer-roles.js';
import { summarizeLayers } from './layer-summary.js';
import { parseDxfText } from './parse.js';
import { scanDxf } from './scan.js';
import { selectedText } from './select.js';
import type { Drawing, LengthUnit } from './types.js';
import { FEET_PER_UNIT, unitFromInsunits } from './units.js';

export interface ReadOptions {
  /** The drawing's length unit; overrides `$INSUNITS`. */
  units?: LengthUnit;
  /** Layer patterns per role (the config's `layers`); roles without are guessed. */
  layers?: Partial<Record<LayerRole, string[]>>;
  limits?: InputLimits;
}

export function readDrawing(bytes: Uint8Array, options: ReadOptions = {}): Drawing {
  const limits = options.limits ?? DEFAULT_INPUT_LIMITS;
  if (bytes.length > limits.fileMB * 1024 * 1024) fail(`larger than ${limits.fileMB} MiB (inputLimits.fileMB)`);
  const { dxf, layers, roles, version, encoding } = parseByRole(bytes, options.layers ?? {}, limits);
  const header = dxf.header ?? {};
  const fromHeader = unitFromInsunits(header['$INSUNITS']);
  const units = options.units ?? fromHeader;
  if (!units) {
    fail('the drawing does not state its length unit ($INSUNITS is missing or unitless); set "units" in the config (in, ft, mm, cm or m)');
  }
  const flat = flattenDxf(dxf, FEET_PER_UNIT[units!], limits, {
    refs: onRoles(roles, 'heads', 'source'), strokes: onRoles(roles, 'pipes', 'walls'), outlines: onRoles(roles, 'walls', 'designArea'),
    texts: (layer) => isLabelLayer(layer, roles), points: onRoles(roles, 'source'),
  });
  const handseed = header['$HANDSEED'];
  return {
    version,
    units: units!,
    unitsFrom: options.units ? 'config' : 'header',
    headerUnits: fromHeader,
    encoding,
    handseed: typeof handseed === 'string' ? handseed : handseed === undefined ? null : String(handseed),
    layers,
    roles,
    refs: flat.refs,
    strokes: flat.strokes,
    outlines: flat.outlines,
    texts: flat.texts,
    points: flat.points,
  };
}

/**
 * Scans the file, assigns the layer roles, and decodes and parses what they need. A function of its own so
 * that the scan and the selected text, the largest things read, are garbage once it returns.
 */
function parseByRole(bytes: Uint8Array, patterns: Partial<Record<LayerRole, string[]>>, limits: InputLimits) {
  const { encoding, version } = drawingEncoding(bytes);
  const decode = textDecoder(encoding);
  const scan = scanDxf(bytes, decode, limits);
  const layers = summarizeLayers(scan, limits.blockDepth);
  const roles = assignLayerRoles(layers, patterns);
  const dxf = parseDxfText(selectedText(bytes, scan, {
    layer: onRoles(roles, ...LAYER_ROLES),
    label: (l, text) => isLabelLayer(l, roles) && couldBeSizeLabel(text),
  }, decode));
  return { dxf, layers, roles, version, encoding };
}
