// Runs a batch: finds the drawings, reuses unchanged results (content and config hashes), checks the rest
// on a worker pool with per-file time and memory limits, shows progress, and writes the summaries.

import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, statSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { setTimeout as sleep } from 'node:timers/promises';
import { setFlagsFromString } from 'node:v8';
import { MessageChannel } from 'node:worker_threads';
import { Piscina } from 'piscina';
import { watchOutputFolder, writeAllAtomically } from '../io/files.js';
import { loadSettings } from '../io/config-file.js';
import { InputError } from '../input-error.js';
import { CAUTION } from '../outputs/caution.js';
import type { LengthUnit } from '../config/settings.js';
import { REPORT_UNITS, type UnitSystem } from '../quantities/convert.js';
import { TOOL } from '../version.js';
import { findConfig } from '../io/config-file.js';
import { discoverDrawings, type BatchItem } from './discover.js';
import { summaryCsv, summaryHtml } from './summary.js';
import type { FormatName } from '../check/formats.js';
import { emptyRow, type BatchRow, type BatchTask } from './worker.js';

export interface BatchOptions {
  inputs: string[];
  out: string;
  config?: string;
  /** The drawings' length unit, over their configs' and headers'. */
  drawingUnits?: LengthUnit;
  requireHydraulics?: boolean;
  units: UnitSystem;
  outputs: Record<FormatName, boolean>;
  workers: number;
  /** Per drawing, seconds and MB of heap. */
  timeLimit: number;
  memoryLimit: number;
  force: boolean;
  /** A folder of the earlier revisions: each drawing is compared with the one at its relative path there. */
  compareWith?: string;
  /** Where the compiled worker is. */
  workerFile: string;
  progress: (line: string, final: boolean) => void;
}

export interface BatchOutcome {
  rows: BatchRow[];
  reused: number;
  exitCode: number;
}

const sha = (data: string | Uint8Array) => createHash('sha256').update(data).digest('hex');

interface Cached {
  key: string;
  row: BatchRow;
}

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
  const { items, skipped } = discoverDrawings(o.inputs, o.out);
  const resultsDir = join(o.out, '.results');
  makeFolder(resultsDir);
  watchOutputFolder(o.out);
  const rows: BatchRow[] = new Array(items.length);
  const todo: { i: number; item: BatchItem; config: string | undefined; key: string; earlier: BatchTask['earlier']; size: number }[] = [];
  let reused = 0;
  items.forEach((item, i) => {
    const config = findConfig(item.file, { root: item.root, ...(o.config ? { fallback: o.config } : {}) })?.path;
    // The config and the file's size are checked here, before the file is read whole to be hashed.
    const admitted = admission(item, config);
    if ('refused' in admitted) {
      rows[i] = errorRow(item, config, admitted.refused);
      return;
    }
    const earlier = earlierOf(item);
    const key = sha(
      JSON.stringify({
        tool: TOOL.version,
        file: sha(readFileSync(item.file)),
        config: config ? sha(readFileSync(config)) : null,
        earlier: earlier && { file: sha(readFileSync(earlier.file)), config: earlier.config ? sha(readFileSync(earlier.config)) : null },
        units: o.units,
        drawingUnits: o.drawingUnits ?? null,
        requireHydraulics: o.requireHydraulics === true,
        outputs: o.outputs,
      }),
    );
    const cacheFile = join(resultsDir, `${item.name}.json`);
    if (!o.force && existsSync(cacheFile)) {
      try {
        const cached = JSON.parse(readFileSync(cacheFile, 'utf8')) as Cached;
        if (cached.key === key && cached.row.status !== 'error' && cached.row.outputs.every((f) => existsSync(join(o.out, f)))) {
          rows[i] = cached.row;
          reused++;
          return;
        }
      } catch {
        // a damaged cache entry is simply redone
      }
    }
    todo.push({ i, item, config, key, earlier, size: admitted.size });
  });

  if (o.workers > 1) setFlagsFromString(`--interrupt-budget=${TIER_UP_BUDGET}`);
  const slots = Math.max(1, Math.min(o.workers, todo.length));
  // No worker is ever stopped while it loads its code (Node 20 aborts the whole process when a worker is terminated
  // inside a synchronous ES module load): workers start only for a drawing waiting for them and stay until the end,
  // a time limit runs only once a worker has its drawing, and the pool is closed once every worker has loaded (one
  // started for a drawing that another worker then took may still be loading when the last drawing is done).
  const pool = new Piscina({
    filename: o.workerFile,
    maxThreads: slots,
    minThreads: 0,
    idleTimeout: Number.POSITIVE_INFINITY,
    resourceLimits: { maxOldGenerationSizeMb: o.memoryLimit },
  });
  // A worker that fails before it takes a drawing (out of memory while loading its code, under a small
  // --memory-limit) is the pool's error, not a task's: the drawings waiting for a worker are told of it.
  const waiting: Waiting = new Set();
  pool.on('error', (err: unknown) => {
    for (const fail of [...waiting]) fail(err);
  });
  const loaded = new Set<number>();
  pool.on('workerCreate', (w: { id: number }) => loaded.add(w.id));
  const started = performance.now();
  let done = 0;
  let failed = rows.filter((r) => r?.status === 'error').length;
  const report = (final: boolean) => {
    const s = (performance.now() - started) / 1000;
    o.progress(
      `${done + reused}/${items.length} drawings, ${failed} could not be checked, ${s.toFixed(1)} s, ${(done / Math.max(s, 1e-3)).toFixed(1)}/s${reused ? `, ${reused} reused` : ''}`,
      final,
    );
  };
  // Largest drawings first (longest-processing-time order), so no long job starts last and leaves a core idle;
  // rows keep the stable order of discovery. No more drawings are handed to the pool than it has threads.
  const queue = [...todo].sort((a, b) => b.size - a.size);
  const checkNext = async (): Promise<void> => {
    for (let job = queue.shift(); job; job = queue.shift()) {
      const { i, item, config, key, earlier } = job;
      const row = await checkInWorker(pool, waiting, o, item, config, earlier);
      rows[i] = row;
      done++;
      if (row.status === 'error') failed++;
      // Each checked drawing is kept at once, so an interrupted run resumes where it stopped; a drawing that could
      // not be checked is tried again next time (a time limit or a full disk may not recur).
      if (row.status !== 'error')
        await writeAllAtomically([{ path: join(resultsDir, `${item.name}.json`), data: JSON.stringify({ key, row } satisfies Cached) }]);
      report(false);
    }
  };
  try {
    await Promise.all(Array.from({ length: slots }, checkNext));
  } finally {
    while (pool.threads.some((t) => !loaded.has(t.threadId))) await sleep(10);
    await pool.destroy();
  }
  report(true);
  const all = [...rows, ...skipped.map((x): BatchRow => ({ ...emptyRow(x.file, x.file, null), status: 'skipped', message: x.reason }))];
  const units = REPORT_UNITS[o.units];
  await writeAllAtomically([
    { path: join(o.out, 'summary.json'), data: `${JSON.stringify({ tool: TOOL, caution: CAUTION, units, drawings: all }, null, 2)}\n` },
    { path: join(o.out, 'summary.csv'), data: summaryCsv(all) },
    { path: join(o.out, 'index.html'), data: summaryHtml(all, units) },
  ]);
  const exitCode = all.some((r) => r.status === 'error') ? 2 : all.some((r) => r.status === 'fail') ? 1 : 0;
  return { rows: all, reused, exitCode };

  /** The earlier revision at the drawing's relative path in `compareWith`, with the config it would be checked with. */
  function earlierOf(item: BatchItem): BatchTask['earlier'] {
    if (!o.compareWith) return null;
    const file = join(o.compareWith, ...item.rel.split('/'));
    if (!existsSync(file)) return null;
    const root = resolve(o.compareWith);
    return { file, config: findConfig(file, { root, ...(o.config ? { fallback: o.config } : {}) })?.path ?? null };
  }

  /**
   * The drawing's size, or why it is not handed to a worker at all: its config cannot be used, or the file is over
   * its size limit (the size orders the queue: stat'ing in the sort's comparisons cost two calls each).
   */
  function admission(item: BatchItem, config: string | undefined): { size: number } | { refused: string } {
    try {
      const { fileMB } = loadSettings(config).inputLimits;
      const size = statSync(item.file).size;
      return size > fileMB * 1024 * 1024 ? { refused: `larger than ${fileMB} MiB (inputLimits.fileMB)` } : { size };
    } catch (err) {
      if (err instanceof InputError) return { refused: err.message };
      return { refused: `cannot be read (${(err as NodeJS.ErrnoException).code ?? 'error'})` };
    }
  }
}

