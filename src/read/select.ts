// Cuts a scanned drawing down to what the later stages read: entities on layers that play a role, texts that
// may be size labels, references whose blocks reach either, and the blocks they use. Only this text is decoded
// and parsed, so a plan's architectural background costs a scan, not a parse.

import { blockLookup, effectiveLayer, nameDecoder } from './layer-summary.js';
import type { BlockEntry, Decode, EntityEntry, ScannedDxf } from './scan.js';

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
  const reachMemo = new Map<string, boolean>();
  const open = new Set<BlockEntry>();
  const blockOf = (e: EntityEntry) => (e.type === 'INSERT' && e.block !== null ? blocks.find(named(e.block)) : null);
  const wants = (e: EntityEntry, inherited: string | null): boolean => {
    const layer = effectiveLayer(named(e.layer), inherited);
    if (wanted.layer(layer) || (isText(e.type) && wanted.label(layer, decode(bytes.subarray(e.textStart, e.textEnd))))) return true;
    const block = blockOf(e);
    return block !== null && reaches(block, layer);
  };
  /** Whether a placement of `block` on layer `inherited` holds anything wanted. */
  const reaches = (block: BlockEntry, inherited: string): boolean => {
    const key = `${block.name}\u0000${inherited}`;
    const known = reachMemo.get(key);
    if (known !== undefined) return known;
    if (open.has(block)) return false; // a cycle, reported by the layer summary
    open.add(block);
    const result = block.entities.some((e) => wants(e, inherited));
    open.delete(block);
    reachMemo.set(key, result);
    return result;
  };
  const entities = scan.entities.filter((e) => !e.paperSpace && wants(e, null));
  // Whole definitions of the blocks the chosen references use, nested ones included.
  const used = new Set<BlockEntry>();
  const stack = entities.map(blockOf).filter((b): b is BlockEntry => b !== null);
  while (stack.length) {
    const b = stack.pop()!;
    if (used.has(b)) continue;
    used.add(b);
    for (const e of b.entities) { const inner = blockOf(e); if (inner) stack.push(inner); }
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
  for (const b of scan.blocks) if (used.has(b)) piece(b.start, b.end);
  ascii('  0\nENDSEC\n  0\nSECTION\n  2\nENTITIES\n');
  for (const e of entities) piece(e.start, e.end);
  ascii('  0\nENDSEC\n  0\nEOF\n');
  const joined = new Uint8Array(parts.reduce((n, p) => n + p.length, 0));
  let at = 0;
  for (const p of parts) { joined.set(p, at); at += p.length; }
  return decode(joined);
}
