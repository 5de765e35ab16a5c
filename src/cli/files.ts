// File access for the CLI: reading inputs with errors that name the file, atomic writes (temporary file,
// then rename) that never leave a partial output, and a guard that an output never replaces the input.

import { createHash } from 'node:crypto';
import { readFileSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';
import { InputError } from '../read/errors.js';

/** Reads a drawing of at most `maxMB` MiB (the config's inputLimits.fileMB), checked before it is read. */
export function readInputFile(path: string, maxMB: number): Uint8Array {
  let size: number;
  try {
    const st = statSync(path);
    if (st.isDirectory()) throw new InputError(`${path}: is a folder, not a drawing`);
    size = st.size;
  } catch (err) {
    if (err instanceof InputError) throw err;
    throw new InputError(`${path}: cannot be read (${(err as NodeJS.ErrnoException).code ?? 'error'})`);
  }
  if (size > maxMB * 1024 * 1024) throw new InputError(`${path}: larger than ${maxMB} MiB (inputLimits.fileMB)`);
  try {
    return new Uint8Array(readFileSync(path));
  } catch (err) {
    throw new InputError(`${path}: cannot be read (${(err as NodeJS.ErrnoException).code ?? 'error'})`);
  }
}

export const sha256Hex = (bytes: Uint8Array): string => createHash('sha256').update(bytes).digest('hex');

/** Refuses an output path that is the input drawing itself. */
export function assertNotInput(output: string, input: string): void {
  if (resolve(output) === resolve(input)) throw new InputError(`${output}: an output may not overwrite the input drawing`);
}

/** Writes all files or none: each goes to a temporary name first; the renames happen only when all are written. */
export function writeAllAtomically(files: { path: string; data: string | Uint8Array }[]): void {
  const temps: { tmp: string; path: string }[] = [];
  try {
    for (const f of files) {
      const tmp = join(dirname(f.path), `.${basename(f.path)}.${process.pid}.${temps.length}.tmp`);
      temps.push({ tmp, path: f.path });
      writeFileSync(tmp, f.data);
    }
  } catch (err) {
    for (const t of temps) removeQuietly(t.tmp);
    const code = (err as NodeJS.ErrnoException).code ?? 'error';
    throw new InputError(`${temps.at(-1)?.path ?? 'output'}: cannot be written (${code})`);
  }
  for (const t of temps) renameSync(t.tmp, t.path);
}

function removeQuietly(path: string): void {
  try {
    rmSync(path, { force: true });
  } catch {
    // the folder itself is unusable; nothing was written there
  }
}

/** Reads and parses a JSON config file, naming it in errors. */
export function readConfigText(path: string): string {
  try {
    return readFileSync(path, 'utf8');
  } catch (err) {
    throw new InputError(`${path}: config cannot be read (${(err as NodeJS.ErrnoException).code ?? 'error'})`);
  }
}
