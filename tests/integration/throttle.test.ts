import { createRequire } from 'node:module';
import { NextRequest } from 'next/server';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { POST as enrollPOST } from '@/app/api/enrollments/route';
import { POST as registerPOST } from '@/app/api/register/route';
import { ThrottledError, verifyCredentials } from '@/lib/auth/users';
import { WAIVER_ALPHABET, WAIVER_REFUSED, generateWaiverCode } from '@/lib/enrollment/waivers';
import { getEnv } from '@/lib/env';
import { take } from '@/lib/throttle';
import { db } from '@/models';
import { createCourses, createUser, resetDatabase } from '../support/db';
import { jsonRequest } from '../support/request';
import { actAs } from '../support/session';

beforeEach(async () => {
  await resetDatabase();
  actAs(null);
});

const hits = async (bucket: string) => {
  const [rows] = (await db().sequelize.query('SELECT hits FROM rate_limits WHERE bucket = ?', { replacements: [bucket] })) as [{ hits: number }[], unknown];
  return rows[0] ? Number(rows[0].hits) : 0;
};

describe('take (lib/throttle.ts)', () => {
  it('starts a new window once the old one is over, and counts concurrent attempts once each', async () => {
    const t0 = new Date('2026-12-01T10:00:00Z');
    const limit = { bucket: 't:a', max: 2, windowSeconds: 60 };
    expect((await take([limit], t0)).allowed).toBe(true);
    expect((await take([limit], new Date(t0.getTime() + 1000))).allowed).toBe(true);
    const third = await take([limit], new Date(t0.getTime() + 2000));
    expect(third).toMatchObject({ allowed: false, retryAfterSeconds: 58 });
    expect(third.counts[0].hits).toBe(3);
    const fresh = await take([limit], new Date(t0.getTime() + 61_000));
    expect(fresh.allowed).toBe(true);
    expect(fresh.counts[0].hits).toBe(1);
    // 30 at once on a new bucket: every one counted, each read back its own place (1..30).
    const many = await Promise.all(Array.from({ length: 30 }, () => take([{ bucket: 't:b', max: 100, windowSeconds: 60 }], t0)));
    expect(many.map((v) => v.counts[0].hits).sort((a, b) => a - b)).toEqual(Array.from({ length: 30 }, (_, i) => i + 1));
  });
});

