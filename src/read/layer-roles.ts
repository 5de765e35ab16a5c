// Decides which layers hold heads, pipes, walls, design areas and the source: the config's patterns where
// given, else a guess that weighs evidence and keeps its reasons (and the head candidates it turned down).

import { compilePatterns } from '../config/patterns.js';
import { LAYER_ROLES, type LayerRole } from '../config/settings.js';
import type { Evidence } from './evidence.js';
import type { LayerSummary } from './types.js';

export interface RoleChoice {
  layers: string[];
  /** `config` when patterns were given, `guess` otherwise. */
  from: 'config' | 'guess';
  reason: string;
  /** Heads guessed from blocks: the blocks taken as head symbols (empty: heads drawn as circles or points). */
  blocks?: string[];
}

export type LayerRoles = Record<LayerRole, RoleChoice>;

/** A layer's best head symbol as the guess weighed it, taken or not and why. */
export interface HeadCandidate {
  layer: string;
  /** The block, or null for plain circles on the layer. */
  block: string | null;
  count: number;
  /** Extent across in drawing units, when known. */
  size: number | null;
  taken: boolean;
  why: string;
}

/** Layer-name hints per role (common CAD layer naming, e.g. the US National CAD Standard's discipline codes). */
const NAME_HINTS: Record<LayerRole, RegExp> = {
  heads: /head|spk|sprink|sprnk|nozzle|kopf|t[eê]te/i,
  pipes: /pipe|piping|main|branch|spk-p|rohr|tuyau/i,
  walls: /wall|a-wal|mur|wand|partition/i,
  designArea: /remote|design.?area|calc.?area|hyd.?area|fp-area/i,
  source: /riser|source|supply|poc|fdc|steig/i,
  zones: /zone|hazard|occupan/i,
};

/** Words of our own choosing that name a sprinkler head (block names) and its attributes (tags). */
const HEAD_BLOCK_WORDS = /spk|sprink|sprnk|head|pendent|pendant|upright|sidewall|nozzle|kopf|t[eê]te/i;
const HEAD_TAGS = new Set([
  'K',
  'KFACTOR',
  'K-FACTOR',
  'K_FACTOR',
  'SPRINKLER',
  'SPK',
  'TEMP',
  'TEMPERATURE',
  'RESPONSE',
  'SIN',
  'HEADTYPE',
  'ORIFICE',
]);
/** Words that name something else drawn as many small alike symbols: furniture, fixtures, devices, drafting marks. */
const OTHER_WORDS =
  /furn|chair|desk|table|sofa|bed\b|door|window|wc\b|toilet|sink|lav\b|tree|plant|car\b|vehicle|dim|arrow|tick|grid|column|bubble|title|north|light|lum|fixture|elec|outlet|switch|socket|speaker|detector|smoke|alarm|text|tag\b/i;
/**
 * A head symbol's extent across, feet (common practice, no source: symbols are drawn a few inches to about two feet
 * across at full scale); under it a tick or a marker, over it furniture, over BUILDING_FT a building part.
 */
const HEAD_MIN_FT = 1 / 12;
const HEAD_MAX_FT = 3;
const BUILDING_FT = 20;
/** How many alike symbols make a layer of heads. */
const MIN_SYMBOLS = 3;

export interface RoleGuessInput {
  layers: LayerSummary[];
  patterns: Partial<Record<LayerRole, string[]>>;
  /** What blocks and circles look like; without it the guess goes by names and counts only. */
  evidence?: Evidence;
  /** Feet per drawing unit, when the unit is known (sizes are judged only then). */
  feetPerUnit: number | null;
}

export function assignLayerRoles(input: RoleGuessInput): { roles: LayerRoles; headCandidates: HeadCandidate[] } {
  const { layers, patterns } = input;
  const out = {} as LayerRoles;
  for (const role of LAYER_ROLES) {
    const given = patterns[role];
    if (given) {
      const match = compilePatterns(given);
      out[role] = { layers: layers.map((l) => l.name).filter(match), from: 'config', reason: `config patterns ${given.join(', ')}` };
    }
  }
  const taken = new Set(Object.values(out).flatMap((c) => c.layers));
  let headCandidates: HeadCandidate[] = [];
  if (!out.heads) {
    const pipeLayers =
      out.pipes?.layers ?? layers.filter((l) => !taken.has(l.name) && NAME_HINTS.pipes.test(l.name) && l.strokes > 0).map((l) => l.name);
    const guess = guessHeads(
      input,
      layers.filter((l) => !taken.has(l.name)),
      pipeLayers,
    );
    out.heads = guess.choice;
    headCandidates = guess.candidates;
    for (const l of out.heads.layers) taken.add(l);
  }
  for (const role of LAYER_ROLES) {
    if (out[role] || role === 'heads') continue;
    out[role] = guessByName(layers, role, taken);
    for (const l of out[role].layers) taken.add(l);
  }
  return { roles: out, headCandidates };
}

type NamedRole = Exclude<LayerRole, 'heads'>;

function guessByName(layers: LayerSummary[], role: NamedRole, taken: Set<string>): RoleChoice {
  const free = layers.filter((l) => !taken.has(l.name));
  const byName = free.filter((l) => NAME_HINTS[role].test(l.name) && Object.keys(l.counts).length > 0);
  const both = byName.filter((l) => looksLike(l, role));
  const pick = both.length ? both : byName;
  const reason = both.length ? 'name and content' : pick.length ? 'layer name' : 'no layer looks like it';
  return { layers: pick.map((l) => l.name), from: 'guess', reason };
}

