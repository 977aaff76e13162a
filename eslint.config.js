import { readdirSync } from 'node:fs';
import js from '@eslint/js';
import { createTypeScriptImportResolver } from 'eslint-import-resolver-typescript';
import { importX } from 'eslint-plugin-import-x';
import globals from 'globals';
import reactHooks from 'eslint-plugin-react-hooks';
import tseslint from 'typescript-eslint';

/** Only the repos and server/db touch the database. */
const drizzleOutsideRepos = {
  group: ['drizzle-orm', 'drizzle-orm/*'],
  message: 'Query the database only in *.repo.ts or server/db.',
};

/** A module in server/modules/<a>/ uses module <b> only through its front door, server/modules/<b>/index.ts. */
const anotherModulesInternals = {
  regex: String.raw`^\.\./(?!\.\.?/)[^/]+/`,
  message: "Import another module through its front door ('../<module>'), never its repo, service or routes.",
};

// Client boundaries: a feature uses only itself and the shared layers (src/components, src/lib,
// src/config, shared/); what two features need lives in one of those. Routes in src/app compose
// features, so nothing below src/app may reach up into it.
const features = readdirSync('src/features', { withFileTypes: true })
  .filter((entry) => entry.isDirectory())
  .map((entry) => entry.name);
const clientZones = [
  ...features.map((feature) => ({
    target: `./src/features/${feature}`,
    from: './src/features',
    except: [`./${feature}`],
    message: 'A feature may not import another feature; move what both need to src/components, src/lib or shared/.',
  })),
  {
    target: ['./src/features', './src/components', './src/lib', './src/config'],
    from: './src/app',
    message: 'Only src/app composes routes; import from the feature or shared layer instead.',
  },
  {
    target: ['./src/components', './src/lib', './src/config'],
    from: './src/features',
    message: 'The shared layers know no feature; pass what they need in as props or arguments.',
  },
];

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
    plugins: { 'react-hooks': reactHooks, 'import-x': importX },
    settings: { 'import-x/resolver-next': [createTypeScriptImportResolver({ project: './tsconfig.json' })] },
    rules: {
      ...reactHooks.configs.recommended.rules,
      'import-x/no-restricted-paths': ['error', { zones: clientZones }],
    },
  },
  {
    // shared/ is used by server and client alike, so it may import neither.
    files: ['shared/**/*.ts'],
    rules: {
      'no-restricted-imports': ['error', { patterns: ['**/src/**', '**/server/**', '@/*', 'node:*', 'pg', 'express'] }],
    },
  },
  {
    // A dependency cycle is a design smell and, with ES modules, an import that is undefined at start-up.
    // The table groups in server/db/schema are the exception: their foreign keys name each other's
    // tables inside `.references(() => table.id)`, which drizzle reads only after every file has loaded.
    files: ['server/**/*.ts', 'shared/**/*.ts'],
    ignores: ['server/db/schema/**'],
    plugins: { 'import-x': importX },
    settings: {
      ...importX.flatConfigs.typescript.settings,
      'import-x/resolver-next': [createTypeScriptImportResolver({ project: 'tsconfig.json' })],
    },
    rules: { 'import-x/no-cycle': 'error' },
  },
  {
    files: ['server/**/*.ts'],
    ignores: ['server/modules/**', 'server/**/*.repo.ts', 'server/db/**'],
    rules: { 'no-restricted-imports': ['error', { patterns: [drizzleOutsideRepos] }] },
  },
  {
    files: ['server/modules/**/*.ts'],
    ignores: ['server/**/*.repo.ts'],
    rules: { 'no-restricted-imports': ['error', { patterns: [drizzleOutsideRepos, anotherModulesInternals] }] },
  },
  {
    files: ['server/modules/**/*.repo.ts'],
    rules: { 'no-restricted-imports': ['error', { patterns: [anotherModulesInternals] }] },
  },
  {
    // The composition root sees each module through its front door too.
    files: ['server/app.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [drizzleOutsideRepos, { regex: String.raw`^\./modules/[^/]+/`, message: "Import a module through its front door ('./modules/<module>')." }],
        },
      ],
    },
  },
  {
    files: ['dev-services/**/*.ts', 'tests/**/*.ts', 'server/index.ts', 'server/scripts/**/*.ts', 'server/db/seed*.ts'],
    rules: { 'no-console': 'off' },
  },
);
