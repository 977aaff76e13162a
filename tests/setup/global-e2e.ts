import type { TestProject } from 'vitest/node';
import { buildClientIfStale } from '../../dev-services/build-client';
import { startMailCatcher, type MailCatcher } from '../../dev-services/mail-catcher';
import { createDatabaseIfMissing, startCluster, testClusterOptions } from '../../dev-services/postgres';
import { createDatabase } from '../../server/db/client';
import { runMigrations } from '../../server/db/migrate';
import { seedDemo } from '../../server/db/seed/index';
import { startStripeFake, type StripeFake } from '../../dev-services/stripe-fake/index';
import { loadConfig } from '../../server/config';
import { startServer, type RunningServer } from '../../server/index';
import { createLogger } from '../../server/lib/logger';
import { ensureChromium } from './chromium';
import { freePort } from './free-port';

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
    /** The e2e mail catcher's REST API and inbox, e.g. http://127.0.0.1:1082. */
    mailCatcherUrl: string;
    /** The local Stripe fake the e2e server pays through (its control API steers renewals). */
    stripeFakeUrl: string;
  }
}

/** The whole product as a browser meets it: built client, seeded database, real server. */
export default async function setup(project: TestProject) {
  ensureChromium();
  buildClientIfStale();

  const cluster = startCluster(testClusterOptions());
  const stopCluster = () => {
    if (cluster.startedHere) cluster.stop();
  };
  let server: RunningServer;
  let mail: MailCatcher | undefined;
  let stripeFake: StripeFake | undefined;
  try {
    createDatabaseIfMissing(cluster, 'restday_e2e', { recreate: true });
    const databaseUrl = cluster.urlFor('restday_e2e');
    await runMigrations(databaseUrl);
    const seeding = createDatabase({ url: databaseUrl, poolMax: 2, connectTimeoutMs: 5000 });
    await seedDemo(seeding.db, { now: new Date() });
    await seeding.close();

    const smtpPort = Number(process.env.RESTDAY_E2E_SMTP_PORT ?? 1027);
    mail = await startMailCatcher({
      smtpPort,
      webPort: Number(process.env.RESTDAY_E2E_MAILDEV_WEB_PORT ?? 1082),
      mailDir: `${cluster.dataDir}-e2e-mail`,
    });
    const port = await freePort();
    const webhookSecret = 'whsec_restday_e2e_webhooks';
    stripeFake = await startStripeFake({
      port: 0,
      webhookUrl: `http://127.0.0.1:${port}/api/payments/webhook`,
      webhookSecret,
      retry: { initialDelayMs: 200, maxDelayMs: 2000 },
    });
    const config = loadConfig({
      NODE_ENV: 'test',
      LOG_LEVEL: 'warn',
      DATABASE_URL: databaseUrl,
      PORT: String(port),
      // Password-reset and invitation links in e-mail point at this server.
      PUBLIC_URL: `http://127.0.0.1:${port}`,
      SMTP_URL: `smtp://127.0.0.1:${smtpPort}`,
      STRIPE_API_URL: stripeFake.url,
      STRIPE_WEBHOOK_SECRET: webhookSecret,
    });
    server = await startServer(config, createLogger(config));
  } catch (error) {
    // Teardown only runs after a successful set-up, so a failed one cleans up here.
    await stripeFake?.stop();
    await mail?.stop();
    stopCluster();
    throw error;
  }
  const mailCatcher = mail;
  project.provide('baseUrl', server.url);
  project.provide('mailCatcherUrl', mailCatcher.webUrl);
  project.provide('stripeFakeUrl', stripeFake.url);

  return async () => {
    await server.stop();
    await stripeFake?.stop();
    await mailCatcher.stop();
    stopCluster();
  };
}
