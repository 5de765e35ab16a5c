// File access for the CLI: reading inputs with errors that name the file, atomic writes (temporary file,
// then rename) that never leave a partial output, and a guard that an output never replaces the input.

import { createHash, randomBytes } from 'node:crypto';
import { readdirSync, readFileSync, renameSync, rmSync, statSync } from 'node:fs';
import { open } from 'node:fs/promises';
import { basename, dirname, join, resolve } from 'node:path';
import type { OutputData } from '../check/formats.js';
import { InputError } from '../input-error.js';
import { collectIfLarge } from './collect.js';

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

/** Temporary files start so (in the output's own folder, so that the rename stays on one disk) and end `.tmp`. */
const TEMP_PREFIX = '.headcheck-';
/** A temporary file older than this in an output folder is left by a run that was killed: removed at start. */
const STALE_MS = 60 * 60 * 1000;

/** Temporary files this thread has open, and folders where this process writes: cleaned on a signal. */
const openTemps = new Set<string>();
const outputFolders = new Set<string>();

const errorCode = (err: unknown) => {
  const e = err as NodeJS.ErrnoException;
  return e.code ? `${e.code}${e.syscall ? ` on ${e.syscall}` : ''}` : e instanceof Error ? e.message : String(err);
};

/**
 * Writes all files or none: each goes to a temporary name in its folder first; the renames happen only when all
 * are written, and a rename that fails takes back the ones before it. A file's data may be a function, called when
 * its turn comes, so that each output is garbage once written; an error it throws leaves no file behind and is
 * passed on as it is. Two outputs on one path, an output that is a folder, an unwritable folder: a one-line
 * InputError naming the path.
 */
export type { OutputData };

export async function writeAllAtomically(files: { path: string; data: OutputData | (() => OutputData) }[]): Promise<void> {
  const seen = new Map<string, string>();
  for (const f of files) {
    const abs = resolve(f.path);
    if (seen.has(abs)) throw new InputError(`${f.path}: two outputs may not share one path (also ${seen.get(abs)})`);
    seen.set(abs, f.path);
    if (isFolder(abs)) throw new InputError(`${f.path}: is a folder, not a file to write`);
  }
  for (const dir of new Set([...seen.keys()].map(dirname))) sweepStaleTemps(dir);
  const temps: { tmp: string; path: string }[] = [];
  const renamed: string[] = [];
  const clean = () => {
    for (const t of temps) {
      removeQuietly(t.tmp);
      openTemps.delete(t.tmp);
    }
    for (const r of renamed) removeQuietly(r);
  };
  const release = guardTemps();
  try {
    for (const f of files) {
      const tmp = join(dirname(f.path), `${TEMP_PREFIX}${basename(f.path)}-${process.pid}-${randomBytes(4).toString('hex')}.tmp`);
      temps.push({ tmp, path: f.path });
      openTemps.add(tmp);
      await makeAndWrite(f, tmp);
    }
    for (const t of temps) {
      try {
        renameSync(t.tmp, t.path);
      } catch (err) {
        throw new InputError(`${t.path}: cannot be written (${errorCode(err)})`);
      }
      openTemps.delete(t.tmp);
      renamed.push(t.path);
    }
  } catch (err) {
    clean();
    throw err;
  } finally {
    release();
  }
}

function isFolder(path: string): boolean {
  try {
    return statSync(path).isDirectory();
  } catch {
    return false;
  }
}

/** Removes temporary files of ours older than an hour from `dir` (a killed run's); once per folder and process. */
function sweepStaleTemps(dir: string): void {
  if (outputFolders.has(dir)) return;
  outputFolders.add(dir);
  let names: string[];
  try {
    names = readdirSync(dir);
  } catch {
    return; // an unreadable folder is reported when it is written to
  }
  const now = Date.now();
  for (const name of names) {
    if (!name.startsWith(TEMP_PREFIX) || !name.endsWith('.tmp')) continue;
    try {
      if (now - statSync(join(dir, name)).mtimeMs > STALE_MS) rmSync(join(dir, name), { force: true });
    } catch {
      // gone already, or not ours to remove
    }
  }
}

const SIGNALS = ['SIGINT', 'SIGTERM', 'SIGHUP'] as const;

