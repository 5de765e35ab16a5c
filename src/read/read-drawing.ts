// The read stage: drawing bytes to a Drawing (every layer summarized, roles assigned, and in world geometry,
// feet, what the roles need: head and source symbols, pipe and wall linework, room and area outlines, labels). Pure: no file access, so it runs the same in the CLI, a worker and the browser.

import { DEFAULT_INPUT_LIMITS, LAYER_ROLES, type InputLimits, type LayerRole } from '../config/settings.js';
import { fail } from '../input-error.js';
import { dxfSource } from './dxf/dxf-source.js';
import { flatten } from './flatten.js';
import { assignLayerRoles, couldBeSizeLabel, isLabelLayer, onRoles } from './layer-roles.js';
import { summarizeLayers } from './layer-summary.js';
import { decodeSelected } from './select.js';
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
  const { raw, layers, roles, header, encoding } = decodeByRole(bytes, options.layers ?? {}, limits);
  const fromHeader = unitFromInsunits(header.insunits);
  const units = options.units ?? fromHeader;
  if (!units) {
    fail('the drawing does not state its length unit ($INSUNITS is missing or unitless); set "units" in the config (in, ft, mm, cm or m)');
  }
  const flat = flatten(raw, FEET_PER_UNIT[units!], limits, {
    refs: onRoles(roles, 'heads', 'source'), strokes: onRoles(roles, 'pipes', 'walls'), outlines: onRoles(roles, 'walls', 'designArea'),
    texts: (layer) => isLabelLayer(layer, roles), points: onRoles(roles, 'source'),
  });
  return {
    version: header.version,
    units: units!,
    unitsFrom: options.units ? 'config' : 'header',
    headerUnits: fromHeader,
    encoding,
    handseed: header.handseed,
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
 * Scans the file, assigns the layer roles, and decodes what they need. A function of its own so that the scan,
 * the largest thing read, is garbage once it returns.
 */
function decodeByRole(bytes: Uint8Array, patterns: Partial<Record<LayerRole, string[]>>, limits: InputLimits) {
  const source = dxfSource(bytes, limits);
  const layers = summarizeLayers(source, limits.blockDepth);
  const roles = assignLayerRoles(layers, patterns);
  const raw = decodeSelected(source, {
    layer: onRoles(roles, ...LAYER_ROLES),
    label: (l, text) => isLabelLayer(l, roles) && couldBeSizeLabel(text),
  });
  return { raw, layers, roles, header: source.header, encoding: source.encoding };
}
