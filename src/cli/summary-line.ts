// The one-line verdict printed after a check: file, heads, errors, warnings, pass or fail.

import type { Report } from '../outputs/json-report.js';

export function summaryLine(file: string, report: Report): string {
  const s = report.summary;
  return `${file}: ${s.pass ? 'PASS' : 'FAIL'}: ${s.heads} heads, ${s.pipes} pipes, ${s.errors} errors, ${s.warnings} warnings`;
}
