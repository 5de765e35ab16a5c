// Runs a batch: finds the drawings, reuses unchanged results (content and config hashes), checks the rest
// on a worker pool with per-file time and memory limits, shows progress, and writes the summaries.

import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { setFlagsFromString } from 'node:v8';
import { Piscina } from 'piscina';
import { writeAllAtomically } from '../io/files.js';
import type { LengthUnit } from '../config/settings.js';
import { REPORT_UNITS, type UnitSystem } from '../quantities/convert.js';
import { TOOL } from '../version.js';
import { findConfig } from '../io/config-file.js';
import { discoverDrawings, type BatchItem } from './discover.js';
import { summaryCsv, summaryHtml } from './summary.js';
import type { BatchRow, BatchTask } from './worker.js';

export interface BatchOptions {
  inputs: string[];
  out: string;
  config?: string;
  /** The drawings' length unit, over their configs' and headers'. */
  drawingUnits?: LengthUnit;
  units: UnitSystem;
  outputs: { json: boolean; dxf: boolean; html: boolean };
  workers: number;
  /** Per drawing, seconds and MB of heap. */
  timeLimit: number;
  memoryLimit: number;
  force: boolean;
  /** Where the compiled worker is. */
  workerFile: string;
  progress: (line: string, final: boolean) => void;
}

export interface BatchOutcome { rows: BatchRow[]; reused: number; exitCode: number }

const sha = (data: string | Uint8Array) => createHash('sha256').update(data).digest('hex');

interface Cached { key: string; row: BatchRow }

/**
 * How much bytecode a function runs before V8 optimizes it, raised from V8's default (132 KiB) when several
 * workers run. Every worker thread compiles its own optimized code, and a set of small drawings is checked in
 * about the time that takes: with the default, V8's compiler threads used more CPU than the checks (perf, 200
 * bench drawings), so a second worker brought nothing. With this budget only the truly hot code is optimized:
 * 2 workers took 25% less time than with the default (one worker is better off with it). Tiering only: the
 * results are the same.
 */
const TIER_UP_BUDGET = 2 * 1024 * 1024;

export async function runBatch(o: BatchOptions): Promise<BatchOutcome> {
  const items = discoverDrawings(o.inputs, o.out);
  const resultsDir = join(o.out, '.results');
  mkdirSync(resultsDir, { recursive: true });
  const keyOf = (item: BatchItem, config: string | undefined) => sha(JSON.stringify({
    tool: TOOL.version, file: sha(readFileSync(item.file)), config: config ? sha(readFileSync(config)) : null, units: o.units, drawingUnits: o.drawingUnits ?? null, outputs: o.outputs,
  }));
  const rows: BatchRow[] = new Array(items.length);
  const todo: { i: number; item: BatchItem; config: string | undefined; key: string }[] = [];
  let reused = 0;
  items.forEach((item, i) => {
    const config = findConfig(item.file, { root: item.root, ...(o.config ? { fallback: o.config } : {}) })?.path;
    let key: string;
    try {
      key = keyOf(item, config);
    } catch {
      key = 'unreadable';
    }
    const cacheFile = join(resultsDir, `${item.name}.json`);
    if (!o.force && existsSync(cacheFile)) {
      try {
        const cached = JSON.parse(readFileSync(cacheFile, 'utf8')) as Cached;
        if (cached.key === key && cached.row.outputs.every((f) => existsSync(join(o.out, f)))) {
          rows[i] = cached.row;
          reused++;
          return;
        }
      } catch {
        // a damaged cache entry is simply redone
      }
    }
    todo.push({ i, item, config, key });
  });

  if (o.workers > 1) setFlagsFromString(`--interrupt-budget=${TIER_UP_BUDGET}`);
  const pool = new Piscina({
    filename: o.workerFile, maxThreads: Math.max(1, o.workers), minThreads: Math.max(1, Math.min(o.workers, todo.length)),
    resourceLimits: { maxOldGenerationSizeMb: o.memoryLimit },
  });
  const started = performance.now();
  let done = 0;
  let failed = rows.filter((r) => r?.status === 'error').length;
  const report = (final: boolean) => {
    const s = (performance.now() - started) / 1000;
    o.progress(`${done + reused}/${items.length} drawings, ${failed} could not be checked, ${s.toFixed(1)} s, ${(done / Math.max(s, 1e-3)).toFixed(1)}/s${reused ? `, ${reused} reused` : ''}`, final);
  };
  // Largest drawings first (longest-processing-time order), so no long job starts last and leaves a core idle;
  // rows keep the stable order of discovery.
  const bySize = [...todo].sort((a, b) => statSync(b.item.file).size - statSync(a.item.file).size);
  try {
    await Promise.all(bySize.map(async ({ i, item, config, key }) => {
      const task: BatchTask = { file: item.file, name: item.name, config: config ?? null, drawingUnits: o.drawingUnits ?? null, outDir: o.out, outputs: o.outputs, units: o.units };
      const abort = new AbortController();
      const timer = setTimeout(() => abort.abort(), o.timeLimit * 1000);
      let row: BatchRow;
      try {
        row = (await pool.run(task, { signal: abort.signal })) as BatchRow;
      } catch (err) {
        const code = (err as { code?: string }).code;
        const why = abort.signal.aborted ? `timed out after ${o.timeLimit} s`
          : code === 'ERR_WORKER_OUT_OF_MEMORY' ? `ran out of memory (limit ${o.memoryLimit} MB)`
            : `worker failed: ${err instanceof Error ? err.message : String(err)}`;
        row = { file: item.file, name: item.name, config: config ?? null, status: 'error', heads: null, errors: null, warnings: null, demandPressure: null, demandFlow: null, margin: null, message: why, ms: 0, outputs: [] };
      } finally {
        clearTimeout(timer);
      }
      rows[i] = row;
      done++;
      if (row.status === 'error') failed++;
      // Each finished drawing is kept at once, so an interrupted run resumes where it stopped.
      writeAllAtomically([{ path: join(resultsDir, `${item.name}.json`), data: JSON.stringify({ key, row } satisfies Cached) }]);
      report(false);
    }));
  } finally {
    await pool.destroy();
  }
  report(true);
  const units = REPORT_UNITS[o.units];
  writeAllAtomically([
    { path: join(o.out, 'summary.json'), data: `${JSON.stringify({ tool: TOOL, units, drawings: rows }, null, 2)}\n` },
    { path: join(o.out, 'summary.csv'), data: summaryCsv(rows) },
    { path: join(o.out, 'index.html'), data: summaryHtml(rows, units) },
  ]);
  const exitCode = rows.some((r) => r.status === 'error') ? 2 : rows.some((r) => r.status === 'fail') ? 1 : 0;
  return { rows, reused, exitCode };
}
