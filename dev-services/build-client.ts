// Builds the SPA into dist/ (and its server render into dist/.ssr) only when a source file is newer than the last build.
import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { projectRoot } from './postgres';

const clientInputs = ['src', 'shared', 'public', 'index.html', 'vite.config.ts', 'tailwind.config.ts', 'package-lock.json'];

function newestModification(entry: string): number {
  if (!existsSync(entry)) return 0;
  const stats = statSync(entry);
  if (!stats.isDirectory()) return stats.mtimeMs;
  return readdirSync(entry).reduce((newest, name) => Math.max(newest, newestModification(path.join(entry, name))), stats.mtimeMs);
}

export function clientBuildIsStale(): boolean {
  const builtIndex = path.join(projectRoot, 'dist', 'index.html');
  if (!existsSync(builtIndex) || !existsSync(path.join(projectRoot, 'dist', '.ssr', 'entry-server.js'))) return true;
  const built = statSync(builtIndex).mtimeMs;
  return clientInputs.some((input) => newestModification(path.join(projectRoot, input)) > built);
}

export function buildClientIfStale(): void {
  if (!clientBuildIsStale()) return;
  console.log('Building the shop client (sources changed since the last build)…');
  const vite = path.join(path.dirname(createRequire(import.meta.url).resolve('vite/package.json')), 'bin', 'vite.js');
  // Always a production bundle, even when a test runner (NODE_ENV=test) asks for the build; then the
  // server render of the public pages, beside it (the same two steps as `npm run build`).
  for (const args of [[], ['--ssr', 'src/entry-server.tsx', '--outDir', 'dist/.ssr']]) {
    const result = spawnSync(process.execPath, [vite, 'build', '--logLevel', 'warn', ...args], {
      cwd: projectRoot,
      stdio: 'inherit',
      env: { ...process.env, NODE_ENV: 'production' },
    });
    if (result.status !== 0) throw new Error('The client build failed; see the messages above.');
  }
}
