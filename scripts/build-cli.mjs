// Builds the `freezeline` command into plain JavaScript with esbuild, so a call starts without compiling TypeScript:
// build/cli/main.js (the command) and one file per worker entry sim/cli/*-worker.ts beside it (tinypool loads
// `<name>-worker.js` from the bundle's own folder). Dependencies are bundled too: one file to load is the fastest
// start. `npm run build:cli` runs this; `prepare` (npm install / npm ci), `npm start` and `npm test` call it, and
// sim/cli/bin.js calls buildCli() itself when a source file is newer than the bundle, so a call never runs stale code.
// Each file is written beside its place and renamed over it, so a command starting meanwhile never reads half a file.
import { mkdirSync, readdirSync, renameSync, statSync, writeFileSync } from 'node:fs';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { join } from 'node:path';

const root = fileURLToPath(new URL('..', import.meta.url));
export const bundlePath = join(root, 'build/cli/main.js');
/** What the bundle is built from: a change here makes it stale. */
const SOURCE_DIRS = ['sim', 'materials'];

/** Newest modification time (ms) among the bundle's sources. */
function newestSourceMs() {
  let newest = 0;
  for (const d of SOURCE_DIRS) {
    for (const f of readdirSync(join(root, d), { recursive: true })) {
      if (/\.(ts|json|mjs)$/.test(f)) newest = Math.max(newest, statSync(join(root, d, f)).mtimeMs);
    }
  }
  return newest;
}

/** Whether build/cli/main.js is missing or older than a source file. */
export function bundleIsStale() {
  try {
    return statSync(bundlePath).mtimeMs < newestSourceMs();
  } catch {
    return true;
  }
}

/**
 * zod ships error messages in ~40 languages and re-exports them all as `z.locales`, which a bundler cannot drop (a
 * namespace). freezeline only uses zod's default English, so the list is replaced by English alone: the bundle loses
 * ~300 KB that every call would compile. English stays the default through zod's own `config(en())`.
 */
const englishOnlyZod = {
  name: 'english-only-zod',
  setup(b) {
    b.onResolve({ filter: /^\.\.\/locales\/index\.js$/ }, (args) => (args.importer.includes(`${'node_modules'}/zod/`)
      ? { path: 'zod-locales-en', namespace: 'freezeline' } : undefined));
    b.onLoad({ filter: /.*/, namespace: 'freezeline' }, () => ({ contents: "export { default as en } from 'zod/v4/locales/en.js';", resolveDir: root }));
  },
};

export async function buildCli() {
  const { build } = await import('esbuild');
  const workers = readdirSync(join(root, 'sim/cli')).filter((f) => f.endsWith('-worker.ts')).map((f) => join(root, 'sim/cli', f));
  const out = await build({
    entryPoints: [join(root, 'sim/cli/main.ts'), ...workers],
    outdir: join(root, 'build/cli'),
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    minify: true,
    // CommonJS dependencies (ndarray, odex, commander) call require(): give the ES module one
    banner: { js: "import { createRequire as __freezelineRequire } from 'node:module'; const require = __freezelineRequire(import.meta.url);" },
    logLevel: 'warning',
    legalComments: 'none',
    plugins: [englishOnlyZod],
    write: false,
  });
  mkdirSync(join(root, 'build/cli'), { recursive: true });
  for (const f of out.outputFiles) {
    const temp = `${f.path}.${process.pid}.tmp`;
    writeFileSync(temp, f.contents);
    renameSync(temp, f.path);
  }
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  try {
    await buildCli();
  } catch (e) {
    // an install must not fail for want of the bundle: the command then runs from source (bin.js says so)
    process.stderr.write(`freezeline: the CLI bundle was not built (${String(e.message).split('\n')[0]})\n`);
    process.exitCode = process.env.npm_lifecycle_event === 'prepare' ? 0 : 1;
  }
}
