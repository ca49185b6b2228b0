import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import yauzl from 'yauzl';
import { DELETE as deleteAccount } from '@/app/api/account/route';
import { POST as confirmationPOST } from '@/app/api/account/confirmation/route';
import { POST as emailPOST } from '@/app/api/account/email/route';
import { GET as exportGET } from '@/app/api/account/export/route';
import { POST as namePOST } from '@/app/api/account/name/route';
import { POST as passwordPOST } from '@/app/api/account/password/route';
import { POST as signOutEverywherePOST } from '@/app/api/account/sign-out-everywhere/route';
import { POST as completePOST } from '@/app/api/password-reset/complete/route';
import { POST as resetPOST } from '@/app/api/password-reset/route';
import { POST as enrollPOST } from '@/app/api/enrollments/route';
import { confirmEmailChange } from '@/lib/account/profile';
import { resetLinkState } from '@/lib/account/reset';
import { hashToken } from '@/lib/account/tokens';
import { requireRole } from '@/lib/auth/guard';
import { verifyCredentials } from '@/lib/auth/users';
import { issueCertificate } from '@/lib/certificates/issue';
import { getStorage } from '@/lib/storage';
import { db } from '@/models';
import { createCourses, createUser, resetDatabase } from '../support/db';
import { eligibleEnrollment } from '../support/certificate-fixtures';
import { makeJpeg, useTemporaryStorage } from '../support/practical-fixtures';
import { jsonRequest } from '../support/request';
import { actAs } from '../support/session';

const post = (url: string, body: unknown, address = '203.0.113.9') =>
  jsonRequest(url, body, { headers: { 'content-type': 'application/json', 'x-forwarded-for': address } });

/** The newest queued message to an address whose subject matches, and the token of its link. */
async function mailTo(to: string, subject: RegExp) {
  const rows = await db().OutboxEmail.findAll({ where: { toAddress: to }, order: [['id', 'DESC']] });
  const row = rows.find((r) => subject.test(r.subject));
  if (!row) throw new Error(`no message to ${to} matching ${subject}`);
  return { row, token: /[?&]token=([^\s&]+)/.exec(row.textBody)?.[1] ?? null };
}

let storage: ReturnType<typeof useTemporaryStorage>;
beforeAll(() => {
  storage = useTemporaryStorage();
});
afterAll(() => storage.cleanup());
beforeEach(async () => {
  await resetDatabase();
  actAs(null);
});

/** A learner who has done everything the flagship course asks (confirmed, paid, read, passed, approved). */
async function completeEverything() {
  const { flagship } = await createCourses();
  const { enrollmentId, userId } = await eligibleEnrollment(flagship);
  const user = (await db().User.findByPk(userId))!;
  return { learner: { id: user.id, email: user.email, name: user.name, roles: user.roles }, enrollment: { id: enrollmentId } };
}

