// The payments provider's official Node SDK, built once from the zod-checked environment. npm start and npm test
// point it at the local payments fake (PAYMENTS_API_HOST/PORT/PROTOCOL); production leaves those unset and sets the
// real keys: no code change.
import 'server-only';
import Stripe from 'stripe';
import { getEnv } from '@/lib/env';
import { HttpError } from '@/lib/http';

let cached: Stripe | undefined;

export function paymentsUnavailable(): HttpError {
  return new HttpError(503, 'payments_unavailable', 'Paid reviews are not set up on this server: PAYMENTS_SECRET_KEY and PAYMENTS_WEBHOOK_SECRET are not set.');
}

export function payments(): Stripe {
  const env = getEnv();
  if (!env.PAYMENTS_SECRET_KEY) throw paymentsUnavailable();
  cached ??= new Stripe(env.PAYMENTS_SECRET_KEY, {
    ...(env.PAYMENTS_API_HOST ? { host: env.PAYMENTS_API_HOST } : {}),
    ...(env.PAYMENTS_API_PORT ? { port: env.PAYMENTS_API_PORT } : {}),
    ...(env.PAYMENTS_API_PROTOCOL ? { protocol: env.PAYMENTS_API_PROTOCOL } : {}),
    maxNetworkRetries: env.PAYMENTS_API_HOST ? 0 : 2,
  });
  return cached;
}

export function webhookSecret(): string {
  const secret = getEnv().PAYMENTS_WEBHOOK_SECRET;
  if (!secret) throw paymentsUnavailable();
  return secret;
}
