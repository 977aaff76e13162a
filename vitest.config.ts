import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

const alias = {
  '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
  '@': fileURLToPath(new URL('./src', import.meta.url)),
};

export default defineConfig({
  resolve: { alias },
  test: {
    setupFiles: ['tests/setup/fail-on-console-error.ts'],
    coverage: {
      provider: 'v8',
      include: ['shared/domain/**/*.ts'],
      exclude: ['**/*.test.ts'],
      thresholds: { lines: 95 },
    },
    projects: [
      {
        resolve: { alias },
        test: {
          name: 'unit',
          // Component tests load lazy routes; on a busy 2-core machine the first import is slow.
          testTimeout: 15_000,
          include: ['shared/**/*.test.ts', 'src/**/*.test.{ts,tsx}', 'tests/unit/**/*.test.{ts,tsx}'],
          setupFiles: ['tests/setup/fail-on-console-error.ts'],
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'api',
          include: ['tests/api/**/*.test.ts', 'tests/reliability/**/*.test.ts'],
          setupFiles: ['tests/setup/fail-on-console-error.ts'],
          globalSetup: ['tests/setup/global-services.ts'],
          // API tests share one database; files run one at a time so their fixtures never collide.
          fileParallelism: false,
          testTimeout: 20_000,
          hookTimeout: 60_000,
        },
      },
    ],
  },
});
