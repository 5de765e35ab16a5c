// The HTML report: one self-contained page (no network, no external script) with the verdict, the plan as SVG
// (zoom, pan, findings that highlight), findings, design areas, hydraulics and the water-supply graph.

import type { Reviewed } from './reviewed.js';
import { boundsOf, type Point } from '../geometry/point.js';
import type { PipeRole } from '../network/types.js';
import { converterFor, REPORT_UNITS } from '../quantities/convert.js';
import { formatterFor, type Formatter } from '../quantities/format.js';
import type { Finding } from '../rules/types.js';
import { CAUTION } from './caution.js';
import { calculationHtml, type HeadNames } from './calculation-html.js';
import { valueText } from './finding-values.js';
import { escapeHtml as esc } from './html-escape.js';
import { REPORT_SCRIPT, REPORT_SCRIPT_SHA256 } from './report-script.generated.js';
import { supplyGraph } from './supply-graph.js';
import { supplyOf } from '../hydraulics/supply-path.js';
import { pushAll } from '../arrays.js';

const ROLE_COLOR: Record<PipeRole, string> = {
  branch: '#1f6fd1',
  'cross-main': '#7a3fc4',
  'feed-main': '#b3261e',
  riser: '#b3261e',
  drop: '#2e7d32',
  unknown: '#888',
};

