// What the role guess and `headcheck layers` weigh beyond counts, found lazily and on samples so that a large
// background costs nothing: each block's size and attribute tags, the circles a layer holds, and whether a
// layer's symbols sit on other layers' linework (heads sit on pipes).

import RBush from 'rbush';
import { distanceToSegment, type Point } from '../geometry/point.js';
import { segmentBox, type SegmentBox } from '../geometry/boxes.js';
import { InputError } from '../input-error.js';
import type { AttDef } from './entities/attdef.js';
import type { Circle } from './entities/circle.js';
import type { Insert } from './entities/insert.js';
import type { EntityBase } from './entities/types.js';
import { flatten } from './flatten.js';
import type { RawBlock } from './select.js';
import { blockLookup, nameDecoder, PAPER_SPACE, rowLayers, type BlockEntry, type DrawingSource } from './source.js';
import { maxOf, minOf } from '../arrays.js';

export interface BlockFacts {
  name: string;
  /** Largest extent across (width or height), drawing units; null when empty or too costly to expand. */
  size: number | null;
  /** Attribute tags its definition holds or its references carry, upper case. */
  tags: string[];
}

export interface CircleFacts {
  /** Circles drawn on the layer itself (a sample), and their median radius in drawing units. */
  sampled: number;
  radius: number | null;
}

export interface Evidence {
  block(name: string): BlockFacts;
  circles(layer: string): CircleFacts;
  /**
   * The share of a sample of the layer's own references to `block` (or its circles, for null) that sit within
   * `reach` (drawing units) of linework on `lineLayers`; null when the layer has none to sample.
   */
  onLinework(layer: string, block: string | null, lineLayers: readonly string[], reach: number): number | null;
}

/** Entities looked at per question (a sample is enough to tell a layer's symbols from its linework). */
const SAMPLE = 200;
/** Linework rows decoded for the on-linework test, and block references expanded to size a block. */
const LINEWORK_ROWS = 50_000;
const SIZE_REFERENCES = 10_000;