describe('sign-in throttle', () => {
  it('20 parallel wrong passwords for one e-mail from one address: exactly SIGNIN_MAX_PER_ACCOUNT_ADDRESS are checked, the rest refused', async () => {
    const max = getEnv().SIGNIN_MAX_PER_ACCOUNT_ADDRESS;
    expect(max).toBe(5);
    await createUser('learner', { email: 'quince@test.example' });
    const outcomes = await Promise.all(
      Array.from({ length: 20 }, (_, i) =>
        verifyCredentials('quince@test.example', `wrong-guess-${i}`, '198.51.100.20').then(
          (user) => (user === null ? 'checked' : 'signed-in'),
          (error) => (error instanceof ThrottledError ? 'throttled' : `error: ${error}`),
        ),
      ),
    );
    expect(outcomes.filter((o) => o === 'checked')).toHaveLength(max);
    expect(outcomes.filter((o) => o === 'throttled')).toHaveLength(20 - max);
    expect(await hits('signin:pair:198.51.100.20|quince@test.example')).toBe(20);
    // The right password from that address is refused too (counted before it is checked) …
    await expect(verifyCredentials('quince@test.example', 'test-password-123', '198.51.100.20')).rejects.toBeInstanceOf(ThrottledError);
    // … but the owner on another network is not locked out.
    expect(await verifyCredentials('quince@test.example', 'test-password-123', '203.0.113.5', { sleep: async () => undefined })).not.toBeNull();
  });

  it('a stranger spraying one account from many addresses slows it down but cannot lock its owner out', async () => {
    const env = getEnv();
    await createUser('learner', { email: 'sorrel@test.example' });
    for (let i = 0; i < 25; i++)
      expect(await verifyCredentials('sorrel@test.example', 'wrong-guess', `192.0.2.${i}`, { sleep: async () => undefined })).toBeNull();
    const waits: number[] = [];
    const owner = await verifyCredentials('sorrel@test.example', 'test-password-123', '203.0.113.77', { sleep: async (ms) => void waits.push(ms) });
    expect(owner).toMatchObject({ email: 'sorrel@test.example' });
    // 26 attempts against a slowdown after 10: the owner waited, at most SIGNIN_SLOW_MAX_SECONDS.
    expect(waits).toEqual([env.SIGNIN_SLOW_MAX_SECONDS * 1000]);
  });

  it('counts per address across accounts (SIGNIN_MAX_PER_ADDRESS), and a right password takes its attempt back', async () => {
    const max = getEnv().SIGNIN_MAX_PER_ADDRESS;
    const user = await createUser('learner', { email: 'yarrow@test.example' });
    // A class signing in on one network: right passwords never use the address up.
    for (let i = 0; i < max + 5; i++) expect(await verifyCredentials(user.email, 'test-password-123', '198.51.100.30')).not.toBeNull();
    expect(await hits('signin:address:198.51.100.30')).toBe(0);
    for (let i = 0; i < max; i++) expect(await verifyCredentials(`nobody${i}@test.example`, 'wrong-guess', '198.51.100.30')).toBeNull();
    await expect(verifyCredentials(user.email, 'test-password-123', '198.51.100.30')).rejects.toBeInstanceOf(ThrottledError);
    expect(await verifyCredentials(user.email, 'test-password-123', '198.51.100.31')).not.toBeNull();
  });

  describe('through next-auth', () => {
    // next-auth's route handler reads cookies() and headers() from next/headers; answered from the request sent.
    let current: Request | null = null;
    const nextHeaders = createRequire(import.meta.url)('next/headers') as { headers: unknown; cookies: unknown };
    const real = { headers: nextHeaders.headers, cookies: nextHeaders.cookies };
    const cookiesOf = () =>
      (current?.headers.get('cookie') ?? '')
        .split(/;\s*/)
        .filter(Boolean)
        .map((pair) => ({ name: pair.slice(0, pair.indexOf('=')), value: decodeURIComponent(pair.slice(pair.indexOf('=') + 1)) }));
    beforeAll(() => {
      nextHeaders.headers = async () => new Headers(current?.headers);
      nextHeaders.cookies = async () => ({ getAll: cookiesOf, get: (n: string) => cookiesOf().find((c) => c.name === n) });
    });
    afterAll(() => Object.assign(nextHeaders, real));

    it('answers a throttled sign-in with 429, Retry-After and the JSON message, keeping the url for the form', async () => {
      const { GET, POST } = (await import('@/app/api/auth/[...nextauth]/route')) as unknown as Record<
        'GET' | 'POST',
        (r: Request, c: { params: Promise<{ nextauth: string[] }> }) => Promise<Response>
      >;
      current = new NextRequest('http://localhost:3000/api/auth/csrf');
      const csrf = await GET(current, { params: Promise.resolve({ nextauth: ['csrf'] }) });
      const csrfCookie = csrf.headers
        .getSetCookie()
        .find((c) => c.startsWith('next-auth.csrf-token='))!
        .split(';')[0];
      const { csrfToken } = await csrf.json();
      await createUser('learner', { email: 'tansy@test.example' });
      const attempt = async (password: string) => {
        const body = new URLSearchParams({ csrfToken, email: 'tansy@test.example', password, json: 'true' }).toString();
        current = new NextRequest('http://localhost:3000/api/auth/callback/credentials', {
          method: 'POST',
          headers: { cookie: csrfCookie, 'content-type': 'application/x-www-form-urlencoded', 'x-forwarded-for': '198.51.100.40' },
          body,
        });
        return POST(current, { params: Promise.resolve({ nextauth: ['callback', 'credentials'] }) });
      };
      for (let i = 0; i < getEnv().SIGNIN_MAX_PER_ACCOUNT_ADDRESS; i++) expect((await attempt(`wrong-guess-${i}`)).status).toBe(401);
      const refused = await attempt('test-password-123');
      expect(refused.status).toBe(429);
      const retryAfter = Number(refused.headers.get('retry-after'));
      expect(retryAfter).toBeGreaterThan(0);
      expect(retryAfter).toBeLessThanOrEqual(getEnv().SIGNIN_WINDOW_MINUTES * 60);
      const answer = await refused.json();
      expect(answer).toMatchObject({ error: 'rate_limit', message: expect.stringMatching(/Too many sign-in attempts/), retryAfterSeconds: retryAfter });
      expect(new URL(answer.url).searchParams.get('error')).toBe('Throttled');
    });
  });
});

