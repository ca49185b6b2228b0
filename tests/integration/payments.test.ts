import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { WAIVER_REFUSED } from '@/lib/enrollment/waivers';
import { POST as enrollPOST } from '@/app/api/enrollments/route';
import { POST as refundPOST } from '@/app/api/enrollments/[id]/refund/route';
import { GET as workshopsGET } from '@/app/api/courses/[course]/workshops/route';
import { POST as webhookPOST } from '@/app/api/webhooks/payments/route';
import { startFakePayments } from '@/fakes/payments/server';
import { getCourse } from '@/lib/content';
import { releaseStaleCheckouts } from '@/lib/payments/reconcile';
import { db } from '@/models';
import { createCourses, createUser, resetDatabase } from '../support/db';
import { jsonRequest, params } from '../support/request';
import { actAs } from '../support/session';
import { API_KEY, WEBHOOK_SECRET, payWithCard, sessionIdOf, signedHeader, startHarness, type Harness } from '../support/enrollment-fakes';

// Brinewright's own practice cards (fakes/payments/cards.ts): 4600 4600 4600 4604 pays, 4600 4600 9090 9096 is turned down.
const GOOD = '4600 4600 4600 4604';
const DECLINED = '4600 4600 9090 9096';

let h: Harness;
let courseId: number;
let workshopId: number;

beforeAll(async () => {
  h = await startHarness();
});
afterAll(async () => {
  await h?.close();
});

beforeEach(async () => {
  await resetDatabase();
  actAs(null);
  const { flagship } = await createCourses();
  courseId = flagship.id;
  const instructor = await createUser('instructor');
  const startsAt = new Date(Date.now() + 10 * 86_400_000);
  const w = await db().Workshop.create({
    courseId,
    instructorId: instructor.id,
    startsAt,
    endsAt: new Date(startsAt.getTime() + 5 * 3600_000),
    timeZone: 'America/Denver',
    place: 'Grange Hall, 14 Mill Road',
    seats: 12,
  });
  workshopId = w.id;
});

async function enroll(user: Awaited<ReturnType<typeof createUser>>, body: Record<string, unknown> = { workshopId }) {
  actAs(user);
  const response = await enrollPOST(jsonRequest('/api/enrollments', body), {});
  return { status: response.status, body: await response.json() };
}

// The fake lives across tests while the database is rebuilt, so deliveries are picked by session.
const deliveriesFor = (sessionId: string) => h.payments.deliveries.filter((d) => d.payload.includes(`"${sessionId}"`));

const enrollmentOf = (userId: number) => db().Enrollment.findOne({ where: { userId }, order: [['id', 'DESC']] });

async function paidEnrollment() {
  const learner = await createUser('learner');
  const { body } = await enroll(learner);
  const paid = await payWithCard(body.url, GOOD);
  await h.payments.settle();
  return { learner, enrollmentId: body.enrollmentId as number, sessionId: sessionIdOf(body.url), paid };
}

async function seatsLeft(): Promise<number> {
  actAs(null);
  const response = await workshopsGET(
    new Request('http://localhost:3000/api/courses/pickling-and-canning/workshops'),
    params({ course: 'pickling-and-canning' }),
  );
  return (await response.json()).workshops[0].seatsLeft;
}