/**
 * Removes this thread's temporary files and, in every output folder of this process, the ones its worker threads
 * left (they carry the process id); then ends the process as `signal` would have.
 */
function cleanAndEnd(signal: NodeJS.Signals): void {
  for (const t of openTemps) removeQuietly(t);
  const mine = `-${process.pid}-`;
  for (const dir of outputFolders) {
    try {
      for (const name of readdirSync(dir))
        if (name.startsWith(TEMP_PREFIX) && name.includes(mine) && name.endsWith('.tmp')) removeQuietly(join(dir, name));
    } catch {
      // the folder went away
    }
  }
  for (const s of SIGNALS) process.removeAllListeners(s);
  process.kill(process.pid, signal);
}

/**
 * While outputs are written (a write yields to the event loop between pieces), a SIGINT, SIGTERM or SIGHUP removes
 * the temporary files before the process ends. Outside writes the default stands: a check is stopped at once, and
 * it has written nothing. Returns the function that takes the guard off. In a worker thread the handlers never run
 * (Node delivers signals to the main thread only, whose cleanUpOnSignals covers the workers' folders).
 */
function guardTemps(): () => void {
  const handlers = SIGNALS.map((signal) => [signal, () => cleanAndEnd(signal)] as const);
  for (const [signal, handler] of handlers) process.on(signal, handler);
  return () => {
    for (const [signal, handler] of handlers) process.off(signal, handler);
  };
}

/** For the whole of a run whose thread waits on workers (the batch): the same cleanup on a signal. */
let cleaning = false;
export function cleanUpOnSignals(): void {
  if (cleaning) return;
  cleaning = true;
  for (const signal of SIGNALS) process.once(signal, () => cleanAndEnd(signal));
}

/** Marks a folder where worker threads of this process write (the batch output folder), for the cleanup above. */
export const watchOutputFolder = (dir: string) => {
  sweepStaleTemps(resolve(dir));
};

/**
 * Makes one output and writes it to `tmp`, after the garbage of the one before is collected where the heap is
 * large. The data lives in this call alone: an async function's locals stay reachable across its awaits, so made in
 * the caller's loop, each output would be kept until the next replaced it. 20,000 heads in lines of 8, the JSON,
 * the annotated drawing and the page: peak 250 → 226 MiB.
 */
async function makeAndWrite(f: { path: string; data: OutputData | (() => OutputData) }, tmp: string): Promise<void> {
  collectIfLarge();
  const data = typeof f.data === 'function' ? f.data() : f.data;
  try {
    await writeData(tmp, data);
  } catch (err) {
    throw new InputError(`${f.path}: cannot be written (${errorCode(err)})`);
  }
}

/** Writes the data a piece at a time, each write a turn of the event loop (so that a signal can be handled). */
async function writeData(path: string, data: OutputData): Promise<void> {
  const file = await open(path, 'w');
  const put = async (piece: Uint8Array) => {
    for (let at = 0; at < piece.length; ) at += (await file.write(piece, at, piece.length - at)).bytesWritten;
  };
  try {
    if (typeof data === 'string') for (const piece of utf8Pieces(data)) await put(piece);
    else for (const piece of Array.isArray(data) ? data : [data]) await put(piece);
  } finally {
    await file.close();
  }
}

/** Characters of text encoded at a time: a large report is written without a second, encoded copy of it whole. */
const TEXT_PIECE = 1 << 20;

/**
 * The text as UTF-8, a piece at a time, never splitting a surrogate pair. Every piece is encoded into the same
 * buffer (at most 3 bytes a UTF-16 unit), so each must be written before the next is asked for.
 */
function* utf8Pieces(text: string): Generator<Uint8Array> {
  const buffer = new Uint8Array(3 * Math.min(text.length, TEXT_PIECE));
  const encoder = new TextEncoder();
  for (let at = 0; at < text.length; ) {
    let end = Math.min(text.length, at + TEXT_PIECE);
    const last = text.charCodeAt(end - 1);
    if (end < text.length && last >= 0xd800 && last <= 0xdbff) end--;
    yield buffer.subarray(0, encoder.encodeInto(text.slice(at, end), buffer).written);
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
