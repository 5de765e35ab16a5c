// Loads the bundled command line (dist/cli-bundle/main.cjs), compiled from V8's code cache of it where the build
// left one for this very source and this Node accepts it: compiling is the largest part of a small check's start.
import { createHash } from 'node:crypto';
import { existsSync, readFileSync } from 'node:fs';
import { createRequire, Module } from 'node:module';
import { dirname } from 'node:path';
import { fileURLToPath } from 'node:url';
import { Script } from 'node:vm';

export const BUNDLE = fileURLToPath(new URL('../dist/cli-bundle/main.cjs', import.meta.url));
/** Written by scripts/cli-code-cache.js at build time: the source's digest, then V8's data. */
export const CODE_CACHE = BUNDLE.replace(/\.cjs$/, '.code-cache');

/** The SHA-256 of the bundle's source, in hex: the 64 bytes a code cache file starts with. */
export const sourceDigest = (source) => createHash('sha256').update(source).digest('hex');

/**
 * V8's data from a code cache file, when the file was written for this source (else undefined). V8 checks its
 * own version, flags and the source's length, not its text: a bundle rebuilt to the same length would otherwise
 * run the functions of the old one.
 */
export function cachedDataFor(source, file) {
  return file.length > 64 && file.subarray(0, 64).toString('latin1') === sourceDigest(source) ? file.subarray(64) : undefined;
}

/**
 * The bundle's exports and the compiled script (whose cachedDataRejected tells whether V8 took the cache). The
 * module goes into require's cache under the bundle's path, so the lazy chunks' require('./main.cjs') shares it.
 */
export function loadCli({ useCache = true } = {}) {
  const source = readFileSync(BUNDLE, 'utf8');
  const cachedData = useCache && existsSync(CODE_CACHE) ? cachedDataFor(source, readFileSync(CODE_CACHE)) : undefined;
  const script = new Script(`(function (exports, require, module, __filename, __dirname) {${source}\n})`, {
    filename: BUNDLE,
    cachedData,
  });
  const require = createRequire(BUNDLE);
  const bundle = new Module(BUNDLE);
  bundle.filename = BUNDLE;
  require.cache[BUNDLE] = bundle;
  script.runInThisContext()(bundle.exports, require, bundle, BUNDLE, dirname(BUNDLE));
  bundle.loaded = true;
  return { cli: bundle.exports, script, source };
}