describe('paying through the fake payment server', () => {
  it('a paid checkout makes one paid payment, an active enrollment and a receipt', async () => {
    const learner = await createUser('learner');
    const { status, body } = await enroll(learner);
    expect(status).toBe(201);
    expect(body.outcome).toBe('checkout');
    expect(body.url).toMatch(new RegExp(`^${h.payments.url}/pay/cs_test_`));
    expect((await enrollmentOf(learner.id))!.status).toBe('awaiting_payment');
    // A new enrollment keeps the course content version it began under (the fermenting lesson's).
    expect((await enrollmentOf(learner.id))!.contentVersion).toBe(getCourse('pickling-and-canning')!.version);
    expect(getCourse('pickling-and-canning')!.version).toBe(2);
    expect(await seatsLeft()).toBe(11);

    // The checkout page is a real form with labelled fields.
    const page = await (await fetch(body.url)).text();
    expect(page).toContain('<label for="card">Card number</label>');
    expect(page).toContain('$45.00');

    const paid = await payWithCard(body.url, GOOD);
    expect(paid.status).toBe(303);
    expect(paid.location).toBe(`http://localhost:3000/checkout/success?session_id=${sessionIdOf(body.url)}`);
    await h.payments.settle();

    const enrollment = (await enrollmentOf(learner.id))!;
    expect(enrollment.status).toBe('active');
    const payments = await db().Payment.findAll({ where: { enrollmentId: enrollment.id } });
    expect(payments).toHaveLength(1);
    expect(payments[0].status).toBe('paid');
    expect(payments[0].amountCents).toBe(4500);
    expect(payments[0].paymentIntentId).toMatch(/^pi_test_/);
    const receipts = await db().OutboxEmail.findAll({ where: { kind: 'enrollment.receipt', toAddress: learner.email } });
    expect(receipts).toHaveLength(1);
    expect(receipts[0].textBody).toContain('Amount paid: $45.00');
    expect(receipts[0].textBody).toContain('Place: Grange Hall, 14 Mill Road');
    const actions = (await db().AuditLog.findAll({ where: { subjectType: 'enrollment', subjectId: String(enrollment.id) }, order: [['id', 'ASC']] })).map(
      (a) => a.action,
    );
    expect(actions).toEqual(['enrollment.created', 'enrollment.active']);
  });

  it('a declined card leaves the checkout open and the seat held; a good card then pays', async () => {
    const learner = await createUser('learner');
    const { body } = await enroll(learner);
    const declined = await payWithCard(body.url, DECLINED);
    expect(declined.status).toBe(402);
    expect(declined.body).toContain('The card’s bank turned this payment down, so nothing was paid.');
    await h.payments.settle();
    expect(deliveriesFor(sessionIdOf(body.url))).toHaveLength(0);
    expect((await enrollmentOf(learner.id))!.status).toBe('awaiting_payment');
    expect(h.payments.sessions.get(sessionIdOf(body.url))!.status).toBe('open');
    expect(await seatsLeft()).toBe(11);

    expect((await payWithCard(body.url, GOOD)).status).toBe(303);
    await h.payments.settle();
    expect((await enrollmentOf(learner.id))!.status).toBe('active');
  });

  it('an expired checkout releases the seat, and the learner may enroll in the same workshop again', async () => {
    const learner = await createUser('learner');
    const { body } = await enroll(learner);
    expect(await seatsLeft()).toBe(11);
    expect(h.payments.expire(sessionIdOf(body.url))).toBe(true);
    await h.payments.settle();
    const first = (await db().Enrollment.findByPk(body.enrollmentId))!;
    expect(first.status).toBe('withdrawn');
    expect((await db().Payment.findOne({ where: { enrollmentId: first.id } }))!.status).toBe('expired');
    expect(await seatsLeft()).toBe(12);
    // The expired page no longer takes a card.
    expect((await payWithCard(body.url, GOOD)).status).toBe(402);

    const again = await enroll(learner);
    expect(again.status).toBe(201);
    expect(again.body.enrollmentId).not.toBe(first.id);
    expect(await seatsLeft()).toBe(11);
  });

  it('asking again while a checkout is open gives the same checkout, not a second seat', async () => {
    const learner = await createUser('learner');
    const a = await enroll(learner);
    const b = await enroll(learner);
    expect(b.status).toBe(201);
    expect(b.body.url).toBe(a.body.url);
    expect(await db().Enrollment.count({ where: { userId: learner.id } })).toBe(1);
    expect(await seatsLeft()).toBe(11);
  });

  it('choosing another workshop gives up the unpaid seat and closes its checkout', async () => {
    const learner = await createUser('learner');
    const first = await enroll(learner);
    const startsAt = new Date(Date.now() + 20 * 86_400_000);
    const other = await db().Workshop.create({
      courseId,
      instructorId: null,
      startsAt,
      endsAt: new Date(startsAt.getTime() + 3600_000),
      timeZone: 'America/Denver',
      place: 'Library',
      seats: 4,
    });
    const second = await enroll(learner, { workshopId: other.id });
    expect(second.status).toBe(201);
    expect((await db().Enrollment.findByPk(first.body.enrollmentId))!.status).toBe('withdrawn');
    expect((await db().Enrollment.findByPk(second.body.enrollmentId))!.status).toBe('awaiting_payment');
    expect(await seatsLeft()).toBe(12);
    // The old checkout is expired at the payment service, and its webhook changes nothing more.
    await expect.poll(() => h.payments.sessions.get(sessionIdOf(first.body.url))!.status).toBe('expired');
    await h.payments.settle();
    expect((await db().Payment.findOne({ where: { enrollmentId: first.body.enrollmentId } }))!.status).toBe('expired');
    expect((await db().Enrollment.findByPk(second.body.enrollmentId))!.status).toBe('awaiting_payment');
  });

  it('when an expiry webhook never arrives, the worker’s reconciliation releases the seat', async () => {
    const learner = await createUser('learner');
    const { body } = await enroll(learner);
    h.payments.setWebhookUrl(undefined);
    try {
      h.payments.expire(sessionIdOf(body.url));
      // Not yet past the grace period: nothing happens.
      expect(await releaseStaleCheckouts()).toBe(0);
      await db().sequelize.query('UPDATE payments SET createdAt = ? WHERE enrollmentId = ?', {
        replacements: [new Date(Date.now() - 2 * 3600_000), body.enrollmentId],
      });
      expect(await releaseStaleCheckouts()).toBe(1);
      expect((await db().Enrollment.findByPk(body.enrollmentId))!.status).toBe('withdrawn');
      expect(await seatsLeft()).toBe(12);
      expect(await releaseStaleCheckouts()).toBe(0);
    } finally {
      h.payments.setWebhookUrl(h.hookUrl);
    }
  });

  it('a refund goes through the SDK, withdraws the enrollment, releases the seat and queues an e-mail', async () => {
    const { learner, enrollmentId } = await paidEnrollment();
    expect(await seatsLeft()).toBe(11);

    actAs(learner);
    expect((await refundPOST(jsonRequest(`/api/enrollments/${enrollmentId}/refund`, {}), params({ id: String(enrollmentId) }))).status).toBe(403);

    actAs(await createUser('coordinator'));
    const response = await refundPOST(jsonRequest(`/api/enrollments/${enrollmentId}/refund`, { reason: 'Moved away' }), params({ id: String(enrollmentId) }));
    expect(response.status).toBe(200);
    const { refund } = await response.json();
    expect(refund.amountCents).toBe(4500);
    expect([...h.payments.refunds.values()].map((r) => r.amount)).toEqual([4500]);
    expect((await db().Enrollment.findByPk(enrollmentId))!.status).toBe('withdrawn');
    const payment = (await db().Payment.findOne({ where: { enrollmentId } }))!;
    expect(payment.status).toBe('refunded');
    expect(payment.refundedCents).toBe(4500);
    expect(await seatsLeft()).toBe(12);
    const mails = await db().OutboxEmail.findAll({ where: { kind: 'payment.refunded', toAddress: learner.email } });
    expect(mails).toHaveLength(1);
    expect(mails[0].textBody).toContain('Refunded: $45.00');

    // A second press refunds nothing more.
    actAs(await createUser('coordinator'));
    const again = await refundPOST(jsonRequest(`/api/enrollments/${enrollmentId}/refund`, {}), params({ id: String(enrollmentId) }));
    expect(again.status).toBe(409);
    expect(h.payments.refunds.size).toBe(1);
    // The fake announces the refund with charge.refunded; the app answers 200 and changes nothing.
    await h.payments.settle();
    const refundedEvent = h.payments.deliveries.find((d) => d.type === 'charge.refunded' && d.payload.includes(payment.paymentIntentId!))!;
    expect(refundedEvent.delivered).toBe(true);
    expect(refundedEvent.lastStatus).toBe(200);
  });
});

