import { randomUUID } from 'node:crypto';
import compression from 'compression';
import express, { type Express } from 'express';
import helmet from 'helmet';
import { pinoHttp } from 'pino-http';
import type { AppDeps } from './app-deps';
import { createPaymentsGateway } from './integrations/payments';
import { createFileStorage } from './integrations/storage';
import { subscriptionStripeSyncJob } from './jobs/subscription-stripe-sync';
import { sendJob, sendJobsDueBetween } from './jobs/registry';
import { applyPaymentEventJob, paymentEventPorts } from './jobs/payment-events';
import { jobs } from './jobs/workers';
import type { ApiModule } from './lib/api-module';
import { apiNotFound, briefError, errorHandler } from './middleware/error-handler';
import { refuseUnstorableText } from './middleware/refuse-unstorable-text';
import { requireClientHeader } from './middleware/require-client-header';
import { createAccountModule } from './modules/account';
import { auditDenials, createAudit } from './modules/audit';
import { createAuthModule } from './modules/auth';
import { createCheckoutModule } from './modules/checkout';
import { createDevClockModule, isAdjustableClock } from './modules/dev-clock';
import { createHealthModule } from './modules/health';
import { createJournalModule } from './modules/journal';
import { createLedgerModule } from './modules/ledger';
import { createLotsModule } from './modules/lots';
import { createOrdersModule } from './modules/orders';
import { createOutboxModule } from './modules/outbox';
import { createPackingModule } from './modules/packing';
import { createPlanningModule } from './modules/planning';
import { createPaymentsService, createPaymentsWebhookModule } from './modules/payments';
import { createRoasteryModule } from './modules/roastery';
import { createRotationModule } from './modules/rotation';
import { createShippingModule } from './modules/shipping';
import { createBuiltAssets, createStorefront } from './modules/storefront';
import { createSubscribersModule } from './modules/subscribers';
import { createSubscriptionPreviewModule } from './modules/subscription-preview';
import { createSubscriptionsModule } from './modules/subscriptions';
import { createTodayModule } from './modules/today';
import { createTeamModule } from './modules/team';
import { createTraceModule } from './modules/trace';
import { createUploadsModule } from './modules/uploads';

const requestIdPattern = /^[\w-]{8,64}$/;

