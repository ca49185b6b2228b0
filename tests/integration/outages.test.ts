// The SMTP server and the payment service go away and come back while learners enroll, pay and
// get their e-mails. Real MariaDB, the real fakes on free ports, the real stripe SDK and nodemailer,
// and an outbox sender looping in the background as the worker does.
//
// The payment service is reached through a TCP relay in this file: stopping the relay is the
// service being unreachable (connections refused), and the fake's webhook deliveries are held
// meanwhile, as a hosted service keeps its events until it can deliver them. The fake keeps its
// state, as the real service would.
//
// Checked at the end: every e-mail row was sent exactly once (messages counted per outbox id and
// per Message-ID at the fake SMTP server), every payment ended in the right state, and while the
// payment service was down the app answered a clear 503, never a 500.
import net from 'node:net';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { GET as workshopsGET } from '@/app/api/courses/[course]/workshops/route';
import { POST as refundPOST } from '@/app/api/enrollments/[id]/refund/route';
import { POST as enrollPOST } from '@/app/api/enrollments/route';
import { messageIdFor, sendDueEmails } from '@/lib/email/sender';
import type { SessionUser } from '@/lib/auth/users';
import { db } from '@/models';
import { createCourses, createUser, resetDatabase } from '../support/db';
import { jsonRequest, params } from '../support/request';
import { actAs } from '../support/session';
import { payWithCard, startHarness, type Harness } from '../support/enrollment-fakes';

// Brinewright's own practice card that pays (fakes/payments/cards.ts).
const GOOD = '4600 4600 4600 4604';
const SEATS = 40;

/** A TCP relay in front of the fake payment server; stop() refuses connections and cuts open ones. */
async function startRelay(targetPort: number) {
  const sockets = new Set<net.Socket>();
  let server: net.Server | null = null;
  let port = 0;
  const listen = () =>
    new Promise<void>((resolve, reject) => {
      const s = net.createServer((client) => {
        const upstream = net.connect(targetPort, '127.0.0.1');
        for (const sock of [client, upstream]) {
          sockets.add(sock);
          sock.on('close', () => sockets.delete(sock));
          sock.on('error', () => undefined);
        }
        client.pipe(upstream).pipe(client);
      });
      s.once('error', reject);
      s.listen(port, '127.0.0.1', () => {
        port = (s.address() as net.AddressInfo).port;
        server = s;
        resolve();
      });
    });
  await listen();
  return {
    get port() {
      return port;
    },
    start: listen,
    stop: () =>
      new Promise<void>((resolve) => {
        const s = server;
        server = null;
        for (const sock of sockets) sock.destroy();
        if (!s) return resolve();
        s.close(() => resolve());
      }),
  };
}

let h: Harness;
let relay: Awaited<ReturnType<typeof startRelay>>;

beforeAll(async () => {
  h = await startHarness();
  relay = await startRelay(h.payments.port);
  // The app talks to the payment service through the relay (set before the first getEnv()).
  process.env.STRIPE_API_PORT = String(relay.port);
});
afterAll(async () => {
  await relay?.stop();
  await h?.close();
});
beforeEach(async () => {
  await resetDatabase();
  h.smtp.messages.length = 0;
  actAs(null);
});

type Answer = { what: string; status: number; body: Record<string, unknown> };

