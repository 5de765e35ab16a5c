// What `compare` hands back, in one typed table as `check`'s outputs are: the JSON comparison (the contract's keys),
// a Markdown list a reviewer pastes under "comments addressed / new comments", and HTML with the later plan marked.

import type { Point } from '../geometry/point.js';
import { CAUTION } from '../outputs/caution.js';
import { escapeHtml as esc } from '../outputs/html-escape.js';
import { planSvg, STYLE } from '../outputs/html-report.js';
import type { ReportDesignArea, ReportFinding } from '../outputs/json-report.js';
import type { Reviewed } from '../outputs/reviewed.js';
import { converterFor } from '../quantities/convert.js';
import { formatterFor } from '../quantities/format.js';
import { TOOL } from '../version.js';
import { type Comparison, compareRevisions } from './compare.js';

/** Two checked revisions and what changed between them. */
export interface Revisions {
  before: Reviewed;
  after: Reviewed;
  comparison: Comparison;
}

export const revisionsOf = (before: Reviewed, after: Reviewed): Revisions => ({
  before,
  after,
  comparison: compareRevisions(before, after),
});

/** A design area's figures as a comparison lists them (report units). */
interface AreaFigures {
  source: ReportDesignArea['source'];
  rank: ReportDesignArea['rank'];
  system: string | null;
  zone: string | null;
  heads: number;
  sourcePressure: number | null;
  totalDemand: number | null;
  supplyAvailable: number | null;
  margin: number | null;
}

export interface ComparisonReport {
  tool: { name: string; version: string };
  caution: string;
  before: { file: string; sha256: string; summary: Reviewed['report']['summary'] };
  after: { file: string; sha256: string; summary: Reviewed['report']['summary'] };
  units: Reviewed['report']['units'];
  findings: { resolved: ReportFinding[]; added: ReportFinding[]; unchanged: { before: ReportFinding; after: ReportFinding }[] };
  heads: {
    added: { handle: string; x: number; y: number }[];
    removed: { handle: string; x: number; y: number }[];
    moved: { handle: string; beforeHandle: string; from: { x: number; y: number }; to: { x: number; y: number }; distance: number }[];
    /** Heads of the later drawing with a new handle, taken for the earlier head at their place. */
    matchedByPosition: number;
  };
  pipes: { resized: { handles: string[]; before: string; after: string }[] };
  designAreas: { before: AreaFigures[]; after: AreaFigures[] };
  summary: { resolved: number; added: number; unchanged: number; errorsAfter: number; pass: boolean };
}

const areaFigures = (a: ReportDesignArea): AreaFigures => ({
  source: a.source,
  rank: a.rank,
  system: a.system,
  zone: a.zone,
  heads: a.heads.length,
  sourcePressure: a.hydraulics?.sourcePressure ?? null,
  totalDemand: a.hydraulics?.totalDemand ?? null,
  supplyAvailable: a.hydraulics?.supplyAvailable ?? null,
  margin: a.hydraulics?.margin ?? null,
});

export function comparisonReport({ before, after, comparison: c }: Revisions): ComparisonReport {
  const conv = converterFor(after.reportUnits);
  const round = (v: number) => Math.round(conv.length(v) * 1e4) / 1e4;
  const at = (p: Point) => ({ x: round(p.x), y: round(p.y) });
  const revision = (r: Reviewed) => ({ file: r.report.input.file, sha256: r.report.input.sha256, summary: r.report.summary });
  return {
    tool: { name: TOOL.name, version: TOOL.version },
    caution: CAUTION,
    before: revision(before),
    after: revision(after),
    units: after.report.units,
    findings: {
      resolved: c.findings.resolved.map((f) => before.report.findings[f.index]!),
      added: c.findings.added.map((f) => after.report.findings[f.index]!),
      unchanged: c.findings.unchanged.map((p) => ({ before: before.report.findings[p.before]!, after: after.report.findings[p.after]! })),
    },
    heads: {
      added: c.heads.added.map((h) => ({ handle: h.handle, ...at(h.at) })),
      removed: c.heads.removed.map((h) => ({ handle: h.handle, ...at(h.at) })),
      moved: c.heads.moved.map((m) => ({
        handle: m.handle,
        beforeHandle: m.beforeHandle,
        from: at(m.from),
        to: at(m.to),
        distance: round(m.distance),
      })),
      matchedByPosition: c.heads.matchedByPosition,
    },
    pipes: c.pipes,
    designAreas: { before: before.report.designAreas.map(areaFigures), after: after.report.designAreas.map(areaFigures) },
    summary: {
      resolved: c.findings.resolved.length,
      added: c.findings.added.length,
      unchanged: c.findings.unchanged.length,
      errorsAfter: after.report.summary.errors,
      pass: after.report.summary.pass,
    },
  };
}

