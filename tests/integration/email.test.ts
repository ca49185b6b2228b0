import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { POST as enrollPOST } from '@/app/api/enrollments/route';
import { POST as registerPOST } from '@/app/api/register/route';
import { confirmEmailAddress } from '@/lib/email/confirm';
import { enqueueEmail } from '@/lib/email/outbox';
import { queueWorkshopReminders } from '@/lib/email/reminders';
import { backoffMs, sendDueEmails } from '@/lib/email/sender';
import { db } from '@/models';
import { createCourses, createUser, resetDatabase } from '../support/db';
import { jsonRequest } from '../support/request';
import { actAs } from '../support/session';
import { startHarness, type Harness } from '../support/enrollment-fakes';

let h: Harness;
let courseId: number;

beforeAll(async () => {
  h = await startHarness();
});
afterAll(async () => {
  await h?.close();
});
beforeEach(async () => {
  await resetDatabase();
  h.smtp.messages.length = 0;
  // Every test starts with the SMTP server up (one of them stops it).
  await h.smtp.stopSmtp();
  await h.smtp.startSmtp();
  const { flagship } = await createCourses();
  courseId = flagship.id;
});

async function workshopIn(hours: number, seats = 12) {
  const startsAt = new Date(Date.now() + hours * 3600_000);
  return db().Workshop.create({
    courseId,
    instructorId: null,
    startsAt,
    endsAt: new Date(startsAt.getTime() + 5 * 3600_000),
    timeZone: 'America/Denver',
    place: 'Upper Fork Community Kitchen, 220 Aspen Street',
    seats,
  });
}

/** Runs sender rounds (as the worker does) until nothing is due, with the clock moved on so backoff has passed. */
async function drain(rounds = 5) {
  for (let i = 0; i < rounds; i++) {
    const r = await sendDueEmails({ now: () => new Date(Date.now() + 24 * 3600_000) });
    if (r.claimed === 0) return;
  }
}

describe('the outbox sender and the fake SMTP server', () => {
  it('with SMTP stopped, enrolling still succeeds; the receipt is sent once when SMTP is back', async () => {
    const w = await workshopIn(240);
    await db().FeeWaiver.create({ code: 'SMTP-DOWN-TEST', courseId, maxUses: 1, expiresAt: new Date(Date.now() + 86_400_000) });
    const learner = await createUser('learner');
    await h.smtp.stopSmtp();

    actAs(learner);
    const response = await enrollPOST(jsonRequest('/api/enrollments', { workshopId: w.id, waiverCode: 'SMTP-DOWN-TEST' }), {});
    expect(response.status).toBe(201);
    expect((await db().Enrollment.findOne({ where: { userId: learner.id } }))!.status).toBe('active');

    const down = await sendDueEmails();
    expect(down).toMatchObject({ claimed: 1, sent: 0, retrying: 1 });
    const row = (await db().OutboxEmail.findOne({ where: { kind: 'enrollment.receipt' } }))!;
    expect(row.status).toBe('pending');
    expect(row.attempts).toBe(1);
    expect(row.lastError).toBeTruthy();
    expect(row.nextAttemptAt.getTime()).toBeGreaterThan(Date.now());
    // Not due yet: the backoff holds it back even once SMTP is up.
    await h.smtp.startSmtp();
    expect((await sendDueEmails()).claimed).toBe(0);

    await drain();
    expect(h.smtp.messages).toHaveLength(1);
    const [message] = h.smtp.messages;
    expect(message.to).toEqual([learner.email]);
    expect(message.subject).toBe('You are enrolled: Safe Pickling and Water-Bath Canning');
    expect(message.text).toContain('Place: Upper Fork Community Kitchen, 220 Aspen Street');
    expect(message.html).toContain('<th scope="row"');
    const sent = (await db().OutboxEmail.findByPk(row.id))!;
    expect(sent.status).toBe('sent');
    expect(sent.attempts).toBe(2);
    expect(sent.sentAt).toBeInstanceOf(Date);

    // Nothing is sent twice.
    await drain();
    expect(h.smtp.messages).toHaveLength(1);
  });

  it('two senders at once deliver each of 30 messages exactly once', async () => {
    for (let i = 0; i < 30; i++)
      await enqueueEmail({ kind: 'test.bulk', to: `reader${i}@test.example`, subject: `Message ${i}`, text: `Body ${i}`, html: `<p>Body ${i}</p>` });
    for (let round = 0; round < 10; round++) {
      const [a, b] = await Promise.all([sendDueEmails({ batchSize: 4 }), sendDueEmails({ batchSize: 4 })]);
      if (a.claimed + b.claimed === 0) break;
    }
    expect(h.smtp.messages).toHaveLength(30);
    const ids = h.smtp.messages.map((m) => m.headers['x-brinewright-outbox-id']);
    expect(new Set(ids).size).toBe(30);
    expect(await db().OutboxEmail.count({ where: { status: 'sent' } })).toBe(30);
  });

  it('gives up after the last attempt and marks the row failed', async () => {
    await enqueueEmail({ kind: 'test.fail', to: 'nobody@test.example', subject: 'Will fail', text: 'x', html: '<p>x</p>' });
    await h.smtp.stopSmtp();
    const results = [];
    for (let i = 0; i < 3; i++) results.push(await sendDueEmails({ maxAttempts: 3, now: () => new Date(Date.now() + (i + 1) * 86_400_000) }));
    expect(results.map((r) => [r.retrying, r.failed])).toEqual([
      [1, 0],
      [1, 0],
      [0, 1],
    ]);
    expect((await db().OutboxEmail.findOne({ where: { kind: 'test.fail' } }))!.status).toBe('failed');
  });

  it('backs off exponentially with a ceiling', () => {
    expect([1, 2, 3, 4].map((n) => backoffMs(n, 5000, 60_000))).toEqual([5000, 10_000, 20_000, 40_000]);
    expect(backoffMs(12, 5000, 60_000)).toBe(60_000);
  });
});

