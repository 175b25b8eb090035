import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

const rootDir = fileURLToPath(new URL('../..', import.meta.url));

/** Browser journeys: the production web build served by createApp(), driven by Debian's chromium. */
export default defineConfig({
  resolve: { alias: { '@batchproof/shared': `${rootDir}libs/shared/src/index.ts` } },
  test: {
    name: 'journeys',
    root: rootDir,
    include: ['tests/journeys/**/*.spec.ts'],
    environment: 'node',
    globalSetup: ['tests/support/global-setup.ts'],
    testTimeout: 60_000,
    hookTimeout: 60_000,
    // One browser at a time: the machine has two cores and the build is shared.
    fileParallelism: false,
  },
});
