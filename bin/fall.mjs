#!/usr/bin/env node
// The `fall` command: loads the built command line (dist-cli/, made by `npm run build:cli`, which
// `npm ci` runs through the prepare script).
try {
  await import('../dist-cli/fall.mjs');
} catch (e) {
  if (e?.code === 'ERR_MODULE_NOT_FOUND' && String(e.message).includes('dist-cli')) {
    process.stderr.write('fall: the command line is not built yet; run `npm run build:cli` (npm ci does it)\n');
    process.exit(1);
  }
  throw e;
}
