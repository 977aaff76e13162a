import js from '@eslint/js';
import globals from 'globals';
import reactHooks from 'eslint-plugin-react-hooks';
import tseslint from 'typescript-eslint';

export default tseslint.config(
  { ignores: ['dist', 'coverage', 'node_modules', 'drizzle', '.data'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@typescript-eslint/consistent-type-imports': 'error',
      'no-console': ['error', { allow: ['warn', 'error'] }],
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    rules: reactHooks.configs.recommended.rules,
  },
  {
    // shared/ is used by server and client alike, so it may import neither.
    files: ['shared/**/*.ts'],
    rules: {
      'no-restricted-imports': ['error', { patterns: ['**/src/**', '**/server/**', '@/*', 'node:*', 'pg', 'express'] }],
    },
  },
  {
    // Only the repos and server/db touch the database.
    files: ['server/**/*.ts'],
    ignores: ['server/**/*.repo.ts', 'server/db/**', 'server/jobs/**', 'server/index.ts', 'server/app.ts'],
    rules: {
      'no-restricted-imports': ['error', { paths: [{ name: 'drizzle-orm', message: 'Query the database only in *.repo.ts or server/db.' }] }],
    },
  },
  {
    files: ['dev-services/**/*.ts', 'tests/**/*.ts', 'server/index.ts', 'server/db/seed*.ts'],
    rules: { 'no-console': 'off' },
  },
);
