import type { TestProject } from 'vitest/node';
import { startMailCatcher, type MailCatcher } from '../../dev-services/mail-catcher';
import { createDatabaseIfMissing, startCluster, testClusterOptions } from '../../dev-services/postgres';
import { startStripeFake, type StripeFake } from '../../dev-services/stripe-fake/index';
import { runMigrations } from '../../server/db/migrate';

/** The whsec_ secret the tests' payment fake signs webhooks with (test servers verify with it). */
export const testWebhookSecret = 'whsec_restday_test_webhooks';

declare module 'vitest' {
  export interface ProvidedContext {
    databaseUrl: string;
    /** SMTP of the test mail catcher, e.g. smtp://127.0.0.1:1026. */
    smtpUrl: string;
    /** The test mail catcher's REST API and inbox, e.g. http://127.0.0.1:1081. */
    mailCatcherUrl: string;
    /** The local Stripe fake: STRIPE_API_URL for test servers, its test-payment pages and control API. */
    stripeFakeUrl: string;
    stripeWebhookSecret: string;
  }
}

/**
 * The real services API tests talk to: the throwaway PostgreSQL cluster with a fresh, migrated
 * database, and a mail catcher on its own ports (never the ones `npm start` uses).
 */
export default async function setup(project: TestProject) {
  const cluster = startCluster(testClusterOptions());
  const stopCluster = () => {
    if (cluster.startedHere) cluster.stop();
  };
  const database = 'restday_test';
  const smtpPort = Number(process.env.RESTDAY_TEST_SMTP_PORT ?? 1026);
  let databaseUrl: string;
  let mail: MailCatcher;
  let stripeFake: StripeFake | undefined;
  try {
    createDatabaseIfMissing(cluster, database, { recreate: true });
    databaseUrl = cluster.urlFor(database);
    await runMigrations(databaseUrl);
    // No webhook endpoint yet: a test that needs webhooks starts a listening server and points the fake at it.
    stripeFake = await startStripeFake({ port: 0, webhookUrl: null, webhookSecret: testWebhookSecret, retry: { initialDelayMs: 100, maxDelayMs: 1000 } });
    mail = await startMailCatcher({
      smtpPort,
      webPort: Number(process.env.RESTDAY_TEST_MAILDEV_WEB_PORT ?? 1081),
      mailDir: `${cluster.dataDir}-mail`,
    });
  } catch (error) {
    // Teardown only runs after a successful set-up, so a failed one cleans up here.
    await stripeFake?.stop();
    stopCluster();
    throw error;
  }

  project.provide('databaseUrl', databaseUrl);
  project.provide('smtpUrl', `smtp://127.0.0.1:${smtpPort}`);
  project.provide('mailCatcherUrl', mail.webUrl);
  project.provide('stripeFakeUrl', stripeFake.url);
  project.provide('stripeWebhookSecret', testWebhookSecret);

  return async () => {
    await stripeFake?.stop();
    await mail.stop();
    stopCluster();
  };
}
