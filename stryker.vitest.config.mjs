// Vitest settings for mutation testing only (npm run mutate; stryker.config.json): the tests that judge the verdicts
// and the window search, run in Node. The CLI test is left out: it spawns a fresh process, which never sees the
// mutant Stryker switches on inside this one, so it would let every mutant survive.
import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['tests/unit/verdict.test.ts', 'tests/study/window-brute.test.ts', 'tests/study/window-cases.test.ts', 'tests/study/window-knob.test.ts'],
    testTimeout: 120_000,
  },
});
