// `headcheck layers`: what each layer holds (entity counts, the blocks placed on it with their size, attribute
// tags), the role the tool gives it and why, and the head symbols it turned down; as text, JSON or a starter config.

import { LAYER_ROLES, type LayerRole, type Settings } from '../config/settings.js';
import { inspectDrawing, type Inspection } from '../read/read-drawing.js';
import { FEET_PER_UNIT } from '../read/units.js';

export interface LayerRow {
  name: string;
  entities: Record<string, number>;
  /** Blocks placed on the layer (through nesting and arrays), most placed first, with their extent across in drawing units. */
  blocks: { name: string; count: number; size: number | null; sizeInches: number | null }[];
  /** Attribute tags of those blocks. */
  tags: string[];
  role: LayerRole | null;
  reason: string | null;
}

export interface LayersReport {
  drawing: { format: string; version: string; encoding: string };
  /** The drawing unit, or null: lengths are then in drawing units. */
  units: string | null;
  layers: LayerRow[];
  roles: Record<LayerRole, { layers: string[]; from: string; reason: string }>;
  /** The blocks taken as head symbols (guessed heads drawn as blocks). */
  headBlocks: string[];
  headCandidates: { layer: string; block: string | null; count: number; size: number | null; taken: boolean; why: string }[];
}

/** Blocks listed per layer. */
const BLOCKS_SHOWN = 8;

/** `dwgVersion`: the DWG's version tag where `bytes` are its DXF conversion. */
export function layersReport(bytes: Uint8Array, settings: Settings, dwgVersion: string | null = null): LayersReport {
  const inspection = inspectDrawing(bytes, {
    layers: settings.layers,
    limits: settings.inputLimits,
    ...(settings.units ? { units: settings.units } : {}),
  });
  return reportOf(inspection, dwgVersion);
}

function reportOf(x: Inspection, dwgVersion: string | null): LayersReport {
  const roleOf = new Map<string, LayerRole>();
  for (const role of LAYER_ROLES) for (const l of x.roles[role].layers) roleOf.set(l, role);
  const inchesPerUnit = x.units ? FEET_PER_UNIT[x.units] * 12 : null;
  const layers = x.layers.map((l): LayerRow => {
    const blocks = Object.entries(l.blockRefs)
      .sort((a, b) => b[1] - a[1])
      .slice(0, BLOCKS_SHOWN)
      .map(([name, count]) => {
        const size = x.evidence.block(name).size;
        return { name, count, size, sizeInches: size !== null && inchesPerUnit !== null ? round(size * inchesPerUnit) : null };
      });
    const tags = [...new Set(blocks.flatMap((b) => x.evidence.block(b.name).tags))].sort();
    const role = roleOf.get(l.name) ?? null;
    return { name: l.name, entities: l.counts, blocks, tags, role, reason: role ? x.roles[role].reason : null };
  });
  return {
    drawing: dwgVersion
      ? { format: 'DWG', version: dwgVersion, encoding: x.source.encoding }
      : { format: x.source.format.toUpperCase(), version: x.source.header.version, encoding: x.source.encoding },
    units: x.units,
    layers,
    roles: Object.fromEntries(
      LAYER_ROLES.map((r) => [r, { layers: x.roles[r].layers, from: x.roles[r].from, reason: x.roles[r].reason }]),
    ) as LayersReport['roles'],
    headBlocks: x.roles.heads.from === 'guess' ? (x.roles.heads.blocks ?? []) : [],
    headCandidates: x.headCandidates,
  };
}

const round = (v: number) => Math.round(v * 100) / 100;

/** The report as text for a terminal: a table of layers, the roles and why, the head symbols turned down. */
export function layersText(r: LayersReport): string {
  const sized = (size: number | null, inches: number | null) =>
    inches !== null ? `${fmt(inches)} in` : size !== null ? `${fmt(size)} units` : 'empty';
  const rows = r.layers.map((l) => [
    l.name,
    l.role ?? '-',
    Object.entries(l.entities)
      .sort(([a], [b]) => a.localeCompare(b))
      .map(([t, n]) => `${t} ${n}`)
      .join(', ') || '(empty)',
    l.blocks.map((b) => `${b.name} ×${b.count} (${sized(b.size, b.sizeInches)})`).join(', '),
    l.tags.join(', '),
  ]);
  const header = ['layer', 'role', 'entities', 'blocks (placed × size across)', 'tags'];
  const width = header.map((h, i) => Math.max(h.length, ...rows.map((row) => row[i]!.length)));
  const line = (row: string[]) =>
    row
      .map((c, i) => (i === row.length - 1 ? c : c.padEnd(width[i]!)))
      .join('  ')
      .trimEnd();
  const unit = r.units ? `units ${r.units}` : 'no unit stated (sizes in drawing units; give one with --drawing-units or "units")';
  const turnedDown = r.headCandidates.filter((c) => !c.taken);
  return [
    `drawing: ${r.drawing.format} ${r.drawing.version}, ${unit}, encoding ${r.drawing.encoding}`,
    line(header),
    ...rows.map(line),
    'roles:',
    ...LAYER_ROLES.map(
      (role) => `  ${role}: ${r.roles[role].layers.join(', ') || '(none)'} (${r.roles[role].from}: ${r.roles[role].reason})`,
    ),
    ...(turnedDown.length
      ? [
          'not taken as heads:',
          ...turnedDown.map((c) => `  ${c.layer}: ${c.block === null ? 'circles' : `block ${c.block}`} ×${c.count}: ${c.why}`),
        ]
      : []),
  ].join('\n');
}

const fmt = (v: number) => String(+v.toPrecision(4));

/** A starter config from the roles chosen: `check --config` accepts it unchanged. */
export function starterConfig(r: LayersReport, drawing: string): Record<string, unknown> {
  const layers = Object.fromEntries(LAYER_ROLES.filter((role) => r.roles[role].layers.length).map((role) => [role, r.roles[role].layers]));
  const { headBlocks } = r;
  return {
    comment:
      `written by headcheck layers from ${drawing.split(/[\\/]/).pop()}: check each role before relying on it` +
      (r.units ? '' : '; the drawing states no unit: add "units" (in, ft, mm, cm or m)'),
    ...(r.units ? { units: r.units } : {}),
    layers,
    ...(headBlocks.length ? { headBlocks } : {}),
  };
}
