import { randomUUID } from 'node:crypto';
import compression from 'compression';
import express, { type Express } from 'express';
import helmet from 'helmet';
import { pinoHttp } from 'pino-http';
import type { Config } from './config';
import type { Database } from './db/client';
import type { Queue } from './jobs/queue';
import type { Clock } from './lib/clock';
import type { Logger } from './lib/logger';
import { apiNotFound, briefError, errorHandler } from './middleware/error-handler';
import { requireClientHeader } from './middleware/require-client-header';
import { createDevClockRepo } from './modules/dev-clock/dev-clock.repo';
import { devClockRoutes } from './modules/dev-clock/dev-clock.routes';
import { createDevClockService, isAdjustableClock } from './modules/dev-clock/dev-clock.service';
import { createAccountsModule } from './modules/auth/auth.module';
import { healthRoutes } from './modules/health/health.routes';
import { createLotsRepo } from './modules/lots/lots.repo';
import { lotsRoutes } from './modules/lots/lots.routes';
import { createLotsService } from './modules/lots/lots.service';
import type { LotListCache } from './modules/lots/lot-list-cache';
import { storefrontRoutes } from './modules/storefront/storefront.routes';
import { createStorefrontService } from './modules/storefront/storefront.service';
import { createLotsAdminRepo } from './modules/lots/lots-admin.repo';
import { greenStockRoutes, lotsAdminRoutes } from './modules/lots/lots-admin.routes';
import { createLotsAdminService } from './modules/lots/lots-admin.service';
import { createUploadsRepo } from './modules/uploads/uploads.repo';
import { uploadsRoutes } from './modules/uploads/uploads.routes';
import { createUploadsService } from './modules/uploads/uploads.service';
import { createFileStorage } from './integrations/storage';
import { createOutboxRepo } from './modules/outbox/outbox.repo';
import { outboxRoutes } from './modules/outbox/outbox.routes';
import { createOutboxService } from './modules/outbox/outbox.service';
import { createPaymentsGateway } from './integrations/payments';
import { createPaymentEventsService } from './modules/payments/payment-events.service';
import { createPaymentsRepo } from './modules/payments/payments.repo';
import { paymentsWebhookRoutes } from './modules/payments/payments.routes';
import { createPaymentsService, shopBaseUrl } from './modules/payments/payments.service';
import { loadShopSettings } from './modules/settings/settings.repo';
import { createCheckoutRepo } from './modules/checkout/checkout.repo';
import { createShippingRepo } from './modules/shipping/shipping.repo';
import { shippingRoutes } from './modules/shipping/shipping.routes';
import { checkoutRoutes } from './modules/checkout/checkout.routes';
import { createCheckoutService } from './modules/checkout/checkout.service';
import { createSubscriptionsRepo } from './modules/subscriptions/subscriptions.repo';
import { subscriptionCheckoutRoutes, subscriptionsRoutes } from './modules/subscriptions/subscriptions.routes';
import { createSubscriptionsService } from './modules/subscriptions/subscriptions.service';
import { subscriptionStripeSyncJob } from './jobs/subscription-stripe-sync';
import { sendJob, sendJobsDueBetween } from './jobs/registry';
import { refuseUnstorableText } from './middleware/refuse-unstorable-text';
import { applyPaymentEventJob } from './jobs/payment-events';
import { jobs } from './jobs/workers';
import { createOrdersRepo } from './modules/orders/orders.repo';
import { ordersRoutes } from './modules/orders/orders.routes';
import { createRoasteryServices, roasteryRoutes } from './modules/roastery/roastery.routes';
import { createOrdersService } from './modules/orders/orders.service';
import { createSubscriptionPreviewRepo } from './modules/subscription-preview/subscription-preview.repo';
import { subscriptionPreviewRoutes } from './modules/subscription-preview/subscription-preview.routes';
import { createSubscribersRepo } from './modules/subscribers/subscribers.repo';
import { subscribersRoutes } from './modules/subscribers/subscribers.routes';
import { createSubscribersService } from './modules/subscribers/subscribers.service';
import { createAuditRepo } from './modules/audit/audit.repo';
import { createAuditTrail } from './modules/audit/audit-trail';
import { createRotationRepo } from './modules/rotation/rotation.repo';
import { rotationRoutes } from './modules/rotation/rotation.routes';
import { createRotationService } from './modules/rotation/rotation.service';
import { createSubscriptionPreviewService } from './modules/subscription-preview/subscription-preview.service';
import { createPackingRepo } from './modules/packing/packing.repo';
import { packingRoutes } from './modules/packing/packing.routes';
import { createPackingService } from './modules/packing/packing.service';
import { createRefundsRepo } from './modules/packing/refunds.repo';
import { createRefundsService } from './modules/packing/refunds.service';
import { createTraceRepo } from './modules/trace/trace.repo';
import { traceRoutes } from './modules/trace/trace.routes';
import { createTraceService } from './modules/trace/trace.service';

