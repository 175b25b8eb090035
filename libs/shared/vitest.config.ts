import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    name: 'shared',
    root: fileURLToPath(new URL('.', import.meta.url)),
    include: ['src/**/*.spec.ts'],
    environment: 'node',
  },
});
