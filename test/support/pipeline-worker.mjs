// Runs the whole built pipeline on one drawing per message, in a worker thread, so that a test can stop a
// run that hangs (a synchronous loop cannot be interrupted from inside its own thread).
import { parentPort } from 'node:worker_threads';
import { FORMAT_NAMES, FORMATS } from '../../dist/check/formats.js';
import { runCheck } from '../../dist/check/run-check.js';
import { parseSettings } from '../../dist/config/settings.js';
import { InputError } from '../../dist/input-error.js';

parentPort.on('message', ({ bytes, config }) => {
  try {
    const input = { bytes, fileName: 'fuzz.dxf', sha256: '', settings: parseSettings(config), reportUnits: 'us' };
    const result = runCheck(input);
    for (const f of FORMAT_NAMES) FORMATS[f].make(result);
    parentPort.postMessage({ outcome: 'report' });
  } catch (err) {
    const message = err instanceof Error ? err.message : String(err);
    parentPort.postMessage(
      err instanceof InputError
        ? { outcome: 'input-error', message }
        : { outcome: 'crash', message: err instanceof Error ? err.stack : message },
    );
  }
});
