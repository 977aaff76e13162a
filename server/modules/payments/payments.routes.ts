import express, { Router } from 'express';
import type { WebhookReceipt } from '@shared/schemas/payments';
import type { PaymentEventsService } from './payment-events.service';

/**
 * `POST /api/payments/webhook`: Stripe's events. Public, authenticated by the Stripe-Signature header
 * over the exact bytes sent, so it reads the raw body and is mounted before express.json and the
 * client-header check.
 */
export function paymentsWebhookRoutes(events: PaymentEventsService): Router {
  const router = Router();
  router.post('/webhook', express.raw({ type: 'application/json', limit: '1mb' }), async (req, res) => {
    const receipt = await events.handleWebhook(req.body as Buffer, req.get('Stripe-Signature'));
    res.json(receipt satisfies WebhookReceipt);
  });
  return router;
}
