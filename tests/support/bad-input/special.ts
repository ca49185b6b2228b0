// Bad requests for the three route handlers that do not read a JSON body through readJson():
// next-auth's catch-all (forms, cookies, callback URLs), the payment webhook (raw body + signature)
// and the photo upload (multipart).
import fc from 'fast-check';
import {
  badQuery,
  brokenObject,
  headerValue,
  hugeString,
  malformedJson,
  nastyNumber,
  nastyString,
  requiredBad,
  wrongContentType,
  wrongValue,
  type FieldSpec,
} from './arbitraries';

export type RawRequest = {
  params?: Record<string, string | string[]>;
  query: [string, string][];
  headers: Record<string, string>;
  body: string | Uint8Array | FormData | null;
  /** null: none (or FormData's own). */
  contentType: string | null;
  kind: string;
};

/** Percent-encodes any string, lone surrogates included (as U+FFFD, as a browser would). */
export const encode = (s: string) => encodeURIComponent(s.toWellFormed());

// ---- next-auth ---------------------------------------------------------------------------------------

export type NextAuthContext = { csrfToken: string; csrfCookie: string; sessionCookies: string[]; knownEmail: string };

// A catch-all gets at least one non-empty segment from Next (/api/auth alone is not this route).
const ACTIONS: string[][] = [
  ['signin'],
  ['signin', 'credentials'],
  ['signin', 'nope'],
  ['callback'],
  ['callback', 'credentials'],
  ['callback', 'nope'],
  ['session'],
  ['csrf'],
  ['providers'],
  ['signout'],
  ['error'],
  ['verify-request'],
  ['_log'],
  ['webauthn-options'],
];

export function nextAuthRequests(ctx: NextAuthContext, method: 'GET' | 'POST'): fc.Arbitrary<RawRequest> {
  const action = fc.oneof(
    { weight: 3, arbitrary: fc.constantFrom(...ACTIONS) },
    {
      weight: 1,
      arbitrary: fc.array(
        nastyString.filter((s) => s !== ''),
        { minLength: 1, maxLength: 3 },
      ),
    },
  );
  const callbackUrl = fc.oneof(
    nastyString,
    fc.constantFrom(
      '/pantry',
      'http://localhost:3000/desk',
      'javascript:alert(1)',
      'data:text/html,x',
      '//evil.example/x',
      'http://[::1',
      'ftp://x',
      'http://',
      '/\\evil.example',
      'http://evil.example',
    ),
  );
  const cookie = fc.oneof(
    fc.constant(ctx.csrfCookie),
    fc.constantFrom(...ctx.sessionCookies),
    nastyString.map((v) => `next-auth.session-token=${encode(v)}`),
    nastyString.map((v) => `next-auth.csrf-token=${encode(v)}`),
    callbackUrl.map((v) => `next-auth.callback-url=${encode(v)}`),
    fc.tuple(nastyString, nastyString).map(([k, v]) => `${encode(k) || 'k'}=${encode(v)}`),
  );
  const goodOrBadCallback = fc.oneof({ weight: 3, arbitrary: fc.constantFrom('/pantry', 'http://localhost:3000/desk') }, { weight: 1, arbitrary: callbackUrl });
  const query = fc
    .tuple(
      badQuery(['error', 'csrf', 'json', 'nextauth'], { error: fc.constantFrom('CredentialsSignin', 'Throttled', 'Configuration') }),
      fc.array(goodOrBadCallback, { maxLength: 2 }),
    )
    .map(([q, callbacks]) => [...q, ...callbacks.map((c): [string, string] => ['callbackUrl', c])]);
  const form = fc.record(
    {
      csrfToken: fc.oneof(fc.constant(ctx.csrfToken), nastyString),
      email: fc.oneof(nastyString, fc.constantFrom(ctx.knownEmail, ctx.knownEmail.toUpperCase(), 'nobody@test.example')),
      // Never the fixture's real password: a sign-in that succeeds is not bad input.
      password: fc.oneof(nastyString, fc.constantFrom('wrong-password-1', 'x'.repeat(201))).filter((p) => p !== 'test-password-123'),
      // Mostly a good one, so that the rest of the form reaches next-auth's own checks.
      callbackUrl: goodOrBadCallback,
      json: fc.oneof(fc.constant('true'), nastyString),
      redirect: nastyString,
    },
    { requiredKeys: [] },
  );
  const formBody = form.map((f) =>
    Object.entries(f)
      .map(([k, v]) => `${k}=${encode(String(v))}`)
      .join('&'),
  );
  const body: fc.Arbitrary<Pick<RawRequest, 'body' | 'contentType' | 'kind'>> =
    method === 'GET'
      ? fc.constant({ body: null, contentType: null, kind: 'GET' })
      : fc.oneof(
          { weight: 4, arbitrary: formBody.map((b) => ({ body: b, contentType: 'application/x-www-form-urlencoded', kind: 'form' })) },
          { weight: 2, arbitrary: malformedJson.map((b) => ({ body: b, contentType: 'application/json', kind: 'malformed JSON' })) },
          {
            weight: 1,
            arbitrary: fc.oneof(fc.jsonValue(), form).map((v) => ({ body: JSON.stringify(v) ?? 'null', contentType: 'application/json', kind: 'JSON' })),
          },
          { weight: 1, arbitrary: fc.tuple(wrongContentType, formBody).map(([t, b]) => ({ body: b, contentType: t, kind: 'wrong type' })) },
          {
            weight: 1,
            arbitrary: hugeString.map((s) => ({
              body: `csrfToken=${encode(s)}&email=${encode(s)}`,
              contentType: 'application/x-www-form-urlencoded',
              kind: 'huge form',
            })),
          },
        );
  const anything = fc
    .record({ action, query, cookies: fc.array(cookie, { maxLength: 3 }), body, origin: fc.option(headerValue) })
    .map(({ action, query, cookies, body, origin }) => ({
      params: { nextauth: action },
      query,
      headers: { ...(cookies.length ? { cookie: cookies.join('; ') } : {}), ...(origin !== null ? { origin, 'x-forwarded-host': origin } : {}) },
      ...body,
    }));
  if (method === 'GET') return anything;
  // Sign-in attempts that pass the CSRF check, so bad e-mails and passwords reach authorize() and
  // its zod schema (a well-formed wrong one is counted by the sign-in throttle, as it should be).
  const signIn = fc
    .record({
      email: form.map((f) => f.email ?? ''),
      password: fc.oneof(nastyString, fc.constant('wrong-password-1')).filter((p) => p !== 'test-password-123'),
      json: fc.boolean(),
    })
    .map(({ email, password, json }): RawRequest => ({
      params: { nextauth: ['callback', 'credentials'] },
      query: [],
      headers: { cookie: ctx.csrfCookie },
      body: [
        `csrfToken=${encode(ctx.csrfToken)}`,
        `email=${encode(email)}`,
        `password=${encode(password)}`,
        'callbackUrl=%2Fpantry',
        ...(json ? ['json=true'] : []),
      ].join('&'),
      contentType: 'application/x-www-form-urlencoded',
      kind: 'sign-in attempt with a valid CSRF token',
    }));
  return fc.oneof({ weight: 4, arbitrary: anything }, { weight: 1, arbitrary: signIn });
}

