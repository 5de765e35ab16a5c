// What headcheck draws on a reviewed drawing, as plain primitives in feet: a ring and a label per finding,
// design-area outlines with their numbers, hazard zones, head and pipe tags of the most demanding areas, a legend.

import type { DesignBasis } from '../basis/design-basis.js';
import type { Zone } from '../zones/zones.js';
import type { DesignAreas } from '../design-area/evaluate.js';
import { boundsOf, type Point } from '../geometry/point.js';
import type { Network } from '../network/types.js';
import type { Formatter } from '../quantities/format.js';
import type { Plan } from '../read/plan.js';
import type { Finding } from '../rules/types.js';
import { TOOL } from '../version.js';
import { CAUTION } from './caution.js';

export type Primitive =
  | { kind: 'circle'; layer: string; center: Point; radius: number; color: number }
  | { kind: 'text'; layer: string; at: Point; height: number; text: string; color: number }
  | { kind: 'polyline'; layer: string; points: Point[]; closed: boolean; color: number };

export interface Annotations {
  layers: { name: string; color: number }[];
  primitives: Primitive[];
  /** The legend, drawn in its own block (local coordinates from its base point) and placed at `at`. */
  legend: { block: string; layer: string; at: Point; primitives: Primitive[] };
}

const LAYERS = {
  findings: { name: 'HC-FINDINGS', color: 1 },
  area: { name: 'HC-DESIGN-AREA', color: 6 },
  heads: { name: 'HC-HEAD-TAGS', color: 3 },
  pipes: { name: 'HC-PIPE-TAGS', color: 5 },
  zones: { name: 'HC-ZONES', color: 8 },
  legend: { name: 'HC-LEGEND', color: 7 },
} as const;

/** AutoCAD colour index per severity: red, orange, cyan. */
const SEVERITY_COLOR = { error: 1, warning: 30, info: 4 } as const;

export interface AnnotationInput {
  fileName: string;
  plan: Plan;
  network: Network;
  design: DesignAreas;
  findings: Finding[];
  edition: string;
  /** The configured design basis, and the hazard zones with theirs. */
  basis: DesignBasis;
  zones: Zone[];
  fmt: Formatter;
}

export function buildAnnotations(a: AnnotationInput): Annotations {
  const pts = [...a.plan.heads.map((h) => h.position), ...a.network.nodes.map((n) => n.position), ...a.plan.rooms.flatMap((r) => r.points)];
  const b = boundsOf(pts.length ? pts : [{ x: 0, y: 0 }]);
  const extent = Math.max(b.maxX - b.minX, b.maxY - b.minY, 1);
  // Text about 1/200 of the plan, between 3 in and 2 ft (common practice for plotted review comments).
  const h = Math.min(2, Math.max(0.25, extent / 200));
  const prims: Primitive[] = [];
  const { fmt } = a;
  for (const f of a.findings) {
    const color = SEVERITY_COLOR[f.severity];
    prims.push({ kind: 'circle', layer: LAYERS.findings.name, center: f.at, radius: 2 * h, color });
    prims.push({
      kind: 'text',
      layer: LAYERS.findings.name,
      at: { x: f.at.x + 2.2 * h, y: f.at.y + 1.2 * h },
      height: h,
      text: findingLabel(f, fmt),
      color,
    });
  }
  for (const zone of a.zones) {
    prims.push({ kind: 'polyline', layer: LAYERS.zones.name, points: zone.outline, closed: true, color: LAYERS.zones.color });
    const box = boundsOf(zone.outline);
    const basis = `${zone.hazard}, ${fmt.density(zone.design.density)} over ${fmt.area(zone.design.area)}`;
    prims.push({
      kind: 'text',
      layer: LAYERS.zones.name,
      at: { x: box.minX + h, y: box.minY + h },
      height: h,
      text: `ZONE ${zone.label ?? zone.id}: ${zone.pattern === null ? `no basis given, design ${basis}` : basis}`,
      color: LAYERS.zones.color,
    });
  }
  const areaName = {
    drawn: 'DRAWN DESIGN AREA',
    'most-demanding': 'MOST DEMANDING AREA (searched)',
    'runner-up': 'RUNNER-UP AREA (searched)',
  };
  const areaColor = { drawn: 2, 'most-demanding': 6, 'runner-up': 4 };
  for (const area of a.design.areas) {
    const key = area.rank ?? 'drawn';
    const rings = area.outline.filter((r) => r.length >= 3);
    if (!rings.length) continue;
    for (const ring of rings) prims.push({ kind: 'polyline', layer: LAYERS.area.name, points: ring, closed: true, color: areaColor[key] });
    const top = boundsOf(rings.flat());
    const hy = area.hydraulics;
    const numbers = hy ? `, ${fmt.pressure(hy.sourcePressure)} at ${fmt.flow(hy.sourceFlow)} at the source` : '';
    prims.push({
      kind: 'text',
      layer: LAYERS.area.name,
      at: { x: top.minX, y: top.maxY + (key === 'runner-up' ? 2.8 : key === 'drawn' ? 4.4 : 1.2) * h },
      height: h,
      text: `${areaName[key]}: ${area.headIds.length} heads, ${fmt.area(area.actualArea)}${numbers}`,
      color: areaColor[key],
    });
  }
  const nodeAt = new Map(a.network.nodes.map((n) => [n.id, n]));
  const headOfNode = new Map(Object.entries(a.network.headNode).map(([head, node]) => [node, head]));
  const pipeAt = new Map(a.network.pipes.map((p) => [p.id, p]));
  // The pressures and flows of each system's (and zone's) most demanding area.
  for (const best of a.design.areas.filter((x) => x.rank === 'most-demanding').map((x) => x.hydraulics)) {
    if (!best) continue;
    for (const n of best.nodes.filter((x) => x.flow > 0)) {
      const node = nodeAt.get(n.id);
      if (!node) continue;
      prims.push({
        kind: 'text',
        layer: LAYERS.heads.name,
        at: { x: node.position.x + 0.6 * h, y: node.position.y - 1.6 * h },
        height: 0.7 * h,
        text: `${headOfNode.get(n.id) ?? n.id} ${fmt.pressure(n.pressure)} ${fmt.flow(n.flow)}`,
        color: LAYERS.heads.color,
      });
    }
    for (const p of best.pipes) {
      const pipe = pipeAt.get(p.id);
      if (!pipe) continue;
      const mid = pipe.points[Math.floor(pipe.points.length / 2)]!;
      const prev = pipe.points[Math.max(0, Math.floor(pipe.points.length / 2) - 1)]!;
      const at =
        pipe.points.length === 2
          ? { x: (pipe.points[0]!.x + pipe.points[1]!.x) / 2, y: (pipe.points[0]!.y + pipe.points[1]!.y) / 2 }
          : { x: (mid.x + prev.x) / 2, y: (mid.y + prev.y) / 2 };
      prims.push({
        kind: 'text',
        layer: LAYERS.pipes.name,
        at: { x: at.x, y: at.y + 0.5 * h },
        height: 0.6 * h,
        text: `${pipe.id} ${pipe.nominalSize}" ${fmt.flow(Math.abs(p.flow))}`,
        color: LAYERS.pipes.color,
      });
    }
  }
  return {
    layers: Object.values(LAYERS),
    primitives: prims,
    legend: { block: 'HC-LEGEND', layer: LAYERS.legend.name, at: { x: b.maxX + 6 * h, y: b.maxY }, primitives: legend(a, h) },
  };
}

