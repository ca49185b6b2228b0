// The bad-input sweep's table: for every route handler method under app/, who gets past its role
// check (so the bad input reaches validation, not just 401/403) and how to generate bad path
// parameters, queries and bodies for it. tests/integration/bad-input.test.ts fails when a route
// handler discovered from app/ has no row here.
import fs from 'node:fs';
import path from 'node:path';
import fc from 'fast-check';
import { CRISPING_AGENTS, GAUGES, JAR_SIZES, PRODUCT_IDS, SALT_KINDS, SUGAR_KINDS } from '@/lib/preserving';
import { ROLES, type Role } from '@/lib/roles';
import {
  AVOID_IDS,
  MISSING_ID,
  badJsonBodies,
  badQuery,
  hugeString,
  idParam,
  idValue,
  malformedJson,
  nastyNumber,
  nastyString,
  requiredBad,
  slugParam,
  wrongContentType,
  wrongValue,
  type BadBody,
  type FieldSpec,
} from './arbitraries';

export type Who = 'visitor' | Role;
export const EVERYONE: Who[] = ['visitor', 'learner', 'instructor', 'coordinator', 'admin'];
const SIGNED_IN: Who[] = ['learner', 'instructor', 'coordinator', 'admin'];
const STAFF: Who[] = ['instructor', 'coordinator', 'admin'];
const DESK: Who[] = ['coordinator', 'admin'];

export type SweepSpec = {
  /** Sessions that pass the route's role check; most requests use one of them. */
  who: Who[];
  params?: Record<string, fc.Arbitrary<string>>;
  query?: fc.Arbitrary<[string, string][]>;
  body?: fc.Arbitrary<BadBody>;
  /** Extra request headers (client address, signatures, cookies). */
  headers?: fc.Arbitrary<Record<string, string>>;
  /**
   * A read whose bad extras may still form a valid request (unknown query names are ignored):
   * 2xx is fine here. Everywhere else every generated request is wrong somewhere and must get a 4xx.
   */
  mayAnswerOk?: boolean;
  /** Handled by the test itself (next-auth's catch-all, the payment webhook): see the test file. */
  special?: 'nextauth' | 'webhook' | 'photo-upload' | 'logo-upload';
};

// ---- values that must be refused ----------------------------------------------------------------

const isPositiveWhole = (v: unknown) => {
  const n = Number(v);
  return Number.isInteger(n) && n > 0;
};
/** Refused by z.number().int().positive() AND by z.coerce.number().int().positive(). */
const badIdValue: fc.Arbitrary<unknown> = fc.oneof(
  nastyString.filter((s) => !isPositiveWhole(s)),
  nastyNumber.filter((n) => !isPositiveWhole(n)),
  fc.constant(null),
  fc.constantFrom({}, { id: MISSING_ID }, [], [MISSING_ID, MISSING_ID], [[]]),
);
const notString: fc.Arbitrary<unknown> = fc.oneof(nastyNumber, fc.boolean(), fc.constant(null), fc.constantFrom([], ['a'], {}, { a: 'b' }));
const longerThan = (n: number) =>
  fc.oneof(
    fc.constant('x'.repeat(n + 1)),
    hugeString.filter((s) => s.trim().length > n),
  );
const shortTrimmed = (n: number) =>
  fc.oneof(
    fc.constantFrom('', ' ', '\t'),
    fc.string({ maxLength: n + 4 }).filter((s) => s.trim().length < n),
  );
const notMatching = (re: RegExp, transform: (s: string) => string = (s) => s) => nastyString.filter((s) => !re.test(transform(s)));
const SLUG = /^[a-z0-9]+(?:-[a-z0-9]+)*$/;

// ---- path parameters ------------------------------------------------------------------------------