export function gatherEvidence(source: DrawingSource): Evidence {
  const lookup = blockLookup(source);
  const layerOf = rowLayers(source);
  const named = nameDecoder();
  const { table, names } = source;
  const typeOf = (row: number) => names[table.type[row]!]!;
  const decodedBlocks = new Map<BlockEntry, RawBlock>();
  const rawBlock = (name: string): RawBlock | null => {
    const entry = lookup.find(name);
    if (!entry) return null;
    let b = decodedBlocks.get(entry);
    if (!b) {
      const entities: EntityBase[] = [];
      for (let row = entry.rows.first; row < entry.rows.end; row++) {
        const e = source.entity(row);
        if (e) entities.push(e);
      }
      decodedBlocks.set(entry, (b = { name: entry.name, base: source.blockBase(entry), entities }));
    }
    return b;
  };
  /** Top-level rows of a layer (of a type, or referencing a block), in drawing order, up to `limit`. */
  const rowsOf = (layer: string, accept: (row: number) => boolean, limit: number): number[] => {
    const out: number[] = [];
    for (const run of source.modelSpace) {
      for (let row = run.first; row < run.end && out.length < limit; row++) {
        if (!(table.flags[row]! & PAPER_SPACE) && layerOf(row) === layer && accept(row)) out.push(row);
      }
    }
    return out;
  };
  const blockFacts = new Map<string, BlockFacts>();
  const circleFacts = new Map<string, CircleFacts>();
  const linework = new Map<string, RBush<SegmentBox>>();
  const all = { refs: () => true, strokes: () => true, outlines: () => true, texts: () => false, points: () => true, symbols: () => false };

  const evidence: Evidence = {
    block(name) {
      let facts = blockFacts.get(name);
      if (facts) return facts;
      const raw = rawBlock(name);
      const tags = new Set<string>();
      for (const e of raw?.entities ?? []) if (e.type === 'ATTDEF' && (e as AttDef).tag) tags.add((e as AttDef).tag.toUpperCase());
      const entry = lookup.find(name);
      for (const row of (entry && referencesOf().get(entry)) ?? [])
        for (const tag of Object.keys((source.entity(row) as Insert).attributes)) tags.add(tag);
      facts = { name, size: raw ? sizeOf(raw) : null, tags: [...tags].sort() };
      blockFacts.set(name, facts);
      return facts;
    },
    circles(layer) {
      let facts = circleFacts.get(layer);
      if (facts) return facts;
      const radii = rowsOf(layer, (row) => typeOf(row) === 'CIRCLE', SAMPLE)
        .map((row) => (source.entity(row) as Circle).radius)
        .sort((a, b) => a - b);
      facts = { sampled: radii.length, radius: radii.length ? radii[Math.floor(radii.length / 2)]! : null };
      circleFacts.set(layer, facts);
      return facts;
    },
    onLinework(layer, block, lineLayers, reach) {
      const at: Point[] =
        block === null
          ? rowsOf(layer, (row) => typeOf(row) === 'CIRCLE' || typeOf(row) === 'POINT', SAMPLE).map((row) => {
              const e = source.entity(row) as Circle & { at?: Point };
              return e.at ?? e.center;
            })
          : rowsOf(
              layer,
              (row) => {
                const b = lookup.of(row);
                return b !== null && named(b.name) === block;
              },
              SAMPLE,
            ).map((row) => (source.entity(row) as Insert).at);
      if (at.length === 0 || lineLayers.length === 0) return null;
      const index = lineworkOf(lineLayers);
      const near = at.filter((p) =>
        index
          .search({ minX: p.x - reach, minY: p.y - reach, maxX: p.x + reach, maxY: p.y + reach })
          .some((s) => distanceToSegment(p, s.a, s.b) <= reach),
      ).length;
      return near / at.length;
    },
  };

  /** A sample of each block's top-level references, found in one pass over model space. */
  let references: Map<BlockEntry, number[]> | null = null;
  function referencesOf(): Map<BlockEntry, number[]> {
    if (references) return references;
    references = new Map();
    for (const row of rowsWhere((r) => typeOf(r) === 'INSERT')) {
      const b = lookup.of(row);
      if (!b) continue;
      let list = references.get(b);
      if (!list) references.set(b, (list = []));
      if (list.length < SAMPLE) list.push(row);
    }
    return references;
  }

  function* rowsWhere(accept: (row: number) => boolean): Generator<number> {
    for (const run of source.modelSpace) for (let row = run.first; row < run.end; row++) if (accept(row)) yield row;
  }

  /** The block's extent across, expanding nested references (a bounded number of them). */
  function sizeOf(raw: RawBlock): number | null {
    try {
      const flat = flatten({ entities: raw.entities, block: rawBlock }, 1, { blockDepth: 16, blockReferences: SIZE_REFERENCES }, all);
      const pts = [
        ...flat.strokes.flatMap((s) => [s.a, s.b, ...s.via]),
        ...flat.outlines.flatMap((o) => o.points),
        ...flat.points.map((p) => p.position),
      ];
      if (!pts.length) return null;
      const xs = pts.map((p) => p.x);
      const ys = pts.map((p) => p.y);
      return Math.max(maxOf(xs) - minOf(xs), maxOf(ys) - minOf(ys));
    } catch (err) {
      if (err instanceof InputError) return null;
      throw err;
    }
  }

  function lineworkOf(layers: readonly string[]): RBush<SegmentBox> {
    const key = [...layers].sort().join('\u0000');
    let index = linework.get(key);
    if (index) return index;
    const wanted = new Set(layers);
    const entities: EntityBase[] = [];
    for (const row of rowsWhere((r) => wanted.has(layerOf(r)) && !(table.flags[r]! & PAPER_SPACE))) {
      if (entities.length >= LINEWORK_ROWS) break;
      const e = source.entity(row);
      if (e && e.type !== 'INSERT') entities.push(e);
    }
    const flat = flatten({ entities, block: () => null }, 1, { blockDepth: 1, blockReferences: 0 }, { ...all, refs: () => false });
    const segs: SegmentBox[] = [];
    for (const s of flat.strokes) {
      const pts = [s.a, ...s.via, s.b];
      for (let k = 1; k < pts.length; k++) segs.push(segmentBox(pts[k - 1]!, pts[k]!));
    }
    index = new RBush<SegmentBox>();
    index.load(segs);
    linework.set(key, index);
    return index;
  }

  return evidence;
}