function findingLabel(f: Finding, fmt: Formatter): string {
  const show = (v: number | null) => {
    if (v === null) return '';
    switch (f.quantity) {
      case 'length':
        return fmt.length(v);
      case 'area':
        return fmt.area(v);
      case 'pressure':
        return fmt.pressure(v);
      case 'flow':
        return fmt.flow(v);
      case 'kFactor':
        return fmt.kFactor(v);
      case 'density':
        return fmt.density(v);
      default:
        return String(Math.round(v * 100) / 100);
    }
  };
  const values = f.measured !== null && f.limit !== null ? `: ${show(f.measured)} (limit ${show(f.limit)})` : '';
  return `${f.severity.toUpperCase()} ${f.rule}${values}`;
}

/** Legend lines, top-down from the block's base point (its top-left corner). */
function legend(a: AnnotationInput, h: number): Primitive[] {
  const errors = a.findings.filter((f) => f.severity === 'error').length;
  const warnings = a.findings.filter((f) => f.severity === 'warning').length;
  const best = a.design.areas.find((x) => x.rank === 'most-demanding')?.hydraulics;
  const lines = [
    `HEADCHECK REVIEW (${TOOL.name} ${TOOL.version})`,
    `Drawing: ${a.fileName.split(/[\\/]/).pop()}`,
    `Verdict: ${errors ? 'FAIL' : 'PASS'} - ${errors} errors, ${warnings} warnings`,
    `Limits: ${a.edition}; ${a.basis.hazard}, density ${a.fmt.density(a.basis.density)} over ${a.fmt.area(a.basis.area)}`,
    ...(best
      ? [
          `Most demanding area: ${a.fmt.pressure(best.sourcePressure)} at ${a.fmt.flow(best.sourceFlow)} + ${a.fmt.flow(best.hoseAllowance)} hose`,
        ]
      : []),
    ...(best && best.supplyAvailable !== null
      ? [`Supply: ${a.fmt.pressure(best.supplyAvailable)} at ${a.fmt.flow(best.totalDemand)}; margin ${a.fmt.pressure(best.margin!)}`]
      : []),
    'Layers: HC-FINDINGS rings red = error, orange = warning, cyan = info; HC-DESIGN-AREA outlines;',
    'HC-HEAD-TAGS pressure and flow of flowing heads; HC-PIPE-TAGS pipe size and flow.',
    ...wrap(CAUTION, 90),
  ];
  const prims: Primitive[] = lines.map((t, i) => ({
    kind: 'text',
    layer: '0',
    at: { x: h, y: -(i + 1) * 1.8 * h },
    height: i === 0 ? 1.2 * h : h,
    text: t,
    color: i === 0 ? 7 : 256,
  }));
  const width = Math.max(...lines.map((l) => l.length)) * 0.75 * h + 2 * h;
  const height = (lines.length + 0.8) * 1.8 * h;
  prims.push({
    kind: 'polyline',
    layer: '0',
    points: [
      { x: 0, y: 0 },
      { x: width, y: 0 },
      { x: width, y: -height },
      { x: 0, y: -height },
    ],
    closed: true,
    color: 256,
  });
  return prims;
}

function wrap(text: string, width: number): string[] {
  const out: string[] = [];
  let line = '';
  for (const word of text.split(/\s+/)) {
    if (`${line} ${word}`.trim().length > width) {
      out.push(line.trim());
      line = word;
    } else line += ` ${word}`;
  }
  if (line.trim()) out.push(line.trim());
  return out;
}
