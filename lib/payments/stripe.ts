import 'server-only';
import Stripe from 'stripe';
import { getEnv } from '@/lib/env';

let cached: { key: string; client: Stripe } | undefined;

/** The stripe SDK client, pointed at the host/port/protocol from configuration (the local fake in the demo and tests). */
export function stripe(): Stripe {
  const env = getEnv();
  const key = `${env.STRIPE_SECRET_KEY}|${env.STRIPE_API_PROTOCOL}://${env.STRIPE_API_HOST}:${env.STRIPE_API_PORT}`;
  if (cached?.key !== key) {
    cached = {
      key,
      client: new Stripe(env.STRIPE_SECRET_KEY, {
        host: env.STRIPE_API_HOST,
        port: env.STRIPE_API_PORT,
        protocol: env.STRIPE_API_PROTOCOL,
        maxNetworkRetries: 1,
        timeout: 10_000,
        telemetry: false,
        appInfo: { name: 'Brinewright' },
      }),
    };
  }
  return cached.client;
}
