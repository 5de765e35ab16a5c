// The files a check hands back, from its result: the JSON report, the annotated DXF (original bytes plus HC-
// layers) and the HTML report. Pure, like the check itself, so the CLI and the browser write the same bytes.

import { annotateDxf } from '../outputs/annotate-dxf.js';
import { buildAnnotations } from '../outputs/annotations.js';
import { htmlReport } from '../outputs/html-report.js';
import { formatterFor } from '../quantities/format.js';
import type { CheckInput, CheckResult } from './run-check.js';

export const reportJson = (result: CheckResult): string => `${JSON.stringify(result.report, null, 2)}\n`;

/** The annotated drawing in pieces to be written one after another (most are views of the input's bytes). */
export function annotatedDrawing(input: CheckInput, result: CheckResult): Uint8Array[] {
  const notes = buildAnnotations({
    fileName: input.fileName, plan: result.plan, network: result.network, design: result.design, findings: result.findings,
    edition: result.limits.edition, fmt: formatterFor(input.reportUnits),
  });
  return annotateDxf(input.bytes, result.drawing.version, result.drawing.units, notes);
}

export const reportPage = (input: CheckInput, result: CheckResult): string => htmlReport(input, result);
