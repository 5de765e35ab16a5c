// Checks one drawing as `headcheck check --json --dxf --html` does, with per-stage timings, and prints them as
// JSON (run by scripts/bench.ts in a child process, so peak memory belongs to this drawing alone). Usage: node bench-one.js drawing.dxf [config.json]

import { mkdirSync, readFileSync, statSync } from 'node:fs';
import { basename, join } from 'node:path';
import { FORMAT_NAMES, FORMATS } from '../src/check/formats.js';
import { runCheck } from '../src/check/run-check.js';
import { collectBetweenStages, collectIfLarge } from '../src/io/collect.js';
import { readInputFile, sha256Hex, writeAllAtomically, type OutputData } from '../src/io/files.js';
import { parseSettings } from '../src/config/settings.js';

const [file, configFile, mode] = process.argv.slice(2);
const bytes = readInputFile(file!, 4096);
const settings = parseSettings(configFile ? JSON.parse(readFileSync(configFile, 'utf8')) : {});
const out: Record<string, unknown> = { file, bytes: bytes.length };
if (mode === 'parse-only') {
  // The reference: dxf-parser's own parse of the same file, nothing else.
  const t0 = performance.now();
  // Loaded here only: the check below runs without it, as the command does (its module would count in the peak).
  const parser = await import('dxf-parser');
  const Parser = (parser.DxfParser ?? parser.default) as unknown as new () => { parseSync(s: string): unknown };
  new Parser().parseSync(new TextDecoder().decode(bytes));
  out['parseMs'] = performance.now() - t0;
} else {
  // What `headcheck check --json --dxf --html` does, stage by stage, outputs written to bench-out/outputs/.
  const stages: Record<string, number> = {};
  const t0 = performance.now();
  let last = t0;
  const lap = (name: string) => {
    const now = performance.now();
    stages[name] = now - last;
    last = now;
  };
  const dir = join('bench-out', 'outputs');
  mkdirSync(dir, { recursive: true });
  const name = basename(file!, '.dxf');
  // The command's collections between stages too (their time falls into the stage after).
  const collect = collectBetweenStages();
  const input = {
    bytes,
    fileName: file!,
    sha256: sha256Hex(bytes),
    settings,
    reportUnits: 'us' as const,
    onStage: (s: string, ms: number) => {
      stages[s] = ms;
      collect(s);
    },
    onGarbage: collectIfLarge,
  };
  lap('hash');
  const r = runCheck(input);
  // Each output is made when its turn to be written comes, as the CLI does; 'write' is the writing alone.
  const made = (name: string, make: () => OutputData) => () => {
    const t = performance.now();
    const d = make();
    stages[name] = performance.now() - t;
    return d;
  };
  last = performance.now();
  await writeAllAtomically([
    ...FORMAT_NAMES.map((f) => ({ path: join(dir, `${name}${FORMATS[f].extension}`), data: made(f, () => FORMATS[f].make(r)) })),
  ]);
  lap('write');
  stages['write']! -= FORMAT_NAMES.reduce((sum, f) => sum + stages[f]!, 0);
  out['totalMs'] = performance.now() - t0;
  out['stages'] = stages;
  out['heads'] = r.plan.heads.length;
  out['pipes'] = r.network.pipes.length;
  out['topology'] = r.network.systems.map((s) => s.topology).join(', ');
  out['search'] = r.report.design.search;
  out['reportBytes'] = statSync(join(dir, `${name}.json`)).size;
  out['demand'] = r.design.areas.find((a) => a.rank === 'most-demanding')?.hydraulics?.sourcePressure ?? null;
}
out['peakRssMb'] = process.resourceUsage().maxRSS / 1024;
process.stdout.write(`${JSON.stringify(out)}\n`);