export interface AppDeps {
  config: Config;
  database: Database;
  logger: Logger;
  /** With RESTDAY_TEST_CLOCK on, an AdjustableClock (createAdjustableClock) that POST /api/dev/clock moves. */
  clock: Clock;
  /** Absent in API-only test apps; health then reports the queue as stopped. */
  queue?: Queue;
  /** The lot list kept in memory by a server process; API-only test apps read the database each time. */
  lotListCache?: LotListCache;
}

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
  // JSON and pages made per request, compressed above 1 kB; the built assets come precompressed and pass untouched.
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
  const paymentsGateway = createPaymentsGateway(config, 'request');
  const paymentsRepo = createPaymentsRepo(database.db);
  // Before express.json and the client-header check: Stripe signs the raw body, and that signature is its authentication.
  const { queue: jobQueue } = deps;
  const enqueueEvent = jobQueue
    ? async (eventId: string) => {
        await sendJob(jobQueue, applyPaymentEventJob, { eventId }, { singletonKey: eventId });
      }
    : undefined;
  api.use(
    '/payments',
    paymentsWebhookRoutes(createPaymentEventsService({ repo: paymentsRepo, gateway: paymentsGateway, clock: deps.clock, logger, config, ...(enqueueEvent ? { enqueueEvent } : {}) })),
  );
  // Personal and staff answers must never sit in a shared cache; public reads that may be kept say so themselves.
  api.use((_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });
  api.use(express.json({ limit: '100kb' }));
  api.use(refuseUnstorableText);
  api.use(requireClientHeader(config));
  api.use('/health', healthRoutes(deps));
  const accounts = createAccountsModule(deps);
  // Every router after this line sees req.user; guard each non-public route with requireRole / requireUser.
  api.use(accounts.loadSession);
  for (const [mountPath, router] of accounts.routers) api.use(mountPath, router);
  const lotsService = createLotsService(createLotsRepo(database.db), deps.lotListCache);
  api.use('/lots', lotsRoutes(lotsService));
  api.use('/shipping', shippingRoutes(createShippingRepo(database.db)));
  const fileStorage = createFileStorage(config.UPLOADS_DIR);
  const lotsAdmin = createLotsAdminService(createLotsAdminRepo(database.db), fileStorage, deps.clock);
  api.use('/lots', lotsAdminRoutes(lotsAdmin));
  api.use('/roastery/green-stock', greenStockRoutes(lotsAdmin));
  api.use('/uploads', uploadsRoutes(createUploadsService(createUploadsRepo(database.db), fileStorage)));
  api.use('/roastery/outbox', outboxRoutes(createOutboxService(createOutboxRepo(database.db))));
  api.use('/roastery', subscribersRoutes(createSubscribersService({ repo: createSubscribersRepo(database.db), clock: deps.clock })));
  api.use(
    '/roastery/rotation',
    rotationRoutes(
      createRotationService({
        repo: createRotationRepo(database.db),
        clock: deps.clock,
        audit: createAuditTrail({ repo: createAuditRepo(database.db), logger, clock: deps.clock }),
      }),
    ),
  );
  const payments = createPaymentsService({ repo: paymentsRepo, gateway: paymentsGateway, config });
  api.use('/checkout', checkoutRoutes(createCheckoutService({ repo: createCheckoutRepo(database.db), payments, clock: deps.clock })));
  const subscriptionsService = createSubscriptionsService({
    repo: createSubscriptionsRepo(database.db),
    payments,
    clock: deps.clock,
    // The Stripe side follows in a job; without a queue (API-only tests) the scheduled sweep or a test pushes it.
    onChanged: async (subscriptionId) => {
      if (deps.queue) await sendJob(deps.queue, subscriptionStripeSyncJob, { subscriptionId });
    },
  });
  api.use('/checkout', subscriptionCheckoutRoutes(subscriptionsService));
  api.use(ordersRoutes(createOrdersService(createOrdersRepo(database.db))));
  // Before the subscriptions router, so /subscriptions/preview is never read as a subscription id.
  api.use('/subscriptions', subscriptionPreviewRoutes(createSubscriptionPreviewService({ repo: createSubscriptionPreviewRepo(database.db), clock: deps.clock })));
  api.use('/subscriptions', subscriptionsRoutes(subscriptionsService));
  api.use('/roastery', roasteryRoutes(createRoasteryServices(database.db)));
  api.use(
    packingRoutes(
      createPackingService({ repo: createPackingRepo(database.db), clock: deps.clock }),
      createRefundsService({ repo: createRefundsRepo(database.db), gateway: paymentsGateway }),
    ),
  );
  api.use(traceRoutes(createTraceService(createTraceRepo(database.db))));
  // The test clock: config already refuses RESTDAY_TEST_CLOCK in production; this is the second lock.
  if (config.RESTDAY_TEST_CLOCK && config.NODE_ENV !== 'production' && isAdjustableClock(deps.clock)) {
    const { queue } = deps;
    const runDueJobs = queue ? (from: Date, to: Date) => sendJobsDueBetween(queue, jobs, from, to) : undefined;
    api.use('/dev/clock', devClockRoutes(createDevClockService(deps.clock, createDevClockRepo(database.db), logger, runDueJobs)));
  }
  api.use(apiNotFound);
  api.use(accounts.auditDenials);
  app.use('/api', api);

  app.use(
    storefrontRoutes(
      createStorefrontService({ lots: lotsService, baseUrl: shopBaseUrl(config), currency: async () => (await loadShopSettings(database.db)).settings.currency }),
      { staticDir: config.STATIC_DIR, baseUrl: shopBaseUrl(config) },
    ),
  );

  app.use(errorHandler);
  return app;
}
