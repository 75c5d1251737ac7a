import { defineConfig } from 'vitest/config';

// Node-environment unit tests of the framework-free core and the cross-project reference checks.
export default defineConfig({
  test: {
    environment: 'node',
    include: ['projects/locus-core/src/**/*.spec.ts', 'tests/**/*.spec.ts'],
    testTimeout: 60000,
    reporters: ['default'],
  },
});
