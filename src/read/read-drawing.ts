// The read stage: drawing bytes to a Drawing (every layer summarized, roles assigned, and in world geometry,
// feet, what the roles need: head and source symbols, pipe and wall linework, room and area outlines, labels). Pure: no file access, so it runs the same in the CLI, a worker and the browser.

import { DEFAULT_INPUT_LIMITS, LAYER_ROLES, type InputLimits, type LayerRole } from '../config/settings.js';
import { fail } from '../input-error.js';
import { dxfSource } from './dxf/dxf-source.js';
import { flatten } from './flatten.js';
import { gatherEvidence, type Evidence } from './evidence.js';
import { assignLayerRoles, couldBeSizeLabel, isLabelLayer, onRoles, type HeadCandidate, type LayerRoles } from './layer-roles.js';
import { summarizeLayers } from './layer-summary.js';
import { decodeSelected } from './select.js';
import type { DrawingSource } from './source.js';
import type { Drawing, LayerSummary, LengthUnit } from './types.js';
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
  const { raw, layers, roles, headCandidates, header, encoding, entityHandles } = decodeByRole(bytes, options, limits);
  const fromHeader = unitFromInsunits(header.insunits);
  const units = options.units ?? fromHeader;
  if (!units) {
    fail('the drawing does not state its length unit ($INSUNITS is missing or unitless); set "units" in the config (in, ft, mm, cm or m)');
  }
  const flat = flatten(raw, FEET_PER_UNIT[units!], limits, {
    refs: onRoles(roles, 'heads', 'source'),
    strokes: onRoles(roles, 'pipes', 'walls'),
    outlines: onRoles(roles, 'walls', 'designArea', 'zones'),
    texts: (layer) => isLabelLayer(layer, roles) || roles.zones.layers.includes(layer),
    points: onRoles(roles, 'source'),
    symbols: onRoles(roles, 'heads'),
  });
  return {
    version: header.version,
    units: units!,
    unitsFrom: options.units ? 'config' : 'header',
    headerUnits: fromHeader,
    encoding,
    handseed: header.handseed,
    entityHandles,
    layers,
    roles,
    headCandidates,
    refs: flat.refs,
    strokes: flat.strokes,
    outlines: flat.outlines,
    texts: flat.texts,
    points: flat.points,
    symbols: flat.symbols,
  };
}

/**
 * Scans the file, assigns the layer roles, and decodes what they need. A function of its own so that the scan,
 * the largest thing read, is garbage once it returns.
 */
function decodeByRole(bytes: Uint8Array, options: ReadOptions, limits: InputLimits) {
  const { source, layers, roles, headCandidates } = inspectSource(dxfSource(bytes, limits), options, limits);
  const raw = decodeSelected(
    source,
    {
      layer: onRoles(roles, ...LAYER_ROLES),
      label: (l, text) => isLabelLayer(l, roles) && couldBeSizeLabel(text),
    },
    limits.expandedEntities,
  );
  return { raw, layers, roles, headCandidates, header: source.header, encoding: source.encoding, entityHandles: source.entityHandles };
}

/** What a drawing holds and the role of each layer, without reading any geometry (`headcheck layers`). */
export interface Inspection {
  source: DrawingSource;
  layers: LayerSummary[];
  roles: LayerRoles;
  headCandidates: HeadCandidate[];
  evidence: Evidence;
  /** The drawing unit (the option's, else the header's), or null when neither states one. */
  units: LengthUnit | null;
}

export function inspectDrawing(bytes: Uint8Array, options: ReadOptions = {}): Inspection {
  const limits = options.limits ?? DEFAULT_INPUT_LIMITS;
  if (bytes.length > limits.fileMB * 1024 * 1024) fail(`larger than ${limits.fileMB} MiB (inputLimits.fileMB)`);
  return inspectSource(dxfSource(bytes, limits), options, limits);
}

function inspectSource(source: DrawingSource, options: ReadOptions, limits: InputLimits): Inspection {
  const layers = summarizeLayers(source, limits.blockDepth);
  const units = options.units ?? unitFromInsunits(source.header.insunits);
  const evidence = gatherEvidence(source);
  const { roles, headCandidates } = assignLayerRoles({
    layers,
    patterns: options.layers ?? {},
    evidence,
    feetPerUnit: units ? FEET_PER_UNIT[units] : null,
  });
  checkHeadCount(layers, roles, limits.heads);
  return { source, layers, roles, headCandidates, evidence, units };
}

/** The head layers' symbols, counted through arrays and nesting before any is expanded, against the limit. */
function checkHeadCount(layers: LayerSummary[], roles: LayerRoles, limit: number): void {
  for (const l of layers) {
    if (!roles.heads.layers.includes(l.name)) continue;
    for (const [block, count] of Object.entries(l.symbolRefs)) {
      if (count > limit)
        fail(`layer "${l.name}" places block "${block}" ${count} times, over the limit of ${limit} heads (inputLimits.heads)`);
    }
  }
}
