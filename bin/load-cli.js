// Loads the bundled command line (dist/cli-bundle/main.cjs), compiled from V8's code cache of it where the build
// left one this Node accepts: compiling the bundle and its functions is the largest part of a small check's start.
import { existsSync, readFileSync } from 'node:fs';
import { createRequire, Module } from 'node:module';
import { dirname } from 'node:path';
import { fileURLToPath } from 'node:url';
import { Script } from 'node:vm';

export const BUNDLE = fileURLToPath(new URL('../dist/cli-bundle/main.cjs', import.meta.url));
/** Written by scripts/cli-code-cache.js at build time; V8 refuses it (and compiles afresh) under another Node or flags. */
export const CODE_CACHE = BUNDLE.replace(/\.cjs$/, '.code-cache');

/**
 * The bundle's exports and the compiled script (whose cachedDataRejected tells whether the cache served). The
 * module goes into require's cache under the bundle's path, so the lazy chunks' require('./main.cjs') shares it.
 */
export function loadCli({ useCache = true } = {}) {
  const source = readFileSync(BUNDLE, 'utf8');
  const cachedData = useCache && existsSync(CODE_CACHE) ? readFileSync(CODE_CACHE) : undefined;
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
  return { cli: bundle.exports, script };
}
