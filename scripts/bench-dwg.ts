// Times one DWG's conversion to DXF in this process, as `check` does it in its worker thread: the first (module
// compiled, cold) and the median of three more (warm), with the process's peak memory, printed as JSON
// (scripts/bench.ts runs it in a child process). Usage: node bench-dwg.js drawing.dwg

import { readFileSync } from 'node:fs';
import { dwgAsDxfHere } from '../src/io/dwg.js';

const file = process.argv[2]!;
const bytes = new Uint8Array(readFileSync(file));
const limits = { seconds: 600, memoryMB: 4096 };
const timed = async () => {
  const t0 = performance.now();
  await dwgAsDxfHere(bytes, limits);
  return performance.now() - t0;
};
const coldMs = await timed();
const warm = [await timed(), await timed(), await timed()].sort((a, b) => a - b);
process.stdout.write(
  `${JSON.stringify({ file, bytes: bytes.length, coldMs, warmMs: warm[1], peakRssMb: process.resourceUsage().maxRSS / 1024 })}\n`,
);
