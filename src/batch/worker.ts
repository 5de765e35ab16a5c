// A batch worker (run by the pool in a worker thread): checks one drawing (and compares it with its earlier
// revision when given), writes its outputs atomically and returns its summary row. Unusable input becomes a row with status "error", never a thrown error.

import { join } from 'node:path';
import type { MessagePort } from 'node:worker_threads';
import { FORMAT_NAMES, FORMATS, type FormatName } from '../check/formats.js';
import { compareRevisions } from '../compare/compare.js';
import type { LengthUnit } from '../config/settings.js';
import { loadSettings } from '../io/config-file.js';
import type { UnitSystem } from '../quantities/convert.js';
import { InputError } from '../input-error.js';
import { checkDrawingFile } from '../io/drawing-file.js';
import { writeAllAtomically } from '../io/files.js';

export interface BatchTask {
  file: string;
  name: string;
  config: string | null;
  drawingUnits: LengthUnit | null;
  /** Whether a drawing without hydraulics is an error row rather than a warning. */
  requireHydraulics: boolean;
  outDir: string;
  outputs: Record<FormatName, boolean>;
  units: UnitSystem;
  /** The earlier revision of the drawing (`--compare-with`: the same relative path there) and its config. */
  earlier: { file: string; config: string | null } | null;
  /** Told once the worker has the drawing in hand: its time limit runs from then. */
  started: MessagePort;
}

export interface BatchRow {
  file: string;
  name: string;
  config: string | null;
  /** pass, fail (error findings), error (could not be checked), skipped (seen and not checked: a link out of the folder). */
  status: 'pass' | 'fail' | 'error' | 'skipped';
  heads: number | null;
  errors: number | null;
  warnings: number | null;
  /** Most demanding area: source pressure and flow (with hose), and the supply margin, in the report's units. */
  demandPressure: number | null;
  demandFlow: number | null;
  margin: number | null;
  /** Against the earlier revision: findings resolved and added (null without one). */
  resolved: number | null;
  added: number | null;
  message: string | null;
  ms: number;
  outputs: string[];
}

/** A row that says nothing yet: status error until the drawing is checked. */
export const emptyRow = (file: string, name: string, config: string | null): BatchRow => ({
  file,
  name,
  config,
  status: 'error',
  heads: null,
  errors: null,
  warnings: null,
  demandPressure: null,
  demandFlow: null,
  margin: null,
  resolved: null,
  added: null,
  message: null,
  ms: 0,
  outputs: [],
});

export default async function checkOne(task: BatchTask): Promise<BatchRow> {
  const t0 = performance.now();
  task.started.postMessage(null);
  task.started.close();
  const row = emptyRow(task.file, task.name, task.config);
  try {
    const result = await checkFile(task.file, task.config, task);
    const files = FORMAT_NAMES.filter((f) => task.outputs[f]).map((f) => ({
      path: join(task.outDir, `${task.name}${FORMATS[f].extension}`),
      data: () => FORMATS[f].make(result),
    }));
    await writeAllAtomically(files);
    const s = result.report.summary;
    const best = result.report.designAreas.find((a) => a.rank === 'most-demanding')?.hydraulics;
    Object.assign(row, {
      status: s.pass ? 'pass' : 'fail',
      heads: s.heads,
      errors: s.errors,
      warnings: s.warnings,
      demandPressure: best?.sourcePressure ?? null,
      demandFlow: best?.totalDemand ?? null,
      margin: best?.margin ?? null,
      outputs: files.map((f) => f.path.slice(task.outDir.length + 1)),
    });
    if (task.earlier) {
      try {
        const { findings } = compareRevisions(await checkFile(task.earlier.file, task.earlier.config, task), result);
        Object.assign(row, { resolved: findings.resolved.length, added: findings.added.length });
      } catch (err) {
        row.message = `the earlier revision ${task.earlier.file}: ${messageOf(err).replace(`${task.earlier.file}: `, '')}`;
      }
    }
  } catch (err) {
    row.message = messageOf(err).replace(`${task.file}: `, '');
  }
  row.ms = Math.round(performance.now() - t0);
  return row;
}

const messageOf = (err: unknown) =>
  err instanceof InputError ? err.message : `internal error: ${err instanceof Error ? err.message : String(err)}`;

/** One drawing read (a DWG converted in this thread: the worker already runs under the batch's limits) and checked. */
function checkFile(file: string, config: string | null, task: BatchTask) {
  const settings = loadSettings(config);
  if (task.drawingUnits) settings.units = task.drawingUnits;
  return checkDrawingFile(file, settings, { reportUnits: task.units, requireHydraulics: task.requireHydraulics, dwgThread: 'this-thread' });
}