// ---- payment webhook -----------------------------------------------------------------------------------

export type Signer = (payload: string, options?: { timestamp?: number; secret?: string }) => string;

/** Event-like bodies that are wrong in at least one of id, type, data.object: never an event the app should store. */
const eventFields: Record<string, FieldSpec> = {
  id: {
    ok: fc.constantFrom('evt_sweep_1', 'evt_sweep_2'),
    bad: requiredBad(fc.oneof(nastyNumber, fc.boolean(), fc.constant(null), fc.constantFrom([], {})), fc.constantFrom('', 'e'.repeat(256))),
  },
  type: {
    ok: fc.constantFrom('checkout.session.completed', 'checkout.session.expired', 'charge.refunded', 'made.up'),
    bad: requiredBad(fc.oneof(nastyNumber, fc.boolean(), fc.constant(null), fc.constantFrom([], {})), fc.constantFrom('', 't'.repeat(101))),
  },
  data: {
    ok: fc.constantFrom(
      { object: { id: 'cs_sweep', object: 'checkout.session', payment_status: 'paid', metadata: { enrollmentId: '987654321' } } },
      { object: {} },
    ),
    bad: requiredBad(
      fc.oneof(nastyString, nastyNumber, fc.constant(null)),
      fc.constantFrom([], {}, { object: null }, { object: 'x' }, { object: [] }, { object: 5 }),
    ),
  },
};

export function webhookRequests(sign: Signer): fc.Arbitrary<RawRequest> {
  const body = fc.oneof(
    { weight: 3, arbitrary: brokenObject(eventFields).map((o) => JSON.stringify(o)) },
    { weight: 2, arbitrary: malformedJson },
    { weight: 1, arbitrary: wrongValue.map((v) => JSON.stringify(v) ?? '') },
    { weight: 1, arbitrary: fc.constantFrom('', ' ', 'null', '[]', '"evt"') },
    { weight: 1, arbitrary: hugeString.map((s) => JSON.stringify({ id: s, type: s })) },
  );
  return fc
    .tuple(body, fc.nat(5), headerValue, fc.constantFrom('application/json', 'text/plain', null, 'application/x-www-form-urlencoded'), body)
    .map(([payload, how, junk, contentType, other]): RawRequest => {
      const now = Math.floor(Date.now() / 1000);
      const signature = [
        null, // missing
        junk, // garbage
        `t=${now},v1=${'0'.repeat(64)}`, // well-formed, wrong
        sign(other === payload ? payload + ' ' : other), // signs another body
        sign(payload, { timestamp: now - 3_600 }), // too old
        sign(payload), // right signature, wrong body
      ][how];
      return {
        query: [],
        headers: signature === null ? {} : { 'stripe-signature': signature },
        body: payload,
        contentType,
        kind: ['no signature', 'garbage signature', 'wrong signature', 'signature of another body', 'old signature', 'signed bad body'][how],
      };
    });
}

