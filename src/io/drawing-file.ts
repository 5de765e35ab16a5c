// A drawing file as the command line and the batch workers read and check it: read under its size limit, a DWG
// (told by its first bytes) converted to DXF, hashed as given, and checked with garbage collected between stages.

import { type CheckResult, runCheck } from '../check/run-check.js';
import type { Settings } from '../config/settings.js';
import { InputError } from '../input-error.js';
import type { UnitSystem } from '../quantities/convert.js';
import { dwgVersionTag } from '../read/dwg/version.js';
import { collectBetweenStages, collectIfLarge } from './collect.js';
import { readInputFile, sha256Hex } from './files.js';

/** Where a DWG is converted: a worker thread of its own under the time limit, or this thread (a batch worker, already limited). */
export type DwgThread = 'own-worker' | 'this-thread';

export interface DrawingBytes {
  /** The bytes the reader takes (a DWG's as DXF). */
  bytes: Uint8Array;
  /** The hash of the file as given. */
  sha256: string;
  dwgVersion: string | null;
}

/** Runs `fn`, naming `file` at the start of an InputError's message that does not name it yet. */
export function withFile<T>(file: string, fn: () => T): T {
  try {
    return fn();
  } catch (err) {
    if (err instanceof InputError && !err.message.startsWith(file)) throw new InputError(`${file}: ${err.message}`);
    throw err;
  }
}

/** The file's bytes as the reader takes them; the DWG module loads only for a DWG. */
export async function drawingBytes(file: string, settings: Settings, dwgThread: DwgThread): Promise<DrawingBytes> {
  const raw = readInputFile(file, settings.inputLimits.fileMB);
  const dwgVersion = dwgVersionTag(raw);
  const sha256 = sha256Hex(raw);
  if (!dwgVersion) return { bytes: raw, sha256, dwgVersion };
  const dwg = await import('./dwg.js');
  const limits = { seconds: settings.inputLimits.dwgSeconds, memoryMB: settings.inputLimits.dwgMemoryMB };
  try {
    return { bytes: await (dwgThread === 'own-worker' ? dwg.dwgAsDxf : dwg.dwgAsDxfHere)(raw, limits), sha256, dwgVersion };
  } catch (err) {
    if (err instanceof InputError) throw new InputError(`${file}: ${err.message}`);
    throw err;
  }
}

/** The file read and checked with `settings`; an InputError names the file. */
export async function checkDrawingFile(
  file: string,
  settings: Settings,
  options: { reportUnits: UnitSystem; requireHydraulics: boolean; dwgThread: DwgThread },
): Promise<CheckResult> {
  const { bytes, sha256, dwgVersion } = await drawingBytes(file, settings, options.dwgThread);
  const input = {
    bytes,
    fileName: file,
    sha256,
    dwgVersion,
    settings,
    reportUnits: options.reportUnits,
    requireHydraulics: options.requireHydraulics,
    onStage: collectBetweenStages(),
    onGarbage: collectIfLarge,
  };
  return withFile(file, () => runCheck(input));
}
