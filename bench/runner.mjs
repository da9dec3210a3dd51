// Runs a TypeScript benchmark module through Vite's module runner, which resolves packages the way the
// app's build does (tfjs-core's gradient registry cannot be imported by plain Node ESM).
import { createRequire } from 'node:module';
import { createServer } from 'vite';

globalThis.require ??= createRequire(import.meta.url); // tfjs-core's Node platform probe calls require()
const entry = process.argv[2];
if (!entry) throw new Error('usage: node bench/runner.mjs /bench/<module>.ts');
const server = await createServer({
  configFile: false,
  root: process.cwd(),
  logLevel: 'error',
  appType: 'custom',
  server: { middlewareMode: true, hmr: false, ws: false },
  ssr: { noExternal: [/@tensorflow/] },
});
try {
  await server.ssrLoadModule(entry);
} finally {
  await server.close();
}