describe('password reset by e-mail', () => {
  it('sends a single-use link, stores only its hash, sets the password once and ends every session', async () => {
    const learner = await createUser('learner', { email: 'rowan@test.example' });
    actAs(learner);
    await expect(requireRole()).resolves.toMatchObject({ id: learner.id });

    const asked = await resetPOST(post('/api/password-reset', { email: 'Rowan@Test.example' }), {});
    expect(asked.status).toBe(202);
    const { row, token } = await mailTo('rowan@test.example', /^Set a new Brinewright password$/);
    expect(row.textBody).toContain('/reset-password?token=');
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/);
    const stored = await db().AccountToken.findOne({ where: { userId: learner.id } });
    // Only the SHA-256 of the token is in the database.
    expect(stored!.tokenHash).toBe(hashToken(token!));
    expect(stored!.tokenHash).not.toContain(token!);
    expect(stored!.expiresAt.getTime() - stored!.createdAt.getTime()).toBe(60 * 60 * 1000);
    expect(await resetLinkState(token!)).toBe('valid');

    const done = await completePOST(post('/api/password-reset/complete', { token, password: 'a brand new pass phrase' }), {});
    expect(done.status).toBe(200);
    // The session made before the reset is over; the old password no longer works, the new one does.
    await expect(requireRole()).rejects.toMatchObject({ status: 401 });
    expect(await verifyCredentials('rowan@test.example', 'test-password-123', 'reset-test')).toBeNull();
    expect(await verifyCredentials('rowan@test.example', 'a brand new pass phrase', 'reset-test')).toMatchObject({ id: learner.id, sessionVersion: 1 });
    expect(await db().AuditLog.count({ where: { action: 'user.password_reset' } })).toBe(1);
    await mailTo('rowan@test.example', /^Your Brinewright password was changed$/);

    // Used twice: refused, and says so.
    const again = await completePOST(post('/api/password-reset/complete', { token, password: 'yet another pass phrase' }), {});
    expect(again.status).toBe(409);
    expect(await again.json()).toMatchObject({ link: 'used', message: 'This link has already been used, or a newer one replaced it. Ask for a new one.' });
    expect(await resetLinkState(token!)).toBe('used');
    expect(await verifyCredentials('rowan@test.example', 'yet another pass phrase', 'reset-test')).toBeNull();
  });

  it('refuses an expired link and says so', async () => {
    const learner = await createUser('learner', { email: 'sorrel@test.example' });
    await resetPOST(post('/api/password-reset', { email: 'sorrel@test.example' }), {});
    const { token } = await mailTo('sorrel@test.example', /^Set a new Brinewright password$/);
    await db().AccountToken.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { userId: learner.id } });
    expect(await resetLinkState(token!)).toBe('expired');
    const response = await completePOST(post('/api/password-reset/complete', { token, password: 'a brand new pass phrase' }), {});
    expect(response.status).toBe(409);
    expect(await response.json()).toMatchObject({ link: 'expired' });
    expect(await verifyCredentials('sorrel@test.example', 'test-password-123', 'reset-test')).toMatchObject({ id: learner.id });
  });

  it('gives an unknown address the same answer and sends nothing', async () => {
    await createUser('learner', { email: 'known@test.example' });
    const known = await resetPOST(post('/api/password-reset', { email: 'known@test.example' }), {});
    const unknown = await resetPOST(post('/api/password-reset', { email: 'nobody@test.example' }), {});
    expect(unknown.status).toBe(known.status);
    expect(await unknown.json()).toEqual(await known.json());
    expect(await db().OutboxEmail.count({ where: { toAddress: 'nobody@test.example' } })).toBe(0);
    expect(await db().AccountToken.count()).toBe(1);
  });

  it('lets only the newest link work, and refuses a made-up token and a weak password', async () => {
    await createUser('learner', { email: 'tansy@test.example' });
    await resetPOST(post('/api/password-reset', { email: 'tansy@test.example' }), {});
    const first = (await mailTo('tansy@test.example', /^Set a new/)).token;
    await resetPOST(post('/api/password-reset', { email: 'tansy@test.example' }), {});
    const second = (await mailTo('tansy@test.example', /^Set a new/)).token;
    expect(second).not.toBe(first);
    expect(await resetLinkState(first!)).toBe('used');
    expect(await resetLinkState('x'.repeat(43))).toBe('invalid');
    const weak = await completePOST(post('/api/password-reset/complete', { token: second, password: 'short' }), {});
    expect(weak.status).toBe(400);
    expect((await weak.json()).fields.password[0]).toBe('Use at least 10 characters for your password.');
    expect(await resetLinkState(second!)).toBe('valid');
  });

  it('throttles requests per address typed (known or not) and per client address', async () => {
    // RESET_MAX_PER_ACCOUNT is 3 (lib/env.ts default): the fourth request for one address within the hour is refused.
    await createUser('learner', { email: 'yarrow@test.example' });
    for (let i = 0; i < 3; i++)
      expect((await resetPOST(post('/api/password-reset', { email: 'yarrow@test.example' }, `198.51.100.${i}`), {})).status).toBe(202);
    const refused = await resetPOST(post('/api/password-reset', { email: 'yarrow@test.example' }, '198.51.100.50'), {});
    expect(refused.status).toBe(429);
    expect(Number(refused.headers.get('retry-after'))).toBeGreaterThan(0);
    expect(await db().OutboxEmail.count({ where: { toAddress: 'yarrow@test.example' } })).toBe(3);
    for (let i = 0; i < 3; i++) await resetPOST(post('/api/password-reset', { email: 'ghost@test.example' }, `198.51.101.${i}`), {});
    expect((await resetPOST(post('/api/password-reset', { email: 'ghost@test.example' }, '198.51.101.50'), {})).status).toBe(429);
    // RESET_MAX_PER_ADDRESS is 10: the eleventh request from one client address, for any addresses, is refused.
    for (let i = 0; i < 10; i++) expect((await resetPOST(post('/api/password-reset', { email: `p${i}@test.example` }, '192.0.2.77'), {})).status).toBe(202);
    expect((await resetPOST(post('/api/password-reset', { email: 'p99@test.example' }, '192.0.2.77'), {})).status).toBe(429);
  });
});