// Real quiz slugs (content/quizzes/*.json) would start a real attempt: the sweep never names one.
const REAL_QUIZZES = new Set(fs.readdirSync(path.resolve(__dirname, '../../../content/quizzes')).map((f) => f.replace(/\.json$/, '')));
const quizParam = slugParam([
  'pickling-and-canning--no-such-lesson',
  'volunteer-refresher--nope',
  'pickling-and-canning',
  'a--b',
  '--',
  'pickling-and-canning--acidity/../final-exam',
  'PICKLING-AND-CANNING--ACIDITY',
]).filter((s) => !REAL_QUIZZES.has(s) && !REAL_QUIZZES.has(s.trim().toLowerCase()));
const serialParam = fc.oneof(
  nastyString,
  fc.stringMatching(/^[0-9A-Z]{16}$/),
  fc.stringMatching(/^[0-9A-Z]{4}-[0-9A-Z]{4}-[0-9A-Z]{4}-[0-9A-Z]{4}$/),
  fc.constantFrom('%', '%zz', '%E0%A4%A', 'a%2Fb', '0000-0000-0000-0000'),
);
const courseParam = slugParam(['no-such-course', 'pickling-and-canning-x', 'volunteer']);

// ---- bodies ----------------------------------------------------------------------------------------

const answerValue = fc.oneof(
  fc.string({ minLength: 1, maxLength: 20 }),
  fc.boolean(),
  fc.array(fc.string({ minLength: 1, maxLength: 20 }), { maxLength: 3 }),
  fc.record({ value: fc.double({ noNaN: true, noDefaultInfinity: true }), unit: fc.constantFrom('g', 'mL', 'ft') }),
);
const submitFields: Record<string, FieldSpec> = {
  answers: {
    ok: fc.dictionary(fc.string({ minLength: 1, maxLength: 12 }), answerValue, { maxKeys: 4 }),
    bad: requiredBad(
      fc.oneof(nastyString, nastyNumber, fc.boolean(), fc.constant(null), fc.array(answerValue)),
      fc.constantFrom(
        { q1: 5 },
        { q1: '' },
        { q1: 'x'.repeat(21) },
        { '': 'a' },
        { q1: { value: 'a', unit: 'g' } },
        { q1: { value: 1, unit: 'furlong' } },
        { q1: { value: 1, unit: 'g', extra: 1 } },
        { q1: Array(13).fill('a') },
        { ['k'.repeat(121)]: 'a' },
        { q1: null },
      ),
    ),
  },
};

const reasonFields = (min: number, max: number, optional: boolean): Record<string, FieldSpec> => ({
  reason: {
    ok: fc.string({ minLength: min + 1, maxLength: Math.min(max, 60) }),
    bad: optional
      ? fc.oneof(
          notString.filter((v) => v !== undefined),
          longerThan(max),
        )
      : requiredBad(notString, shortTrimmed(min), longerThan(max)),
  },
});

const roleSetField: FieldSpec = {
  ok: fc.subarray([...ROLES], { minLength: 1 }),
  bad: requiredBad(
    notString,
    nastyString,
    fc.constantFrom([], ['superuser'], ['admin', 'root'], [null], [1], ['learner', 'instructor', 'coordinator', 'admin', 'learner']),
  ),
};

const criterion = fc.record({ verdict: fc.constantFrom('met', 'not_met'), comment: fc.string({ maxLength: 20 }) });
const reviewFields: Record<string, FieldSpec> = {
  decision: {
    ok: fc.constantFrom('approved', 'changes_requested'),
    bad: requiredBad(
      notString,
      nastyString.filter((s) => !['approved', 'changes_requested'].includes(s)),
    ),
  },
  rubric: {
    ok: fc.record(
      Object.fromEntries(['rims-and-lids', 'headspace', 'liquid-covers', 'no-siphoning', 'colour-texture', 'labelled'].map((id) => [id, criterion])),
    ),
    bad: requiredBad(
      fc.oneof(nastyString, nastyNumber, fc.constant(null), fc.constantFrom([], {}, { headspace: { verdict: 'maybe' } }, { 'rims-and-lids': 'met' })),
    ),
  },
  comment: { ok: fc.string({ maxLength: 40 }), bad: fc.oneof(notString, longerThan(2000)) },
};

