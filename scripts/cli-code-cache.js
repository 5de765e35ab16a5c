// Build step: writes V8's code cache of the bundled command line after running the demo through it, so the
// functions a check runs come compiled too (bin/load-cli.js reads it; a small check starts ~40 ms sooner).
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { CODE_CACHE, loadCli, sourceDigest } from '../bin/load-cli.js';

const { cli, script, source } = loadCli({ useCache: false });
const out = mkdtempSync(join(tmpdir(), 'headcheck-code-cache-'));
const write = process.stdout.write;
try {
  // The demo checks a drawing with every output: the path a reviewer's check takes. Its lines are not wanted here.
  process.stdout.write = () => true;
  await cli.main(['node', 'headcheck', 'demo', '--out', out]);
} finally {
  process.stdout.write = write;
  rmSync(out, { recursive: true, force: true });
}
const cache = script.createCachedData();
writeFileSync(CODE_CACHE, Buffer.concat([Buffer.from(sourceDigest(source), 'latin1'), cache]));
console.log(`code cache of the command line: ${(cache.length / 1024).toFixed(0)} KiB in ${CODE_CACHE}`);
