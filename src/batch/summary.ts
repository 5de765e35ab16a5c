// The batch summary files: summary.json (every row), summary.csv (one line a drawing) and index.html
// (worst first, each drawing linked to its report), with the caution.

import { CAUTION } from '../outputs/caution.js';
import { escapeHtml as esc } from '../outputs/html-escape.js';
import type { ReportUnits } from '../quantities/convert.js';
import { TOOL } from '../version.js';
import type { BatchRow } from './worker.js';

const rankOf = { error: 0, fail: 1, pass: 2, skipped: 3 } as const;

/** Worst first: unreadable, then failing (most errors first, then most new findings), then passing; ties by file. */
const worstFirst = (rows: BatchRow[]): BatchRow[] =>
  [...rows].sort(
    (a, b) =>
      rankOf[a.status] - rankOf[b.status] ||
      (b.errors ?? 0) - (a.errors ?? 0) ||
      (b.added ?? 0) - (a.added ?? 0) ||
      a.file.localeCompare(b.file),
  );

const csvCell = (v: unknown) => {
  const s = v === null || v === undefined ? '' : String(v);
  return /[",\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
};

export function summaryCsv(rows: BatchRow[]): string {
  const head = [
    'file',
    'status',
    'heads',
    'errors',
    'warnings',
    'demand_pressure',
    'demand_flow_with_hose',
    'supply_margin',
    'resolved',
    'added',
    'config',
    'message',
    'ms',
  ];
  const lines = rows.map((r) =>
    [
      r.file,
      r.status,
      r.heads,
      r.errors,
      r.warnings,
      r.demandPressure,
      r.demandFlow,
      r.margin,
      r.resolved,
      r.added,
      r.config,
      r.message,
      r.ms,
    ]
      .map(csvCell)
      .join(','),
  );
  // The caution closes the table as a row of its own: file "caution", the text where a row's message goes.
  const caution = ['caution', '', '', '', '', '', '', '', '', '', '', CAUTION, ''].map(csvCell).join(',');
  return `${head.join(',')}\n${[...lines, caution].join('\n')}\n`;
}

export function summaryHtml(rows: BatchRow[], units: ReportUnits): string {
  const body = worstFirst(rows).map((r) => {
    const link = r.outputs.find((o) => o.endsWith('.html'));
    const name = link ? `<a href="${esc(encodeURI(link))}">${esc(r.file)}</a>` : esc(r.file);
    return (
      `<tr class="${r.status}"><td>${r.status.toUpperCase()}</td><td>${name}</td><td>${r.heads ?? ''}</td><td>${r.errors ?? ''}</td><td>${r.warnings ?? ''}</td>` +
      `<td>${r.demandPressure ?? ''}</td><td>${r.demandFlow ?? ''}</td><td>${r.margin ?? ''}</td><td>${r.resolved ?? ''}</td><td>${r.added ?? ''}</td><td>${esc(r.message ?? '')}</td></tr>`
    );
  });
  const count = (s: BatchRow['status']) => rows.filter((r) => r.status === s).length;
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'">
<title>headcheck batch: ${rows.length} drawings</title><style>
body{font-family:system-ui,sans-serif;max-width:1200px;margin:0 auto;padding:12px}table{border-collapse:collapse;width:100%;font-size:.9rem}
th,td{border-bottom:1px solid #ddd;padding:4px 6px;text-align:left}tr.error td:first-child{color:#6a1b9a;font-weight:700}
tr.fail td:first-child{color:#b3261e;font-weight:700}tr.pass td:first-child{color:#2e7d32}tr.skipped td:first-child{color:#666}.caution{background:#fff6d6;padding:6px 8px}
</style></head><body><h1>headcheck batch: ${rows.length} drawings</h1>
<p>${count('error')} could not be checked, ${count('fail')} fail, ${count('pass')} pass${count('skipped') ? `, ${count('skipped')} skipped` : ''}. Pressures in ${esc(units.pressure)}, flows in ${esc(units.flow)}.</p>
<p class="caution">${esc(CAUTION)}</p>
<table><thead><tr><th>verdict</th><th>drawing</th><th>heads</th><th>errors</th><th>warnings</th><th>demand pressure</th><th>demand flow (with hose)</th><th>supply margin</th><th>resolved</th><th>new</th><th>problem</th></tr></thead>
<tbody>${body.join('\n')}</tbody></table><p>${esc(TOOL.name)} ${esc(TOOL.version)}</p></body></html>
`;
}
