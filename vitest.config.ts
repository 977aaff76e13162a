import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';
import { reactOnPreact } from './vite.config';

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
        resolve: {
          alias: {
            ...alias,
            ...reactOnPreact,
            // Its CommonJS build would require the real react-dom past the aliases.
            // ES module builds, as the browser gets: the CommonJS ones require React past the aliases.
            '@testing-library/react': '@testing-library/react/dist/@testing-library/react.esm.js',
            'react-router-dom': fileURLToPath(new URL('./node_modules/react-router-dom/dist/index.mjs', import.meta.url)),
            'react-router/dom': fileURLToPath(new URL('./node_modules/react-router/dist/development/dom-export.mjs', import.meta.url)),
            'react-router': fileURLToPath(new URL('./node_modules/react-router/dist/development/index.mjs', import.meta.url)),
            recharts: fileURLToPath(new URL('./node_modules/recharts/es6/index.js', import.meta.url)),
          },
        },
        test: {
          name: 'unit',
          // Libraries that import React go through the aliases too, so every component sees one Preact.
          server: { deps: { inline: [/react/, /preact/, /@tanstack/, /@hookform/, /@testing-library/, /lucide/, /recharts/] } },
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
