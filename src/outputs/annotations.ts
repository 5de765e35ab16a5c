// What headcheck draws on a reviewed drawing, as plain primitives in feet: a ring and a label per finding,
// design-area outlines with their numbers, hazard zones, head and pipe tags of the most demanding areas, a legend.

import type { DesignBasis } from '../basis/design-basis.js';
import type { Zone } from '../zones/zones.js';
import type { DesignAreas } from '../design-area/evaluate.js';
import { placeLabels, type Box } from '../geometry/labels.js';
import { boundsOf, type Point } from '../geometry/point.js';
import { pushAll } from '../arrays.js';
import type { Network } from '../network/types.js';
import type { Formatter } from '../quantities/format.js';
import type { Plan } from '../read/plan.js';
import type { Finding } from '../rules/types.js';
import { TOOL } from '../version.js';
import { CAUTION } from './caution.js';
import { headsNamed, measuredText } from './finding-values.js';

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

/**
 * AutoCAD colour indexes readable on a white and on a black background alike: each has a contrast ratio of at
 * least 3.5 against both (WCAG's formula on ezdxf's palette; 7 is black or white by the background itself).
 */
const LAYERS = {
  findings: { name: 'HC-FINDINGS', color: 1 },
  area: { name: 'HC-DESIGN-AREA', color: 230 },
  heads: { name: 'HC-HEAD-TAGS', color: 94 },
  pipes: { name: 'HC-PIPE-TAGS', color: 142 },
  zones: { name: 'HC-ZONES', color: 193 },
  legend: { name: 'HC-LEGEND', color: 7 },
} as const;

/** Per severity: red, brown-orange, blue. */
const SEVERITY_COLOR = { error: 1, warning: 32, info: 150 } as const;
/** Per design area: ochre (drawn), rose (most demanding), teal (runner-up). */
const AREA_COLOR = { drawn: 42, 'most-demanding': 230, 'runner-up': 134 } as const;
export const ANNOTATION_COLORS: readonly number[] = [
  ...Object.values(LAYERS).map((l) => l.color),
  ...Object.values(SEVERITY_COLOR),
  ...Object.values(AREA_COLOR),
];

/**
 * A text's box as readers measure it without the font: each character as wide as the text is high, a third of the
 * height below the baseline (ezdxf's monospace measure).
 */
const textBox = (text: string, height: number) => ({ width: text.length * height, height: (4 / 3) * height, below: height / 3 });

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

/** A text waiting for its place: near `anchor`, at least `clear` away from it. */
interface Label {
  layer: string;
  anchor: Point;
  clear: number;
  height: number;
  text: string;
  color: number;
}

