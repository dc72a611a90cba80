import express, { Router } from 'express';
import type { AppDeps } from '../../deps.ts';
import { verifyWebhook } from '../../integrations/payments.ts';
import { handleEvent } from './payments.service.ts';

/**
 * POST /api/payments/webhook — mounted before the JSON parser: the signature covers the raw bytes
 * (Stripe's webhook signing; stripe-node's constructEvent). A bad signature or a timestamp older than 300 s → 400, nothing written.
 */
export function paymentsWebhookRouter(deps: AppDeps): Router {
  const r = Router();
  r.post('/', express.raw({ type: 'application/json', limit: '1mb' }), async (req, res) => {
    const sig = req.get('stripe-signature');
    if (!sig || !Buffer.isBuffer(req.body)) {
      res.status(400).json({ error: { code: 'bad_signature', message: 'Missing signature or body.' } });
      return;
    }
    let event: ReturnType<typeof verifyWebhook>;
    try {
      event = verifyWebhook(deps.env, req.body, sig, deps.now());
    } catch {
      res.status(400).json({ error: { code: 'bad_signature', message: 'The signature does not match or is too old.' } });
      return;
    }
    const out = await handleEvent(deps, event);
    res.json({ received: true, outcome: out.outcome });
  });
  return r;
}