describe('SMTP and the payment service stopped and started during enrollments', () => {
  it('loses nothing, sends nothing twice, and answers 503 (never 500) while payments are down', { timeout: 120_000 }, async () => {
    const { flagship } = await createCourses();
    const startsAt = new Date(Date.now() + 10 * 86_400_000);
    const workshop = await db().Workshop.create({
      courseId: flagship.id,
      instructorId: null,
      startsAt,
      endsAt: new Date(startsAt.getTime() + 5 * 3600_000),
      timeZone: 'America/Denver',
      place: 'Grange Hall, 14 Mill Road',
      seats: SEATS,
    });
    await db().FeeWaiver.create({ code: 'OUTAGE-WAIVER', courseId: flagship.id, maxUses: 10, expiresAt: new Date(Date.now() + 86_400_000) });
    const learners = await Promise.all(Array.from({ length: 13 }, () => createUser('learner')));
    const coordinator = await createUser('coordinator');

    const answers: Answer[] = [];
    const answer = async (what: string, response: Promise<Response>) => {
      const r = await response;
      const a: Answer = { what, status: r.status, body: (await r.json()) as Record<string, unknown> };
      answers.push(a);
      return a;
    };
    // actAs is read synchronously when the handler asks for the session, so each call is started
    // right after choosing its user and the calls may then run concurrently.
    const enroll = (user: SessionUser, body: Record<string, unknown> = { workshopId: workshop.id }) => {
      actAs(user);
      return answer(`enroll ${user.id}`, enrollPOST(jsonRequest('/api/enrollments', body), {}));
    };
    const refund = (enrollmentId: number) => {
      actAs(coordinator);
      return answer(
        `refund ${enrollmentId}`,
        refundPOST(jsonRequest(`/api/enrollments/${enrollmentId}/refund`, { reason: 'Moved away' }), params({ id: String(enrollmentId) })),
      );
    };
    // The learner's browser reaches the card page through the relay too.
    const viaRelay = (url: string) => url.replace(`:${h.payments.port}/`, `:${relay.port}/`);
    const pay = (url: string) => payWithCard(viaRelay(url), GOOD);
    const seatsLeft = async () => {
      actAs(null);
      const r = await workshopsGET(new Request('http://localhost:3000/api/courses/pickling-and-canning/workshops'), params({ course: 'pickling-and-canning' }));
      return (await r.json()).workshops[0].seatsLeft as number;
    };
    const control = (path: string) => fetch(`${h.payments.url}/_fake/${path}`, { method: 'POST' }).then((r) => expect(r.status).toBe(200));
    const statusOf = async (enrollmentId: number) => (await db().Enrollment.findByPk(enrollmentId))!.status;

    // The outbox sender, looping as `npm run worker` does, with short backoff.
    let sending = true;
    let rounds = 0;
    let smtpFailures = 0;
    const sender = (async () => {
      while (sending) {
        const r = await sendDueEmails({ backoffBaseMs: 50, maxBackoffMs: 400, maxAttempts: 1000, batchSize: 5 });
        rounds += 1;
        smtpFailures += r.retrying + r.failed;
        await new Promise((resolve) => setTimeout(resolve, 25));
      }
    })();

    const [l1, l2, l3, l4, l5, l6, l7, l8, l9, l10, l11, l12, l13] = learners;
    const paidEnrollments: number[] = [];
    try {
      // 1. Everything up: three pay by card, one uses a waiver.
      const first = await Promise.all([enroll(l1), enroll(l2), enroll(l3), enroll(l4, { workshopId: workshop.id, waiverCode: 'OUTAGE-WAIVER' })]);
      expect(first.map((a) => a.status)).toEqual([201, 201, 201, 201]);
      for (const a of first.slice(0, 3)) expect((await pay(a.body.url as string)).status).toBe(303);
      paidEnrollments.push(...first.slice(0, 3).map((a) => a.body.enrollmentId as number));

      // 2. SMTP stops while the sender is working; enrollments and payments go on.
      await h.smtp.stopSmtp();
      const second = await Promise.all([enroll(l5), enroll(l6), enroll(l7, { workshopId: workshop.id, waiverCode: 'OUTAGE-WAIVER' }), enroll(l8)]);
      expect(second.map((a) => a.status)).toEqual([201, 201, 201, 201]);
      for (const a of [second[0], second[1]]) expect((await pay(a.body.url as string)).status).toBe(303);
      paidEnrollments.push(second[0].body.enrollmentId as number, second[1].body.enrollmentId as number);
      const l8Checkout = second[3]; // opened now, its card page tried while the service is down, paid after
      await h.payments.settle();
      await expect.poll(() => smtpFailures, { timeout: 10_000 }).toBeGreaterThan(0);

      // 3. The payment service goes away. Just before, learner 9 pays: its webhook is held by the
      //    service and arrives only after it is back. SMTP comes back in the middle of this outage.
      const l9Enroll = await enroll(l9);
      expect(l9Enroll.status).toBe(201);
      await control('webhooks/pause');
      expect((await pay(l9Enroll.body.url as string)).status).toBe(303);
      await relay.stop();
      const l9Id = l9Enroll.body.enrollmentId as number;
      expect(await statusOf(l9Id)).toBe('awaiting_payment');

      const seatsBefore = await seatsLeft();
      const down = await Promise.all([
        enroll(l10),
        enroll(l11),
        enroll(l9), // asks for its checkout again: the service cannot be asked
        refund(paidEnrollments[0]),
        enroll(l12, { workshopId: workshop.id, waiverCode: 'OUTAGE-WAIVER' }), // needs no payment service
      ]);
      await h.smtp.startSmtp();
      expect(down.map((a) => a.status)).toEqual([503, 503, 503, 503, 201]);
      for (const a of down.slice(0, 3)) {
        expect(a.body.error).toBe('unavailable');
        expect(a.body.message).toMatch(/payments are not available right now/i);
      }
      // Those without a checkout lose the seat they were about to take; learner 9 keeps the one
      // its open (and meanwhile paid) checkout holds, and is told so.
      expect(down[0].body.message).toMatch(/seat was not kept/);
      expect(down[1].body.message).toMatch(/seat was not kept/);
      expect(down[2].body.message).toMatch(/seat is held while your checkout is open/);
      expect(down[3].body.message).toMatch(/payment service cannot be reached.*nothing was refunded/i);
      // No seat was kept for the two who could not reach checkout; the waiver took one.
      expect(await seatsLeft()).toBe(seatsBefore - 1);
      const withdrawn = await db().Enrollment.findAll({ where: { userId: [l10.id, l11.id] } });
      expect(withdrawn.map((e) => e.status)).toEqual(['withdrawn', 'withdrawn']);
      // The card page is down too.
      await expect(pay(l8Checkout.body.url as string)).rejects.toThrow();
      expect(await statusOf(l9Id)).toBe('awaiting_payment');

      // 4. The payment service is back: held webhooks arrive, the learners try again and pay.
      await relay.start();
      await control('webhooks/resume');
      await expect.poll(() => statusOf(l9Id), { timeout: 10_000 }).toBe('active');
      paidEnrollments.push(l9Id);
      const again = await Promise.all([enroll(l10), enroll(l11)]);
      expect(again.map((a) => a.status)).toEqual([201, 201]);
      for (const a of again) expect((await pay(a.body.url as string)).status).toBe(303);
      paidEnrollments.push(...again.map((a) => a.body.enrollmentId as number));
      expect((await pay(l8Checkout.body.url as string)).status).toBe(303);
      paidEnrollments.push(l8Checkout.body.enrollmentId as number);
      // SMTP stops once more while these receipts go out, and comes back.
      await h.smtp.stopSmtp();
      expect((await refund(paidEnrollments[0])).status).toBe(200);
      const late = await enroll(l13);
      expect((await pay(late.body.url as string)).status).toBe(303);
      paidEnrollments.push(late.body.enrollmentId as number);
      await new Promise((r) => setTimeout(r, 300));
      await h.smtp.startSmtp();
      await h.payments.settle();
      // Seats held: 10 paid less the refunded one, and 3 waivers.
      expect(await seatsLeft()).toBe(SEATS - 12);

      // Everything queued is delivered.
      const { OutboxEmail } = db();
      await expect.poll(() => OutboxEmail.count({ where: { status: ['pending', 'sending'] } }), { timeout: 30_000, interval: 100 }).toBe(0);
      // A little longer: a duplicate, if one were coming, would arrive now.
      await new Promise((r) => setTimeout(r, 500));
    } finally {
      sending = false;
      await sender;
    }

    // ---- every e-mail row sent exactly once
    const rows = await db().OutboxEmail.findAll({ order: [['id', 'ASC']] });
    expect(rows.map((r) => r.status).every((s) => s === 'sent')).toBe(true);
    expect(rows.filter((r) => r.kind === 'enrollment.receipt')).toHaveLength(paidEnrollments.length + 3);
    expect(rows.filter((r) => r.kind === 'payment.refunded')).toHaveLength(1);
    const perOutboxId = new Map<number, number>();
    const perMessageId = new Map<string, number>();
    for (const m of h.smtp.messages) {
      const id = Number(m.headers['x-brinewright-outbox-id']);
      perOutboxId.set(id, (perOutboxId.get(id) ?? 0) + 1);
      perMessageId.set(m.headers['message-id'], (perMessageId.get(m.headers['message-id']) ?? 0) + 1);
    }
    expect(h.smtp.messages).toHaveLength(rows.length);
    for (const row of rows) {
      expect(perOutboxId.get(row.id), `messages for outbox row ${row.id}`).toBe(1);
      expect(perMessageId.get(messageIdFor(row)), `messages with the Message-ID of row ${row.id}`).toBe(1);
    }
    // The SMTP outages were really met: some rows needed more than one attempt.
    expect(rows.some((r) => r.attempts > 1)).toBe(true);

    // ---- every payment in the right state
    const payments = await db().Payment.findAll();
    const byEnrollment = new Map<number, typeof payments>();
    for (const p of payments) byEnrollment.set(p.enrollmentId, [...(byEnrollment.get(p.enrollmentId) ?? []), p]);
    for (const id of paidEnrollments) {
      const list = byEnrollment.get(id) ?? [];
      expect(list, `payments of enrollment ${id}`).toHaveLength(1);
      expect(list[0].status).toBe(id === paidEnrollments[0] ? 'refunded' : 'paid');
      expect(await statusOf(id)).toBe(id === paidEnrollments[0] ? 'withdrawn' : 'active');
    }
    // No payment belongs to the enrollments that could not reach checkout.
    for (const e of await db().Enrollment.findAll({ where: { userId: [l10.id, l11.id], status: 'withdrawn' } })) expect(byEnrollment.get(e.id)).toBeUndefined();
    expect(payments.filter((p) => p.status === 'pending')).toEqual([]);
    // One refund at the service for the one refunded payment, though it was asked for twice.
    expect([...h.payments.refunds.values()].map((r) => r.amount)).toEqual([4500]);
    // Each webhook event stored once.
    const events = await db().PaymentEvent.findAll();
    expect(new Set(events.map((e) => e.providerEventId)).size).toBe(events.length);
    expect(events.filter((e) => e.type === 'checkout.session.completed')).toHaveLength(paidEnrollments.length);

    // ---- the app never answered 500
    expect(answers.filter((a) => a.status >= 500 && a.status !== 503)).toEqual([]);
    const unavailable = answers.filter((a) => a.status === 503);
    expect(unavailable).toHaveLength(4);
    for (const a of unavailable) expect(a.body).toMatchObject({ error: 'unavailable', message: expect.stringMatching(/payment/i) });
    expect(rounds).toBeGreaterThan(10);
  });
});