/** Geometry signatures: pipes are linework; walls and areas are outlines or linework; a source is a symbol or point. */
function looksLike(layer: LayerSummary, role: NamedRole): boolean {
  switch (role) {
    case 'pipes':
      return layer.strokes > 0;
    case 'walls':
    case 'designArea':
      return layer.outlines > 0 || layer.strokes > 0;
    case 'zones':
      return layer.outlines > 0;
    case 'source':
      return layer.refs > 0 || layer.points > 0;
  }
}

interface Weighed extends HeadCandidate {
  score: number;
  blocks: string[];
}

/**
 * Heads: each layer's symbols (blocks of which it holds several, or its plain circles) weighed: sized like a
 * head, and named, tagged or placed on pipe linework like one. The layers whose best symbol scores highest win.
 */
function guessHeads(
  input: RoleGuessInput,
  free: LayerSummary[],
  pipeLayers: string[],
): { choice: RoleChoice; candidates: HeadCandidate[] } {
  const weighed: Weighed[] = [];
  for (const layer of free) {
    const symbols = Object.entries(layer.symbolRefs)
      .filter(([, n]) => n >= MIN_SYMBOLS)
      .sort((a, b) => b[1] - a[1])
      .slice(0, 5);
    const options = symbols.map(([block, count]) => weigh(input, layer.name, block, count, pipeLayers));
    if ((layer.counts['CIRCLE'] ?? 0) >= MIN_SYMBOLS && !options.some((o) => o.score >= 2))
      options.push(weigh(input, layer.name, null, layer.counts['CIRCLE']!, pipeLayers));
    if (!options.length) continue;
    options.sort((a, b) => b.score - a.score || b.count - a.count);
    const best = options[0]!;
    // Other blocks of the layer that qualify too are heads of another type (upright and sidewall symbols).
    best.blocks = options.filter((o) => o.block !== null && o.score >= 2).map((o) => o.block!);
    weighed.push(best);
  }
  const top = Math.max(2, ...weighed.map((w) => w.score));
  for (const w of weighed) {
    w.taken = w.score >= 2 && w.score >= top - 1;
    if (!w.taken && w.score >= 2) w.why += `; a layer with more evidence was taken`;
  }
  const chosen = weighed.filter((w) => w.taken);
  const candidates = weighed
    .sort((a, b) => Number(b.taken) - Number(a.taken) || b.score - a.score || b.count - a.count)
    .map(({ layer, block, count, size, taken, why }) => ({ layer, block, count, size, taken, why }));
  if (!chosen.length)
    return { choice: { layers: [], from: 'guess', reason: 'no layer holds symbols that look like heads', blocks: [] }, candidates };
  return {
    choice: {
      layers: chosen.map((w) => w.layer),
      from: 'guess',
      reason: chosen.map((w) => `${w.layer}: ${w.block === null ? 'circles' : `block ${w.block}`} ×${w.count} (${w.why})`).join('; '),
      blocks: chosen.flatMap((w) => w.blocks),
    },
    candidates,
  };
}

function weigh(input: RoleGuessInput, layer: string, block: string | null, count: number, pipeLayers: string[]): Weighed {
  const { evidence, feetPerUnit } = input;
  const facts = block !== null ? evidence?.block(block) : undefined;
  const circles = block === null ? evidence?.circles(layer) : undefined;
  const size = block !== null ? (facts?.size ?? null) : circles?.radius != null ? 2 * circles.radius : null;
  const candidate: Weighed = { layer, block, count, size, taken: false, why: '', score: 0, blocks: [] };
  const sizeFt = size !== null && feetPerUnit !== null ? size * feetPerUnit : null;
  if (sizeFt !== null && sizeFt < HEAD_MIN_FT)
    return { ...candidate, score: -10, why: `${inches(sizeFt)} across: too small for a head symbol (a tick or a marker)` };
  if (sizeFt !== null && sizeFt > BUILDING_FT)
    return { ...candidate, score: -10, why: `${feet(sizeFt)} across: building-sized, not a head` };
  if (sizeFt !== null && sizeFt > HEAD_MAX_FT)
    return { ...candidate, score: -10, why: `${feet(sizeFt)} across: furniture-sized, not a head` };
  const said: string[] = [];
  if (sizeFt !== null) said.push(`${inches(sizeFt)} across`);
  else if (feetPerUnit === null) said.push('size not judged: the drawing states no unit');
  let score = 0;
  if (NAME_HINTS.heads.test(layer)) {
    score += 2;
    said.push('layer name');
  }
  if (block !== null && HEAD_BLOCK_WORDS.test(block)) {
    score += 2;
    said.push('block name');
  }
  const tags = (facts?.tags ?? []).filter((t) => HEAD_TAGS.has(t));
  if (tags.length) {
    score += 2;
    said.push(`${tags.join(', ')} attribute`);
  }
  if (OTHER_WORDS.test(layer) || (block !== null && OTHER_WORDS.test(block))) {
    score -= 3;
    said.push('name says something else');
  }
  if (score < 2 && evidence && pipeLayers.length && feetPerUnit !== null) {
    // Heads sit on their pipes: within the symbol's size, or half a foot.
    const reach = Math.max(size ?? 0, 0.5 / feetPerUnit);
    const share = evidence.onLinework(layer, block, pipeLayers, reach);
    if (share !== null && share >= 0.5) {
      score += 2;
      said.push(`${Math.round(share * 100)}% on pipe linework`);
    } else if (share !== null) said.push(`${Math.round(share * 100)}% on pipe linework`);
  }
  if (score < 2) said.push('nothing says head');
  return { ...candidate, score, why: said.join(', ') };
}

const inches = (ft: number) => `${+(ft * 12).toPrecision(3)} in`;
const feet = (ft: number) => `${+ft.toPrecision(3)} ft`;

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
