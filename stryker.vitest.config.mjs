// Vitest settings for mutation testing only (npm run mutate; stryker.config.json): the tests that judge the verdicts
// and the window search, run in Node. Left out: the CLI test (it spawns a fresh process, which never sees the mutant
// Stryker switches on inside this one) and the brute-force scans of the demo (hundreds of full runs per mutant would
// take hours on two shared cores; the small invented cases of window-cases.test.ts exercise the same code).
import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['tests/unit/verdict.test.ts', 'tests/study/window-bracket.test.ts', 'tests/study/window-cases.test.ts', 'tests/study/window-knob.test.ts'],
    testTimeout: 120_000,
  },
});