export function htmlReport(result: Reviewed): string {
  const input = result;
  const r = result.report;
  const fmt = formatterFor(input.reportUnits);
  const c = converterFor(input.reportUnits);
  const u = REPORT_UNITS[input.reportUnits];
  const verdict = r.summary.pass ? 'PASS' : 'FAIL';
  const body = [
    `<header class="${r.summary.pass ? 'pass' : 'fail'}"><h1>${verdict}: ${esc(r.input.file)}</h1>`,
    `<p>${r.summary.heads} heads, ${r.summary.pipes} pipes, <b>${r.summary.errors} errors</b>, ${r.summary.warnings} warnings.`,
    ` Limits: ${esc(r.limits.edition)}, hazard ${esc(r.design.hazard)}. Units: ${esc(u.length)}, ${esc(u.flow)}, ${esc(u.pressure)}.</p>`,
    `<p class="caution">${esc(CAUTION)}</p></header>`,
    '<section><h2>Plan</h2><div class="tools"><button type="button" id="fit">Fit</button> <span>wheel or pinch to zoom, drag to pan</span></div>',
    planSvg(result),
    legendHtml(result),
    '</section>',
    findingsTable(r.findings, result.findings, fmt),
    designAreasHtml(result, fmt),
    supplyHtml(result, c, u),
    `<footer><p>${esc(r.tool.name)} ${esc(r.tool.version)} · drawing SHA-256 ${esc(r.input.sha256)} · ${esc(r.input.dxfVersion)}, units ${esc(r.input.drawingUnits)}</p></footer>`,
  ];
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'; script-src '${REPORT_SCRIPT_HASH}'; img-src data:">
<title>headcheck: ${verdict} ${esc(r.input.file)}</title><style>${STYLE}</style></head>
<body>${body.join('\n')}<script>${REPORT_SCRIPT}</script></body></html>
`;
}

/** Extra marks drawn over the plan, given its coordinate mapping and a mark size (a comparison's markers). */
export type PlanOverlay = (X: (p: Point) => string, Y: (p: Point) => string, unit: number) => string[];

/** The plan as inline SVG: rooms, walls, zones, areas, pipes by role, heads, finding markers, and `overlay`. */
export function planSvg(result: Reviewed, overlay?: PlanOverlay): string {
  const { plan, network, design, findings } = result;
  const said = result.report.findings;
  const pts: Point[] = [
    ...plan.heads.map((h) => h.position),
    ...network.nodes.map((n) => n.position),
    ...plan.rooms.flatMap((x) => x.points),
  ];
  const b = boundsOf(pts.length ? pts : [{ x: 0, y: 0 }]);
  const pad = Math.max(b.maxX - b.minX, b.maxY - b.minY, 1) * 0.04;
  const w = b.maxX - b.minX + 2 * pad;
  const h = b.maxY - b.minY + 2 * pad;
  const X = (p: Point) => (p.x - b.minX + pad).toFixed(3);
  const Y = (p: Point) => (b.maxY - p.y + pad).toFixed(3);
  const path = (ps: Point[], close: boolean) => `M${ps.map((p) => `${X(p)} ${Y(p)}`).join(' L')}${close ? ' Z' : ''}`;
  const unit = Math.max(w, h) / 250;
  const parts: string[] = [];
  pushAll(
    parts,
    plan.rooms.map((room) => `<path class="room" d="${path(room.points, true)}"/>`),
  );
  pushAll(
    parts,
    plan.walls.map((s) => `<path class="wall" d="${path([s.a, ...s.via, s.b], false)}"/>`),
  );
  for (const z of result.zoning.zones) {
    parts.push(
      `<path class="zone" d="${path(z.outline, true)}"><title>zone ${esc(z.label ?? z.id)}: ${esc(z.hazard)}${z.pattern === null ? ' (no basis given: the design)' : ''}</title></path>`,
    );
  }
  for (const a of design.areas) {
    const rings = a.outline.filter((r) => r.length >= 3);
    if (!rings.length) continue;
    parts.push(
      `<path class="area area-${a.rank ?? 'drawn'}" d="${rings.map((r) => path(r, true)).join(' ')}"><title>${esc(a.rank ?? 'drawn')} design area: ${a.headIds.length} heads</title></path>`,
    );
  }
  // Few large paths, not one element per pipe or head: a plan of 20,000 heads stays smooth to zoom and pan.
  for (const role of Object.keys(ROLE_COLOR) as PipeRole[]) {
    const mine = network.pipes.filter((p) => p.role === role);
    if (mine.length)
      parts.push(
        `<path class="pipe" data-role="${role}" data-count="${mine.length}" stroke="${ROLE_COLOR[role]}" d="${mine.map((p) => path(p.points, false)).join(' ')}"/>`,
      );
  }
  const flowing = new Set(design.areas.filter((a) => a.rank === 'most-demanding').flatMap((a) => a.headIds));
  const r = unit * 1.1;
  // A ring is two half arcs from its left point; the arcs are the same for every head (written once, not per head).
  const arcs = `a${r.toFixed(3)} ${r.toFixed(3)} 0 1 0 ${(2 * r).toFixed(3)} 0a${r.toFixed(3)} ${r.toFixed(3)} 0 1 0 ${(-2 * r).toFixed(3)} 0`;
  const ring = (p: Point) => `M${(Number(X(p)) - r).toFixed(3)} ${Y(p)}${arcs}`;
  for (const [cls, heads] of [
    ['head', plan.heads.filter((h) => !flowing.has(h.id))],
    ['head flowing', plan.heads.filter((h) => flowing.has(h.id))],
  ] as const) {
    if (heads.length) parts.push(`<path class="${cls}" data-count="${heads.length}" d="${heads.map((h) => ring(h.position)).join('')}"/>`);
  }
  pushAll(
    parts,
    findings.map(
      (f, i) =>
        `<circle class="marker ${f.severity}" data-finding="${i}" cx="${X(f.at)}" cy="${Y(f.at)}" r="${(unit * 3).toFixed(3)}"><title>${esc(f.rule)}: ${esc(said[i]!.message)}</title></circle>`,
    ),
  );
  if (overlay) pushAll(parts, overlay(X, Y, unit));
  return `<div class="planbox"><svg id="plan" role="img" aria-label="plan" viewBox="0 0 ${w.toFixed(3)} ${h.toFixed(3)}" data-w="${w.toFixed(3)}" data-h="${h.toFixed(3)}" xmlns="http://www.w3.org/2000/svg">${parts.join('')}</svg></div>`;
}

/**
 * The key to every kind of line, outline and mark the plan draws, each with a small drawn swatch (drawn, not a
 * background colour: printing keeps it).
 */
function legendHtml(result: Reviewed): string {
  const { plan, network, design, findings, zoning } = result;
  const swatch = (inner: string) => `<svg width="22" height="12" viewBox="0 0 22 12" aria-hidden="true">${inner}</svg>`;
  const line = (color: string, dash = '') =>
    swatch(`<path d="M1 6H21" stroke="${color}" stroke-width="3"${dash ? ` stroke-dasharray="${dash}"` : ''}/>`);
  const box = (cls: string) => swatch(`<rect class="${cls}" x="1.5" y="1.5" width="19" height="9"/>`);
  const dot = (fill: string, stroke: string) =>
    swatch(`<circle cx="11" cy="6" r="4" fill="${fill}" stroke="${stroke}" stroke-width="1.5"/>`);
  const entries: [string, string, string][] = [];
  if (plan.rooms.length) entries.push(['room', box('room'), 'room']);
  if (zoning.zones.length) entries.push(['zone', box('zone'), 'hazard zone']);
  const areaNames = { drawn: 'drawn design area', 'most-demanding': 'most demanding area', 'runner-up': 'runner-up area' } as const;
  for (const kind of ['drawn', 'most-demanding', 'runner-up'] as const) {
    if (design.areas.some((a) => (a.rank ?? 'drawn') === kind && a.outline.length))
      entries.push([`area-${kind}`, box(`area area-${kind}`), areaNames[kind]]);
  }
  for (const [role, color] of Object.entries(ROLE_COLOR) as [PipeRole, string][]) {
    if (network.pipes.some((p) => p.role === role)) entries.push([`pipe-${role}`, line(color), role]);
  }
  entries.push(['head', dot('#fff', '#c62828'), 'head']);
  if (design.areas.some((a) => a.rank === 'most-demanding')) entries.push(['head-flowing', dot('#c62828', '#c62828'), 'flowing head']);
  const markColor = { error: '#b3261e', warning: '#ef6c00', info: '#0277bd' } as const;
  for (const severity of ['error', 'warning', 'info'] as const) {
    if (findings.some((f) => f.severity === severity)) entries.push([`marker-${severity}`, dot('none', markColor[severity]), severity]);
  }
  return `<p class="key">${entries.map(([key, sw, label]) => `<span data-key="${key}">${sw}${esc(label)}</span>`).join(' ')}</p>`;
}

function findingsTable(findings: Reviewed['report']['findings'], data: Finding[], fmt: Formatter): string {
  if (!findings.length) return '<section><h2>Findings</h2><p>None.</p></section>';
  const rows = findings.map(
    (f, i) =>
      `<tr class="${f.severity}" data-finding="${i}" tabindex="0"><td>${esc(f.severity)}</td><td><code>${esc(f.rule)}</code></td><td>${esc(f.message)}</td><td>${esc(valueText(data[i]!, data[i]!.measured, fmt))}</td><td>${esc(valueText(data[i]!, data[i]!.limit, fmt))}</td><td>${esc(f.handles.join(' '))}</td><td class="ref">${esc(f.reference)}</td></tr>`,
  );
  return `<section><h2>Findings (${findings.length})</h2><div class="scroll"><table id="findings"><thead><tr><th>severity</th><th>rule</th><th>message</th><th>measured</th><th>limit</th><th>handles</th><th>reference</th></tr></thead><tbody>${rows.join('')}</tbody></table></div></section>`;
}

function designAreasHtml(result: Reviewed, fmt: ReturnType<typeof formatterFor>): string {
  const { design, zoning } = result;
  const basis = zoning.design.design;
  const zoneName = (id: string | null) => (id === null ? '' : (zoning.zones.find((z) => z.id === id)!.label ?? id));
  const groupName = (system: string | null, zone: string | null) =>
    `${system === null ? 'no system' : `system ${system}`}${zone === null ? '' : `, zone ${zoneName(zone)}`}`;
  const head =
    `<p>Design basis: ${esc(basis.hazard)}, ${esc(fmt.density(basis.density))} over ${esc(fmt.area(basis.area))} (${esc(basis.source)})` +
    `${basis.adjustments.length ? `; ${basis.adjustments.map(esc).join('; ')}` : ''}; hose allowance ${esc(fmt.flow(basis.hoseAllowance))}, ${basis.durationMinutes} min.</p>`;
  const groups = design.groups.map((g) => {
    const b = g.basis;
    const search = g.search
      ? ` Search: ${g.search.candidates} candidate areas, ${g.search.evaluated} calculated, ${g.search.screened} ruled out by one solve${g.search.pruned ? ', the rest by a proven bound' : ''}.`
      : '';
    return (
      `<li><b>${esc(groupName(g.system, g.zone))}</b>: ${g.headIds.length} heads; ${esc(b.hazard)}, ${esc(fmt.density(b.density))} over ${esc(fmt.area(b.area))}, hose ${esc(fmt.flow(b.hoseAllowance))}.` +
      `${g.shape ? ` Shape: length ≥ 1.2·√A = ${esc(fmt.length(g.shape.minLength))}, ${g.shape.headsAlong} heads along a line, ${g.shape.totalHeads} heads.` : ''}${search}</li>`
    );
  });
  const rows = design.areas.map((a) => {
    const hy = a.hydraulics;
    return (
      `<tr><td>${esc(a.rank ?? 'drawn')}</td><td>${esc(a.system ?? '-')}</td><td>${esc(zoneName(a.zone) || '-')}</td><td>${a.headIds.length}</td><td>${esc(fmt.length(a.length))}</td><td>${esc(fmt.length(a.width))}</td><td>${esc(fmt.area(a.actualArea))}</td><td>${esc(fmt.area(a.coveredArea))}</td>` +
      `<td>${hy ? esc(fmt.pressure(hy.sourcePressure)) : '-'}</td><td>${hy ? esc(fmt.flow(hy.sourceFlow)) : '-'}</td><td>${hy ? esc(fmt.flow(hy.totalDemand)) : '-'}</td>` +
      `<td>${hy?.supplyAvailable != null ? esc(fmt.pressure(hy.supplyAvailable)) : '-'}</td><td>${hy?.margin != null ? esc(fmt.pressure(hy.margin)) : '-'}</td>` +
      `<td>${hy?.handMethod ? esc(fmt.pressure(hy.handMethod.sourcePressure)) : '-'}</td><td>${esc(a.note ?? '')}</td></tr>`
    );
  });
  // Every calculated area gets its calculation: the drawn (submitted) one and each most demanding one unfolded.
  const names = headNames(result);
  const several = design.groups.length > 1;
  const tables = design.areas
    .filter((a) => a.hydraulics)
    .map((a, k) => {
      const kind = a.rank === null ? 'drawn design area' : a.rank === 'most-demanding' ? 'most demanding area' : 'runner-up area';
      const title = `Calculation of the ${kind}${several ? ` (${groupName(a.system, a.zone)})` : ''}`;
      return calculationHtml(a.hydraulics!, title, k === 0 || a.rank !== 'runner-up', fmt, names);
    });
  return `<section><h2>Design areas</h2>${head}${groups.length ? `<ul>${groups.join('')}</ul>` : ''}
<div class="scroll"><table id="areas"><thead><tr><th>area</th><th>system</th><th>zone</th><th>heads</th><th>length</th><th>width</th><th>floor area</th><th>S × L</th><th>source pressure</th><th>source flow</th><th>with hose</th><th>supply</th><th>margin</th><th>hand method</th><th>note</th></tr></thead><tbody>${rows.join('')}</tbody></table></div>
${tables.join('\n')}</section>`;
}

/** Heads by node and by handle, as the calculation names them (H29 on node N40, handle 1B3). */
function headNames(result: Reviewed): HeadNames {
  const byId = new Map(result.plan.heads.map((h) => [h.id, h]));
  const onNode = new Map<string, string>();
  for (const [headId, node] of Object.entries(result.network.headNode)) onNode.set(node, `${headId} (${byId.get(headId)!.handle})`);
  return { onNode, byHandle: new Map(result.plan.heads.map((h) => [h.handle, h.id])) };
}

function supplyHtml(result: Reviewed, c: ReturnType<typeof converterFor>, u: (typeof REPORT_UNITS)['us']): string {
  const supply = result.settings.supply;
  const demands = result.design.areas.flatMap((a) =>
    a.hydraulics
      ? [
          {
            label: `${a.rank ?? 'drawn'}${a.place ? ` (${a.place.replace(/^the /, '')})` : ''}`,
            flow: a.hydraulics.sourceFlow,
            withHose: a.hydraulics.totalDemand,
            pressure: a.hydraulics.sourcePressure,
          },
        ]
      : [],
  );
  if (!supply && !demands.length) return '';
  const atSource = supplyOf(result.settings);
  return `<section><h2>Water supply</h2>${supply ? '' : '<p>No flow test given: demand points only.</p>'}${supplyGraph(supply, atSource, demands, c, u)}${supplyPathHtml(result, u)}</section>`;
}

/** The supply path at the most demanding area's total demand: the calculation from the flow-test point to the source. */
function supplyPathHtml(result: Reviewed, u: (typeof REPORT_UNITS)['us']): string {
  const area = result.design.areas.find((a) => a.rank === 'most-demanding' && a.hydraulics?.supplyPath.length);
  if (!area) return '';
  const h = area.hydraulics!;
  const fmt = formatterFor(result.reportUnits);
  const rows = h.supplyPath.map(
    (x) =>
      `<tr><td>${esc(x.name)}</td><td>${esc(x.type)}</td><td class="num">${esc(fmt.flow(x.flow))}</td><td class="num">${esc(fmt.pressure(x.pressureFrom))}</td>` +
      `<td class="num">${esc(fmt.pressure(x.loss))}</td><td class="num">${esc(fmt.pressure(x.pressureTo))}</td></tr>`,
  );
  return (
    `<h3>Supply path at ${esc(fmt.flow(h.totalDemand))} (the most demanding area with hose)</h3>` +
    `<table class="supply-path"><thead><tr><th>part</th><th>kind</th><th>flow</th><th>available before (${esc(u.pressure)})</th>` +
    `<th>loss (a pump's boost negative)</th><th>available after</th></tr></thead><tbody>${rows.join('')}</tbody></table>` +
    `<p>Available at the source ${esc(fmt.pressure(h.supplyAvailable!))} against ${esc(fmt.pressure(h.sourcePressure))} needed: margin ${esc(fmt.pressure(h.margin!))}. ` +
    'The hose allowance is taken through the whole path (conservative).</p>'
  );
}