const GOOD_PRACTICAL = {
  product: 'fresh-pack-dill-pickles',
  recipeTitle: 'Quick fresh-pack dill pickles',
  recipeSource: 'A tested recipe book, page 12',
  jar: 'pint',
  jars: 7,
  pack: 'raw',
  vinegarAcidityPct: 5,
  vinegarMl: 1420,
  waterMl: 1420,
  headspaceIn: 0.5,
  method: 'boiling-water',
  altitudeFt: 800,
  minutes: 10,
  batchDate: '2026-11-20',
  sealedJars: 7,
  unsealedJars: 0,
  notes: '',
  photoIds: [MISSING_ID, MISSING_ID - 1],
};
const practicalBadField: fc.Arbitrary<[string, unknown]> = fc.oneof(
  fc.tuple(fc.constant('product'), fc.oneof(notString, nastyString)),
  fc.tuple(fc.constantFrom('jars', 'sealedJars', 'minutes'), fc.oneof(nastyString, fc.constantFrom(-1, 1.5, 1e99, 31, 14_001, null))),
  // Below sea level is allowed down to -1,500 ft (the lowest dry land is about -1,410 ft).
  fc.tuple(fc.constant('altitudeFt'), fc.oneof(nastyString, fc.constantFrom(-1_501, 1.5, 1e99, 14_001, null))),
  fc.tuple(fc.constant('saltG'), fc.oneof(nastyString, fc.constantFrom(-1, 1e99, 5_001, null))),
  fc.tuple(fc.constantFrom('vinegarAcidityPct', 'vinegarMl', 'waterMl', 'headspaceIn'), fc.oneof(nastyString, fc.constantFrom(-1, 1e99, -1e99, null, 20_001))),
  fc.tuple(fc.constant('batchDate'), fc.oneof(notString, nastyString, fc.constantFrom('2999-01-01', '1999-12-31', '2026-02-30', '2026-13-01'))),
  fc.tuple(
    fc.constant('photoIds'),
    fc.oneof(
      notString,
      fc.constantFrom(
        [],
        [MISSING_ID],
        [MISSING_ID, MISSING_ID],
        Array(7)
          .fill(0)
          .map((_, i) => MISSING_ID - i),
        [-1, 0],
        ['1', '2'],
      ),
    ),
  ),
  fc.tuple(
    fc.constantFrom('recipeTitle', 'recipeSource', 'notes'),
    fc.oneof(
      notString.filter((v) => v !== undefined),
      fc.constant('x'.repeat(2_001)),
      fc.constant(''),
    ),
  ),
  fc.tuple(fc.constantFrom('jar', 'pack', 'method'), fc.oneof(notString, nastyString)),
);
const practicalFields: Record<string, FieldSpec> = {
  course: { ok: fc.constantFrom('pickling-and-canning', 'volunteer-refresher'), bad: requiredBad(notString, notMatching(/^[a-z0-9-]{1,80}$/)) },
  practical: {
    ok: fc.constant(GOOD_PRACTICAL),
    bad: requiredBad(
      fc.oneof(nastyString, nastyNumber, fc.constant(null), fc.constant([])),
      fc.array(practicalBadField, { minLength: 1, maxLength: 3 }).map((bad) => ({ ...GOOD_PRACTICAL, ...Object.fromEntries(bad) })),
      fc.constant({ ...GOOD_PRACTICAL, sealedJars: 3, unsealedJars: 1 }),
    ),
  },
};

const slugField: FieldSpec = {
  ok: fc.constantFrom('pickling-and-canning', 'acidity', 'why-preserving-is-a-safety-job'),
  bad: requiredBad(
    notString,
    fc.constantFrom('', ' ', 'Acidity', 'a b', 'a--b', '-a', 'a-', 'a_b', '../x', 'x'.repeat(121), '\u202Eacidity'),
    notMatching(SLUG, (s) => s.trim()),
  ),
};

