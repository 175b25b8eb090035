import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

const rootDir = fileURLToPath(new URL('../..', import.meta.url));

export default defineConfig({
  resolve: { alias: { '@batchproof/shared': `${rootDir}libs/shared/src/index.ts` } },
  test: {
    name: 'api',
    root: rootDir,
    include: ['tests/api/**/*.spec.ts', 'apps/api/src/**/*.spec.ts'],
    environment: 'node',
    globalSetup: ['tests/support/global-setup.ts'],
    testTimeout: 20_000,
    hookTimeout: 30_000,
  },
});
