// Loads the bundled command line (dist/cli-bundle/main.cjs), compiled from V8's code cache of it where the build
// left one for this very source and this Node accepts it: compiling is the largest part of a small check's start.
const { createHash } = require('node:crypto');
const { existsSync, readFileSync } = require('node:fs');
const { createRequire, Module } = require('node:module');
const { dirname, join } = require('node:path');
const { Script } = require('node:vm');

const BUNDLE = join(__dirname, '..', 'dist', 'cli-bundle', 'main.cjs');
/** Written by scripts/cli-code-cache.js at build time: the source's digest, then V8's data. */
const CODE_CACHE = BUNDLE.replace(/\.cjs$/, '.code-cache');

/** The SHA-256 of the bundle's source, in hex: the 64 bytes a code cache file starts with. */
const sourceDigest = (source) => createHash('sha256').update(source).digest('hex');

/**
 * V8's data from a code cache file, when the file was written for this source (else undefined). V8 checks its
 * own version, flags and the source's length, not its text: a bundle rebuilt to the same length would otherwise
 * run the functions of the old one.
 */
function cachedDataFor(source, file) {
  return file.length > 64 && file.subarray(0, 64).toString('latin1') === sourceDigest(source) ? file.subarray(64) : undefined;
}

/**
 * The bundle's exports and the compiled script (whose cachedDataRejected tells whether V8 took the cache). The
 * module goes into require's cache under the bundle's path, so the lazy chunks' require('./main.cjs') shares it.
 */
function loadCli({ useCache = true } = {}) {
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

module.exports = { BUNDLE, CODE_CACHE, sourceDigest, cachedDataFor, loadCli };
