import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { chromium, type Browser } from 'playwright-core';

const chromiumPath = '/usr/bin/chromium';

/** Debian's Chromium; installed with apt-get when missing (never a downloaded browser). */
export function ensureChromium(): string {
  if (existsSync(chromiumPath)) return chromiumPath;
  if (process.getuid?.() !== 0) {
    throw new Error(`Chromium is missing. Install Debian's package as root: apt-get update && apt-get install -y chromium`);
  }
  console.log('Installing Debian chromium for the browser tests (about a minute)…');
  const result = spawnSync('sh', ['-c', 'apt-get update && apt-get install -y --no-install-recommends chromium'], {
    stdio: 'inherit',
    env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
  });
  if (result.status !== 0 || !existsSync(chromiumPath)) throw new Error('Installing chromium with apt-get failed.');
  return chromiumPath;
}

/** Playwright gives each launch a fresh, empty profile of its own. */
export async function launchChromium(): Promise<Browser> {
  return chromium.launch({
    executablePath: ensureChromium(),
    headless: true,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
}
