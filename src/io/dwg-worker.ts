// The worker thread that converts one DWG drawing to DXF (io/dwg.ts starts it): the answer is the DXF bytes, or
// the one-line reason it could not be read (an input error) or the crash (anything else).

import { parentPort, workerData } from 'node:worker_threads';
import { InputError } from '../input-error.js';
import { dwgAsDxfHere, type DwgReadLimits } from './dwg.js';

const { bytes, limits } = workerData as { bytes: Uint8Array; limits: DwgReadLimits };
try {
  const dxf = await dwgAsDxfHere(bytes, limits);
  parentPort!.postMessage({ dxf }, [dxf.buffer as ArrayBuffer]);
} catch (err) {
  parentPort!.postMessage({ error: err instanceof Error ? err.message : String(err), input: err instanceof InputError });
}
