// Decides which layers hold heads, pipes, walls, design areas and the source: the config's patterns
// where given, else a guess from layer names and geometry, with the reason kept for `headcheck layers`.

import { compilePatterns } from '../config/patterns.js';
import { LAYER_ROLES, type LayerRole } from '../config/settings.js';
import type { LayerSummary } from './types.js';

export interface RoleChoice {
  layers: string[];
  /** `config` when patterns were given, `guess` otherwise. */
  from: 'config' | 'guess';
  reason: string;
}

export type LayerRoles = Record<LayerRole, RoleChoice>;

/** Layer-name hints per role (common CAD layer naming, e.g. the US National CAD Standard's discipline codes). */
const NAME_HINTS: Record<LayerRole, RegExp> = {
  heads: /head|spk|sprink|sprnk|nozzle|kopf|t[eê]te/i,
  pipes: /pipe|piping|main|branch|spk-p|rohr|tuyau/i,
  walls: /wall|a-wal|mur|wand|partition/i,
  designArea: /remote|design.?area|calc.?area|hyd.?area|fp-area/i,
  source: /riser|source|supply|poc|fdc|steig/i,
};

export function assignLayerRoles(layers: LayerSummary[], patterns: Partial<Record<LayerRole, string[]>>): LayerRoles {
  const out = {} as LayerRoles;
  for (const role of LAYER_ROLES) {
    const given = patterns[role];
    if (given) {
      const match = compilePatterns(given);
      out[role] = {
        layers: layers.map((l) => l.name).filter(match),
        from: 'config',
        reason: `config patterns ${given.join(', ')}`,
      };
    }
  }
  const taken = new Set(Object.values(out).flatMap((c) => c.layers));
  for (const role of LAYER_ROLES) {
    if (out[role]) continue;
    out[role] = guessRole(layers, role, taken);
    for (const l of out[role].layers) taken.add(l);
  }
  return out;
}

function guessRole(layers: LayerSummary[], role: LayerRole, taken: Set<string>): RoleChoice {
  const free = layers.filter((l) => !taken.has(l.name));
  const byName = free.filter((l) => NAME_HINTS[role].test(l.name) && Object.keys(l.counts).length > 0);
  const geometric = free.filter((l) => looksLike(l, role));
  const both = byName.filter((l) => geometric.includes(l));
  const pick = both.length ? both : role === 'heads' && !byName.length ? geometric.slice(0, 1) : byName;
  const reason = both.length
    ? 'name and content'
    : pick === byName && pick.length
      ? 'layer name'
      : pick.length
        ? 'content (many identical small block references)'
        : 'no layer looks like it';
  return { layers: pick.map((l) => l.name), from: 'guess', reason };
}

/** Geometry signatures: heads are many references to one block; pipes are linework; walls and areas are outlines. */
function looksLike(layer: LayerSummary, role: LayerRole): boolean {
  switch (role) {
    case 'heads':
      return Math.max(0, ...Object.values(layer.symbolRefs)) >= 3;
    case 'pipes':
      return layer.strokes > 0;
    case 'walls':
    case 'designArea':
      return layer.outlines > 0 || layer.strokes > 0;
    case 'source':
      return layer.refs > 0 || layer.points > 0;
  }
}

/** Whether a layer plays any of the given roles. */
export function onRoles(roles: LayerRoles, ...which: LayerRole[]): (layer: string) => boolean {
  const set = new Set(which.flatMap((role) => roles[role].layers));
  return (layer) => set.has(layer);
}

/** Layers whose texts may be pipe-size labels: the pipe layers, and layers named for sizes, dimensions or notes. */
export function isLabelLayer(layer: string, roles: LayerRoles): boolean {
  return roles.pipes.layers.includes(layer) || /size|pipe|dim|text|anno/i.test(layer);
}

/**
 * Whether a text as written could state a pipe size: an inch mark, a number with in, inch or mm, DN and a
 * number, or a fraction sign (plain or as a \U+ escape). A loose test that every size label passes (1",
 * 1-1/4", 2½", DN32, 32mm), so that notes and room names are not read at all.
 */
export const couldBeSizeLabel = (raw: string): boolean =>
  /["\u2033]|''|\d\s*(?:in\b|inch|mm\b)|\bdn\s*\d|[\u00bc-\u00be]|\\U\+00B[C-E]/i.test(raw);