export function buildAnnotations(a: AnnotationInput): Annotations {
  const pts = [...a.plan.heads.map((h) => h.position), ...a.network.nodes.map((n) => n.position), ...a.plan.rooms.flatMap((r) => r.points)];
  const b = boundsOf(pts.length ? pts : [{ x: 0, y: 0 }]);
  const extent = Math.max(b.maxX - b.minX, b.maxY - b.minY, 1);
  // Text about 1/200 of the plan, between 3 in and 2 ft (common practice for plotted review comments).
  const h = Math.min(2, Math.max(0.25, extent / 200));
  const prims: Primitive[] = [];
  // Texts in order of importance: the findings take the nearest free places, then areas, zones and tags.
  const labels: Label[] = [];
  const { fmt } = a;
  for (const f of a.findings) {
    const color = SEVERITY_COLOR[f.severity];
    prims.push({ kind: 'circle', layer: LAYERS.findings.name, center: f.at, radius: 2 * h, color });
    labels.push({ layer: LAYERS.findings.name, anchor: f.at, clear: 2 * h, height: h, text: findingLabel(f, fmt), color });
  }
  const areaName = {
    drawn: 'DRAWN DESIGN AREA',
    'most-demanding': 'MOST DEMANDING AREA (searched)',
    'runner-up': 'RUNNER-UP AREA (searched)',
  };
  for (const area of a.design.areas) {
    const key = area.rank ?? 'drawn';
    const rings = area.outline.filter((r) => r.length >= 3);
    if (!rings.length) continue;
    for (const ring of rings) prims.push({ kind: 'polyline', layer: LAYERS.area.name, points: ring, closed: true, color: AREA_COLOR[key] });
    const top = boundsOf(rings.flat());
    const hy = area.hydraulics;
    const numbers = hy ? `, ${fmt.pressure(hy.sourcePressure)} at ${fmt.flow(hy.sourceFlow)} at the source` : '';
    const where = area.place ? ` - ${area.place}` : '';
    labels.push({
      layer: LAYERS.area.name,
      anchor: { x: top.minX, y: top.maxY },
      clear: 0.5 * h,
      height: h,
      text: `${areaName[key]}${where}: ${area.headIds.length} heads, ${fmt.area(area.actualArea)}${numbers}`,
      color: AREA_COLOR[key],
    });
  }
  for (const zone of a.zones) {
    prims.push({ kind: 'polyline', layer: LAYERS.zones.name, points: zone.outline, closed: true, color: LAYERS.zones.color });
    const box = boundsOf(zone.outline);
    const basis = `${zone.hazard}, ${fmt.density(zone.design.density)} over ${fmt.area(zone.design.area)}`;
    labels.push({
      layer: LAYERS.zones.name,
      anchor: { x: box.minX, y: box.minY },
      clear: 0.5 * h,
      height: h,
      text: `ZONE ${zone.label ?? zone.id}: ${zone.pattern === null ? `no basis given, design ${basis}` : basis}`,
      color: LAYERS.zones.color,
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
      labels.push({
        layer: LAYERS.heads.name,
        anchor: node.position,
        clear: 0.5 * h,
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
      labels.push({
        layer: LAYERS.pipes.name,
        anchor: at,
        clear: 0.3 * h,
        height: 0.6 * h,
        text: `${pipe.id} ${pipe.nominalSize}" ${fmt.flow(Math.abs(p.flow))}`,
        color: LAYERS.pipes.color,
      });
    }
  }
  const legendAt = { x: b.maxX + 6 * h, y: b.maxY };
  const legendPrims = legend(a, h);
  const frame = boundsOf(legendPrims.flatMap((p) => (p.kind === 'polyline' ? p.points : [])));
  pushAll(
    prims,
    placed(
      labels,
      [{ minX: legendAt.x + frame.minX, minY: legendAt.y + frame.minY, maxX: legendAt.x + frame.maxX, maxY: legendAt.y + frame.maxY }],
      h,
    ),
  );
  return {
    layers: Object.values(LAYERS),
    primitives: prims,
    legend: { block: 'HC-LEGEND', layer: LAYERS.legend.name, at: legendAt, primitives: legendPrims },
  };
}

/** The labels as texts where none overlaps another or the kept-clear boxes, with a leader line where one had to move. */
function placed(labels: Label[], keepClear: Box[], h: number): Primitive[] {
  const boxes = labels.map((l) => textBox(l.text, l.height));
  const spots = placeLabels(
    labels.map((l, i) => ({ at: l.anchor, width: boxes[i]!.width, height: boxes[i]!.height, clear: l.clear })),
    keepClear,
    0.25 * h,
  );
  return labels.flatMap((l, i): Primitive[] => {
    const spot = spots[i]!;
    const text: Primitive = {
      kind: 'text',
      layer: l.layer,
      at: { x: spot.minX, y: spot.minY + boxes[i]!.below },
      height: l.height,
      text: l.text,
      color: l.color,
    };
    if (!spot.moved) return [text];
    const to = { x: Math.min(Math.max(l.anchor.x, spot.minX), spot.maxX), y: Math.min(Math.max(l.anchor.y, spot.minY), spot.maxY) };
    return [text, { kind: 'polyline', layer: l.layer, points: [l.anchor, to], closed: false, color: l.color }];
  });
}

/** A finding's label on the drawing: severity, rule, the heads it names, measured against the limit. */
function findingLabel(f: Finding, fmt: Formatter): string {
  const heads = headsNamed(f);
  const shown = heads.length > 4 ? `${heads.slice(0, 3).join(' ')} +${heads.length - 3}` : heads.join(' ');
  const values = measuredText(f, fmt);
  return `${f.severity.toUpperCase()} ${f.rule}${shown ? ` ${shown}` : ''}${values ? `: ${values}` : ''}`;
}

/** Legend lines, top-down from the block's base point (its top-left corner). */
function legend(a: AnnotationInput, h: number): Primitive[] {
  const errors = a.findings.filter((f) => f.severity === 'error').length;
  const warnings = a.findings.filter((f) => f.severity === 'warning').length;
  const demanding = a.design.areas.filter((x) => x.rank === 'most-demanding' && x.hydraulics);
  const lines = [
    `HEADCHECK REVIEW (${TOOL.name} ${TOOL.version})`,
    `Drawing: ${a.fileName.split(/[\\/]/).pop()}`,
    `Verdict: ${errors ? 'FAIL' : 'PASS'} - ${errors} errors, ${warnings} warnings`,
    `Limits: ${a.edition}; ${a.basis.hazard}, density ${a.fmt.density(a.basis.density)} over ${a.fmt.area(a.basis.area)}`,
    ...demanding.flatMap((x) => {
      const hy = x.hydraulics!;
      const where = x.place ? ` (${x.place})` : '';
      return [
        `Most demanding area${where}: ${a.fmt.pressure(hy.sourcePressure)} at ${a.fmt.flow(hy.sourceFlow)} + ${a.fmt.flow(hy.hoseAllowance)} hose` +
          (hy.supplyAvailable !== null ? `; supply ${a.fmt.pressure(hy.supplyAvailable)}, margin ${a.fmt.pressure(hy.margin!)}` : ''),
      ];
    }),
    'Layers: HC-FINDINGS rings red = error, brown = warning, blue = info; HC-DESIGN-AREA outlines;',
    'HC-ZONES hazard zones; HC-HEAD-TAGS pressure and flow of flowing heads; HC-PIPE-TAGS pipe size and flow.',
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
  const width = Math.max(...lines.map((l, i) => textBox(l, i === 0 ? 1.2 * h : h).width)) + 2 * h;
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