/** The drawings handed to the pool that no worker has taken yet: each a function that ends its wait with an error. */
type Waiting = Set<(err: unknown) => void>;

/**
 * One drawing in a worker of the pool, under the time limit from when the worker has it (a new worker's start is
 * not the drawing's time); a worker's failure, before or while it checks the drawing, becomes its row.
 */
async function checkInWorker(
  pool: Piscina,
  waiting: Waiting,
  o: BatchOptions,
  item: BatchItem,
  config: string | undefined,
  earlier: BatchTask['earlier'],
): Promise<BatchRow> {
  const channel = new MessageChannel();
  const task: BatchTask = {
    file: item.file,
    name: item.name,
    config: config ?? null,
    drawingUnits: o.drawingUnits ?? null,
    requireHydraulics: o.requireHydraulics === true,
    outDir: o.out,
    outputs: o.outputs,
    units: o.units,
    earlier,
    started: channel.port2,
  };
  const abort = new AbortController();
  let timer: NodeJS.Timeout | undefined;
  /** Set when the worker failed before it took the drawing. */
  const before: { failure: { err: unknown } | null } = { failure: null };
  const failStart = (err: unknown) => {
    before.failure = { err };
    abort.abort();
  };
  waiting.add(failStart);
  channel.port1.once('message', () => {
    waiting.delete(failStart);
    timer = setTimeout(() => abort.abort(), o.timeLimit * 1000);
  });
  try {
    return (await pool.run(task, { signal: abort.signal, transferList: [channel.port2] })) as BatchRow;
  } catch (err) {
    const cause = before.failure ? before.failure.err : err;
    const code = (cause as { code?: string }).code;
    const why =
      !before.failure && abort.signal.aborted
        ? `timed out after ${o.timeLimit} s`
        : code === 'ERR_WORKER_OUT_OF_MEMORY'
          ? `ran out of memory (limit ${o.memoryLimit} MB)`
          : `worker failed: ${cause instanceof Error ? cause.message : String(cause)}`;
    return errorRow(item, config, why);
  } finally {
    waiting.delete(failStart);
    clearTimeout(timer);
    channel.port1.close();
  }
}

const errorRow = (item: BatchItem, config: string | undefined, message: string): BatchRow => ({
  ...emptyRow(item.file, item.name, config ?? null),
  message,
});

/** Creates a folder (and its parents), or says in one line why it cannot be. */
function makeFolder(dir: string): void {
  try {
    mkdirSync(dir, { recursive: true });
  } catch (err) {
    throw new InputError(`${dir}: the output folder cannot be created (${(err as NodeJS.ErrnoException).code ?? 'error'})`);
  }
}
