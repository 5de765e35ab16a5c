// Cuts a scanned drawing down to what the later stages read: entities on layers that play a role, texts that
// may be size labels, references whose blocks reach either, and the blocks they use. Only this text is decoded
// and parsed, so a plan's architectural background costs a scan, not a parse.

import { blockLookup, effectiveLayer, nameDecoder, rowLayers } from './layer-summary.js';
import { PAPER_SPACE, type BlockEntry, type Decode, type ScannedDxf } from './scan.js';

export interface Wanted {
  /** Layers whose every entity is read. */
  layer(name: string): boolean;
  /** Texts read besides (size labels), by layer and the text as written. */
  label(layer: string, text: string): boolean;
}

const isText = (type: string) => type === 'TEXT' || type === 'MTEXT';

/**
 * DXF text holding the header, the blocks in use and the wanted model-space entities of the drawing `bytes`, in
 * their original order, decoded with `decode`.
 */
export function selectedText(bytes: Uint8Array, scan: ScannedDxf, wanted: Wanted, decode: Decode): string {
  const blocks = blockLookup(scan);
  const named = nameDecoder();
  const layerOf = rowLayers(scan);
  const { table, names } = scan;
  const reachMemo = new Map<string, boolean>();
  const open = new Set<BlockEntry>();
  const blockOf = (row: number) => (names[table.type[row]!] === 'INSERT' && table.block[row]! >= 0 ? blocks.find(named(names[table.block[row]!]!)) : null);
  const wants = (row: number, inherited: string | null): boolean => {
    const layer = effectiveLayer(layerOf(row), inherited);
    if (wanted.layer(layer)) return true;
    if (isText(names[table.type[row]!]!) && wanted.label(layer, decode(bytes.subarray(table.textStart[row]!, table.textEnd[row]!)))) return true;
    const block = blockOf(row);
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
  const chosen: number[] = [];
  for (const run of scan.modelSpace) for (let row = run.first; row < run.end; row++) if (!(table.flags[row]! & PAPER_SPACE) && wants(row, null)) chosen.push(row);
  // Whole definitions of the blocks the chosen references use, nested ones included.
  const used = new Set<BlockEntry>();
  const stack = chosen.map(blockOf).filter((b): b is BlockEntry => b !== null);
  while (stack.length) {
    const b = stack.pop()!;
    if (used.has(b)) continue;
    used.add(b);
    for (let row = b.rows.first; row < b.rows.end; row++) { const inner = blockOf(row); if (inner) stack.push(inner); }
  }
  const header = scan.sections.find((s) => s.name === 'HEADER');
  const parts: Uint8Array[] = [];
  const ascii = (s: string) => parts.push(Uint8Array.from(s, (ch) => ch.charCodeAt(0)));
  /** A range of the original bytes, ending with a line break. */
  const piece = (start: number, end: number) => {
    parts.push(bytes.subarray(start, end));
    if (end > start && bytes[end - 1] !== 10) ascii('\n');
  };
  if (header) piece(header.start, header.end);
  ascii('  0\nSECTION\n  2\nBLOCKS\n');
  // A block without a name cannot be expanded (dxf-parser drops it, and says so on the console): left out.
  for (const b of scan.blocks) if (used.has(b) && b.name !== '') piece(b.start, b.end);
  ascii('  0\nENDSEC\n  0\nSECTION\n  2\nENTITIES\n');
  for (const row of chosen) piece(table.start[row]!, table.end[row]!);
  ascii('  0\nENDSEC\n  0\nEOF\n');
  const joined = new Uint8Array(parts.reduce((n, p) => n + p.length, 0));
  let at = 0;
  for (const p of parts) { joined.set(p, at); at += p.length; }
  return decode(joined);
}
