// Starts both local fakes in one process (the demo and the browser tests run this):
// the payment server the stripe SDK talks to, and the SMTP server with its mailbox page; with
// STORAGE_DRIVER=s3 and a loopback S3_ENDPOINT (npm run demo:cluster) also the S3-compatible store.
// Ports and secrets come from the same variables the app reads (see lib/env.ts).
import path from 'node:path';
import { startFakePayments } from '../fakes/payments/server';
import { startFakeS3, type FakeS3 } from '../fakes/s3/server';
import { startFakeSmtp } from '../fakes/smtp/server';
import { watchParent } from './watch-parent';

async function main() {
  const appUrl = (process.env.APP_URL ?? 'http://localhost:3000').replace(/\/$/, '');
  const payments = await startFakePayments({
    port: Number(process.env.STRIPE_API_PORT ?? 12111),
    webhookUrl: process.env.FAKE_PAYMENTS_WEBHOOK_URL ?? `${appUrl}/api/webhooks/payments`,
    webhookSecret: process.env.STRIPE_WEBHOOK_SECRET ?? 'whsec_brinewright_local_signing_secret',
    apiKey: process.env.STRIPE_SECRET_KEY ?? 'sk_test_brinewright_local',
    retryBaseMs: Number(process.env.FAKE_PAYMENTS_RETRY_MS ?? 1000),
    log: (line) => console.log(`[fake-payments] ${line}`),
  });
  const smtp = await startFakeSmtp({
    smtpPort: Number(process.env.SMTP_PORT ?? 2525),
    webPort: Number(process.env.FAKE_MAILBOX_PORT ?? 2580),
    log: (line) => console.log(`[fake-smtp] ${line}`),
  });
  console.log(`[fakes] payments on ${payments.url}; SMTP on 127.0.0.1:${smtp.smtpPort}; mailbox at ${smtp.webUrl}`);
  // The S3-compatible store, when the app is configured to keep photos in a bucket on this machine.
  let s3: FakeS3 | undefined;
  const s3Endpoint = process.env.STORAGE_DRIVER === 's3' && process.env.S3_ENDPOINT ? new URL(process.env.S3_ENDPOINT) : null;
  if (s3Endpoint && ['127.0.0.1', 'localhost'].includes(s3Endpoint.hostname)) {
    s3 = await startFakeS3({
      port: Number(s3Endpoint.port || 80),
      root: process.env.FAKE_S3_ROOT ?? path.join(process.cwd(), '.data', 'fake-s3'),
      accessKeyId: process.env.S3_ACCESS_KEY_ID ?? '',
      secretAccessKey: process.env.S3_SECRET_ACCESS_KEY ?? '',
      buckets: process.env.S3_BUCKET ? [process.env.S3_BUCKET] : [],
      log: (line) => console.log(`[fake-s3] ${line}`),
    });
    console.log(`[fakes] S3-compatible store on ${s3.url}, bucket ${process.env.S3_BUCKET}`);
  }
  const stop = () => {
    void Promise.allSettled([payments.close(), smtp.close(), s3?.close()]).then(() => process.exit(0));
  };
  process.on('SIGTERM', stop);
  process.on('SIGINT', stop);
  watchParent(stop);
}

main().catch((error) => {
  console.error('[fakes] could not start:', error);
  process.exit(1);
});
