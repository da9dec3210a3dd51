import { defineConfig } from 'vite';

/**
 * The command line's build: a self-contained Node bundle (dependencies included) in dist-cli/, the
 * entry `fall.mjs` and the worker-thread entry `run-worker.mjs`. `npm ci` runs it (the prepare script).
 */
export default defineConfig({
  build: {
    ssr: true,
    target: 'node20',
    outDir: process.env.FALL_CLI_OUT_DIR ?? 'dist-cli',
    emptyOutDir: true,
    minify: false,
    rollupOptions: {
      input: { fall: 'src/cli/main.ts', 'run-worker': 'src/cli/run-worker.ts' },
      output: { format: 'es', entryFileNames: '[name].mjs', chunkFileNames: 'chunks/[name]-[hash].mjs' },
    },
  },
  ssr: { noExternal: true, target: 'node' },
  logLevel: 'warn',
});
