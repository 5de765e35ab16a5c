// Bundles the command line into dist/cli-bundle/ from the compiled dist/cli/main.js: one CommonJS file with its
// pure-JavaScript libraries, so that bin/load-cli.js can compile it from V8's code cache; lazy chunks for batch,
// serve, demo and DWG (loading 99 modules cost a small check a fifth of its time).
import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vite';

export default defineConfig({
  logLevel: 'warn',
  // Libraries that need their own files at run time (LibreDWG's wasm, piscina's worker) stay packages.
  // commander's node:child_process, loaded only where it is used (scripts/bundle/lazy-child-process.cjs).
  resolve: { alias: { 'node:child_process': fileURLToPath(new URL('scripts/bundle/lazy-child-process.cjs', import.meta.url)) } },
  ssr: { target: 'node', noExternal: ['commander', 'rbush', 'quickselect', 'valibot', '@flatten-js/core'] },
  build: {
    ssr: 'dist/cli/main.js',
    outDir: 'dist/cli-bundle',
    emptyOutDir: true,
    target: 'node20',
    minify: false,
    rollupOptions: {
      output: {
        format: 'cjs',
        entryFileNames: 'main.cjs',
        chunkFileNames: '[name]-[hash].cjs',
        // Plain ASCII without the doc comments: V8 keeps a one-byte source of half the size, read and hashed at each
        // start (a non-ASCII character makes every character two bytes).
        charset: 'ascii',
        comments: { legal: true, annotation: false, jsdoc: false },
      },
    },
  },
});