const findingLine = (f: ReportFinding) =>
  `${f.severity} \`${f.rule}\`: ${f.message}${f.handles.length ? ` (handles ${f.handles.join(', ')})` : ''}`;
const areaName = (a: AreaFigures) => `${a.rank ?? a.source}${a.zone ? ` · ${a.zone}` : ''}${a.system ? ` · system ${a.system}` : ''}`;

/** Design areas of both revisions side by side, paired by rank, system and zone. */
interface AreaRow {
  name: string;
  before: AreaFigures | null;
  after: AreaFigures | null;
}
function areaRows(r: ComparisonReport): AreaRow[] {
  const key = (a: AreaFigures) => `${a.source}|${a.rank}|${a.system}|${a.zone}`;
  const earlier = new Map(r.designAreas.before.map((a) => [key(a), a]));
  const rows: AreaRow[] = r.designAreas.after.map((a) => ({ name: areaName(a), before: earlier.get(key(a)) ?? null, after: a }));
  const later = new Set(r.designAreas.after.map(key));
  for (const a of r.designAreas.before) if (!later.has(key(a))) rows.push({ name: areaName(a), before: a, after: null });
  return rows;
}

/** An area's demand and margin as one phrase, in the report's units. */
const figuresOf = (a: AreaFigures | null, u: ComparisonReport['units']) => {
  if (a?.sourcePressure == null) return '-';
  const p = (v: number) => `${v.toFixed(u.pressure === 'bar' ? 3 : 1)} ${u.pressure}`;
  return `${p(a.sourcePressure)} at ${a.totalDemand!.toFixed(1)} ${u.flow}${a.margin === null ? '' : `, margin ${p(a.margin)}`}`;
};

export function comparisonMarkdown(revisions: Revisions): string {
  const r = comparisonReport(revisions);
  const u = r.units;
  const figures = (a: AreaFigures | null) => figuresOf(a, u);
  const list = (items: string[], none: string) => (items.length ? items.map((x) => `- ${x}`) : [`- ${none}`]);
  return [
    `# Revision comparison: ${r.before.file} → ${r.after.file}`,
    '',
    `> ${r.caution}`,
    '',
    `The revision ${r.summary.pass ? 'passes' : 'fails'}: ${r.after.summary.errors} errors, ${r.after.summary.warnings} warnings ` +
      `(before: ${r.before.summary.errors} errors, ${r.before.summary.warnings} warnings).`,
    '',
    `## Comments addressed (${r.findings.resolved.length})`,
    ...list(r.findings.resolved.map(findingLine), 'none'),
    '',
    `## New comments (${r.findings.added.length})`,
    ...list(r.findings.added.map(findingLine), 'none'),
    '',
    `## Still open (${r.findings.unchanged.filter((p) => p.after.severity !== 'info').length} errors and warnings)`,
    ...list(
      r.findings.unchanged.filter((p) => p.after.severity !== 'info').map((p) => findingLine(p.after)),
      'none',
    ),
    '',
    '## Heads and pipes',
    ...list(
      [
        ...r.heads.added.map((h) => `head added: ${h.handle} at (${h.x}, ${h.y}) ${u.length}`),
        ...r.heads.removed.map((h) => `head removed: ${h.handle} at (${h.x}, ${h.y}) ${u.length}`),
        ...r.heads.moved.map((m) => `head moved: ${m.handle} by ${m.distance} ${u.length}`),
        ...r.pipes.resized.map((p) => `pipe ${p.handles.join(', ')} resized: ${p.before} → ${p.after} in`),
      ],
      'no head added, removed or moved; no pipe resized',
    ),
    '',
    '## Design areas',
    '',
    '| area | before | after |',
    '|---|---|---|',
    ...areaRows(r).map((row) => `| ${row.name} | ${figures(row.before)} | ${figures(row.after)} |`),
    '',
  ].join('\n');
}

