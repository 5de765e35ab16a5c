// Sorts a Drawing's content by role into a Plan: heads (with K-factor and elevation), pipe strokes,
// walls and rooms, drawn design areas, water sources, pipe-size labels and hazard zones, all in feet and US units.

import { compilePatterns } from '../config/patterns.js';
import type { Settings } from '../config/settings.js';
import { PointGrid } from '../geometry/point-grid.js';
import { distance, type Point } from '../geometry/point.js';
import { KSI_PER_KUS, M_PER_FT } from '../quantities/convert.js';
import { isLabelLayer, onRoles, type LayerRoles } from './layer-roles.js';
import type { BlockRef, Drawing, Outline, Stroke, TextItem } from './types.js';

/** What a head's attributes say about its kind; anything but standard spray has listed limits. */
export type HeadKind = 'standard' | 'sidewall' | 'extended-coverage' | 'other';

export interface Head {
  id: string;
  handle: string;
  layer: string;
  block: string;
  position: Point;
  kFactor: number;
  elevation: number;
  kind: HeadKind;
  attributes: Record<string, string>;
}

export interface Source {
  handle: string;
  layer: string;
  position: Point;
}

/** Head symbols drawn again at a head's point: the head counts once, the extra copies are reported. */
export interface DuplicateHeads {
  headId: string;
  /** Handles of the extra copies. */
  handles: string[];
}

export interface Plan {
  roles: LayerRoles;
  heads: Head[];
  duplicateHeads: DuplicateHeads[];
  pipes: Stroke[];
  walls: Stroke[];
  rooms: Outline[];
  designAreas: Outline[];
  sources: Source[];
  labels: TextItem[];
  /** Hazard-zone outlines, and the texts on zone layers that name them. */
  zones: Outline[];
  zoneTexts: TextItem[];
}

/**
 * The block names that are heads: the config's `headBlocks`, or where it keeps its default (every block) and the
 * head layers were guessed, the blocks the guess took as head symbols.
 */
function headBlocksOf(drawing: Drawing, settings: Settings): string[] {
  const guessed = drawing.roles.heads.from === 'guess' ? (drawing.roles.heads.blocks ?? []) : [];
  const isDefault = settings.headBlocks.length === 1 && settings.headBlocks[0] === '*';
  return isDefault && guessed.length ? guessed : settings.headBlocks;
}

/** Head-type attribute values (TYPE or HEADTYPE) and the kind they mean (common practice, no source). */
function headKind(attributes: Record<string, string>): HeadKind {
  const t = (attributes['TYPE'] ?? attributes['HEADTYPE'] ?? '').trim().toUpperCase();
  if (t === '' || /^(STD|STANDARD|SSU|SSP|UPRIGHT|PENDENT|PENDANT|SPRAY)$/.test(t)) return 'standard';
  if (/^(SW|SIDEWALL|HSW|VSW)/.test(t)) return 'sidewall';
  if (/^(EC|EXT|EXTENDED)/.test(t)) return 'extended-coverage';
  return 'other';
}

function attributeNumber(attributes: Record<string, string>, tag: string): number | undefined {
  const raw = attributes[tag];
  if (raw === undefined) return undefined;
  const n = Number.parseFloat(raw.replace(',', '.'));
  return Number.isFinite(n) ? n : undefined;
}

