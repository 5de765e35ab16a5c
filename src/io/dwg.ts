// DWG drawings on Node: LibreDWG's WebAssembly module compiled once per thread, and a drawing converted to DXF in a
// worker thread of its own, ended past the time limit; the converter's memory is capped inside the module.

import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { setFlagsFromString } from 'node:v8';
import { Worker } from 'node:worker_threads';
import { InputError } from '../input-error.js';
import { dwgToDxf } from '../read/dwg/dwg-to-dxf.js';

let compiled: Promise<WebAssembly.Module> | null = null;

/**
 * The LibreDWG module, compiled once per thread from the package's wasm file, by V8's baseline compiler only: its
 * optimising tier spends ~10 s on the module's largest functions the second time an instance runs them, while the
 * baseline code converts a 2.1 MB DWG in ~0.9 s (measured, docs/performance.md). V8's flags are the process's, and
 * the program loads no other WebAssembly (epanet-js runs in tests only).
 */
export function libreDwgModule(): Promise<WebAssembly.Module> {
  if (!compiled) {
    setFlagsFromString('--liftoff-only');
    const entry = createRequire(import.meta.url).resolve('@mlightcad/libredwg-web');
    compiled = WebAssembly.compile(readFileSync(join(dirname(entry), '..', 'wasm', 'libredwg-web.wasm')));
  }
  return compiled;
}

export interface DwgReadLimits {
  seconds: number;
  memoryMB: number;
}

/** Converts in this thread (a batch worker already runs under its own limits). */
export async function dwgAsDxfHere(bytes: Uint8Array, limits: DwgReadLimits): Promise<Uint8Array> {
  return dwgToDxf(bytes, await libreDwgModule(), limits);
}

/** Converts in a worker thread, ended after `limits.seconds`; an InputError names what went wrong. */
export function dwgAsDxf(bytes: Uint8Array, limits: DwgReadLimits): Promise<Uint8Array> {
  return new Promise((resolve, reject) => {
    // From dist/io or from the bundle in dist/cli-bundle alike: both sit beside dist/io.
    const worker = new Worker(new URL('../io/dwg-worker.js', import.meta.url), {
      workerData: { bytes, limits },
      transferList: [],
      resourceLimits: { maxOldGenerationSizeMb: Math.max(256, limits.memoryMB) },
      stdout: true,
      stderr: true,
    });
    const timer = setTimeout(() => {
      void worker.terminate();
      reject(new InputError(`reading the DWG took longer than ${limits.seconds} s (inputLimits.dwgSeconds)`));
    }, limits.seconds * 1000);
    worker.once('message', (m: { dxf?: Uint8Array; error?: string; input?: boolean }) => {
      clearTimeout(timer);
      void worker.terminate();
      if (m.dxf) resolve(m.dxf);
      else reject(m.input ? new InputError(m.error!) : new Error(m.error));
    });
    worker.once('error', (err) => {
      clearTimeout(timer);
      reject(new InputError(`the DWG could not be read (${err.message})`));
    });
    worker.once('exit', (code) => {
      clearTimeout(timer);
      if (code !== 0) reject(new InputError(`the DWG could not be read (its reader stopped with code ${code})`));
    });
  });
}
