// Every output a check hands back, in one typed table that the command line, the batch, the page and the benchmark
// all read: its option, file name ending, media type and how it is made from the reviewed drawing. A new format
// is one row here; `satisfies` keeps every row complete.

import { annotateDxf } from '../outputs/annotate-dxf.js';
import { buildAnnotations } from '../outputs/annotations.js';
import { htmlReport } from '../outputs/html-report.js';
import { markdownReport } from '../outputs/markdown-report.js';
import type { Reviewed } from '../outputs/reviewed.js';
import { formatterFor } from '../quantities/format.js';

/** An output's content: text (UTF-8), bytes, or bytes in pieces to be written one after another. */
export type OutputData = string | Uint8Array | Uint8Array[];

export interface OutputFormat {
  /** What `--help` says of it. */
  description: string;
  /** The file name ending batch outputs and page downloads take. */
  extension: string;
  mediaType: string;
  /** Whether `batch` writes it for each drawing unless told not to (`--no-NAME`); else only when asked (`--NAME`). */
  inBatch: boolean;
  make(reviewed: Reviewed): OutputData;
}

export const FORMATS = {
  json: {
    description: 'the JSON report',
    extension: '.json',
    mediaType: 'application/json',
    inBatch: true,
    make: (r) => `${JSON.stringify(r.report, null, 2)}\n`,
  },
  dxf: {
    description: 'the annotated drawing (DXF)',
    extension: '.annotated.dxf',
    mediaType: 'application/dxf',
    inBatch: true,
    // In pieces, most of them views of the input's bytes.
    make: (r) =>
      annotateDxf(
        r.bytes,
        r.drawing.version,
        r.drawing.units,
        buildAnnotations({
          fileName: r.fileName,
          plan: r.plan,
          network: r.network,
          design: r.design,
          findings: r.findings,
          edition: r.zoning.design.limits.edition,
          basis: r.zoning.design.design,
          zones: r.zoning.zones,
          fmt: formatterFor(r.reportUnits),
        }),
        r.drawing.entityHandles,
      ),
  },
  html: { description: 'the HTML report', extension: '.html', mediaType: 'text/html', inBatch: true, make: (r) => htmlReport(r) },
  md: {
    description: 'the review summary (Markdown)',
    extension: '.md',
    mediaType: 'text/markdown',
    inBatch: false,
    make: (r) => markdownReport(r),
  },
} satisfies Record<string, OutputFormat>;

export type FormatName = keyof typeof FORMATS;
export const FORMAT_NAMES = Object.keys(FORMATS) as FormatName[];
