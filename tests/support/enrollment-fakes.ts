// Shared by the enrollment, payments and email integration tests: the real fakes on free ports, and
// a small HTTP server that hands webhook deliveries to the real route handler.
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import Stripe from 'stripe';
import { startFakePayments, type FakePayments } from '../../fakes/payments/server';
import { startFakeSmtp, type FakeSmtp } from '../../fakes/smtp/server';

export const WEBHOOK_SECRET = 'whsec_integration_test_secret_h4';
export const API_KEY = 'sk_test_integration_h4';

export type Harness = {
  payments: FakePayments;
  smtp: FakeSmtp;
  hookUrl: string;
  /** Answers 503 to the next n deliveries, as an app that is down would. */
  failNextDeliveries(n: number): void;
  hookCalls: () => number;
  close(): Promise<void>;
};

/** Signs a payload exactly as the payment service does. */
export function signedHeader(payload: string, secret = WEBHOOK_SECRET): string {
  return new Stripe('sk_test_signer', { telemetry: false }).webhooks.generateTestHeaderString({ payload, secret });
}

/** Starts both fakes and points the app's configuration at them; call before the first getEnv(). */
export async function startHarness(): Promise<Harness> {
  let failing = 0;
  let calls = 0;
  const { POST } = await import('../../app/api/webhooks/payments/route');
  const hook = http.createServer((req, res) => {
    let body = '';
    req.setEncoding('utf8');
    req.on('data', (c) => (body += c));
    req.on('end', async () => {
      calls += 1;
      if (failing > 0) {
        failing -= 1;
        res.writeHead(503).end();
        return;
      }
      const headers = new Headers();
      for (const [k, v] of Object.entries(req.headers)) if (typeof v === 'string') headers.set(k, v);
      const response = await POST(new Request('http://localhost:3000/api/webhooks/payments', { method: 'POST', headers, body }), {});
      res.writeHead(response.status, { 'content-type': 'application/json' }).end(await response.text());
    });
  });
  await new Promise<void>((r) => hook.listen(0, '127.0.0.1', () => r()));
  const hookUrl = `http://127.0.0.1:${(hook.address() as AddressInfo).port}/api/webhooks/payments`;
  const payments = await startFakePayments({
    webhookUrl: hookUrl,
    webhookSecret: WEBHOOK_SECRET,
    apiKey: API_KEY,
    retryBaseMs: 40,
    maxRetryMs: 400,
    maxAttempts: 8,
  });
  const smtp = await startFakeSmtp();
  Object.assign(process.env, {
    STRIPE_SECRET_KEY: API_KEY,
    STRIPE_WEBHOOK_SECRET: WEBHOOK_SECRET,
    STRIPE_API_HOST: '127.0.0.1',
    STRIPE_API_PORT: String(payments.port),
    STRIPE_API_PROTOCOL: 'http',
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(smtp.smtpPort),
    APP_URL: 'http://localhost:3000',
  });
  return {
    payments,
    smtp,
    hookUrl,
    failNextDeliveries: (n) => {
      failing = n;
    },
    hookCalls: () => calls,
    async close() {
      await payments.close();
      await smtp.close();
      hook.closeAllConnections?.();
      await new Promise<void>((r) => hook.close(() => r()));
    },
  };
}

/** Submits the fake's card form the way a browser does; answers the status and the redirect target. */
export async function payWithCard(checkoutUrl: string, card: string): Promise<{ status: number; location: string | null; body: string }> {
  const response = await fetch(checkoutUrl, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ card, exp: '12/34', cvc: '123', name: 'Test Learner' }).toString(),
    redirect: 'manual',
  });
  return { status: response.status, location: response.headers.get('location'), body: await response.text() };
}

export const sessionIdOf = (checkoutUrl: string) => checkoutUrl.split('/pay/')[1];