describe('the webhook endpoint', () => {
  it('the same event delivered 10 times (one after another and at once) gives one payment and one active enrollment', async () => {
    const { enrollmentId, learner, sessionId } = await paidEnrollment();
    const completed = deliveriesFor(sessionId).find((d) => d.type === 'checkout.session.completed')!;
    for (let i = 0; i < 5; i++) await h.payments.redeliver(completed.eventId);
    const responses = await Promise.all(
      Array.from({ length: 5 }, () =>
        webhookPOST(
          new Request('http://localhost:3000/api/webhooks/payments', {
            method: 'POST',
            headers: { 'stripe-signature': signedHeader(completed.payload) },
            body: completed.payload,
          }),
          {},
        ),
      ),
    );
    expect(responses.map((r) => r.status)).toEqual([200, 200, 200, 200, 200]);
    expect(h.payments.deliveries.filter((d) => d.eventId === completed.eventId).every((d) => d.lastStatus === 200)).toBe(true);
    expect(await db().PaymentEvent.count({ where: { providerEventId: completed.eventId } })).toBe(1);
    expect(await db().Payment.count({ where: { enrollmentId } })).toBe(1);
    expect((await db().Payment.findOne({ where: { enrollmentId } }))!.status).toBe('paid');
    expect(await db().Enrollment.count({ where: { userId: learner.id, status: 'active' } })).toBe(1);
    expect(await db().OutboxEmail.count({ where: { kind: 'enrollment.receipt' } })).toBe(1);
    expect(await db().AuditLog.count({ where: { action: 'enrollment.active' } })).toBe(1);
  });

  it('an expired event arriving after the completed one does not undo the payment', async () => {
    const { enrollmentId, sessionId } = await paidEnrollment();
    const session = { ...h.payments.sessions.get(sessionId)!, status: 'expired', payment_status: 'unpaid', line_items_name: undefined };
    const payload = JSON.stringify({
      id: 'evt_test_out_of_order_1',
      object: 'event',
      type: 'checkout.session.expired',
      created: Math.floor(Date.now() / 1000),
      data: { object: session },
      livemode: false,
    });
    const response = await webhookPOST(
      new Request('http://localhost:3000/api/webhooks/payments', { method: 'POST', headers: { 'stripe-signature': signedHeader(payload) }, body: payload }),
      {},
    );
    expect(response.status).toBe(200);
    expect((await db().Payment.findOne({ where: { enrollmentId } }))!.status).toBe('paid');
    expect((await db().Enrollment.findByPk(enrollmentId))!.status).toBe('active');
  });

  it('a paid checkout whose amount or currency differs from the fee activates nothing, is audited and e-mails every coordinator', async () => {
    const coordinator = await createUser('coordinator');
    const admin = await createUser('admin');
    for (const [n, change] of [
      [1, { amount_total: 100 }],
      [2, { currency: 'eur' }],
    ] as const) {
      const learner = await createUser('learner');
      const { body } = await enroll(learner);
      const session = {
        ...h.payments.sessions.get(sessionIdOf(body.url))!,
        status: 'complete',
        payment_status: 'paid',
        payment_intent: `pi_test_mismatch_${n}`,
        ...change,
      };
      const payload = JSON.stringify({
        id: `evt_test_mismatch_${n}`,
        object: 'event',
        type: 'checkout.session.completed',
        created: Math.floor(Date.now() / 1000),
        data: { object: session },
      });
      const response = await webhookPOST(
        new Request('http://localhost:3000/api/webhooks/payments', { method: 'POST', headers: { 'stripe-signature': signedHeader(payload) }, body: payload }),
        {},
      );
      expect(response.status).toBe(200);
      expect((await db().Enrollment.findByPk(body.enrollmentId))!.status).toBe('awaiting_payment');
      const audit = await db().AuditLog.findAll({ where: { action: 'payment.amount_mismatch' } });
      expect(audit).toHaveLength(n);
      expect(audit[n - 1].data).toMatchObject({
        enrollmentId: body.enrollmentId,
        feeCents: 4500,
        feeCurrency: 'usd',
        ...(n === 1 ? { paidCents: 100, paidCurrency: 'usd' } : { paidCents: 4500, paidCurrency: 'eur' }),
      });
    }
    const mails = await db().OutboxEmail.findAll({ where: { kind: 'payment.amount_mismatch' } });
    expect(mails.map((m) => m.toAddress).sort()).toEqual([admin.email, admin.email, coordinator.email, coordinator.email].sort());
    expect(mails[0].textBody).toContain('Fee: $45.00');
    expect(await db().OutboxEmail.count({ where: { kind: 'enrollment.receipt' } })).toBe(0);
    expect(await db().AuditLog.count({ where: { action: 'enrollment.active' } })).toBe(0);
  });

  it('a missing, wrong or stale signature, or a changed body, is a 400 and changes nothing', async () => {
    const learner = await createUser('learner');
    const { body } = await enroll(learner);
    const session = { ...h.payments.sessions.get(sessionIdOf(body.url))!, status: 'complete', payment_status: 'paid', payment_intent: 'pi_test_forged' };
    const payload = JSON.stringify({
      id: 'evt_test_forged_1',
      object: 'event',
      type: 'checkout.session.completed',
      created: Math.floor(Date.now() / 1000),
      data: { object: session },
    });
    const post = (headers: Record<string, string>, raw = payload) =>
      webhookPOST(new Request('http://localhost:3000/api/webhooks/payments', { method: 'POST', headers, body: raw }), {});

    expect((await post({})).status).toBe(400);
    expect((await post({ 'stripe-signature': signedHeader(payload, 'whsec_someone_else') })).status).toBe(400);
    expect((await post({ 'stripe-signature': signedHeader(payload) }, payload.replace('"paid"', '"paid" '))).status).toBe(400);
    expect((await post({ 'stripe-signature': 't=1,v1=0000' })).status).toBe(400);
    const stale = new (await import('stripe')).default('sk_x').webhooks.generateTestHeaderString({
      payload,
      secret: WEBHOOK_SECRET,
      timestamp: Math.floor(Date.now() / 1000) - 3600,
    });
    expect((await post({ 'stripe-signature': stale })).status).toBe(400);

    expect(await db().PaymentEvent.count()).toBe(0);
    expect((await enrollmentOf(learner.id))!.status).toBe('awaiting_payment');
    expect((await db().Payment.findOne({ where: { enrollmentId: body.enrollmentId } }))!.status).toBe('pending');
  });

  it('an unknown event type answers 200, is stored once and changes nothing', async () => {
    const learner = await createUser('learner');
    await enroll(learner);
    const payload = JSON.stringify({
      id: 'evt_test_unknown_1',
      object: 'event',
      type: 'customer.created',
      data: { object: { id: 'cus_1', object: 'customer' } },
    });
    const response = await webhookPOST(
      new Request('http://localhost:3000/api/webhooks/payments', { method: 'POST', headers: { 'stripe-signature': signedHeader(payload) }, body: payload }),
      {},
    );
    expect(response.status).toBe(200);
    expect(await response.json()).toMatchObject({ received: true, handled: false });
    expect(await db().PaymentEvent.count()).toBe(1);
    expect((await enrollmentOf(learner.id))!.status).toBe('awaiting_payment');
    expect(await db().Payment.count({ where: { status: 'pending' } })).toBe(1);
  });

  it('the fake retries with backoff until the app answers 2xx', async () => {
    const learner = await createUser('learner');
    const { body } = await enroll(learner);
    h.failNextDeliveries(3);
    const before = h.hookCalls();
    expect((await payWithCard(body.url, GOOD)).status).toBe(303);
    await h.payments.settle();
    const delivery = deliveriesFor(sessionIdOf(body.url)).find((d) => d.type === 'checkout.session.completed')!;
    expect(delivery.attempts).toBe(4);
    expect(delivery.delivered).toBe(true);
    expect(h.hookCalls() - before).toBe(4);
    expect((await enrollmentOf(learner.id))!.status).toBe('active');
  });
});

