/**
 * `npm run build:cli`: the command line built once for Node 20, so a run starts without compiling
 * TypeScript (`npm run cli` still runs the sources through tsx for development).
 *   out/cli/main.js             the command (package.json "bin": setpoint-critic), with a node shebang
 *   out/cli/resampleThread.js   the helper thread's module, its own entry: src/cli/helperThread.ts
 *                               starts `./resampleThread.js` next to the module that holds it
 *   out/cli/*-[hash].js         shared code and the network fit's chunk (loaded only by a network fit)
 * npm packages stay external (Vite's server-side build leaves bare imports to Node), so they are
 * resolved from node_modules at run time and TensorFlow.js stays a dynamic import of its own.
 * A test builds elsewhere with `--outDir` (test/cli/builtCli.test.ts).
 */
import { chmod } from 'node:fs/promises';
import { resolve } from 'node:path';
import { defineConfig } from 'vite';

export default defineConfig({
  root: import.meta.dirname,
  publicDir: false,
  logLevel: 'warn',
  build: {
    // A server-side (Node) build: no HTML, no browser polyfills, dependencies left external.
    ssr: true,
    target: 'node20',
    outDir: 'out/cli',
    emptyOutDir: true,
    sourcemap: true,
    minify: false,
    rolldownOptions: {
      input: { main: resolve(import.meta.dirname, 'src/cli/main.ts'), resampleThread: resolve(import.meta.dirname, 'src/cli/resampleThread.ts') },
      output: {
        format: 'es',
        // Every file in one folder: the helper thread is found beside whichever chunk holds helperThread.ts.
        entryFileNames: '[name].js',
        chunkFileNames: '[name]-[hash].js',
        banner: (chunk) => (chunk.isEntry && chunk.name === 'main' ? '#!/usr/bin/env node' : ''),
      },
    },
  },
  plugins: [{
    name: 'executable-cli',
    // The bin file runs as a program from the build folder too, not only once npm has linked it.
    async writeBundle(options) {
      if (options.dir) await chmod(resolve(options.dir, 'main.js'), 0o755);
    },
  }],
});
