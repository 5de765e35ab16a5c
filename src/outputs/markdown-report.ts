// The review summary in plain Markdown, to paste into a review letter: verdict, caution, findings with their
// handles and places, each design area's demand and the supply's margin, and what was checked against what.

import { PRESSURE_BASIS } from '../hydraulics/velocity-pressure.js';
import type { Reviewed } from './reviewed.js';
import { formatterFor } from '../quantities/format.js';
import { CAUTION } from './caution.js';
import { valueText } from './finding-values.js';

/** A table cell: one line, its pipes escaped. */
const cell = (s: string) => s.replace(/\r?\n/g, ' ').replace(/\|/g, '\\|');
const row = (cells: string[]) => `| ${cells.map(cell).join(' | ')} |`;

export function markdownReport(r: Reviewed): string {
  const fmt = formatterFor(r.reportUnits);
  const report = r.report;
  const s = report.summary;
  const unit = report.units.length;
  const plural = (n: number, one: string) => `${n} ${one}${n === 1 ? '' : 's'}`;
  const out: string[] = [
    `# Review summary: ${report.input.file}`,
    '',
    `**Verdict: ${s.pass ? 'PASS' : 'FAIL'}** — ${plural(s.errors, 'error')}, ${plural(s.warnings, 'warning')}; ` +
      `${plural(s.heads, 'head')}, ${plural(s.pipes, 'pipe')}${s.systems > 1 ? `, ${s.systems} systems` : ''}${s.zones ? `, ${plural(s.zones, 'hazard zone')}` : ''}. ` +
      `Limits: ${report.limits.edition}; design ${report.design.hazard}, ${fmt.density(r.zoning.design.design.density)} over ${fmt.area(r.zoning.design.design.area)}.`,
    '',
    `> ${CAUTION}`,
    '',
    '## Findings',
    '',
  ];
  if (!report.findings.length) out.push('None.');
  else {
    out.push(
      row(['#', 'severity', 'rule', `where (${unit})`, 'finding', 'measured (limit)', 'handles']),
      row(['-', '-', '-', '-', '-', '-', '-']),
    );
    report.findings.forEach((f, i) => {
      const data = r.findings[i]!;
      const measured =
        data.measured !== null && data.limit !== null ? `${valueText(data, data.measured, fmt)} (${valueText(data, data.limit, fmt)})` : '';
      out.push(
        row([
          String(i + 1),
          f.severity,
          `\`${f.rule}\``,
          `${f.at.x.toFixed(1)}, ${f.at.y.toFixed(1)}`,
          f.message,
          measured,
          f.handles.join(' '),
        ]),
      );
    });
  }
  out.push('', '## Design areas', '');
  const areas = r.design.areas;
  if (!areas.length) out.push('None calculated.');
  else {
    const zoneName = (id: string | null) => (id === null ? '' : (r.zoning.zones.find((z) => z.id === id)!.label ?? id));
    out.push(
      row(['area', 'system', 'zone', 'basis', 'heads', 'floor area', 'at the source', 'with hose', 'supply', 'margin', 'note']),
      row(['-', '-', '-', '-', '-', '-', '-', '-', '-', '-', '-']),
    );
    for (const a of areas) {
      const h = a.hydraulics;
      out.push(
        row([
          a.rank ?? 'drawn',
          a.system ?? '',
          zoneName(a.zone),
          `${a.basis.hazard} ${fmt.density(a.basis.density)} over ${fmt.area(a.basis.area)}`,
          String(a.headIds.length),
          fmt.area(a.actualArea),
          h ? `${fmt.pressure(h.sourcePressure)} at ${fmt.flow(h.sourceFlow)}` : '',
          h ? fmt.flow(h.totalDemand) : '',
          h?.supplyAvailable != null ? fmt.pressure(h.supplyAvailable) : '',
          h?.margin != null ? fmt.pressure(h.margin) : '',
          a.note ?? '',
        ]),
      );
    }
    out.push('', PRESSURE_BASIS[r.settings.design.velocityPressure ? 'normal' : 'total']);
  }
  const supply = r.settings.supply;
  out.push(
    '',
    '## Water supply',
    '',
    supply
      ? `Flow test: ${fmt.pressure(supply.static)} static, ${fmt.pressure(supply.residual)} residual at ${fmt.flow(supply.flow)}. A margin under 10 psi is a warning (common practice).`
      : 'No flow test given: the supply was not compared with the demand.',
    '',
    `Checked by ${report.tool.name} ${report.tool.version}; drawing SHA-256 ${report.input.sha256}.`,
    '',
  );
  return out.join('\n');
}
