// Checks one drawing with per-stage timings and prints them as JSON (run by scripts/bench.ts in a child
// process, so peak memory belongs to this drawing alone). Usage: node bench-one.js drawing.dxf [config.json]

import { readFileSync } from 'node:fs';
import { DxfParser } from 'dxf-parser';
import { runCheck } from '../src/check/run-check.js';
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
  const stages: Record<string, number> = {};
  const t0 = performance.now();
  const r = runCheck({ bytes, fileName: file!, sha256: '', settings, reportUnits: 'us', onStage: (s, ms) => { stages[s] = ms; } });
  const t1 = performance.now();
  const json = JSON.stringify(r.report);
  stages['write'] = performance.now() - t1;
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
