// Runs the real command, `headcheck check DRAWING --config C --json --dxf --html`, in this process and prints its
// wall time and peak memory as JSON (scripts/bench.ts runs it in a child process). Usage: node bench-cli.js drawing.dxf config.json

import { mkdirSync } from 'node:fs';
import { basename, join } from 'node:path';
import { main } from '../src/cli/main.js';

const [file, config] = process.argv.slice(2);
const dir = join('bench-out', 'outputs');
mkdirSync(dir, { recursive: true });
const name = basename(file!, '.dxf');
const t0 = performance.now();
const args = [
  'check',
  file!,
  '--config',
  config!,
  '--json',
  join(dir, `${name}.json`),
  '--dxf',
  join(dir, `${name}.annotated.dxf`),
  '--html',
  join(dir, `${name}.html`),
];
const code = await main(['node', 'headcheck', ...args], { out: () => true, err: (s) => process.stderr.write(`${s}\n`) });
process.stdout.write(
  `${JSON.stringify({ file, exitCode: code, totalMs: performance.now() - t0, peakRssMb: process.resourceUsage().maxRSS / 1024 })}\n`,
);
