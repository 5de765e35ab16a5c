// Builds the local page (src/web) into dist/web with the project's own core code, for `headcheck serve`.
import { defineConfig } from 'vite';

export default defineConfig({
  root: 'src/web',
  base: './',
  logLevel: 'warn',
  build: { outDir: '../../dist/web', emptyOutDir: true, modulePreload: false, target: 'es2022', sourcemap: false },
  worker: { format: 'es' },
});
