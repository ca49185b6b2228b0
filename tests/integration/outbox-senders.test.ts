// The outbox sender with more than one sender at a time: two in-process senders, two real worker
// processes (`scripts/worker.ts`), a claim held open by another transaction, and a sender that
// "crashes" after the SMTP server accepted a message (the at-least-once window).
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import nodemailer from 'nodemailer';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { QueryTypes, Transaction } from 'sequelize';
import { enqueueEmail } from '@/lib/email/outbox';
import { claimDue, lockDueIds, messageIdFor, sendDueEmails } from '@/lib/email/sender';
import { db } from '@/models';
import { resetDatabase } from '../support/db';
import { startHarness, type Harness } from '../support/enrollment-fakes';

const root = path.resolve(__dirname, '../..');
let h: Harness;

beforeAll(async () => {
  h = await startHarness();
});
afterAll(async () => {
  await h?.close();
});
beforeEach(async () => {
  await resetDatabase();
  h.smtp.messages.length = 0;
});

async function enqueueMany(n: number, kind = 'test.senders') {
  const ids: number[] = [];
  for (let i = 0; i < n; i++)
    ids.push(await enqueueEmail({ kind, to: `reader${i}@test.example`, subject: `Message ${i}`, text: `Body ${i}`, html: `<p>Body ${i}</p>` }));
  return ids;
}

/** A transport of its own, as a second process would have. */
const ownTransport = () =>
  nodemailer.createTransport({ host: '127.0.0.1', port: h.smtp.smtpPort, secure: false, ignoreTLS: true, pool: true, maxConnections: 1 });

/** How many messages the fake SMTP server received per outbox id and per Message-ID. */
function receivedCounts() {
  const byOutboxId = new Map<number, number>();
  const byMessageId = new Map<string, number>();
  for (const m of h.smtp.messages) {
    const id = Number(m.headers['x-brinewright-outbox-id']);
    byOutboxId.set(id, (byOutboxId.get(id) ?? 0) + 1);
    const mid = m.headers['message-id'];
    byMessageId.set(mid, (byMessageId.get(mid) ?? 0) + 1);
  }
  return { byOutboxId, byMessageId };
}

async function expectEachSentOnce(ids: number[]) {
  const rows = await db().OutboxEmail.findAll({ where: { id: ids } });
  expect(rows.every((r) => r.status === 'sent')).toBe(true);
  expect(h.smtp.messages).toHaveLength(ids.length);
  const { byOutboxId, byMessageId } = receivedCounts();
  expect([...byOutboxId.keys()].sort((a, b) => a - b)).toEqual([...ids].sort((a, b) => a - b));
  expect([...byOutboxId.values()].every((n) => n === 1)).toBe(true);
  // The Message-ID the fake saw is the row's stable one, once each.
  expect(byMessageId.size).toBe(ids.length);
  for (const row of rows) expect(byMessageId.get(messageIdFor(row))).toBe(1);
}

describe('two outbox senders at once', () => {
  it('two senders looping side by side over 200 rows send each message exactly once, and both take part', async () => {
    const ids = await enqueueMany(200);
    const senders = [ownTransport(), ownTransport()].map(async (transport) => {
      let sent = 0;
      let idle = 0;
      // Loops like the worker does, until the outbox has stayed empty for a few rounds.
      while (idle < 3) {
        const r = await sendDueEmails({ batchSize: 7, transport });
        sent += r.sent;
        expect(r.retrying + r.failed).toBe(0);
        idle = r.claimed === 0 ? idle + 1 : 0;
        if (r.claimed === 0) await new Promise((resolve) => setTimeout(resolve, 10));
      }
      transport.close();
      return sent;
    });
    const counts = await Promise.all(senders);
    expect(counts[0] + counts[1]).toBe(200);
    expect(counts[0]).toBeGreaterThan(0);
    expect(counts[1]).toBeGreaterThan(0);
    await expectEachSentOnce(ids);
    // Every row went through exactly one claim.
    const attempts = await db().sequelize.query<{ attempts: number; n: number }>('SELECT attempts, COUNT(*) AS n FROM outbox_emails GROUP BY attempts', {
      type: QueryTypes.SELECT,
    });
    expect(attempts.map((a) => [Number(a.attempts), Number(a.n)])).toEqual([[1, 200]]);
  });

  it('a claim skips rows another transaction has locked, without waiting for it', async () => {
    const ids = await enqueueMany(20);
    const { sequelize } = db();
    const other = await sequelize.transaction({ isolationLevel: Transaction.ISOLATION_LEVELS.READ_COMMITTED });
    try {
      // Another sender in the middle of its claim holds the first 10 rows (the same locking read).
      const held = await lockDueIds(other, { limit: 10, now: new Date(), staleClaimMs: 60_000 });
      expect(held).toEqual(ids.slice(0, 10));
      const started = Date.now();
      const claimed = await claimDue('test-claimer', { batchSize: 50, staleClaimMs: 60_000, now: new Date() });
      const waited = Date.now() - started;
      expect(claimed.map((r) => r.id)).toEqual(ids.slice(10));
      // InnoDB's lock wait is 50 s by default; a claim that waited would take far longer than this.
      expect(waited).toBeLessThan(5_000);
    } finally {
      await other.rollback();
    }
    // The held rows are still due and go to the next claim.
    const next = await claimDue('test-claimer-2', { batchSize: 50, staleClaimMs: 60_000, now: new Date() });
    expect(next.map((r) => r.id)).toEqual(ids.slice(0, 10));
  });

  it('two worker processes (npm run worker) against one outbox of 200 rows send each message exactly once', { timeout: 200_000 }, async () => {
    const ids = await enqueueMany(200);
    const env = {
      ...process.env,
      WORKER_POLL_MS: '50',
      WORKER_BACKOFF_MS: '200',
      BRINEWRIGHT_PARENT_PID: String(process.pid),
    };
    const workers: { child: ChildProcess; out: string[] }[] = [];
    const exited = (child: ChildProcess) => new Promise<void>((resolve) => (child.exitCode !== null ? resolve() : child.once('exit', () => resolve())));
    try {
      for (let i = 0; i < 2; i++) {
        const child = spawn(path.join(root, 'node_modules/.bin/tsx'), ['--conditions=react-server', 'scripts/worker.ts'], {
          cwd: root,
          env,
          stdio: ['ignore', 'pipe', 'pipe'],
        });
        const out: string[] = [];
        child.stdout!.on('data', (c) => out.push(String(c)));
        child.stderr!.on('data', (c) => out.push(String(c)));
        workers.push({ child, out });
      }
      // Generous for a loaded machine: 200 SMTP deliveries take ~30 s on an idle 2-core one.
      await h.smtp.waitFor(200, 170_000);
      // A moment more: a duplicate, if any, would arrive now.
      await new Promise((r) => setTimeout(r, 1_000));
    } finally {
      for (const w of workers) w.child.kill('SIGTERM');
      await Promise.all(workers.map((w) => exited(w.child)));
    }
    await expectEachSentOnce(ids);
    // Both processes took part: each logs "outbox: sent N" per round.
    const sentBy = workers.map((w) => [...w.out.join('').matchAll(/outbox: sent (\d+)/g)].reduce((sum, m) => sum + Number(m[1]), 0));
    expect(sentBy[0] + sentBy[1]).toBe(200);
    expect(Math.min(...sentBy)).toBeGreaterThan(0);
  });
});