/** Builds the whole HTTP app from its dependencies. Never listens: index.ts and the tests do that. */
export function createApp(deps: AppDeps): Express {
  const { config, database, logger } = deps;
  if (config.RESTDAY_TEST_CLOCK && !isAdjustableClock(deps.clock)) {
    throw new Error('RESTDAY_TEST_CLOCK is on, so the app needs an adjustable clock (createAdjustableClock()).');
  }
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.use(createBuiltAssets(config));
  // JSON and pages made per request, compressed above 1 kB; the built assets come precompressed.
  app.use(compression({ threshold: 1024 }));

  app.use(
    pinoHttp({
      logger,
      // Honour a load balancer's request id when it looks like one; otherwise mint our own.
      genReqId: (req, res) => {
        const incoming = req.headers['x-request-id'];
        const id = typeof incoming === 'string' && requestIdPattern.test(incoming) ? incoming : randomUUID();
        res.setHeader('X-Request-Id', id);
        return id;
      },
      customLogLevel: (_req, res, error) => (error || res.statusCode >= 500 ? 'error' : res.statusCode >= 400 ? 'info' : 'debug'),
      // One line per failed request: its status and what failed, without the stack (the error handler logs that at debug).
      customErrorMessage: (_req, res) => `request failed with ${res.statusCode}`,
      serializers: {
        err: briefError,
        req: (req: { id: string; method: string; url: string }) => ({ id: req.id, method: req.method, url: req.url }),
        res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
      },
    }),
  );

  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: false,
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          styleSrc: ["'self'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          fontSrc: ["'self'"],
          connectSrc: ["'self'"],
          objectSrc: ["'none'"],
          baseUri: ["'none'"],
          frameAncestors: ["'none'"],
          formAction: ["'self'"],
          ...(config.NODE_ENV === 'production' ? { upgradeInsecureRequests: [] } : {}),
        },
      },
      strictTransportSecurity: config.NODE_ENV === 'production',
      referrerPolicy: { policy: 'strict-origin-when-cross-origin' },
    }),
  );

  const api = express.Router();
  const mount = (module: ApiModule) => {
    for (const { path: mountPath, router } of module.mounts) api.use(mountPath, router);
  };
  const { clock, queue } = deps;
  const db = database.db;

  // Shared services, built once.
  const gateway = createPaymentsGateway(config, 'request');
  const payments = createPaymentsService({ db, gateway, config });
  const audit = createAudit({ db, logger, clock });
  const storage = createFileStorage(config.UPLOADS_DIR);

  // Before express.json and the client-header check: Stripe signs the raw body, and that signature is its authentication.
  // Without a queue (API-only test apps) the webhook applies each event before it answers.
  const enqueueEvent = queue
    ? async (eventId: string) => {
        await sendJob(queue, applyPaymentEventJob, { eventId }, { singletonKey: eventId });
      }
    : undefined;
  mount(createPaymentsWebhookModule({ db, ports: paymentEventPorts, gateway, clock, logger, config, enqueueEvent }));

  // Personal and staff answers must never sit in a shared cache; public reads that may be kept say so themselves.
  api.use((_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });
  api.use(express.json({ limit: '100kb' }));
  api.use(refuseUnstorableText);
  api.use(requireClientHeader(config));
  mount(createHealthModule(deps));
  const auth = createAuthModule({ config, db, logger, clock, audit });
  // Every router after this line sees req.user; guard each non-public route with requireRole / requireUser.
  api.use(auth.loadSession);

  const { sessions, throttles } = auth;
  const planning = createPlanningModule({ db, clock });
  const reorderDates = async () => new Map((await planning.service.plan(8)).lots.map((lot) => [lot.lotCode, lot]));
  const lots = createLotsModule({ db, storage, clock, listCache: deps.lotListCache, reorderDates });
  const modules: ApiModule[] = [
    auth,
    createAccountModule({ config, db, audit, sessions, throttles }),
    createTeamModule({ config, db, clock, audit, sessions, throttles }),
    lots,
    createShippingModule({ db }),
    createUploadsModule({ db, storage }),
    createOutboxModule({ db }),
    createSubscribersModule({ db, clock }),
    createRotationModule({ db, clock, audit }),
    createCheckoutModule({ db, payments, clock }),
    createOrdersModule({ db, gateway, clock, audit }),
    // Before the subscriptions module, so /subscriptions/preview is never read as a subscription id.
    createSubscriptionPreviewModule({ db, clock }),
    createSubscriptionsModule({
      db,
      payments,
      clock,
      audit,
      // The Stripe side follows in a job; without a queue (API-only tests) the scheduled sweep or a test pushes it.
      onChanged: async (subscriptionId) => {
        // The change is committed: if the queue cannot take the push now, the every-minute sync sends it.
        if (queue)
          await sendJob(queue, subscriptionStripeSyncJob, { subscriptionId }).catch((error: unknown) =>
            logger.warn({ err: error, subscriptionId }, 'subscription push left for the sync'),
          );
      },
    }),
    createRoasteryModule({ db }),
    planning,
    createTodayModule({ db, clock, planning: planning.service }),
    createLedgerModule({ db, clock }),
    createPackingModule({ db, clock }),
    createTraceModule({ db }),
    createJournalModule({ db, clock }),
  ];
  // The test clock: config already refuses RESTDAY_TEST_CLOCK in production; this is the second lock.
  if (config.RESTDAY_TEST_CLOCK && config.NODE_ENV !== 'production' && isAdjustableClock(clock)) {
    const runDueJobs = queue ? (from: Date, to: Date) => sendJobsDueBetween(queue, jobs, from, to) : undefined;
    modules.push(createDevClockModule({ clock, db, logger, runDueJobs }));
  }
  modules.forEach(mount);
  api.use(apiNotFound);
  api.use(auditDenials(audit));
  app.use('/api', api);

  app.use(createStorefront({ config, db, lots: lots.catalogue, logger }));

  app.use(errorHandler);
  return app;
}
