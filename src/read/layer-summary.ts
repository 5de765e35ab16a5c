// What each layer of a scanned drawing holds, counted through block references without expanding them: entity
// counts by type, references to each symbol block, linework, outlines and points. Layer roles are guessed from it.

import { fail } from '../input-error.js';
import {
  blockLookup,
  CLOSED,
  effectiveLayer,
  nameDecoder,
  PAPER_SPACE,
  rowLayers,
  type BlockEntry,
  type DrawingSource,
  type Rows,
} from './source.js';
import { kindOf } from './entities/registry.js';
import type { LayerSummary } from './types.js';

type Tally = Map<string, LayerSummary>;

const emptySummary = (name: string): LayerSummary => ({
  name,
  counts: {},
  blockRefs: {},
  symbolRefs: {},
  refs: 0,
  strokes: 0,
  outlines: 0,
  points: 0,
});

/** Adds `times` × `from` into `into`. */
function addTally(into: Tally, from: Tally, times: number): void {
  for (const [name, s] of from) {
    let t = into.get(name);
    if (!t) into.set(name, (t = emptySummary(name)));
    for (const [k, v] of Object.entries(s.counts)) t.counts[k] = (t.counts[k] ?? 0) + v * times;
    for (const [k, v] of Object.entries(s.blockRefs)) t.blockRefs[k] = (t.blockRefs[k] ?? 0) + v * times;
    for (const [k, v] of Object.entries(s.symbolRefs)) t.symbolRefs[k] = (t.symbolRefs[k] ?? 0) + v * times;
    t.refs += s.refs * times;
    t.strokes += s.strokes * times;
    t.outlines += s.outlines * times;
    t.points += s.points * times;
  }
}

/**
 * Per-layer summaries of model space, every layer of the LAYER table included, sorted by name. A block's
 * contents count once per placed copy (MINSERT arrays and nesting multiply). A block that contains itself, or
 * nesting deeper than `maxDepth`, is an error.
 */
export function summarizeLayers(
  scan: Pick<DrawingSource, 'blocks' | 'names' | 'table' | 'modelSpace' | 'layerNames'>,
  maxDepth: number,
): LayerSummary[] {
  const blocks = blockLookup(scan);
  const named = nameDecoder();
  const layerOf = rowLayers(scan);
  const { table, names } = scan;
  const memo = new Map<BlockEntry, Map<string, { tally: Tally; height: number }>>();
  const open = new Set<BlockEntry>();
  /** One placement of `block` whose reference sits on layer `inherited`: its tally and nesting height. */
  const placement = (block: BlockEntry, inherited: string): { tally: Tally; height: number } => {
    let byLayer = memo.get(block);
    if (!byLayer) memo.set(block, (byLayer = new Map()));
    const known = byLayer.get(inherited);
    if (known) return known;
    if (open.has(block)) fail(`block "${named(block.name)}" contains a reference to itself`);
    if (open.size >= maxDepth) fail(`block nesting deeper than ${maxDepth} levels at "${named(block.name)}" (inputLimits.blockDepth)`);
    open.add(block);
    const result = walk([block.rows], inherited);
    open.delete(block);
    byLayer.set(inherited, result);
    return result;
  };
  const walk = (runs: Rows[], inherited: string | null): { tally: Tally; height: number } => {
    const tally: Tally = new Map();
    const on = (layer: string) => {
      let t = tally.get(layer);
      if (!t) tally.set(layer, (t = emptySummary(layer)));
      return t;
    };
    // A block's contents are added at its first reference on a layer (so that every count keeps the place where
    // it first appears), the copies of its later references there in one addition at the end: a drawing places a
    // head block thousands of times.
    const later = new Map<{ tally: Tally; height: number }, number>();
    let height = 0;
    for (const run of runs)
      for (let row = run.first; row < run.end; row++) {
        const type = names[table.type[row]!]!;
        if ((inherited === null && table.flags[row]! & PAPER_SPACE) || type === 'ATTDEF') continue;
        const layer = effectiveLayer(layerOf(row), inherited);
        const s = on(layer);
        s.counts[type] = (s.counts[type] ?? 0) + 1;
        const kind = kindOf(type);
        if (kind?.shape === 'stroke') s.strokes++;
        if ((kind?.closedOutline && table.flags[row]! & CLOSED) || kind?.shape === 'outline') s.outlines++;
        if (kind?.shape === 'point') s.points++;
        const block = type === 'INSERT' ? blocks.of(row) : null;
        if (!block) continue;
        const copies = table.copies[row]!;
        s.refs += copies;
        const name = named(block.name);
        s.blockRefs[name] = (s.blockRefs[name] ?? 0) + copies;
        if (!blocks.hasNestedRefs(block)) s.symbolRefs[name] = (s.symbolRefs[name] ?? 0) + copies;
        const inner = placement(block, layer);
        const pending = later.get(inner);
        if (pending === undefined) {
          addTally(tally, inner.tally, copies);
          later.set(inner, 0);
        } else later.set(inner, pending + copies);
        height = Math.max(height, inner.height + 1);
      }
    for (const [inner, copies] of later) if (copies > 0) addTally(tally, inner.tally, copies);
    return { tally, height };
  };
  const top = walk(scan.modelSpace, null);
  if (top.height > maxDepth) fail(`block nesting deeper than ${maxDepth} levels (inputLimits.blockDepth)`);
  const layers = top.tally;
  for (const raw of scan.layerNames) {
    const name = named(raw);
    if (!layers.has(name)) layers.set(name, emptySummary(name));
  }
  return byName([...layers.values()]);
}

/**
 * Layers in order of their names, case aside, by code units: the same order on every machine (a locale's
 * collation is not, and building one costs a small check about 12 ms).
 */
function byName(layers: LayerSummary[]): LayerSummary[] {
  const keyed = layers.map((layer) => ({ layer, key: layer.name.toLowerCase() }));
  const order = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0);
  return keyed.sort((a, b) => order(a.key, b.key) || order(a.layer.name, b.layer.name)).map((x) => x.layer);
}