const registerFields: Record<string, FieldSpec> = {
  name: { ok: fc.constantFrom('Juniper Vale', 'Ada', '𝔘𝔫𝔦'), bad: requiredBad(notString, shortTrimmed(1), longerThan(120)) },
  email: {
    ok: fc.constantFrom('new.person@test.example', 'X@Example.org'),
    bad: requiredBad(
      notString,
      nastyString.filter((s) => !s.includes('@') || s.trim().length > 254),
      fc.constantFrom('a@', '@b', 'a@b', 'a b@c.d', 'a@b..c', `${'x'.repeat(250)}@example.org`),
    ),
  },
  password: { ok: fc.constant('a long pass phrase'), bad: requiredBad(notString, fc.string({ maxLength: 9 }), fc.constant('p'.repeat(201))) },
};

// Well-formed tokens that name no invitation: the sweep never accepts a real one.
const acceptFields: Record<string, FieldSpec> = {
  token: {
    ok: fc.stringMatching(/^[A-Za-z0-9_-]{43}$/),
    bad: requiredBad(
      notString,
      nastyString.filter((v) => !/^[A-Za-z0-9_-]{43}$/.test(v)),
    ),
  },
  name: registerFields.name,
  password: registerFields.password,
};

const WAIVER = /^[A-Z0-9-]{4,40}$/;
const waiverCodeBad = fc.oneof(
  nastyNumber,
  fc.boolean(),
  fc.constantFrom({}, [], ['CODE']),
  nastyString.filter((s) => s !== '' && !WAIVER.test(s.trim().toUpperCase())),
);
const waiverFields: Record<string, FieldSpec> = {
  code: { ok: fc.constantFrom('', 'SPRING-2027', 'cedar-volunteer'), bad: waiverCodeBad },
  courseId: { ok: fc.constantFrom('', null, 1, '2'), bad: requiredBad(badIdValue.filter((v) => v !== null && v !== '')) },
  maxUses: { ok: fc.constantFrom(1, 10, '25', 1000), bad: requiredBad(fc.constantFrom(0, -1, 1001, 1.5, 'abc', null, {}, '1e99', 'NaN', '')) },
  expiresOn: { ok: fc.constantFrom('2027-06-30', '2027-01-01'), bad: requiredBad(notString, notMatching(/^\d{4}-\d{2}-\d{2}$/)) },
  note: {
    ok: fc.constantFrom('Volunteers', '', '🥒'),
    bad: fc.oneof(
      notString.filter((v) => v !== undefined),
      longerThan(300),
    ),
  },
};

const enrollFields: Record<string, FieldSpec> = {
  workshopId: { ok: fc.constantFrom(MISSING_ID, String(MISSING_ID)), bad: requiredBad(badIdValue) },
  waiverCode: { ok: fc.constantFrom('', null, 'CEDAR-VOLUNTEER'), bad: waiverCodeBad },
};

const idsField = (max: number): FieldSpec => ({
  ok: fc.array(fc.constant(MISSING_ID), { minLength: 1, maxLength: 3 }),
  bad: requiredBad(
    fc.oneof(nastyString, nastyNumber, fc.boolean(), fc.constant(null), fc.constant({})),
    fc.constant([]),
    fc.constant(Array(max + 1).fill(MISSING_ID)),
    fc.array(badIdValue, { minLength: 1, maxLength: 3 }),
    fc.constantFrom([String(MISSING_ID)], [MISSING_ID, 'x'], [1.5], [true]),
  ),
});

const attendanceFields: Record<string, FieldSpec> = {
  attended: { ok: fc.boolean(), bad: requiredBad(fc.oneof(nastyString, nastyNumber, fc.constant(null), fc.constantFrom([], {}, 'true', 1, 0))) },
};

