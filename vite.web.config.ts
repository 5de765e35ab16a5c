// Builds the local page (src/web) into dist/web with the project's own core code, for `headcheck serve`; the DWG
// reader's WebAssembly module (which its package does not export by path) is reached through an alias.
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { defineConfig } from 'vite';

const libreDwgEntry = createRequire(import.meta.url).resolve('@mlightcad/libredwg-web');

export default defineConfig({
  root: 'src/web',
  base: './',
  logLevel: 'warn',
  resolve: {
    alias: [{ find: /^libredwg-web\.wasm\?url$/, replacement: `${join(dirname(libreDwgEntry), '..', 'wasm', 'libredwg-web.wasm')}?url` }],
  },
  build: { outDir: '../../dist/web', emptyOutDir: true, modulePreload: false, target: 'es2022', sourcemap: false },
  worker: { format: 'es' },
});
