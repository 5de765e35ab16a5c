// File access for the CLI: reading inputs with errors that name the file, atomic writes (temporary file,
// then rename) that never leave a partial output, and a guard that an output never replaces the input.

import { createHash } from 'node:crypto';
import { closeSync, openSync, readFileSync, renameSync, rmSync, statSync, writeSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';
import { InputError } from '../input-error.js';

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
    const buffer = readFileSync(path);
    return new Uint8Array(buffer.buffer, buffer.byteOffset, buffer.byteLength); // a view: no second copy of the file
  } catch (err) {
    throw new InputError(`${path}: cannot be read (${(err as NodeJS.ErrnoException).code ?? 'error'})`);
  }
}

export const sha256Hex = (bytes: Uint8Array): string => createHash('sha256').update(bytes).digest('hex');

/** Refuses an output path that is the input drawing itself. */
export function assertNotInput(output: string, input: string): void {
  if (resolve(output) === resolve(input)) throw new InputError(`${output}: an output may not overwrite the input drawing`);
}

/** An output's content: text (written as UTF-8), bytes, or bytes in pieces written one after another. */
export type OutputData = string | Uint8Array | Uint8Array[];

/**
 * Writes all files or none: each goes to a temporary name first; the renames happen only when all are written.
 * A file's data may be a function, called when its turn comes, so that each output is garbage once written;
 * an error it throws leaves no file behind and is passed on as it is.
 */
export function writeAllAtomically(files: { path: string; data: OutputData | (() => OutputData) }[]): void {
  const temps: { tmp: string; path: string }[] = [];
  const clean = () => { for (const t of temps) removeQuietly(t.tmp); };
  for (const f of files) {
    let data: OutputData;
    try {
      data = typeof f.data === 'function' ? f.data() : f.data;
    } catch (err) {
      clean();
      throw err;
    }
    const tmp = join(dirname(f.path), `.${basename(f.path)}.${process.pid}.${temps.length}.tmp`);
    temps.push({ tmp, path: f.path });
    try {
      writeData(tmp, data);
    } catch (err) {
      clean();
      throw new InputError(`${f.path}: cannot be written (${(err as NodeJS.ErrnoException).code ?? 'error'})`);
    }
  }
  for (const t of temps) renameSync(t.tmp, t.path);
}

function writeData(path: string, data: OutputData): void {
  const fd = openSync(path, 'w');
  const put = (piece: Uint8Array) => { for (let at = 0; at < piece.length;) at += writeSync(fd, piece, at, piece.length - at); };
  try {
    if (typeof data === 'string') for (const piece of utf8Pieces(data)) put(piece);
    else for (const piece of Array.isArray(data) ? data : [data]) put(piece);
  } finally {
    closeSync(fd);
  }
}

/** Characters of text encoded at a time: a large report is written without a second, encoded copy of it whole. */
const TEXT_PIECE = 1 << 20;

/** The text as UTF-8, a piece at a time, never splitting a surrogate pair. */
function* utf8Pieces(text: string): Generator<Uint8Array> {
  for (let at = 0; at < text.length;) {
    let end = Math.min(text.length, at + TEXT_PIECE);
    const last = text.charCodeAt(end - 1);
    if (end < text.length && last >= 0xd800 && last <= 0xdbff) end--;
    yield Buffer.from(text.slice(at, end), 'utf8');
    at = end;
  }
}

function removeQuietly(path: string): void {
  try {
    rmSync(path, { force: true });
  } catch {
    // the folder itself is unusable; nothing was written there
  }
}
