// npm run worker: the background jobs the app needs beside the app (`next start`):
// - the outbox sender (claims due e-mail rows, sends them over SMTP, retries with backoff),
// - the day-before workshop reminders,
// - releasing seats of checkouts that expired while their webhook never arrived,
// - removing uploaded photos that never became part of a submission (after a week),
// - e-mailing certificate holders once per published "what changed" entry (content/changes/).
// Run with the react-server condition so the app's server-only modules load outside Next.
import { queueChangeNotices } from '../lib/changes/notices';
import { queueWorkshopReminders } from '../lib/email/reminders';
import { getEnv } from '../lib/env';
import { refuseDemoSettings } from '../lib/production-check';
import { outboxBacklog, sendDueEmails } from '../lib/email/sender';
import { releaseStaleCheckouts } from '../lib/payments/reconcile';
import { LOOSE_PHOTO_DAYS, pruneLoosePhotos } from '../lib/practicals/service';
import { pruneThrottles } from '../lib/throttle';
import { watchParent } from './watch-parent';

const POLL_MS = Number(process.env.WORKER_POLL_MS ?? 1000);
const REMINDER_EVERY_MS = Number(process.env.WORKER_REMINDER_MS ?? 5 * 60_000);
const RECONCILE_EVERY_MS = Number(process.env.WORKER_RECONCILE_MS ?? 60_000);
const PRUNE_EVERY_MS = Number(process.env.WORKER_PRUNE_MS ?? 60 * 60_000);

let stopping = false;
// Sleeps end early when the worker is asked to stop, so it never lingers for a long interval.
const sleepers = new Set<() => void>();
const sleep = (ms: number) =>
  new Promise<void>((resolve) => {
    const done = () => {
      clearTimeout(timer);
      sleepers.delete(done);
      resolve();
    };
    const timer = setTimeout(done, ms);
    sleepers.add(done);
  });
const log = (line: string) => console.log(`[worker] ${new Date().toISOString()} ${line}`);

async function every(ms: number, name: string, job: () => Promise<string | null>) {
  while (!stopping) {
    try {
      const line = await job();
      if (line) log(line);
    } catch (error) {
      log(`${name} failed: ${error instanceof Error ? error.message : String(error)}`);
    }
    if (!stopping) await sleep(ms);
  }
}

async function main() {
  // The same refusal as the app server: no demo secrets and no payment fake in production.
  refuseDemoSettings(getEnv(), process.env, 'The worker');
  log(`started (poll ${POLL_MS} ms)`);
  await Promise.all([
    every(POLL_MS, 'outbox', async () => {
      const r = await sendDueEmails({ backoffBaseMs: Number(process.env.WORKER_BACKOFF_MS ?? 5000) });
      if (!r.claimed) return null;
      return `outbox: sent ${r.sent}, retrying ${r.retrying}, failed ${r.failed}; ${await outboxBacklog()} left`;
    }),
    every(REMINDER_EVERY_MS, 'reminders', async () => {
      const n = await queueWorkshopReminders();
      return n ? `reminders: queued ${n}` : null;
    }),
    every(RECONCILE_EVERY_MS, 'checkouts', async () => {
      const n = await releaseStaleCheckouts();
      return n ? `checkouts: released ${n} seat(s) of expired checkouts` : null;
    }),
    every(REMINDER_EVERY_MS, 'changes', async () => {
      const r = await queueChangeNotices();
      return r.changes ? `changes: announced ${r.changes} to ${r.emails} certificate holder(s)` : null;
    }),
    every(PRUNE_EVERY_MS, 'photos', async () => {
      // Throttle windows that ended a day ago count nothing any more.
      await pruneThrottles(86_400);
      const n = await pruneLoosePhotos();
      return n ? `photos: removed ${n} uploaded more than ${LOOSE_PHOTO_DAYS} days ago and never submitted` : null;
    }),
  ]);
  const g = globalThis as { __brinewrightSequelize?: { close: () => Promise<void> } };
  await g.__brinewrightSequelize?.close();
  log('stopped');
}

const stop = () => {
  if (stopping) process.exit(0);
  stopping = true;
  log('stopping after the current round…');
  for (const wake of [...sleepers]) wake();
};
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
// Started by the browser tests with their own pid: if that process is gone, so is the reason to run.
watchParent(stop);

main().catch((error) => {
  console.error('[worker] fatal:', error instanceof Error && error.name === 'EnvError' ? error.message : error);
  process.exit(1);
});
