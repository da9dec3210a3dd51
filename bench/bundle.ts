import { resolve } from 'node:path';
import { build } from 'vite';

/**
 * Bundles a bench entry and everything it imports (our TypeScript sources and any package) into one
 * ES module, with Vite's build API in SSR mode, so plain Node (and its worker threads) load it as the
 * app's build runs: no module runner between our modules. Returns the bundle's path.
 */
export async function bundleForNode(entry: string, outDir: string, fileName: string): Promise<string> {
  const out = resolve(process.cwd(), outDir);
  await build({
    configFile: false,
    root: process.cwd(),
    logLevel: 'warn',
    ssr: { noExternal: true },
    build: {
      ssr: resolve(process.cwd(), entry),
      outDir: out,
      emptyOutDir: true,
      minify: false,
      target: 'node20',
      rolldownOptions: { output: { format: 'es', entryFileNames: fileName } },
    },
  });
  return resolve(out, fileName);
}
