// What `check` prints: each error and warning finding on a line of its own (file, severity, rule, where, what,
// handles), then the one-line verdict: file, heads, systems, errors, warnings, pass or fail.

import type { Report, ReportFinding } from '../outputs/json-report.js';

export function summaryLine(file: string, report: Report): string {
  const s = report.summary;
  const systems = s.systems > 1 ? `, ${s.systems} systems` : '';
  return `${file}: ${s.pass ? 'PASS' : 'FAIL'}: ${s.heads} heads, ${s.pipes} pipes${systems}, ${s.errors} errors, ${s.warnings} warnings`;
}

/** The error and warning findings, one line each, in report order. */
export function findingLines(file: string, report: Report): string[] {
  const unit = report.units.length;
  const line = (f: ReportFinding) =>
    `${file}: ${f.severity} ${f.rule} at (${f.at.x.toFixed(1)}, ${f.at.y.toFixed(1)}) ${unit}: ${f.message}${f.handles.length ? ` [${handlesShown(f.handles)}]` : ''}`;
  return report.findings.filter((f) => f.severity !== 'info').map(line);
}

/** Handles as a line shows them: all of a few, the first eight and a count of many. */
const handlesShown = (handles: string[]) =>
  handles.length <= 10 ? handles.join(' ') : `${handles.slice(0, 8).join(' ')} and ${handles.length - 8} more`;
