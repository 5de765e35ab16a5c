// Decides which layers hold heads, pipes, walls, design areas and the source: the config's patterns
// where given, else a guess from layer names and geometry, with the reason kept for `headcheck layers`.

import { compilePatterns } from '../config/patterns.js';
import { LAYER_ROLES, type LayerRole } from '../config/settings.js';
import type { Drawing } from './types.js';

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

export function assignLayerRoles(drawing: Drawing, patterns: Partial<Record<LayerRole, string[]>>): LayerRoles {
  const out = {} as LayerRoles;
  for (const role of LAYER_ROLES) {
    const given = patterns[role];
    if (given) {
      const match = compilePatterns(given);
      out[role] = {
        layers: drawing.layers.map((l) => l.name).filter(match),
        from: 'config',
        reason: `config patterns ${given.join(', ')}`,
      };
    }
  }
  const taken = new Set(Object.values(out).flatMap((c) => c.layers));
  for (const role of LAYER_ROLES) {
    if (out[role]) continue;
    out[role] = guessRole(drawing, role, taken);
    for (const l of out[role].layers) taken.add(l);
  }
  return out;
}

function guessRole(drawing: Drawing, role: LayerRole, taken: Set<string>): RoleChoice {
  const free = drawing.layers.filter((l) => !taken.has(l.name));
  const byName = free.filter((l) => NAME_HINTS[role].test(l.name) && Object.keys(l.counts).length > 0);
  const geometric = free.filter((l) => looksLike(drawing, role, l.name));
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
function looksLike(drawing: Drawing, role: LayerRole, layer: string): boolean {
  switch (role) {
    case 'heads': {
      const perBlock = new Map<string, number>();
      for (const r of drawing.refs) if (r.layer === layer && !r.hasNestedRefs) perBlock.set(r.block, (perBlock.get(r.block) ?? 0) + 1);
      return Math.max(0, ...perBlock.values()) >= 3;
    }
    case 'pipes':
      return drawing.strokes.some((s) => s.layer === layer);
    case 'walls':
    case 'designArea':
      return drawing.outlines.some((o) => o.layer === layer) || drawing.strokes.some((s) => s.layer === layer);
    case 'source':
      return drawing.refs.some((r) => r.layer === layer) || drawing.points.some((p) => p.layer === layer);
  }
}
