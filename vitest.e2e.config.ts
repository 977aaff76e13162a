import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

// Browser tests: one real server on a seeded test database, driven through Debian's Chromium.
export default defineConfig({
  resolve: {
    alias: {
      '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
      '@': fileURLToPath(new URL('./src', import.meta.url)),
    },
  },
  test: {
    name: 'e2e',
    include: ['tests/e2e/**/*.spec.ts'],
    setupFiles: ['tests/setup/fail-on-console-error.ts'],
    globalSetup: ['tests/setup/global-e2e.ts'],
    fileParallelism: false,
    testTimeout: 30_000,
    hookTimeout: 180_000,
  },
});