const HHMM = /^([01]\d|2[0-3]):[0-5]\d$/;
const notWholeIn = (min: number, max: number) => (v: unknown) => !(Number.isInteger(Number(v)) && Number(v) >= min && Number(v) <= max);
const badTimeZone = requiredBad(notString, fc.constantFrom('', 'Mars/Olympus', 'America/Nowhere', 'UTC+25'));
const workshopFields: Record<string, FieldSpec> = {
  courseId: { ok: fc.constantFrom(MISSING_ID, String(MISSING_ID)), bad: requiredBad(badIdValue) },
  date: { ok: fc.constant('2030-05-01'), bad: requiredBad(notString, notMatching(/^\d{4}-\d{2}-\d{2}$/)) },
  startTime: { ok: fc.constant('09:00'), bad: requiredBad(notString, notMatching(HHMM)) },
  endTime: { ok: fc.constant('14:00'), bad: requiredBad(notString, notMatching(HHMM)) },
  timeZone: { ok: fc.constant('America/Denver'), bad: badTimeZone },
  place: { ok: fc.constant('Cedar Hollow Grange Hall'), bad: requiredBad(notString, shortTrimmed(3), longerThan(300)) },
  // Coerced to a number: a boolean or a one-element array would coerce to a valid count.
  seats: {
    ok: fc.integer({ min: 1, max: 200 }),
    bad: requiredBad(fc.oneof(nastyNumber, nastyString).filter(notWholeIn(1, 200)), fc.constantFrom(0, -1, 201, 1.5, '', 'many', {}, [])),
  },
  attendanceRequired: { ok: fc.boolean(), bad: requiredBad(fc.constantFrom('true', 1, 0, null, [], {})) },
};

const programFields: Record<string, FieldSpec> = {
  name: { ok: fc.constant('Upper Fork County home-preserving program'), bad: requiredBad(notString, shortTrimmed(1), longerThan(200)) },
  shortName: { ok: fc.constant('Upper Fork Preserving'), bad: requiredBad(notString, shortTrimmed(1), longerThan(40)) },
  contactEmail: { ok: fc.constantFrom('', null, 'office@upperfork.example'), bad: fc.constantFrom('not-an-address', '@upperfork.example', 5, true, [], {}) },
  timeZone: { ok: fc.constant('America/Boise'), bad: badTimeZone },
};

const holderFileFields: Record<string, FieldSpec> = {
  text: { ok: fc.constant('name,email,course,certificate_date,end_date\n'), bad: requiredBad(notString, fc.constantFrom('', 'x'.repeat(2_000_001))) },
};

/** A body for a route that reads none: anything at all. */
const anyBody: fc.Arbitrary<BadBody> = fc.oneof(
  malformedJson.map((body): BadBody => ({ contentType: 'application/json', body, kind: 'ignored malformed JSON' })),
  fc.tuple(wrongContentType, nastyString).map(([contentType, body]): BadBody => ({ contentType, body, kind: 'ignored body' })),
  fc.constant<BadBody>({ contentType: null, body: null, kind: 'no body' }),
);

// ---- queries ---------------------------------------------------------------------------------------

const num = fc.constantFrom('0', '1', '5', '1000', '7000', '0.5');
const toolQuery = (names: string[], ok: Record<string, fc.Arbitrary<string>> = {}) =>
  badQuery(names, { ...Object.fromEntries(names.map((n) => [n, num])), ...ok });
const product = fc.constantFrom(...PRODUCT_IDS, 'no-such-product');
const jar = fc.constantFrom(...JAR_SIZES, 'gallon');
const unit = fc.constantFrom('cup', 'tbsp', 'mL', 'g', 'lb', 'F', 'C', 'ft', 'furlong');

const clientAddress = fc.record(
  { 'x-forwarded-for': fc.oneof(fc.ipV4(), fc.ipV6(), fc.constantFrom('unknown', ' ', 'x'.repeat(300), '1.1.1.1, 2.2.2.2')) },
  { requiredKeys: [] },
);

const tool = (names: string[], ok: Record<string, fc.Arbitrary<string>> = {}): SweepSpec => ({ who: EVERYONE, query: toolQuery(names, ok), mayAnswerOk: true });

