// Lint: typescript-eslint's recommended rules, the import direction of DESIGN.md enforced for sim/, and the layering
// between sim/'s folders (DEVELOPERS.md "Layout"): each folder may import only the folders listed for it.
import tseslint from 'typescript-eslint';

/** What no file in sim/ outside sim/cli/ may import: it runs in Node and in a Web Worker. */
const corePatterns = [
  { group: ['node:*', 'fs', 'path', 'os', 'child_process'], message: 'sim/ must not use Node APIs (only sim/cli/ may).' },
  { group: ['**/ui/**', '../ui', '../../ui'], message: 'sim/ must not import from ui/.' },
  { group: ['plotly.js-dist-min', 'plotly.js*'], message: 'sim/ knows nothing of plotting.' },
  { group: ['commander', 'cli-progress'], message: 'CLI packages belong in sim/cli/.' },
];

/** The folders of sim/, lowest first, and which others each may import (its own folder always). */
const layers = {
  physics: [],
  grid: ['physics'],
  time: ['grid', 'physics'],
  observe: ['grid', 'physics'], // reads solver-neutral observations (physics/observation.ts), not time/
  lumped: ['physics'],
  scenario: ['observe', 'grid', 'physics'],
  study: ['scenario', 'observe', 'time', 'grid', 'physics', 'lumped'],
};
const folders = ['physics', 'grid', 'time', 'observe', 'lumped', 'scenario', 'study', 'cli'];

function layerRule(folder) {
  const forbidden = folders.filter((f) => f !== folder && !layers[folder].includes(f));
  return {
    files: [`sim/${folder}/**/*.ts`],
    ignores: folder === 'physics' ? ['sim/physics/salt.ts'] : [],
    rules: {
      'no-restricted-imports': ['error', {
        patterns: [
          ...corePatterns,
          { group: forbidden.map((f) => `../${f}/*`), message: `sim/${folder}/ ${layers[folder].length ? `may import only ${layers[folder].map((f) => `sim/${f}/`).join(', ')}` : 'imports no other folder of sim/'} (DEVELOPERS.md, Layout).` },
          { group: ['../*.ts', '../index.ts'], message: `sim/${folder}/ must not import the top of sim/ (run.ts, index.ts): they import it.` },
        ],
      }],
    },
  };
}

/**
 * The integrator and its step control see a system only through the stage-system interface (DEVELOPERS.md, "The
 * numerical method"): no grid, no kernels, no Thomas solve, so the same TR-BDF2 serves the stack, a network and 2D.
 */
function integratorRule() {
  const time = layerRule('time').rules['no-restricted-imports'][1].patterns;
  return {
    files: ['sim/time/tr-bdf2.ts', 'sim/time/step-control.ts', 'sim/time/drive.ts'],
    rules: {
      'no-restricted-imports': ['error', {
        patterns: [...time, { group: ['../grid/*', '!../grid/stage-system.ts'], message: 'the integrator sees a system only through grid/stage-system.ts (no grid, kernels or linear solver of its own).' }],
      }],
    },
  };
}

export default tseslint.config(
  { ignores: ['dist/**', 'build/**', 'node_modules/**', 'sim/cli/bin.js'] },
  ...tseslint.configs.recommended,
  {
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@typescript-eslint/no-explicit-any': 'error',
    },
  },
  {
    // The computational core runs in Node and in a Web Worker: no DOM, no Node APIs, no UI, no Plotly.
    files: ['sim/**/*.ts'],
    ignores: ['sim/cli/**'],
    rules: {
      'no-restricted-imports': ['error', { patterns: corePatterns }],
      'no-restricted-globals': ['error', 'document', 'window', 'localStorage', 'process'],
    },
  },
  ...['physics', 'grid', 'time', 'observe', 'lumped', 'scenario'].map(layerRule),
  integratorRule(),
  {
    // study/ may use everything below it and run.ts, but not the CLI
    files: ['sim/study/**/*.ts'],
    rules: {
      'no-restricted-imports': ['error', {
        patterns: [...corePatterns, { group: ['../cli/*'], message: 'sim/study/ must not import the CLI.' }],
      }],
    },
  },
  {
    // The salt model reads the pure salts' melting facts from the bundled library (one copy of each number): the one
    // place physics/ reads scenario/, and only its library.
    files: ['sim/physics/salt.ts'],
    rules: {
      'no-restricted-imports': ['error', {
        patterns: [...corePatterns, { group: ['../grid/*', '../time/*', '../observe/*', '../lumped/*', '../study/*', '../cli/*', '../*.ts'], message: 'physics/ imports no other folder.' }],
      }],
    },
  },
  {
    // The view reaches the core through its public API only (sim/index.ts); the worker runs the same code.
    files: ['ui/**/*.ts'],
    rules: {
      'no-restricted-imports': ['error', {
        patterns: [{ group: ['../sim/*/**', '../sim/*.ts', '!../sim/index.ts'], message: 'ui/ imports the core only through sim/index.ts.' }],
      }],
    },
  },
);