describe('registration throttle', () => {
  const register = (i: number, address: string) =>
    registerPOST(
      jsonRequest(
        '/api/register',
        { name: `Flood ${i}`, email: `flood${i}-${address}@test.example`, password: 'a long pass phrase' },
        { headers: { 'content-type': 'application/json', 'x-forwarded-for': address } },
      ),
      {},
    );

  it('lets REGISTER_MAX_PER_ADDRESS accounts a window come from one address (a class on one Wi-Fi), then answers 429 with Retry-After', async () => {
    const max = getEnv().REGISTER_MAX_PER_ADDRESS;
    expect(max).toBe(30);
    // Four waves of ten at once: counted exactly whatever the order of arrival.
    const statuses: number[] = [];
    for (let wave = 0; wave < (max + 10) / 10; wave++) {
      statuses.push(...(await Promise.all(Array.from({ length: 10 }, (_, i) => register(wave * 10 + i, '198.51.100.50').then((r) => r.status)))));
    }
    expect(statuses.filter((s) => s === 201)).toHaveLength(max);
    expect(statuses.filter((s) => s !== 201)).toEqual(Array(10).fill(429));
    expect(await db().User.count()).toBe(max);
    const over = await register(999, '198.51.100.50');
    expect(over.status).toBe(429);
    expect(Number(over.headers.get('retry-after'))).toBeGreaterThan(3000);
    expect((await over.json()).message).toMatch(/Too many new accounts/);
    // Another address is not affected.
    expect((await register(1000, '198.51.100.51')).status).toBe(201);
  });

  it('does not count a request that fails validation', async () => {
    const bad = await registerPOST(
      jsonRequest(
        '/api/register',
        { name: '', email: 'nope', password: 'x' },
        { headers: { 'content-type': 'application/json', 'x-forwarded-for': '198.51.100.52' } },
      ),
      {},
    );
    expect(bad.status).toBe(400);
    expect(await hits('register:198.51.100.52')).toBe(0);
  });
});