describe('the account page routes', () => {
  it('changes the password only with the present one, and ends the sessions', async () => {
    const learner = await createUser('learner');
    actAs(learner);
    const wrong = await passwordPOST(post('/api/account/password', { currentPassword: 'not-my-password', newPassword: 'a brand new pass phrase' }), {});
    expect(wrong.status).toBe(403);
    expect((await wrong.json()).fields.currentPassword[0]).toBe('That is not your present password.');
    await expect(requireRole()).resolves.toMatchObject({ id: learner.id });
    const ok = await passwordPOST(post('/api/account/password', { currentPassword: 'test-password-123', newPassword: 'a brand new pass phrase' }), {});
    expect(ok.status).toBe(200);
    await expect(requireRole()).rejects.toMatchObject({ status: 401 });
    expect(await verifyCredentials(learner.email, 'a brand new pass phrase', 'account-test')).toMatchObject({ id: learner.id });
    await mailTo(learner.email, /^Your Brinewright password was changed$/);
  });

  it('changes the e-mail address only once the new address confirms, and tells the old one', async () => {
    const learner = await createUser('learner', { email: 'old@test.example' });
    actAs(learner);
    const asked = await emailPOST(post('/api/account/email', { newEmail: 'New@Test.example', currentPassword: 'test-password-123' }), {});
    expect(asked.status).toBe(202);
    const notice = await mailTo('old@test.example', /^A change of your Brinewright e-mail address was asked for$/);
    expect(notice.row.textBody).toContain('new@test.example');
    const { token } = await mailTo('new@test.example', /^Confirm your new e-mail address/);
    // Not confirmed: nothing has changed, and the session goes on.
    expect((await db().User.findByPk(learner.id))!.email).toBe('old@test.example');
    await expect(requireRole()).resolves.toMatchObject({ id: learner.id });
    expect(await verifyCredentials('new@test.example', 'test-password-123', 'account-test')).toBeNull();

    expect(await confirmEmailChange(token!)).toBe('changed');
    const row = (await db().User.findByPk(learner.id))!;
    expect(row.email).toBe('new@test.example');
    expect(row.emailVerifiedAt).toBeInstanceOf(Date);
    await expect(requireRole()).rejects.toMatchObject({ status: 401 });
    expect(await verifyCredentials('new@test.example', 'test-password-123', 'account-test')).toMatchObject({ id: learner.id });
    expect(await confirmEmailChange(token!)).toBe('used');
  });

  it('refuses an address another account uses, and an e-mail change link that expired', async () => {
    await createUser('learner', { email: 'taken@test.example' });
    const learner = await createUser('learner', { email: 'mine@test.example' });
    actAs(learner);
    const taken = await emailPOST(post('/api/account/email', { newEmail: 'taken@test.example', currentPassword: 'test-password-123' }), {});
    expect(taken.status).toBe(409);
    await emailPOST(post('/api/account/email', { newEmail: 'later@test.example', currentPassword: 'test-password-123' }), {});
    const { token } = await mailTo('later@test.example', /^Confirm your new e-mail address/);
    await db().AccountToken.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { userId: learner.id } });
    expect(await confirmEmailChange(token!)).toBe('expired');
    expect((await db().User.findByPk(learner.id))!.email).toBe('mine@test.example');
  });

  it('signs out everywhere only when the body says so', async () => {
    const learner = await createUser('learner');
    actAs(learner);
    expect((await signOutEverywherePOST(post('/api/account/sign-out-everywhere', {}), {})).status).toBe(400);
    await expect(requireRole()).resolves.toMatchObject({ id: learner.id });
    expect((await signOutEverywherePOST(post('/api/account/sign-out-everywhere', { confirm: true }), {})).status).toBe(200);
    await expect(requireRole()).rejects.toMatchObject({ status: 401 });
    expect(await db().AuditLog.count({ where: { action: 'user.signed_out_everywhere' } })).toBe(1);
  });

  it('changes the name for future certificates and asks for a reissue when one was issued', async () => {
    const { learner, enrollment } = await completeEverything();
    actAs(learner);
    const coordinator = await createUser('coordinator');
    const issued = await issueCertificate(enrollment.id, coordinator.id);
    expect(issued.outcome).toBe('issued');
    const response = await namePOST(post('/api/account/name', { name: 'Marigold Q. Fenn' }), {});
    expect(response.status).toBe(200);
    expect((await response.json()).reissueAdvice).toMatch(/ask the program coordinator for a reissue/);
    expect((await db().User.findByPk(learner.id))!.name).toBe('Marigold Q. Fenn');
    expect((await db().Certificate.findOne({ where: { userId: learner.id } }))!.holderName).toBe(learner.name);
  });

  it('refuses to enroll or certify an unconfirmed address with a 403 that says how, and sends the confirmation again (throttled)', async () => {
    const learner = await createUser('learner', { confirmed: false });
    actAs(learner);
    const refused = await enrollPOST(post('/api/enrollments', { workshopId: 1 }), {});
    expect(refused.status).toBe(403);
    const body = await refused.json();
    expect(body.reason).toBe('email_unconfirmed');
    expect(body.message).toMatch(/confirm your e-mail address first/i);
    // ACCOUNT_MAIL_MAX_PER_ACCOUNT is 5 (lib/env.ts default).
    for (let i = 0; i < 5; i++) expect((await confirmationPOST(post('/api/account/confirmation', {}), {})).status).toBe(202);
    expect((await confirmationPOST(post('/api/account/confirmation', {}), {})).status).toBe(429);
    const { row } = await mailTo(learner.email, /^Confirm your e-mail address for Brinewright$/);
    expect(row.textBody).toContain('/confirm-email?token=');

    const { learner: done, enrollment } = await completeEverything();
    await db().User.update({ emailVerifiedAt: null }, { where: { id: done.id } });
    const outcome = await issueCertificate(enrollment.id, null);
    expect(outcome).toMatchObject({ outcome: 'not_eligible', missing: ['email'] });
    const confirmed = await createUser('learner');
    actAs(confirmed);
    expect((await confirmationPOST(post('/api/account/confirmation', {}), {})).status).toBe(409);
  });
});