describe('messages', () => {
  it('registration queues the welcome message in its transaction; its link confirms the address once', async () => {
    const response = await registerPOST(
      jsonRequest('/api/register', { name: 'Ada Brook', email: 'ada.brook@test.example', password: 'a-long-password-1' }),
      {},
    );
    expect(response.status).toBe(201);
    await drain();
    expect(h.smtp.messages).toHaveLength(1);
    const [welcome] = h.smtp.messages;
    expect(welcome.subject).toMatch(/Welcome to Brinewright/);
    expect(welcome.html).toContain('Confirm my e-mail address');
    const link = /http:\/\/localhost:3000\/confirm-email\?token=(\S+)/.exec(welcome.text);
    expect(link).not.toBeNull();
    const token = decodeURIComponent(link![1]);
    expect(await confirmEmailAddress(token)).toBe('confirmed');
    expect((await db().User.findOne({ where: { email: 'ada.brook@test.example' } }))!.emailVerifiedAt).toBeInstanceOf(Date);
    expect(await confirmEmailAddress(token)).toBe('already');
    expect(await confirmEmailAddress(token.slice(0, -2) + 'xx')).toBe('invalid');

    // A taken address: no second account, no second message.
    const again = await registerPOST(jsonRequest('/api/register', { name: 'Ada Again', email: 'ada.brook@test.example', password: 'a-long-password-1' }), {});
    expect(again.status).toBe(409);
    expect(await db().OutboxEmail.count({ where: { kind: 'user.welcome' } })).toBe(1);
  });

  it('the day-before reminder goes once to each active learner of a workshop starting within 24 hours', async () => {
    const soon = await workshopIn(20);
    const later = await workshopIn(72);
    const [a, b, c, d] = await Promise.all([createUser('learner'), createUser('learner'), createUser('learner'), createUser('learner')]);
    const { Enrollment } = db();
    await Enrollment.create({ userId: a.id, courseId, workshopId: soon.id, runKey: String(soon.id), status: 'active', feeCents: 4500 });
    await Enrollment.create({ userId: b.id, courseId, workshopId: soon.id, runKey: String(soon.id), status: 'awaiting_payment', feeCents: 4500 });
    await Enrollment.create({ userId: c.id, courseId, workshopId: later.id, runKey: String(later.id), status: 'active', feeCents: 4500 });
    await Enrollment.create({ userId: d.id, courseId, workshopId: soon.id, runKey: `withdrawn:1:${soon.id}`, status: 'withdrawn', feeCents: 4500 });

    const [first, second] = await Promise.all([queueWorkshopReminders(), queueWorkshopReminders()]);
    expect(first + second).toBe(1);
    expect(await queueWorkshopReminders()).toBe(0);
    await drain();
    expect(h.smtp.messages.map((m) => m.to[0])).toEqual([a.email]);
    expect(h.smtp.messages[0].subject).toBe('Tomorrow: your Safe Pickling and Water-Bath Canning workshop');
    expect(h.smtp.messages[0].text).toContain('Place: Upper Fork Community Kitchen, 220 Aspen Street');
  });
});