describe('seats and waivers', () => {
  it('20 learners at once for a 12-seat workshop: exactly 12 seats taken and 8 clear "full" answers', async () => {
    const learners = await Promise.all(Array.from({ length: 20 }, () => createUser('learner')));
    // Each request runs as its own learner: actAs is read when getServerSession is called, so the
    // calls are started one after another (synchronously) and then run concurrently.
    const pending = learners.map((learner) => {
      actAs(learner);
      return enrollPOST(jsonRequest('/api/enrollments', { workshopId }), {});
    });
    const responses = await Promise.all(pending);
    const statuses = responses.map((r) => r.status);
    expect(statuses.filter((s) => s === 201)).toHaveLength(12);
    expect(statuses.filter((s) => s === 409)).toHaveLength(8);
    const refusals = await Promise.all(responses.filter((r) => r.status === 409).map((r) => r.json()));
    for (const r of refusals) {
      expect(r.reason).toBe('full');
      expect(r.message).toMatch(/full/);
    }
    expect(await db().Enrollment.count({ where: { workshopId, status: 'awaiting_payment' } })).toBe(12);
    expect(new Set((await db().Enrollment.findAll({ where: { workshopId } })).map((e) => e.userId)).size).toBe(12);
    expect(await seatsLeft()).toBe(0);
  });

  it('a waiver code skips payment; its uses are counted in a transaction; expired, used-up and other-course codes are refused', async () => {
    const { FeeWaiver, Course } = db();
    const refresher = (await Course.findOne({ where: { slug: 'volunteer-refresher' } }))!;
    const future = new Date(Date.now() + 7 * 86_400_000);
    await FeeWaiver.create({ code: 'CEDAR-VOLUNTEER', courseId, maxUses: 2, expiresAt: future });
    await FeeWaiver.create({ code: 'OLD-CODE', courseId: null, maxUses: 5, expiresAt: new Date(Date.now() - 1000) });
    await FeeWaiver.create({ code: 'REFRESH-ONLY', courseId: refresher.id, maxUses: 5, expiresAt: future });

    const learners = await Promise.all(Array.from({ length: 5 }, () => createUser('learner')));
    const responses = await Promise.all(
      learners.map((learner) => {
        actAs(learner);
        return enrollPOST(jsonRequest('/api/enrollments', { workshopId, waiverCode: 'cedar-volunteer' }), {});
      }),
    );
    const ok = responses.filter((r) => r.status === 201);
    expect(ok).toHaveLength(2);
    for (const r of ok) expect((await r.json()).outcome).toBe('active');
    const refused = await Promise.all(responses.filter((r) => r.status !== 201).map(async (r) => ({ status: r.status, body: await r.json() })));
    expect(refused.map((r) => r.status)).toEqual([400, 400, 400]);
    // Used up, expired, another course's or unknown: one answer, so a guess learns nothing.
    for (const r of refused) expect(r.body.fields.waiverCode[0]).toBe(WAIVER_REFUSED);
    expect((await FeeWaiver.findOne({ where: { code: 'CEDAR-VOLUNTEER' } }))!.uses).toBe(2);
    expect(await db().Enrollment.count({ where: { status: 'active', feeCents: 0 } })).toBe(2);
    expect(await db().Payment.count()).toBe(0);
    const receipt = (await db().OutboxEmail.findAll({ where: { kind: 'enrollment.receipt' } }))[0];
    expect(receipt.textBody).toContain('$0.00 (course fee waived)');

    const other = await createUser('learner');
    for (const waiverCode of ['OLD-CODE', 'REFRESH-ONLY', 'NO-SUCH-CODE']) {
      const answer = await enroll(other, { workshopId, waiverCode });
      expect(answer.status, waiverCode).toBe(400);
      expect(answer.body.message, waiverCode).toBe(WAIVER_REFUSED);
    }
    expect(await db().Enrollment.count({ where: { userId: other.id } })).toBe(0);
  });

  it('only signed-in learners enroll; a bad body is a 400; an already-active learner gets a 409', async () => {
    actAs(null);
    expect((await enrollPOST(jsonRequest('/api/enrollments', { workshopId }), {})).status).toBe(401);
    actAs(await createUser('coordinator'));
    expect((await enrollPOST(jsonRequest('/api/enrollments', { workshopId }), {})).status).toBe(403);
    const learner = await createUser('learner');
    expect((await enroll(learner, { workshopId: 'x' })).status).toBe(400);
    expect((await enroll(learner, { workshopId: 999999 })).status).toBe(404);
    const { learner: paidLearner } = await paidEnrollment();
    const again = await enroll(paidLearner);
    expect(again.status).toBe(409);
    expect(again.body.message).toMatch(/already enrolled/);
  });

  it('when the payment service is down, enrolling answers 503 and keeps no seat', async () => {
    const port = h.payments.port;
    await h.payments.close();
    try {
      const learner = await createUser('learner');
      const { status, body } = await enroll(learner);
      expect(status).toBe(503);
      expect(body.message).toMatch(/not available/);
      expect((await enrollmentOf(learner.id))!.status).toBe('withdrawn');
      expect(await seatsLeft()).toBe(12);
    } finally {
      h.payments = await startFakePayments({
        port,
        webhookUrl: h.hookUrl,
        webhookSecret: WEBHOOK_SECRET,
        apiKey: API_KEY,
        retryBaseMs: 40,
        maxRetryMs: 400,
        maxAttempts: 8,
      });
    }
  });
});