export function planFromDrawing(drawing: Drawing, settings: Settings): Plan {
  const { roles } = drawing;
  const onHeads = onRoles(roles, 'heads');
  const onPipes = onRoles(roles, 'pipes');
  const onWalls = onRoles(roles, 'walls');
  const onArea = onRoles(roles, 'designArea');
  const onSource = onRoles(roles, 'source');
  const onZones = onRoles(roles, 'zones');
  const headBlock = compilePatterns(headBlocksOf(drawing, settings));
  const si = settings.unitSystem === 'si';

  const candidates = drawing.refs.filter((r) => onHeads(r.layer) && headBlock(r.block));
  // A head layer without a matching head block holds heads drawn as plain circles or points (an exploded drawing).
  const withBlocks = new Set(candidates.map((r) => r.layer));
  const drawnPlain = drawing.symbols
    .filter((s) => onHeads(s.layer) && !withBlocks.has(s.layer))
    .map(
      (s): BlockRef => ({
        handle: s.handle,
        layer: s.layer,
        block: `(${s.type.toLowerCase()})`,
        position: s.position,
        rotationDeg: 0,
        mirrored: false,
        attributes: {},
        parents: [],
        hasNestedRefs: false,
      }),
    );
  // A matching reference whose block holds further matching references is a group of heads, not a head.
  const containers = new Set(candidates.filter((r) => r.hasNestedRefs).map((r) => r.block));
  const isLeaf = (block: string) => !containers.has(block) || !candidates.some((c) => c.parents.at(-1) === block);
  const { kept, duplicates } = withoutDuplicates([...candidates.filter((r) => isLeaf(r.block)), ...drawnPlain]);
  const heads: Head[] = kept.map((r, i) => {
    const k = attributeNumber(r.attributes, 'K');
    const elev = attributeNumber(r.attributes, 'ELEV');
    return {
      id: `H${i + 1}`,
      handle: r.handle,
      layer: r.layer,
      block: r.block,
      position: r.position,
      kFactor: k === undefined ? settings.defaults.kFactor : si ? k / KSI_PER_KUS : k,
      elevation: elev === undefined ? settings.defaults.headElevation : si ? elev / M_PER_FT : elev,
      kind: headKind(r.attributes),
      attributes: r.attributes,
    };
  });

  const sources: Source[] = [
    ...drawing.refs
      .filter((r) => onSource(r.layer) && r.parents.length === 0)
      .map((r) => ({ handle: r.handle, layer: r.layer, position: r.position })),
    ...drawing.points.filter((p) => onSource(p.layer)).map((p) => ({ handle: p.handle, layer: p.layer, position: p.position })),
  ];
  // Linework inside head and riser symbols is never pipe, even where they share the pipe layer.
  const symbolHandles = new Set([...heads.map((h) => h.handle), ...sources.map((s) => s.handle)]);
  return {
    roles,
    heads,
    duplicateHeads: duplicates.map((d) => ({ headId: heads[d.kept]!.id, handles: d.copies.map((c) => c.handle) })),
    pipes: drawing.strokes.filter((s) => onPipes(s.layer) && !symbolHandles.has(s.handle)),
    walls: drawing.strokes.filter((s) => onWalls(s.layer)),
    rooms: drawing.outlines.filter((o) => onWalls(o.layer)),
    designAreas: drawing.outlines.filter((o) => onArea(o.layer)),
    sources,
    labels: drawing.texts.filter((t) => isLabelLayer(t.layer, roles)),
    zones: drawing.outlines.filter((o) => onZones(o.layer)),
    zoneTexts: drawing.texts.filter((t) => onZones(t.layer)),
  };
}

/** Two head symbols closer than this are one head drawn twice (1/8 in; common practice, no source). */
const DUPLICATE_FT = 1 / 96;

/** Drops head symbols drawn again at the point of an earlier one, keeping the first of each point. */
function withoutDuplicates(refs: BlockRef[]): { kept: BlockRef[]; duplicates: { kept: number; copies: BlockRef[] }[] } {
  const near = new PointGrid(DUPLICATE_FT);
  const kept: BlockRef[] = [];
  const copiesOf = new Map<number, BlockRef[]>();
  for (const r of refs) {
    let first: number | undefined;
    near.visitNear(r.position, (k) => {
      if (distance(kept[k]!.position, r.position) >= DUPLICATE_FT) return false;
      first = k;
      return true;
    });
    if (first === undefined) {
      near.insert(r.position, kept.length);
      kept.push(r);
    } else {
      const copies = copiesOf.get(first);
      if (copies) copies.push(r);
      else copiesOf.set(first, [r]);
    }
  }
  return { kept, duplicates: [...copiesOf.entries()].map(([k, copies]) => ({ kept: k, copies })) };
}
