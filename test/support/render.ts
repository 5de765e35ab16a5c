// LibreCAD as a real CAD client in tests: a DXF rendered to PDF with `librecad dxf2pdf` (offscreen, under a timeout)
// and the share of dark pixels on its first page measured with poppler's pdftoppm.

import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { expect } from 'vitest';
import { hasCommand } from './external.js';

export const canRender = (): boolean => hasCommand('librecad') && hasCommand('pdftoppm');

/** Renders DIR/NAME.dxf to DIR/NAME.pdf (dxf2pdf writes beside the drawing; it can hang on broken files). */
export function renderPdf(dir: string, name: string): string {
  const r = spawnSync('librecad', ['dxf2pdf', '-a', join(dir, `${name}.dxf`)], {
    cwd: dir,
    timeout: 90_000,
    env: { ...process.env, QT_QPA_PLATFORM: 'offscreen' },
    encoding: 'utf8',
  });
  expect(r.error).toBeUndefined();
  return join(dir, `${name}.pdf`);
}

/** Share of dark pixels of page 1 of a PDF, from pdftoppm's greyscale PGM output. */
export function inkShare(pdf: string): number {
  const base = pdf.replace(/\.pdf$/, '');
  const r = spawnSync('pdftoppm', ['-r', '5', '-gray', '-singlefile', pdf, base], { timeout: 60_000 });
  expect(r.status).toBe(0);
  const pgm = readFileSync(`${base}.pgm`);
  const header = pgm.subarray(0, 64).toString('latin1').split(/\s+/);
  const [w, h] = [Number(header[1]), Number(header[2])];
  const pixels = pgm.subarray(pgm.length - w * h);
  let dark = 0;
  for (const p of pixels) if (p < 200) dark++;
  return dark / pixels.length;
}
