// The local mail catcher (maildev): real SMTP on loopback, and a web inbox to read what Restday sent.
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { projectRoot } from './postgres';

export interface MailCatcher {
  smtpPort: number;
  webUrl: string;
  stop(): Promise<void>;
}

const startDeadlineMs = 45_000;

async function answers(url: string): Promise<boolean> {
  try {
    return (await fetch(url, { signal: AbortSignal.timeout(500) })).ok;
  } catch {
    return false;
  }
}

/** Starts maildev's own binary (not through npx) so the PID we hold is the one we stop. */
export async function startMailCatcher(options: { smtpPort: number; webPort: number; mailDir?: string }): Promise<MailCatcher> {
  const webUrl = `http://127.0.0.1:${options.webPort}`;
  if (await answers(`${webUrl}/api/healthz`)) {
    throw new Error(`Port ${options.webPort} already answers; is another mail catcher running? Set MAILDEV_WEB_PORT to use another port.`);
  }
  const mailDir = options.mailDir ?? path.join(projectRoot, '.data', 'mail');
  mkdirSync(mailDir, { recursive: true });
  // maildev's package exports only its ESM entry, so its binary is found by path (a direct dependency).
  const binary = path.join(projectRoot, 'node_modules', 'maildev', 'dist', 'bin', 'maildev.js');
  const child: ChildProcess = spawn(
    process.execPath,
    [
      binary,
      '--smtp',
      String(options.smtpPort),
      '--web',
      String(options.webPort),
      '--ip',
      '127.0.0.1',
      '--web-ip',
      '127.0.0.1',
      '--mail-directory',
      mailDir,
      '--silent',
    ],
    { stdio: ['ignore', 'ignore', 'inherit'] },
  );
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));

  // A cold start on a busy 2-core machine (modules read from a fresh install) can take well over 10 s.
  const deadline = Date.now() + startDeadlineMs;
  while (Date.now() < deadline) {
    if (child.exitCode !== null) throw new Error(`The mail catcher exited at start (is SMTP port ${options.smtpPort} taken?).`);
    if (await answers(`${webUrl}/api/healthz`)) {
      return {
        smtpPort: options.smtpPort,
        webUrl,
        async stop() {
          if (child.exitCode === null) child.kill('SIGTERM');
          await exited;
        },
      };
    }
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  child.kill('SIGKILL');
  throw new Error(`The mail catcher did not answer on ${webUrl} within ${startDeadlineMs / 1000} s.`);
}
