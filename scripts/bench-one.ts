// Checks one drawing as `headcheck check --json --dxf --html` does, with per-stage timings, and prints them as
// JSON (run by scripts/bench.ts in a child process, so peak memory belongs to this drawing alone). Usage: node bench-one.js drawing.dxf [config.json]

import { mkdirSync, readFileSync } from 'node:fs';
import { basename, join } from 'node:path';
import { DxfParser } from 'dxf-parser';
import { annotatedDrawing, reportPage } from '../src/check/outputs.js';
import { runCheck } from '../src/check/run-check.js';
import { sha256Hex, writeAllAtomically } from '../src/cli/files.js';
import { parseSettings } from '../src/config/settings.js';

const [file, configFile, mode] = process.argv.slice(2);
const bytes = new Uint8Array(readFileSync(file!));
const settings = parseSettings(configFile ? JSON.parse(readFileSync(configFile, 'utf8')) : {});
const out: Record<string, unknown> = { file, bytes: bytes.length };
if (mode === 'parse-only') {
  // The reference: dxf-parser's own parse of the same file, nothing else.
  const t0 = performance.now();
  const Parser = (DxfParser ?? (await import('dxf-parser')).default) as unknown as new () => { parseSync(s: string): unknown };
  new Parser().parseSync(new TextDecoder().decode(bytes));
  out['parseMs'] = performance.now() - t0;
} else {
  // What `headcheck check --json --dxf --html` does, stage by stage, outputs written to bench-out/outputs/.
  const stages: Record<string, number> = {};
  const t0 = performance.now();
  let last = t0;
  const lap = (name: string) => { const now = performance.now(); stages[name] = now - last; last = now; };
  const input = { bytes, fileName: file!, sha256: sha256Hex(bytes), settings, reportUnits: 'us' as const, onStage: (s: string, ms: number) => { stages[s] = ms; } };
  lap('hash');
  const r = runCheck(input);
  last = performance.now();
  const json = `${JSON.stringify(r.report, null, 2)}\n`;
  lap('json');
  const dxf = annotatedDrawing(input, r);
  lap('annotated-dxf');
  const html = reportPage(input, r);
  lap('html');
  const dir = join('bench-out', 'outputs');
  mkdirSync(dir, { recursive: true });
  const name = basename(file!, '.dxf');
  writeAllAtomically([
    { path: join(dir, `${name}.json`), data: json }, { path: join(dir, `${name}.annotated.dxf`), data: dxf }, { path: join(dir, `${name}.html`), data: html },
  ]);
  lap('write');
  out['totalMs'] = performance.now() - t0;
  out['stages'] = stages;
  out['heads'] = r.plan.heads.length;
  out['pipes'] = r.network.pipes.length;
  out['topology'] = r.network.topology;
  out['search'] = r.design.search;
  out['reportBytes'] = json.length;
  out['demand'] = r.design.areas.find((a) => a.rank === 'most-demanding')?.hydraulics?.sourcePressure ?? null;
}
out['peakRssMb'] = process.resourceUsage().maxRSS / 1024;
process.stdout.write(`${JSON.stringify(out)}\n`);
