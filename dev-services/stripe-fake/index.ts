// Restday's local Stripe fake, for development and tests only: the part of Stripe's API Restday
// uses, a hosted test-payment page, signed webhooks with retries, and a control API for its clock.
// Production sets real Stripe keys and leaves STRIPE_API_URL unset; the same code talks to Stripe.
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import express from 'express';
import type { Config } from '../../server/config';
import { projectRoot } from '../postgres';
import { stripeApiRoutes } from './api-routes';
import { controlRoutes } from './control-routes';
import { createFakeAccount } from './fake-account';
import { createStore } from './store';
import { testPaymentPageRoutes } from './test-payment-page';
import { createWebhookSender, defaultRetryPolicy, type RetryPolicy } from './webhook-sender';

export interface StripeFakeOptions {
  /** 0 picks a free port. */
  port: number;
  host?: string;
  /** Where events go (Restday's `/api/payments/webhook`); null until set through the control API. */
  webhookUrl: string | null;
  /** The whsec_ secret webhooks are signed with (Restday's STRIPE_WEBHOOK_SECRET). */
  webhookSecret: string;
  /** Keep the state in this JSON file across restarts; in memory only when absent. */
  stateFile?: string;
  retry?: Partial<RetryPolicy>;
}

export interface StripeFake {
  /** Base URL: STRIPE_API_URL for Restday, and the home of the test-payment pages and control API. */
  url: string;
  port: number;
  stop(): Promise<void>;
}

export async function startStripeFake(options: StripeFakeOptions): Promise<StripeFake> {
  const host = options.host ?? '127.0.0.1';
  const store = createStore(options.stateFile);
  const sender = createWebhookSender({
    store,
    secret: options.webhookSecret,
    endpointUrl: options.webhookUrl,
    retry: { ...defaultRetryPolicy, ...options.retry },
  });
  let url = '';
  const account = createFakeAccount({ store, baseUrl: () => url, onEvent: (event) => sender.enqueue(event) });

  const app = express();
  app.disable('x-powered-by');
  // Stripe's SDK sends nested query parameters (`expand[0]=line_items`).
  app.set('query parser', 'extended');
  app.use('/v1', stripeApiRoutes(store, account));
  app.use('/test-payment', testPaymentPageRoutes(account));
  app.use('/control', controlRoutes(store, account, sender));
  app.get('/', (_req, res) => {
    res
      .type('text')
      .send(
        'Restday local payment fake (development and tests only). Stripe API under /v1, test-payment pages under /test-payment, control API under /control.',
      );
  });

  const server: Server = await new Promise((resolve, reject) => {
    const listening = app.listen(options.port, host, () => resolve(listening));
    listening.once('error', (error: NodeJS.ErrnoException) =>
      reject(
        error.code === 'EADDRINUSE'
          ? new Error(`Port ${options.port} is taken; is another payment fake running? Set STRIPE_FAKE_PORT to use another port.`)
          : error,
      ),
    );
  });
  const port = (server.address() as AddressInfo).port;
  url = `http://${host}:${port}`;
  // Events a previous run could not deliver are sent again.
  sender.resume();

  return {
    url,
    port,
    async stop() {
      await sender.stop();
      await new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      });
      store.flush();
    },
  };
}

/**
 * The fake as `npm start` and `npm run dev` run it: on STRIPE_FAKE_PORT (4242), its state kept in
 * .data/stripe-fake/state.json, webhooks sent to the server's own endpoint. Null when STRIPE_API_URL
 * or STRIPE_SECRET_KEY is set: the developer then points Restday at Stripe (or another fake) themselves.
 */
export async function startDevelopmentStripeFake(
  config: Pick<Config, 'HOST' | 'PORT' | 'STRIPE_WEBHOOK_SECRET'>,
  env: NodeJS.ProcessEnv = process.env,
): Promise<StripeFake | null> {
  if (env.STRIPE_API_URL || env.STRIPE_SECRET_KEY) return null;
  const serverHost = config.HOST === '0.0.0.0' || config.HOST === '::' ? '127.0.0.1' : config.HOST;
  return startStripeFake({
    port: Number(env.STRIPE_FAKE_PORT ?? 4242),
    webhookUrl: `http://${serverHost}:${config.PORT}/api/payments/webhook`,
    webhookSecret: config.STRIPE_WEBHOOK_SECRET,
    stateFile: path.join(projectRoot, '.data', 'stripe-fake', 'state.json'),
  });
}
