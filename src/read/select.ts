// Cuts a drawing down to what the later stages read and decodes only that: entities on layers that play a role,
// texts that may be size labels, references whose blocks reach either, and the blocks they use. A plan's
// architectural background costs a scan, not a decode.

import type { Point } from '../geometry/point.js';
import type { EntityBase } from './entities/types.js';
import { blockLookup, effectiveLayer, PAPER_SPACE, rowLayers, type BlockEntry, type DrawingSource } from './source.js';

export interface Wanted {
  /** Layers whose every entity is read. */
  layer(name: string): boolean;
  /** Texts read besides (size labels), by layer and the text as written. */
  label(layer: string, text: string): boolean;
}

export interface RawBlock { name: string; base: Point; entities: EntityBase[] }

/** The decoded part of a drawing: the wanted model-space entities in their order, and the blocks they use. */
export interface RawDrawing {
  entities: EntityBase[];
  /** Blocks by name as written; `block` finds one exactly, then case-insensitively. */
  block(name: string): RawBlock | null;
}

export function decodeSelected(source: DrawingSource, wanted: Wanted): RawDrawing {
  const blocks = blockLookup(source);
  const layerOf = rowLayers(source);
  const { table } = source;
  const reachMemo = new Map<string, boolean>();
  const open = new Set<BlockEntry>();
  const wants = (row: number, inherited: string | null): boolean => {
    const layer = effectiveLayer(layerOf(row), inherited);
    if (wanted.layer(layer)) return true;
    if (table.textStart[row]! >= 0 && wanted.label(layer, source.labelText(row))) return true;
    const block = blocks.of(row);
    return block !== null && reaches(block, layer);
  };
  /** Whether a placement of `block` on layer `inherited` holds anything wanted. */
  const reaches = (block: BlockEntry, inherited: string): boolean => {
    const key = `${block.name}\u0000${inherited}`;
    const known = reachMemo.get(key);
    if (known !== undefined) return known;
    if (open.has(block)) return false; // a cycle, reported by the layer summary
    open.add(block);
    let result = false;
    for (let row = block.rows.first; row < block.rows.end && !result; row++) result = wants(row, inherited);
    open.delete(block);
    reachMemo.set(key, result);
    return result;
  };
  const entities: EntityBase[] = [];
  const used = new Set<BlockEntry>();
  const stack: BlockEntry[] = [];
  for (const run of source.modelSpace) {
    for (let row = run.first; row < run.end; row++) {
      if (table.flags[row]! & PAPER_SPACE || !wants(row, null)) continue;
      const e = source.entity(row);
      if (e) entities.push(e);
      const b = blocks.of(row);
      if (b) stack.push(b);
    }
  }
  // Whole definitions of the blocks the chosen references use, nested ones included.
  const decoded = new Map<BlockEntry, RawBlock>();
  while (stack.length) {
    const b = stack.pop()!;
    if (used.has(b)) continue;
    used.add(b);
    const inner: EntityBase[] = [];
    for (let row = b.rows.first; row < b.rows.end; row++) {
      const e = source.entity(row);
      if (e) inner.push(e);
      const nested = blocks.of(row);
      if (nested) stack.push(nested);
    }
    decoded.set(b, { name: b.name, base: source.blockBase(b), entities: inner });
  }
  return { entities, block: (name) => { const b = blocks.find(name); return b ? (decoded.get(b) ?? null) : null; } };
}
