// The benchmark (`npm run bench`): generates layouts of 1,000, 5,000 and 20,000 heads, tree and grid, checks
// each in its own process, and writes per-stage times, search statistics and peak memory to bench-out/.

import { spawnSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { layoutDxf } from '../src/demo/generated-layout.js';

const OUT = 'bench-out';
const ONE = join('dist-scripts', 'scripts', 'bench-one.js');
const sizes = (process.env['BENCH_SIZES'] ?? '1000,5000,20000').split(',').map(Number);
const kinds = (process.env['BENCH_KINDS'] ?? 'tree,grid').split(',');

mkdirSync(OUT, { recursive: true });
const config = { design: { hazard: 'OH2', density: 0.2, area: 1500 }, supply: { static: 120, residual: 90, flow: 2000 } };
writeFileSync(join(OUT, 'config.json'), JSON.stringify(config));
const rows: Record<string, unknown>[] = [];
for (const heads of sizes) {
  for (const kind of kinds) {
    // Branch lines of about 2.5 × as many heads as there are lines, 12 ft × 10 ft spacing (common practice).
    const lines = Math.max(2, Math.round(Math.sqrt(heads / 2.5)));
    const perLine = Math.ceil(heads / lines);
    const file = join(OUT, `${kind}-${heads}.dxf`);
    writeFileSync(file, layoutDxf({ s: 12, l: 10, heads: perLine, lines, gridded: kind === 'grid' }));
    const run = spawnSync(process.execPath, ['--max-old-space-size=8192', ONE, file, join(OUT, 'config.json')], { encoding: 'utf8', timeout: 3_600_000 });
    if (run.status !== 0) {
      rows.push({ kind, heads, error: (run.stderr || 'failed').split('\n')[0] });
      console.log(`${kind} ${heads}: failed: ${run.stderr.split('\n')[0]}`);
      continue;
    }
    const r = { kind, ...JSON.parse(run.stdout) } as Record<string, any>;
    rows.push(r);
    const st = r['stages'];
    console.log(
      `${kind.padEnd(4)} ${String(r['heads']).padStart(6)} heads: total ${(r['totalMs'] / 1000).toFixed(2)} s ` +
      `(read ${st.read.toFixed(0)}, network ${st.network.toFixed(0)}, design-area ${st['design-area'].toFixed(0)} ms: ` +
      `${r["search"]?.evaluated}/${r["search"]?.candidates} candidates solved, ${r["search"]?.screened} screened, ${r['search']?.solves} solves), peak ${r['peakRssMb'].toFixed(0)} MB`,
    );
  }
}
// Batch throughput: 200 generated drawings of 60 to 600 heads, checked with 1 and with 2 workers.
const batch: Record<string, number> = {};
if ((process.env['BENCH_BATCH'] ?? '1') !== '0') {
  const set = join(OUT, 'batch-set');
  mkdirSync(set, { recursive: true });
  for (let i = 0; i < 200; i++) {
    const heads = 6 + (i % 10) * 2;
    const lines = 10 + (i % 5) * 5;
    writeFileSync(join(set, `plan-${String(i).padStart(3, '0')}.dxf`), layoutDxf({ s: 12, l: 10, heads, lines, gridded: i % 7 === 0 }));
  }
  writeFileSync(join(set, 'headcheck.json'), JSON.stringify(config));
  for (const workers of [1, 2]) {
    const t0 = performance.now();
    const r = spawnSync(process.execPath, ['bin/headcheck.js', 'batch', set, '--out', join(OUT, `batch-out-${workers}`), '--workers', String(workers), '--force'], { encoding: 'utf8', timeout: 3_600_000 });
    const s = (performance.now() - t0) / 1000;
    batch[`workers${workers}`] = 200 / s;
    console.log(`batch of 200 drawings, ${workers} worker(s): ${s.toFixed(1)} s, ${(200 / s).toFixed(2)} drawings/s (exit ${r.status})`);
  }
  batch['speedup'] = batch['workers2']! / batch['workers1']!;
  console.log(`2 workers / 1 worker: ${batch['speedup']!.toFixed(2)}×`);
}
writeFileSync(join(OUT, 'bench.json'), `${JSON.stringify({ date: new Date().toISOString(), node: process.version, rows, batch }, null, 2)}\n`);
console.log(`figures written to ${join(OUT, 'bench.json')}`);
