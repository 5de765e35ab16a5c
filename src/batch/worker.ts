// A batch worker (run by the pool in a worker thread): checks one drawing, writes its outputs atomically
// and returns its summary row. Unusable input becomes a row with status "error", never a thrown error.

import { join } from 'node:path';
import { FORMAT_NAMES, FORMATS, type FormatName } from '../check/formats.js';
import { runCheck } from '../check/run-check.js';
import type { LengthUnit } from '../config/settings.js';
import { loadSettings } from '../io/config-file.js';
import type { UnitSystem } from '../quantities/convert.js';
import { InputError } from '../input-error.js';
import { dwgVersionTag } from '../read/dwg/version.js';
import { collectBetweenStages } from '../io/collect.js';
import { readInputFile, sha256Hex, writeAllAtomically } from '../io/files.js';

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
  message: null,
  ms: 0,
  outputs: [],
});

export default async function checkOne(task: BatchTask): Promise<BatchRow> {
  const t0 = performance.now();
  const row = emptyRow(task.file, task.name, task.config);
  try {
    const settings = loadSettings(task.config);
    if (task.drawingUnits) settings.units = task.drawingUnits;
    const raw = readInputFile(task.file, settings.inputLimits.fileMB);
    // A DWG is converted here: this worker already runs under the batch's time and memory limits.
    const dwgVersion = dwgVersionTag(raw);
    const bytes = dwgVersion
      ? await (await import('../io/dwg.js')).dwgAsDxfHere(raw, {
          seconds: settings.inputLimits.dwgSeconds,
          memoryMB: settings.inputLimits.dwgMemoryMB,
        })
      : raw;
    const onStage = collectBetweenStages(bytes.length);
    const input = {
      bytes,
      fileName: task.file,
      sha256: sha256Hex(raw),
      dwgVersion,
      settings,
      reportUnits: task.units,
      requireHydraulics: task.requireHydraulics,
      ...(onStage ? { onStage } : {}),
    };
    const result = runCheck(input);
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
  } catch (err) {
    row.message =
      err instanceof InputError
        ? err.message.replace(`${task.file}: `, '')
        : `internal error: ${err instanceof Error ? err.message : String(err)}`;
  }
  row.ms = Math.round(performance.now() - t0);
  return row;
}
