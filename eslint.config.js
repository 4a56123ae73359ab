// Lint: typescript-eslint's recommended rules, and the import direction of DESIGN.md enforced for sim/.
import tseslint from 'typescript-eslint';

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
      'no-restricted-imports': ['error', {
        patterns: [
          { group: ['node:*', 'fs', 'path', 'os', 'child_process'], message: 'sim/ must not use Node APIs (only sim/cli/ may).' },
          { group: ['**/ui/**', '../ui', '../../ui'], message: 'sim/ must not import from ui/.' },
          { group: ['plotly.js-dist-min', 'plotly.js*'], message: 'sim/ knows nothing of plotting.' },
          { group: ['commander', 'cli-progress'], message: 'CLI packages belong in sim/cli/.' },
        ],
      }],
      'no-restricted-globals': ['error', 'document', 'window', 'localStorage', 'process'],
    },
  },
);
