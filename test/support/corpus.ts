// What every run of a drawing from a real corpus must be, whatever the drawing: exit 0, 1 or 2, one line on stderr
// when it is 2, under 60 s and 1 GiB (the runs themselves: scripts/corpus.ts).

import { expect } from 'vitest';
import type { CorpusRow } from '../../scripts/corpus.js';

export function expectSoundRuns(row: CorpusRow): void {
  for (const run of [row.layers, row.check]) {
    expect([0, 1, 2], `${row.file}: ${run.message}`).toContain(run.code);
    if (run.code === 2) expect(run.stderrLines, `${row.file}: one line on stderr`).toBe(1);
    expect(run.seconds, row.file).toBeLessThan(60);
    expect(run.peakMiB, row.file).toBeLessThan(1024);
  }
}
