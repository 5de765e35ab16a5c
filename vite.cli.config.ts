// Bundles the command line into dist/cli-bundle/ from the compiled dist/cli/main.js: one file with its libraries
// and lazy chunks for batch, serve, demo and DWG (loading 99 modules cost a small check a fifth of its time).
import { defineConfig } from 'vite';

export default defineConfig({
  logLevel: 'warn',
  // Libraries stay packages (some need their own __dirname); the project's own modules become one file.
  ssr: { target: 'node' },
  build: {
    ssr: 'dist/cli/main.js',
    outDir: 'dist/cli-bundle',
    emptyOutDir: true,
    target: 'node20',
    minify: false,
    rollupOptions: { output: { entryFileNames: 'main.js', chunkFileNames: '[name]-[hash].js' } },
  },
});
