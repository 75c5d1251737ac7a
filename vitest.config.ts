import { defineConfig } from 'vitest/config';

// One Vitest run, three projects (all in Node): the framework-free core with the cross-project reference
// checks, the REST API server and its contract, and the real-browser tests (playwright-core driving Debian
// Chromium, one file at a time). Angular component specs run through their own runner (see scripts/run-tests.mjs).
export default defineConfig({
  test: {
    testTimeout: 60000,
    reporters: ['default'],
    projects: [
      {
        extends: true,
        test: {
          name: 'core',
          environment: 'node',
          include: ['projects/locus-core/src/**/*.spec.ts', 'tests/references/**/*.spec.ts', 'tests/properties/**/*.spec.ts', 'tests/package/**/*.spec.ts', 'tests/support/**/*.spec.ts'],
        },
      },
      {
        extends: true,
        test: { name: 'server', environment: 'node', include: ['server/src/**/*.spec.ts', 'tests/contract/**/*.spec.ts'] },
      },
      {
        extends: true,
        test: { name: 'browser', environment: 'node', include: ['tests/e2e/**/*.spec.ts'], fileParallelism: false, testTimeout: 120000, hookTimeout: 180000 },
      },
    ],
  },
});