describe('fee waiver codes', () => {
  let workshopId: number;
  beforeEach(async () => {
    const { flagship } = await createCourses();
    const instructor = await createUser('instructor');
    const startsAt = new Date(Date.now() + 10 * 86_400_000);
    workshopId = (
      await db().Workshop.create({
        courseId: flagship.id,
        instructorId: instructor.id,
        startsAt,
        endsAt: new Date(startsAt.getTime() + 5 * 3600_000),
        timeZone: 'America/Denver',
        place: 'Grange Hall',
        seats: 12,
      })
    ).id;
    await db().FeeWaiver.create({ code: 'CEDAR-GOOD-CODE', courseId: flagship.id, maxUses: 50, expiresAt: new Date(Date.now() + 7 * 86_400_000) });
  });

  const enroll = async (user: Awaited<ReturnType<typeof createUser>>, waiverCode: string, address = '198.51.100.60') => {
    actAs(user);
    const response = await enrollPOST(
      jsonRequest('/api/enrollments', { workshopId, waiverCode }, { headers: { 'content-type': 'application/json', 'x-forwarded-for': address } }),
      {},
    );
    return { status: response.status, retryAfter: response.headers.get('retry-after'), body: await response.json() };
  };

  it('40 wrong codes in a row from one learner: WAIVER_MAX_PER_ACCOUNT answers of one message, then 429 with Retry-After', async () => {
    const max = getEnv().WAIVER_MAX_PER_ACCOUNT;
    expect(max).toBe(10);
    const learner = await createUser('learner');
    const answers = [];
    for (let i = 0; i < 40; i++) answers.push(await enroll(learner, `GUESS-${String(i).padStart(4, '0')}`, `198.51.100.${100 + i}`));
    expect(answers.slice(0, max).map((a) => a.status)).toEqual(Array(max).fill(400));
    expect(new Set(answers.slice(0, max).map((a) => a.body.message))).toEqual(new Set([WAIVER_REFUSED]));
    expect(answers.slice(max).map((a) => a.status)).toEqual(Array(40 - max).fill(429));
    expect(Number(answers[39].retryAfter)).toBeGreaterThan(0);
    expect(answers[39].body.message).toMatch(/Too many wrong waiver codes/);
    // Even the right code waits for the window now, and nothing was enrolled.
    expect((await enroll(learner, 'CEDAR-GOOD-CODE', '198.51.100.99')).status).toBe(429);
    expect(await db().Enrollment.count()).toBe(0);
  });

  it('counts wrong codes per client address across accounts (WAIVER_MAX_PER_ADDRESS); a right code takes its attempt back', async () => {
    const max = getEnv().WAIVER_MAX_PER_ADDRESS;
    const learners = await Promise.all(Array.from({ length: Math.ceil(max / 5) + 1 }, () => createUser('learner')));
    let sent = 0;
    for (const learner of learners.slice(0, -1))
      for (let i = 0; i < 5 && sent < max; i++, sent++) expect((await enroll(learner, `WRONG-${sent}`)).status).toBe(400);
    const fresh = learners[learners.length - 1];
    expect((await enroll(fresh, 'WRONG-LAST')).status).toBe(429);
    // A right code from another address works, and is not counted as a failure.
    expect((await enroll(fresh, 'cedar-good-code', '198.51.100.61')).status).toBe(201);
    expect(await hits(`waiver:account:${fresh.id}`)).toBe(1);
    expect(await hits('waiver:address:198.51.100.61')).toBe(0);
  });

  it('checks the code before taking the workshop row lock: a wrong code is answered while another request holds it', async () => {
    const learner = await createUser('learner');
    const { sequelize } = db();
    const holder = await sequelize.transaction();
    try {
      await sequelize.query('SELECT id FROM workshops WHERE id = ? FOR UPDATE', { replacements: [workshopId], transaction: holder });
      const started = Date.now();
      const answer = await enroll(learner, 'NOT-A-CODE');
      expect(answer.status).toBe(400);
      expect(answer.body.message).toBe(WAIVER_REFUSED);
      expect(Date.now() - started).toBeLessThan(3000);
    } finally {
      await holder.rollback();
    }
  });

  it('generates codes with 12 random characters after the prefix, from an alphabet without look-alikes', () => {
    expect(WAIVER_ALPHABET).not.toMatch(/[01ILO]/);
    const codes = Array.from({ length: 2000 }, generateWaiverCode);
    for (const code of codes) expect(code).toMatch(/^BRINE-(?:[A-HJKMNP-Z2-9]{4}-){2}[A-HJKMNP-Z2-9]{4}$/);
    expect(new Set(codes).size).toBe(codes.length);
    // Every character of the alphabet turns up (24,000 draws of 31): the draw covers it.
    expect([...new Set(codes.flatMap((c) => c.slice('BRINE-'.length).replace(/-/g, '').split('')))].sort().join('')).toBe([...WAIVER_ALPHABET].sort().join(''));
  });
});
