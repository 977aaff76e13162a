// `npm start`: the whole product on one machine with its demo data: PostgreSQL, the mail catcher,
// and the server with the built shop. Ctrl-C stops everything this started.
import { ConfigError, loadConfig } from '../server/config';
import { demoSignIns } from '../server/db/seed/index';
import { startServer } from '../server/index';
import { createLogger } from '../server/lib/logger';
import { buildClientIfStale } from './build-client';
import { startMailCatcher } from './mail-catcher';
import { prepareDatabase } from './prepare-database';
import { startDevelopmentStripeFake } from './stripe-fake/index';

const stops: (() => Promise<void> | void)[] = [];
let stopping = false;

async function stopAll(exitCode: number) {
  if (stopping) return;
  stopping = true;
  for (const stop of stops.reverse()) {
    try {
      await stop();
    } catch (error) {
      console.error('While stopping:', error);
    }
  }
  process.exit(exitCode);
}

async function main() {
  // A bad setting stops start-up before anything is started.
  const config = loadConfig();
  process.once('SIGINT', () => void stopAll(0));
  process.once('SIGTERM', () => void stopAll(0));

  buildClientIfStale();
  const database = await prepareDatabase({ seed: true });
  if (database.cluster?.startedHere) stops.push(() => database.cluster?.stop());

  const smtpPort = Number(new URL(config.SMTP_URL).port || 1025);
  const mail = await startMailCatcher({ smtpPort, webPort: Number(process.env.MAILDEV_WEB_PORT ?? 1080) });
  stops.push(() => mail.stop());

  // Test payments go to the local payment fake unless STRIPE_API_URL or STRIPE_SECRET_KEY is set.
  const stripeFake = await startDevelopmentStripeFake(config);
  if (stripeFake) stops.push(() => stripeFake.stop());

  const server = await startServer(
    { ...config, DATABASE_URL: database.url, ...(stripeFake ? { STRIPE_API_URL: stripeFake.url } : {}) },
    createLogger({ ...config, LOG_LEVEL: process.env.LOG_LEVEL ? config.LOG_LEVEL : 'warn' }),
  );
  stops.push(() => server.stop());

  const width = Math.max(...demoSignIns.map((signIn) => signIn.email.length));
  console.log(`
Restday is running.
  Shop            ${server.url}/
  Roastery        ${server.url}/roastery
  Health          ${server.url}/api/health
  Mail catcher    ${mail.webUrl}/
  Payment fake    ${stripeFake ? `${stripeFake.url}/ (test payments only; pay with 4242 4242 4242 4242)` : 'off (STRIPE_API_URL or STRIPE_SECRET_KEY is set)'}
  Database        ${database.url}

Demo sign-ins (all invented):
${demoSignIns.map((signIn) => `  ${signIn.role.padEnd(9)}${signIn.email.padEnd(width + 2)}${signIn.password}`).join('\n')}

Press Ctrl-C to stop everything.`);
}

main().catch(async (error: unknown) => {
  console.error(error instanceof ConfigError ? error.message : error instanceof Error ? `Restday could not start: ${error.message}` : error);
  await stopAll(1);
});