// ---- photo upload ----------------------------------------------------------------------------------------

const MAGIC: Uint8Array[] = [
  [0xff, 0xd8, 0xff, 0xe0],
  [0xff, 0xd8, 0xff, 0xe1, 0x00, 0x10, 0x45, 0x78, 0x69, 0x66, 0x00, 0x00],
  [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a],
  [0x47, 0x49, 0x46, 0x38, 0x39, 0x61],
  [0x52, 0x49, 0x46, 0x46, 0x00, 0x00, 0x00, 0x00, 0x57, 0x45, 0x42, 0x50],
  [0x00, 0x00, 0x00, 0x18, 0x66, 0x74, 0x79, 0x70, 0x68, 0x65, 0x69, 0x63],
  [0x49, 0x49, 0x2a, 0x00],
  [0x42, 0x4d],
  [0x25, 0x50, 0x44, 0x46, 0x2d],
  [0x3c, 0x73, 0x76, 0x67, 0x20],
  [],
].map((b) => Uint8Array.from(b));

/** Bytes that start like an image (or nothing) and are not one. */
const garbageFile = fc.tuple(fc.constantFrom(...MAGIC), fc.uint8Array({ maxLength: 4_000 })).map(([magic, rest]) => {
  const out = new Uint8Array(magic.length + rest.length);
  out.set(magic);
  out.set(rest, magic.length);
  return out;
});

/** Broken uploads of one file in the form field `field` (the practical's photo, the program's logo). */
export function photoRequests(field = 'photo'): fc.Arbitrary<RawRequest> {
  const course = fc.oneof({ weight: 2, arbitrary: fc.constantFrom('pickling-and-canning', 'volunteer-refresher') }, { weight: 1, arbitrary: nastyString });
  const fileName = fc.oneof(fc.constantFrom('IMG_0001.jpg', 'photo.png', '../../etc/passwd', 'a\u0000b.jpg', '\u202Egpj.exe', ''), nastyString);
  const fileType = fc.constantFrom('image/jpeg', 'image/png', 'image/heic', 'text/html', 'application/octet-stream', '', 'image/svg+xml');
  const form = fc
    .record({
      course: fc.option(course),
      file: fc.option(fc.tuple(garbageFile, fileName, fileType), { freq: 8 }),
      photoAsText: fc.oneof({ weight: 6, arbitrary: fc.constant(null) }, { weight: 1, arbitrary: nastyString }),
      extra: fc.array(fc.tuple(nastyString, nastyString), { maxLength: 2 }),
      second: fc.boolean(),
    })
    .map(({ course, file, photoAsText, extra, second }): RawRequest => {
      const data = new FormData();
      if (course !== null) data.set('course', course);
      if (photoAsText !== null) data.append(field, photoAsText);
      if (file) data.append(field, new File([file[0] as BlobPart], file[1], { type: file[2] }));
      if (file && second) data.append(field, new File([file[0] as BlobPart], 'second.jpg', { type: 'image/jpeg' }));
      for (const [k, v] of extra) data.append(k, v);
      return { query: [], headers: {}, body: data, contentType: null, kind: 'multipart form' };
    });
  const brokenMultipart = fc.constantFrom(
    `--xyz\r\nContent-Disposition: form-data; name="${field}"; filename="a.jpg"\r\n\r\n\xff\xd8\xff`,
    '--xyz\r\nContent-Disposition: form-data; name="course"\r\n\r\npickling-and-canning\r\n',
    '--xyz--',
    '',
    'not a multipart body at all',
    `--abc\r\nContent-Disposition: form-data; name="${field}"\r\n\r\nx\r\n--abc--\r\n`,
    '--xyz\r\nContent-Disposition: form-data\r\n\r\n\r\n--xyz--\r\n',
  );
  return fc.oneof(
    { weight: 6, arbitrary: form },
    {
      weight: 2,
      arbitrary: fc
        .tuple(
          brokenMultipart,
          fc.constantFrom(
            'multipart/form-data; boundary=xyz',
            'multipart/form-data',
            'multipart/form-data; boundary=',
            'multipart/form-data; boundary="',
            'MULTIPART/FORM-DATA; boundary=xyz',
            'multipart/mixed; boundary=xyz',
          ),
        )
        .map(([body, contentType]): RawRequest => ({ query: [], headers: {}, body, contentType, kind: 'broken multipart' })),
    },
    {
      weight: 1,
      arbitrary: fc
        .tuple(
          wrongContentType.filter((t) => !t.startsWith('multipart')),
          fc.oneof(garbageFile, nastyString),
        )
        .map(([contentType, body]): RawRequest => ({ query: [], headers: {}, body, contentType, kind: 'not multipart' })),
    },
    {
      weight: 1,
      arbitrary: fc.constantFrom('99999999999', '10551297', '-1', 'abc').map((length): RawRequest => ({
        query: [],
        headers: { 'content-length': length },
        body: '--xyz--',
        contentType: 'multipart/form-data; boundary=xyz',
        kind: 'declared length',
      })),
    },
  );
}