/** The names and bytes of every file in a ZIP. */
function unzip(buffer: Buffer): Promise<Map<string, Buffer>> {
  return new Promise((resolve, reject) => {
    yauzl.fromBuffer(buffer, { lazyEntries: true }, (error, zip) => {
      if (error || !zip) return reject(error);
      const files = new Map<string, Buffer>();
      zip.on('entry', (entry: yauzl.Entry) => {
        zip.openReadStream(entry, (e, stream) => {
          if (e || !stream) return reject(e);
          const chunks: Buffer[] = [];
          stream.on('data', (c: Buffer) => chunks.push(c));
          stream.on('end', () => {
            files.set(entry.fileName, Buffer.concat(chunks));
            zip.readEntry();
          });
        });
      });
      zip.on('end', () => resolve(files));
      zip.readEntry();
    });
  });
}

describe('your data', () => {
  it('exports profile, enrollments, payments, quiz attempts, practicals with their photos and certificates as one ZIP', async () => {
    const { learner, enrollment, photoKey } = await exportFixture();
    actAs(learner);
    const response = await exportGET(new Request('http://localhost:3000/api/account/export'), {});
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toBe('application/zip');
    expect(response.headers.get('content-disposition')).toMatch(/^attachment; filename="brinewright-my-data-\d{4}-\d{2}-\d{2}\.zip"$/);
    const files = await unzip(Buffer.from(await response.arrayBuffer()));
    const json = (name: string) => JSON.parse(files.get(name)!.toString('utf8'));
    expect(json('profile.json')).toMatchObject({ id: learner.id, email: learner.email, name: learner.name });
    expect(JSON.stringify(json('profile.json'))).not.toContain('$2');
    expect(json('enrollments.json').map((e: { id: number }) => e.id)).toContain(enrollment.id);
    expect(json('payments.json')).toEqual([expect.objectContaining({ enrollmentId: enrollment.id, amountCents: 4500, status: 'paid' })]);
    expect(json('quizAttempts.json').length).toBeGreaterThan(0);
    const practicals = json('practicals.json');
    expect(practicals).toHaveLength(1);
    const photoFile = practicals[0].photos[0].file;
    expect(photoFile).toMatch(/^photos\/\d+\.jpg$/);
    const stored = await getStorage().get(photoKey);
    expect(files.get(photoFile)!.equals(stored!.data)).toBe(true);
    expect(json('certificates.json')).toEqual([expect.objectContaining({ holderName: learner.name })]);
    // Someone else's export holds none of it.
    const other = await createUser('learner');
    actAs(other);
    const theirs = await unzip(Buffer.from(await (await exportGET(new Request('http://localhost:3000/api/account/export'), {})).arrayBuffer()));
    expect(JSON.parse(theirs.get('payments.json')!.toString())).toEqual([]);
    expect([...theirs.keys()].filter((k) => k.startsWith('photos/'))).toEqual([]);
  });

  it('deletes an account after the password: personal data and photos go, payments, certificates and the audit log stay under a pseudonym', async () => {
    const { learner, enrollment, photoKey } = await exportFixture();
    actAs(learner);
    const wrong = await deleteAccount(jsonRequest('/api/account', { currentPassword: 'nope-nope-nope', confirm: 'DELETE' }, { method: 'DELETE' }), {});
    expect(wrong.status).toBe(403);
    const unconfirmed = await deleteAccount(jsonRequest('/api/account', { currentPassword: 'test-password-123', confirm: 'yes' }, { method: 'DELETE' }), {});
    expect(unconfirmed.status).toBe(400);
    const auditBefore = await db().AuditLog.count();

    const done = await deleteAccount(jsonRequest('/api/account', { currentPassword: 'test-password-123', confirm: 'DELETE' }, { method: 'DELETE' }), {});
    expect(done.status).toBe(200);
    const row = (await db().User.findByPk(learner.id))!;
    expect({ name: row.name, email: row.email }).toEqual({ name: `Deleted account #${learner.id}`, email: `deleted-${learner.id}@erased.invalid` });
    expect(row.erasedAt).toBeInstanceOf(Date);
    await expect(requireRole()).rejects.toMatchObject({ status: 401 });
    expect(await verifyCredentials(learner.email, 'test-password-123', 'erase-test')).toBeNull();
    // Removed.
    expect(await db().QuizAttempt.count({ where: { userId: learner.id } })).toBe(0);
    expect(await db().LessonProgress.count({ where: { userId: learner.id } })).toBe(0);
    expect(await db().Practical.count({ where: { userId: learner.id } })).toBe(0);
    expect(await db().PracticalPhoto.count({ where: { userId: learner.id } })).toBe(0);
    expect(await getStorage().get(photoKey)).toBeNull();
    expect(await db().OutboxEmail.count({ where: { toAddress: learner.email } })).toBe(0);
    // Kept, under the pseudonym.
    expect(await db().Payment.count({ where: { enrollmentId: enrollment.id, status: 'paid' } })).toBe(1);
    expect(await db().Enrollment.count({ where: { id: enrollment.id } })).toBe(1);
    const certificate = (await db().Certificate.findOne({ where: { userId: learner.id } }))!;
    expect(certificate.holderName).toBe(`Deleted account #${learner.id}`);
    expect(await db().AuditLog.count()).toBe(auditBefore + 1);
    expect(await db().AuditLog.count({ where: { actorId: learner.id, action: 'user.erased' } })).toBe(1);
  });

  it('leaves staff accounts to an admin, also one that is a learner too', async () => {
    for (const roles of [['instructor'], ['learner', 'instructor'], ['learner', 'coordinator']] as const) {
      const person = await createUser(roles);
      actAs(person);
      const response = await deleteAccount(jsonRequest('/api/account', { currentPassword: 'test-password-123', confirm: 'DELETE' }, { method: 'DELETE' }), {});
      expect(response.status, roles.join(',')).toBe(403);
      expect((await db().User.findByPk(person.id))?.erasedAt ?? null).toBeNull();
    }
  });
});

/** A learner with everything: progress, quizzes, a paid enrollment, an approved practical with a photo, an issued certificate. */
async function exportFixture() {
  const { learner, enrollment } = await completeEverything();
  const coordinator = await createUser('coordinator');
  expect((await issueCertificate(enrollment.id, coordinator.id)).outcome).toBe('issued');
  const practical = (await db().Practical.findOne({ where: { enrollmentId: enrollment.id } }))!;
  const photoKey = `photos/export-${learner.id}.jpg`;
  const jpeg = await makeJpeg(64, 48);
  await getStorage().put(photoKey, jpeg, 'image/jpeg');
  await getStorage().put(`thumbs/export-${learner.id}.jpg`, jpeg, 'image/jpeg');
  await db().PracticalPhoto.create({
    practicalId: practical.id,
    userId: learner.id,
    storageKey: photoKey,
    thumbnailKey: `thumbs/export-${learner.id}.jpg`,
    contentType: 'image/jpeg',
    width: 64,
    height: 48,
    bytes: jpeg.length,
  });
  return { learner, enrollment, photoKey };
}