describe('what the sender guarantees', () => {
  it('a sender that dies after SMTP accepted a message: the row is sent again after the stale-claim time, with the same Message-ID', async () => {
    const [id] = await enqueueMany(1, 'test.crash');
    const { OutboxEmail } = db();
    // The crashed sender: it claimed the row and SMTP accepted the message, then it died before
    // marking the row sent.
    const [row] = await claimDue('crashed-sender', { batchSize: 5, staleClaimMs: 60_000, now: new Date() });
    await ownTransport().sendMail({
      from: 'hello@brinewright.example',
      to: row.toAddress,
      subject: row.subject,
      text: row.textBody,
      headers: { 'X-Brinewright-Outbox-Id': String(row.id) },
      messageId: messageIdFor(row),
    });
    expect((await OutboxEmail.findByPk(id))!.status).toBe('sending');

    // Within the stale-claim time no other sender touches it.
    expect((await sendDueEmails({ staleClaimMs: 60_000 })).claimed).toBe(0);
    // After it, the row is claimed again and delivered: nothing is lost …
    const later = await sendDueEmails({ staleClaimMs: 60_000, now: () => new Date(Date.now() + 61_000) });
    expect(later).toMatchObject({ claimed: 1, sent: 1 });
    const sent = (await OutboxEmail.findByPk(id))!;
    expect(sent.status).toBe('sent');
    expect(sent.attempts).toBe(2);
    // … and the one duplicate carries the same Message-ID, so it can be recognised as one message.
    expect(h.smtp.messages).toHaveLength(2);
    expect(new Set(h.smtp.messages.map((m) => m.headers['message-id']))).toEqual(new Set([messageIdFor(sent)]));
    // Sent rows are never claimed again.
    expect((await sendDueEmails({ now: () => new Date(Date.now() + 86_400_000) })).claimed).toBe(0);
  });

  it('a database failure after SMTP accepted a message leaves the row claimed (not queued for a quick retry)', async () => {
    const [id] = await enqueueMany(1, 'test.db-after-smtp');
    const { OutboxEmail } = db();
    const original = OutboxEmail.update.bind(OutboxEmail);
    // The database goes away exactly between the SMTP acceptance and the "sent" mark.
    (OutboxEmail as unknown as { update: unknown }).update = async () => {
      throw Object.assign(new Error('connect ECONNREFUSED 127.0.0.1:3307'), { code: 'ECONNREFUSED' });
    };
    try {
      await expect(sendDueEmails({ transport: ownTransport() })).rejects.toThrow(/ECONNREFUSED/);
    } finally {
      (OutboxEmail as unknown as { update: unknown }).update = original;
    }
    expect(h.smtp.messages).toHaveLength(1);
    const row = (await OutboxEmail.findByPk(id))!;
    expect(row.status).toBe('sending');
    // Not re-sent by the next rounds within the stale-claim time.
    expect((await sendDueEmails({ now: () => new Date(Date.now() + 60_000) })).claimed).toBe(0);
    expect(h.smtp.messages).toHaveLength(1);
  });
});