export function comparisonHtml(revisions: Revisions): string {
  const r = comparisonReport(revisions);
  const { before, after, comparison: c } = revisions;
  const fmt = formatterFor(after.reportUnits);
  // Resolved findings where they were (struck through), added ones ringed, on the later plan.
  const overlay = (X: (p: Point) => string, Y: (p: Point) => string, unit: number) => [
    ...c.findings.resolved.map(({ index }) => {
      const f = before.findings[index]!;
      const d = unit * 3;
      return (
        `<g class="resolved"><circle cx="${X(f.at)}" cy="${Y(f.at)}" r="${d.toFixed(3)}"/>` +
        `<line x1="${(Number(X(f.at)) - d).toFixed(3)}" y1="${(Number(Y(f.at)) + d).toFixed(3)}" x2="${(Number(X(f.at)) + d).toFixed(3)}" y2="${(Number(Y(f.at)) - d).toFixed(3)}"/>` +
        `<title>resolved: ${esc(before.report.findings[index]!.message)}</title></g>`
      );
    }),
    ...c.findings.added.map(({ index }) => {
      const f = after.findings[index]!;
      return `<circle class="added" cx="${X(f.at)}" cy="${Y(f.at)}" r="${(unit * 4.5).toFixed(3)}"><title>new: ${esc(after.report.findings[index]!.message)}</title></circle>`;
    }),
  ];
  const rows = (items: ReportFinding[], cls: string) =>
    items.length
      ? `<table class="${cls}"><tbody>${items.map((f) => `<tr><td>${esc(f.severity)}</td><td>${esc(f.rule)}</td><td>${esc(f.message)}</td><td>${esc(f.handles.join(', '))}</td></tr>`).join('')}</tbody></table>`
      : '<p>None.</p>';
  const figures = (a: AreaFigures | null) => esc(figuresOf(a, r.units));
  const headLines = [
    ...r.heads.added.map((h) => `added ${esc(h.handle)}`),
    ...r.heads.removed.map((h) => `removed ${esc(h.handle)}`),
    ...c.heads.moved.map((m) => `moved ${esc(m.handle)} by ${esc(fmt.length(m.distance))}`),
    ...r.pipes.resized.map((p) => `pipe ${esc(p.handles.join(', '))}: ${esc(p.before)} → ${esc(p.after)} in`),
  ];
  const body = [
    `<header class="${r.summary.pass ? 'pass' : 'fail'}"><h1>${r.summary.pass ? 'PASS' : 'FAIL'}: ${esc(r.after.file)} against ${esc(r.before.file)}</h1>`,
    `<p>${r.summary.resolved} resolved, ${r.summary.added} new, ${r.summary.unchanged} unchanged findings; ${r.after.summary.errors} errors now, ${r.before.summary.errors} before.</p>`,
    `<p class="caution">${esc(CAUTION)}</p></header>`,
    `<section><h2>The revision's plan</h2><p>Resolved findings struck through where they were; new ones ringed.</p>${planSvg(after, overlay)}</section>`,
    `<section><h2>Resolved</h2>${rows(r.findings.resolved, 'resolved')}</section>`,
    `<section><h2>New</h2>${rows(r.findings.added, 'added')}</section>`,
    `<section><h2>Unchanged</h2>${rows(
      r.findings.unchanged.map((p) => p.after),
      'unchanged',
    )}</section>`,
    `<section><h2>Heads and pipes</h2>${headLines.length ? `<ul>${headLines.map((l) => `<li>${l}</li>`).join('')}</ul>` : '<p>No head added, removed or moved; no pipe resized.</p>'}</section>`,
    `<section><h2>Design areas</h2><table><thead><tr><th>area</th><th>before</th><th>after</th></tr></thead><tbody>${areaRows(r)
      .map((row) => `<tr><td>${esc(row.name)}</td><td>${figures(row.before)}</td><td>${figures(row.after)}</td></tr>`)
      .join('')}</tbody></table></section>`,
  ];
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'; img-src data:">
<title>headcheck: ${esc(r.after.file)} against ${esc(r.before.file)}</title><style>${STYLE}${COMPARE_STYLE}</style></head>
<body>${body.join('\n')}</body></html>
`;
}

const COMPARE_STYLE =
  '.resolved circle{fill:none;stroke:#777;stroke-width:0.4}.resolved line{stroke:#777;stroke-width:0.4}' +
  'circle.added{fill:none;stroke:#d81b60;stroke-width:0.8}table.resolved td{text-decoration:line-through;color:#555}' +
  'table.added td{background:#fde7ef}';

/** The comparison's outputs: option, what `--help` says, and how each is made. */
export const COMPARE_FORMATS = {
  json: { description: 'the comparison (JSON)', make: (r: Revisions) => `${JSON.stringify(comparisonReport(r), null, 2)}\n` },
  html: { description: 'the comparison with the later plan marked (HTML)', make: comparisonHtml },
  md: { description: 'comments addressed and new comments (Markdown)', make: comparisonMarkdown },
} satisfies Record<string, { description: string; make: (r: Revisions) => string }>;
export type CompareFormatName = keyof typeof COMPARE_FORMATS;
export const COMPARE_FORMAT_NAMES = Object.keys(COMPARE_FORMATS) as CompareFormatName[];
