import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

/** Checks of the project's own tooling (lint boundaries, the scripts): no database, no browser. */
export default defineConfig({
  test: {
    name: 'tooling',
    root: fileURLToPath(new URL('../..', import.meta.url)),
    include: ['tests/tooling/**/*.spec.ts'],
    environment: 'node',
    testTimeout: 30_000,
  },
});