/** Key: `${file}#${method}`, as discoverRoutes() names them. */
// Accounts that recover: every body breaks at least one field, so no password is ever checked.
const presentPasswordField: FieldSpec = {
  ok: fc.constantFrom('not-the-password-1', 'another wrong one'),
  bad: requiredBad(notString, fc.constant(''), fc.constant('p'.repeat(201))),
};
const accountFields = {
  resetRequest: { email: registerFields.email },
  resetComplete: {
    token: { ok: fc.constant('A'.repeat(43)), bad: requiredBad(notString, fc.constant(''), longerThan(200)) },
    password: registerFields.password,
  },
  password: { currentPassword: presentPasswordField, newPassword: registerFields.password },
  email: { newEmail: registerFields.email, currentPassword: presentPasswordField },
  name: { name: registerFields.name },
  signOutEverywhere: { confirm: { ok: fc.constant(true), bad: requiredBad(fc.constantFrom(false, 'true', 1, 0, null, {}, [], 'yes')) } },
  erase: {
    currentPassword: presentPasswordField,
    confirm: { ok: fc.constant('DELETE'), bad: requiredBad(notString, fc.constantFrom('delete', 'yes', '', ' DELETE', 'DELETE ', 'Delete')) },
  },
} satisfies Record<string, Record<string, FieldSpec>>;

