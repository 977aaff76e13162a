// `npm run dev`: PostgreSQL and the mail catcher, the API restarting on change (tsx watch), and
// Vite's dev server with hot reload proxying /api to it. Ctrl-C stops everything this started.
import { spawn, type ChildProcess } from 'node:child_process';
import { loadConfig } from '../server/config';
import { startMailCatcher } from './mail-catcher';
import { prepareDatabase } from './prepare-database';
import { projectRoot } from './postgres';
import { startDevelopmentStripeFake } from './stripe-fake/index';

const config = loadConfig();
const database = await prepareDatabase({ seed: true });
const mail = await startMailCatcher({
  smtpPort: Number(new URL(config.SMTP_URL).port || 1025),
  webPort: Number(process.env.MAILDEV_WEB_PORT ?? 1080),
});
const stripeFake = await startDevelopmentStripeFake(config);

const children: ChildProcess[] = [
  spawn('npx', ['tsx', 'watch', '--clear-screen=false', 'server/index.ts'], {
    cwd: projectRoot,
    stdio: 'inherit',
    env: { ...process.env, DATABASE_URL: database.url, PORT: String(config.PORT), ...(stripeFake ? { STRIPE_API_URL: stripeFake.url } : {}) },
  }),
  spawn('npx', ['vite', '--host', '127.0.0.1'], {
    cwd: projectRoot,
    stdio: 'inherit',
    env: { ...process.env, RESTDAY_API_PORT: String(config.PORT) },
  }),
];
console.log(
  `API on http://127.0.0.1:${config.PORT}, shop with hot reload on http://127.0.0.1:5173, mail on ${mail.webUrl}${stripeFake ? `, payment fake on ${stripeFake.url}` : ''}`,
);

let stopping = false;
async function stopAll() {
  if (stopping) return;
  stopping = true;
  await Promise.all(
    children.map(
      (child) =>
        new Promise<void>((resolve) => {
          if (child.exitCode !== null) return resolve();
          child.once('exit', () => resolve());
          child.kill('SIGTERM');
        }),
    ),
  );
  await stripeFake?.stop();
  await mail.stop();
  if (database.cluster?.startedHere) database.cluster.stop();
  process.exit(0);
}
process.once('SIGINT', () => void stopAll());
process.once('SIGTERM', () => void stopAll());
for (const child of children) child.once('exit', () => void stopAll());
