#!/usr/bin/env node
// The `freezeline` command. Runs the JavaScript bundle build/cli/main.js (esbuild, `npm run build:cli`), rebuilding it
// first when a source file is newer. Without esbuild or when the build fails it runs the TypeScript source through tsx
// (a slower start) and says so on stderr.
import { buildCli, bundleIsStale, bundlePath } from '../../scripts/build-cli.mjs';
import { pathToFileURL } from 'node:url';

let useBundle = true;
if (bundleIsStale()) {
  try {
    await buildCli();
  } catch (e) {
    useBundle = false;
    process.stderr.write(`freezeline: could not build the bundle (${e.message.split('\n')[0]}); running the TypeScript source with tsx (slower start). Try \`npm run build:cli\`.\n`);
  }
}
if (useBundle) {
  await import(pathToFileURL(bundlePath).href);
} else {
  const { register } = await import('tsx/esm/api');
  register();
  await import('./main.ts');
}