export const STYLE = `
:root{font-family:system-ui,-apple-system,Segoe UI,Roboto,sans-serif;color:#1b1b1b;line-height:1.4}
body{margin:0 auto;max-width:1200px;padding:0 12px 24px}
header{border-left:8px solid #2e7d32;padding:4px 12px;margin:12px 0}header.fail{border-color:#b3261e}
h1{font-size:1.4rem;margin:.3em 0}h2{font-size:1.15rem;border-bottom:1px solid #ccc;padding-bottom:2px}
.caution{font-size:.9rem;background:#fff6d6;padding:6px 8px;border-radius:4px}
.planbox{width:100%;height:70vh;border:1px solid #ccc;background:#fff;overflow:hidden;touch-action:none;cursor:grab}
#plan{width:100%;height:100%;display:block;transform-origin:0 0;will-change:transform}
.zone{fill:#e8eefc;fill-opacity:.5;stroke:#5b6fa8;stroke-dasharray:6 3;stroke-width:1px;vector-effect:non-scaling-stroke}.room{fill:#f4f4f4;stroke:#555;stroke-width:1.2px;vector-effect:non-scaling-stroke}.wall{stroke:#555;fill:none;stroke-width:1.2px;vector-effect:non-scaling-stroke}
.pipe{fill:none;stroke-width:2px;stroke-linecap:round;vector-effect:non-scaling-stroke}
.head{fill:#fff;stroke:#c62828;stroke-width:1px;vector-effect:non-scaling-stroke}.head.flowing{fill:#c62828}
.area{fill:none;stroke-width:1.6px;stroke-dasharray:8 4;vector-effect:non-scaling-stroke}
.area-most-demanding{stroke:#c2185b;fill:rgba(194,24,91,.06)}.area-runner-up{stroke:#00838f}.area-drawn{stroke:#f9a825}
.marker{fill:none;stroke-width:1.6px;cursor:pointer;vector-effect:non-scaling-stroke}.marker.error{stroke:#b3261e}.marker.warning{stroke:#ef6c00}.marker.info{stroke:#0277bd}
.marker.hl{stroke-width:4px;fill:rgba(255,214,0,.35)}
.key span{margin-right:12px;white-space:nowrap;display:inline-block}.key svg{vertical-align:middle;margin-right:4px}
.key .area{stroke-dasharray:5 2}.key .room,.key .zone,.key .area{vector-effect:none}
details.calc{margin:8px 0;border-left:3px solid #c2185b;padding-left:8px}details.calc>summary{font-weight:600;cursor:pointer}
table.steps td,table.steps th{text-align:right;white-space:nowrap}table.steps td:nth-child(2),table.steps td:nth-child(3),table.steps th:nth-child(3){text-align:left}
.sum{font-size:.9rem;color:#333}tr.controlling{background:#fde7ef}
table{border-collapse:collapse;width:100%;font-size:.88rem}th,td{border-bottom:1px solid #e2e2e2;padding:3px 6px;text-align:left;vertical-align:top}
tr.error td:first-child{color:#b3261e;font-weight:600}tr.warning td:first-child{color:#ef6c00}tr.info td:first-child{color:#0277bd}
tr[data-finding]{cursor:pointer}tr.hl{background:#fff3b0}.ref{font-size:.78rem;color:#555}.scroll{overflow-x:auto}
.chart{width:100%;max-width:760px}.chart text{font-size:11px}.chart .axis{stroke:#333}.chart .grid{stroke:#e5e5e5}.chart .supply{stroke:#1f6fd1;stroke-width:2;fill:none}.chart .supply-source{stroke:#1f6fd1;stroke-width:2;stroke-dasharray:6 3;fill:none}
.chart .demand{fill:#c2185b}.chart .hose{stroke:#c2185b;stroke-dasharray:4 3}.chart .leader{stroke:#999;stroke-width:.8}
footer{font-size:.8rem;color:#666;margin-top:24px}
@media (max-width:640px){.planbox{height:50vh}td.ref,th:last-child{display:none}}
@media print{*{-webkit-print-color-adjust:exact;print-color-adjust:exact}.tools{display:none}.scroll{overflow:visible}table{font-size:.68rem}th,td{padding:2px 3px}.planbox{height:auto;border:none}#plan{height:auto;max-height:60vh}details{display:block}details>*{display:block}
section{break-inside:avoid-page}header{border-left-width:4px}a{color:inherit}}
`;

/** The CSP source of the report's one script, by its SHA-256 (no other inline script may run). */
export const REPORT_SCRIPT_HASH = `sha256-${REPORT_SCRIPT_SHA256}`;