export const SWEEP: Record<string, SweepSpec> = {
  'app/api/account/confirmation/route.ts#POST': { who: SIGNED_IN },
  'app/api/account/email/route.ts#POST': { who: SIGNED_IN, body: badJsonBodies(accountFields.email) },
  'app/api/account/export/route.ts#GET': { who: SIGNED_IN, query: badQuery([]), mayAnswerOk: true },
  'app/api/account/name/route.ts#POST': { who: SIGNED_IN, body: badJsonBodies(accountFields.name) },
  'app/api/account/password/route.ts#POST': { who: SIGNED_IN, body: badJsonBodies(accountFields.password) },
  'app/api/account/route.ts#DELETE': { who: ['learner'], body: badJsonBodies(accountFields.erase) },
  'app/api/account/sign-out-everywhere/route.ts#POST': { who: SIGNED_IN, body: badJsonBodies(accountFields.signOutEverywhere) },
  'app/api/password-reset/complete/route.ts#POST': { who: EVERYONE, body: badJsonBodies(accountFields.resetComplete) },
  'app/api/password-reset/route.ts#POST': { who: EVERYONE, body: badJsonBodies(accountFields.resetRequest) },
  'app/api/attempts/[id]/route.ts#GET': { who: SIGNED_IN, params: { id: idParam } },
  'app/api/attempts/[id]/submit/route.ts#POST': { who: ['learner'], params: { id: idParam }, body: badJsonBodies(submitFields) },
  'app/api/auth/[...nextauth]/route.ts#GET': { who: EVERYONE, special: 'nextauth', mayAnswerOk: true },
  'app/api/auth/[...nextauth]/route.ts#POST': { who: EVERYONE, special: 'nextauth', mayAnswerOk: true },
  'app/api/certificates/[serial]/pdf/route.ts#GET': { who: SIGNED_IN, params: { serial: serialParam } },
  'app/api/certificates/[serial]/route.ts#GET': { who: EVERYONE, params: { serial: serialParam }, headers: clientAddress },
  'app/api/certificates/refresher/route.ts#POST': {
    who: ['learner'],
    body: badJsonBodies({ enrollmentId: { ok: fc.constant(MISSING_ID), bad: requiredBad(badIdValue, fc.constant(String(MISSING_ID))) } }),
  },
  'app/api/courses/[course]/workshops/route.ts#GET': { who: EVERYONE, params: { course: courseParam } },
  'app/api/desk/certificates/[id]/reissue/route.ts#POST': {
    who: DESK,
    params: { id: idParam },
    body: badJsonBodies({
      ...reasonFields(5, 500, false),
      holderName: {
        ok: fc.string({ minLength: 1, maxLength: 60 }).filter((s) => s.trim().length > 0),
        bad: fc.oneof(
          notString.filter((v) => v !== undefined && v !== null),
          longerThan(120),
        ),
      },
    }),
  },
  'app/api/admin/invitations/route.ts#POST': { who: ['admin'], body: badJsonBodies({ email: registerFields.email, roles: roleSetField }) },
  'app/api/invitations/accept/route.ts#POST': { who: EVERYONE, body: badJsonBodies(acceptFields) },
  'app/api/admin/users/[id]/roles/route.ts#POST': { who: ['admin'], params: { id: idParam }, body: badJsonBodies({ roles: roleSetField }) },
  'app/api/admin/users/[id]/deactivate/route.ts#POST': { who: ['admin'], params: { id: idParam } },
  'app/api/admin/users/[id]/reactivate/route.ts#POST': { who: ['admin'], params: { id: idParam } },
  'app/api/desk/certificates/[id]/revoke/route.ts#POST': { who: DESK, params: { id: idParam }, body: badJsonBodies(reasonFields(5, 500, false)) },
  'app/api/desk/certificates/route.ts#POST': { who: DESK, body: badJsonBodies({ enrollmentIds: idsField(100) }) },
  'app/api/desk/enrollments/route.ts#GET': {
    who: DESK,
    query: badQuery(['course', 'workshop', 'status', 'eligible', 'q', 'page', 'pageSize'], {
      status: fc.constantFrom('active', 'completed', 'nope'),
      page: num,
      pageSize: num,
    }),
    mayAnswerOk: true,
  },
  'app/api/desk/options/route.ts#GET': { who: DESK, query: badQuery([]), mayAnswerOk: true },
  'app/api/desk/roster/route.ts#GET': {
    who: DESK,
    query: badQuery(['ids', 'course', 'workshop', 'status', 'eligible'], {
      ids: fc.constantFrom(String(MISSING_ID), `${MISSING_ID},${MISSING_ID}`, '1,,2', ',', Array(5001).fill(MISSING_ID).join(',')),
    }),
    mayAnswerOk: true,
  },
  'app/api/enrollments/[id]/attendance/route.ts#POST': { who: STAFF, params: { id: idParam }, body: badJsonBodies(attendanceFields) },
  'app/api/enrollments/[id]/refund/route.ts#POST': { who: DESK, params: { id: idParam }, body: badJsonBodies(reasonFields(0, 300, true)) },
  'app/api/enrollments/[id]/route.ts#GET': { who: SIGNED_IN, params: { id: idParam } },
  'app/api/enrollments/route.ts#POST': { who: ['learner'], body: badJsonBodies(enrollFields) },
  'app/api/desk/import/preview/route.ts#POST': { who: DESK, body: badJsonBodies(holderFileFields) },
  'app/api/desk/import/route.ts#POST': { who: DESK, body: badJsonBodies(holderFileFields) },
  'app/api/desk/workshops/[id]/route.ts#POST': { who: DESK, params: { id: idParam }, body: badJsonBodies(workshopFields) },
  'app/api/desk/workshops/route.ts#POST': { who: DESK, body: badJsonBodies(workshopFields) },
  'app/api/health/route.ts#GET': { who: EVERYONE, query: badQuery([]), mayAnswerOk: true },
  'app/api/program/route.ts#GET': { who: EVERYONE, query: badQuery([]), mayAnswerOk: true },
  'app/api/program/logo/route.ts#GET': { who: EVERYONE, query: badQuery([]), mayAnswerOk: true },
  'app/api/program/logo/route.ts#POST': { who: ['admin'], special: 'logo-upload' },
  'app/api/program/route.ts#POST': { who: ['admin'], body: badJsonBodies(programFields) },
  'app/api/pantry/route.ts#GET': { who: ['learner'], query: badQuery([]), mayAnswerOk: true },
  'app/api/photos/[id]/route.ts#GET': { who: SIGNED_IN, params: { id: idParam }, query: badQuery(['size'], { size: fc.constantFrom('thumb', 'full') }) },
  'app/api/photos/route.ts#POST': { who: ['learner'], special: 'photo-upload' },
  'app/api/practicals/[id]/review/route.ts#POST': { who: STAFF, params: { id: idParam }, body: badJsonBodies(reviewFields) },
  'app/api/practicals/[id]/claim/route.ts#POST': { who: STAFF, params: { id: idParam } },
  'app/api/practicals/[id]/claim/route.ts#DELETE': { who: STAFF, params: { id: idParam } },
  'app/api/practicals/route.ts#POST': { who: ['learner'], body: badJsonBodies(practicalFields) },
  'app/api/progress/route.ts#GET': {
    who: ['learner'],
    query: badQuery(['course'], { course: fc.constantFrom('pickling-and-canning', 'no-such-course') }),
    mayAnswerOk: true,
  },
  'app/api/progress/route.ts#POST': { who: ['learner'], body: badJsonBodies({ courseSlug: slugField, lessonSlug: slugField }) },
  'app/api/quizzes/[quiz]/attempts/route.ts#POST': { who: ['learner'], params: { quiz: quizParam }, body: anyBody },
  'app/api/register/route.ts#POST': { who: EVERYONE, body: badJsonBodies(registerFields) },
  'app/api/tasting-table/submissions/route.ts#GET': {
    who: STAFF,
    query: badQuery(['page', 'sort', 'status', 'workshop', 'flagged', 'olderThanDays'], {
      page: num,
      sort: fc.constantFrom('oldest', 'flags', 'x'),
      status: fc.constantFrom('all', 'approved', 'x'),
      flagged: fc.constantFrom('yes', 'any'),
    }),
    mayAnswerOk: true,
  },
  'app/api/tools/batch/route.ts#GET': tool(['product', 'jar', 'jars'], { product, jar }),
  'app/api/tools/boiling-point/route.ts#GET': tool(['altitudeFt', 'altitudeM']),
  'app/api/tools/brine/route.ts#GET': tool(['vinegarMl', 'vinegarAcidityPct', 'waterMl', 'otherMl', 'produceG', 'produceWaterPct', 'product'], { product }),
  'app/api/tools/convert/route.ts#GET': tool(['value', 'from', 'to'], { from: unit, to: unit }),
  'app/api/tools/crisping/route.ts#GET': tool(['agent', 'jar', 'jars'], { agent: fc.constantFrom(...CRISPING_AGENTS, 'alum'), jar }),
  'app/api/tools/headspace/route.ts#GET': tool(['product', 'measuredIn'], { product }),
  'app/api/tools/pressure/route.ts#GET': tool(['gauge', 'altitudeFt', 'altitudeM'], { gauge: fc.constantFrom(...GAUGES, 'digital') }),
  'app/api/tools/processing-time/route.ts#GET': tool(['product', 'jar', 'altitudeFt', 'altitudeM'], { product, jar }),
  'app/api/tools/sugar/route.ts#GET': tool(['sugar', 'amount', 'unit', 'liquidMl'], { sugar: fc.constantFrom(...SUGAR_KINDS, 'maple'), unit }),
  'app/api/tools/salt/route.ts#GET': tool(['salt', 'amount', 'unit', 'waterMl'], { salt: fc.constantFrom(...SALT_KINDS, 'rock'), unit }),
  'app/api/waivers/route.ts#GET': { who: DESK, query: badQuery([]), mayAnswerOk: true },
  'app/api/waivers/route.ts#POST': { who: DESK, body: badJsonBodies(waiverFields) },
  'app/api/webhooks/payments/route.ts#POST': { who: EVERYONE, special: 'webhook' },
};

// Ids 1..50 are the fixture's rows (users, courses, one enrollment): generated values never name them.
for (let i = 1; i <= 50; i++) AVOID_IDS.add(i);

export { idValue, wrongValue };
