// One config for the browser view (root ui/, built to dist/) and the test projects.
// `unit` runs everything under tests/ except the browser tests; `e2e` drives dist/ in headless Chromium.
import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

const repoRoot = fileURLToPath(new URL('.', import.meta.url));

export default defineConfig({
  root: 'ui',
  base: './',
  build: {
    outDir: '../dist',
    emptyOutDir: true,
    // Plotly is ~4.8 MB minified and arrives through a dynamic import, after the page is usable.
    chunkSizeWarningLimit: 6000,
  },
  worker: { format: 'es' },
  server: { host: '127.0.0.1' },
  preview: { host: '127.0.0.1' },
  test: {
    projects: [
      {
        extends: true,
        test: {
          name: 'unit',
          root: repoRoot,
          include: ['tests/**/*.test.ts'],
          exclude: ['tests/e2e/**'],
          testTimeout: 60_000,
        },
      },
      {
        extends: true,
        test: {
          name: 'e2e',
          root: repoRoot,
          include: ['tests/e2e/**/*.test.ts'],
          testTimeout: 120_000,
          hookTimeout: 120_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
