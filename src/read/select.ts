// Cuts a drawing down to what the later stages read and decodes only that: entities on layers that play a role,
// texts that may be size labels, references whose blocks reach either, and the blocks they use. A plan's
// architectural background costs a scan, not a decode.

import type { Point } from '../geometry/point.js';
import { fail } from '../input-error.js';
import type { EntityBase } from './entities/types.js';
import { blockLookup, effectiveLayer, PAPER_SPACE, rowLayers, type BlockEntry, type DrawingSource } from './source.js';

export interface Wanted {
  /** Layers whose every entity is read. */
  layer(name: string): boolean;
  /** Texts read besides (size labels), by layer and the text as written. */
  label(layer: string, text: string): boolean;
}

export interface RawBlock {
  name: string;
  base: Point;
  entities: EntityBase[];
}

/** The decoded part of a drawing: the wanted model-space entities in their order, and the blocks they use. */
export interface RawDrawing {
  entities: EntityBase[];
  /** Blocks by name as written; `block` finds one exactly, then case-insensitively. */
  block(name: string): RawBlock | null;
}

/**
 * Decodes what `wanted` selects; refused first, without decoding anything, when expanding the selection would
 * produce more than `budget` entities (a block arrayed or nested into millions of copies).
 */
export function decodeSelected(source: DrawingSource, wanted: Wanted, budget = Infinity): RawDrawing {
  const blocks = blockLookup(source);
  const layerOf = rowLayers(source);
  const { table } = source;
  const reachMemo = new Map<BlockEntry, Map<string, boolean>>();
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
    let byLayer = reachMemo.get(block);
    if (!byLayer) reachMemo.set(block, (byLayer = new Map()));
    const known = byLayer.get(inherited);
    if (known !== undefined) return known;
    if (open.has(block)) return false; // a cycle, reported by the layer summary
    open.add(block);
    let result = false;
    for (let row = block.rows.first; row < block.rows.end && !result; row++) result = wants(row, inherited);
    open.delete(block);
    byLayer.set(inherited, result);
    return result;
  };
  const chosen: number[] = [];
  for (const run of source.modelSpace)
    for (let row = run.first; row < run.end; row++) if (!(table.flags[row]! & PAPER_SPACE) && wants(row, null)) chosen.push(row);
  checkExpansion(source, chosen, budget);
  const entities: EntityBase[] = [];
  const used = new Set<BlockEntry>();
  const stack: BlockEntry[] = [];
  for (const row of chosen) {
    const e = source.entity(row);
    if (e) entities.push(e);
    const b = blocks.of(row);
    if (b) stack.push(b);
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
  return {
    entities,
    block: (name) => {
      const b = blocks.find(name);
      return b ? (decoded.get(b) ?? null) : null;
    },
  };
}

/**
 * The entities the chosen rows expand to (each reference's block contents times its array copies, through nesting)
 * are counted before anything is expanded: over `budget` is a one-line refusal naming the largest reference.
 */
function checkExpansion(source: DrawingSource, rows: number[], budget: number): void {
  if (!Number.isFinite(budget)) return;
  const blocks = blockLookup(source);
  const { table } = source;
  const layerOf = rowLayers(source);
  const size = new Map<BlockEntry, number>();
  const expanded = (block: BlockEntry): number => {
    let n = size.get(block);
    if (n !== undefined) return n;
    size.set(block, 0); // a cycle is reported by the layer summary; here it adds nothing
    n = 0;
    for (let row = block.rows.first; row < block.rows.end; row++) {
      const inner = blocks.of(row);
      n += 1 + (inner ? table.copies[row]! * expanded(inner) : 0);
    }
    size.set(block, n);
    return n;
  };
  let total = 0;
  let worst = { row: -1, count: 0 };
  for (const row of rows) {
    const block = blocks.of(row);
    const count = 1 + (block ? table.copies[row]! * expanded(block) : 0);
    total += count;
    if (count > worst.count) worst = { row, count };
  }
  if (total <= budget) return;
  const block = blocks.of(worst.row);
  const copies = table.copies[worst.row]!;
  const where = block
    ? `block "${block.name}"${copies > 1 ? ` placed ${copies} times by one array` : ''} on layer "${layerOf(worst.row)}" expands to ${worst.count} entities`
    : `${total} entities`;
  fail(`the drawing's read layers expand to ${total} entities, over the limit of ${budget} (inputLimits.expandedEntities): ${where}`);
}
