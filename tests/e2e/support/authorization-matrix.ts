// The authorization matrix: every page, route handler (each method) and server action under app/,
// with the answer each kind of person must get. tests/e2e/authorization.test.ts walks the pages and
// routes against the running production build with real sessions; the server actions are called
// with each role in tests/integration/server-actions-authz.test.ts. Both fail when app/ has a page,
// method or action that this table does not list, or when the table lists one that is gone.
//
// Columns (SUBJECTS), one key per person in every row's `expect`:
//   visitor      signed out
//   own          learner A, Avery, on A's own data (A: active in the flagship course; refresher withdrawn)
//   other        Avery on learner B's (Bellamy's) data (B: active in both courses), or on a course only B may use
//   instructor   Ingrid, an instructor and nothing else (teaches the workshop A and B are in)
//   coordinator  the demo coordinator, Priya
//   admin        the demo admin, Dale
//   volunteer    the demo instructor, Tomas, who is also a learner: a certified volunteer (completed
//                flagship enrollment, certificate expiring within the year) who teaches other workshops
// Staff columns and the volunteer act on B's data, so "a learner's data, not theirs".
//
// Expected answers: an HTTP status; 'signin' = a redirect to /signin?callbackUrl=… (pages, signed out);
// 'n/a' = the column has no meaning for this row (no one else's data in the request), not requested.
// For writes, a role that passes the guard is sent a body that fails validation or names a missing
// record, so the walk proves the guard without changing shared demo data: 400/404 in an allowed column
// (or 409: nothing to do) means "let through, then refused on its merits", 401/403 means the guard stopped it.

export const SUBJECTS = ['visitor', 'own', 'other', 'instructor', 'coordinator', 'admin', 'volunteer'] as const;
export type Subject = (typeof SUBJECTS)[number];
export type Expected = number | 'signin' | 'n/a';
/** One expected answer per person, keyed by the column's name. */
export type Answers = Record<Subject, Expected>;

/** The ids the walk fills in, made by tests/e2e/support/authorization-fixtures.ts. */
export type Fixtures = {
  a: { enrollmentId: number; refresherEnrollmentId: number; attemptId: number; photoId: number; serial: string };
  b: { enrollmentId: number; refresherEnrollmentId: number; attemptId: number; photoId: number; serial: string; certificateId: number };
  workshopId: number;
  /** A practical batch of a third learner waiting at the Tasting table (demo seed). */
  practicalId: number;
  /** A small real JPEG for the upload route. */
  jpeg: Uint8Array;
};

export type Request = { path: string; body?: unknown; headers?: Record<string, string> };
export type Probe = (fx: Fixtures, subject: Subject) => Request;

/** `renders`: the app route that answers the probe when a rewrite sends it elsewhere (the router-request walk claims its layouts). */
export type PageRow = { kind: 'page'; pattern: string; probe: Probe; expect: Answers; bodyIncludes?: Partial<Record<Subject, string>>; renders?: string };
export type RouteRow = { kind: 'route'; pattern: string; method: string; probe: Probe; expect: Answers };
export type ActionExpected = 'pass' | 401 | 403 | 'n/a';
export type ActionRow = {
  kind: 'action';
  pattern: string;
  action: string;
  expect: Record<Subject, ActionExpected>;
};
export type MatrixRow = PageRow | RouteRow | ActionRow;

/** A's resource in the `own` column, B's in every other one. */
const ab = <T>(subject: Subject, own: T, theirs: T) => (subject === 'own' ? own : theirs);
const at =
  (path: string): Probe =>
  () => ({ path });

const FLAGSHIP = 'pickling-and-canning';
const REFRESHER = 'volunteer-refresher';
const S = 'signin' as const;
const NA = 'n/a' as const;

// Answer patterns that repeat.
const PUBLIC: Answers = { visitor: 200, own: 200, other: NA, instructor: 200, coordinator: 200, admin: 200, volunteer: 200 };
const COORDINATOR_PAGE: Answers = { visitor: S, own: 403, other: NA, instructor: 403, coordinator: 200, admin: 200, volunteer: 403 };
const INSTRUCTOR_PAGE: Answers = { visitor: S, own: 403, other: NA, instructor: 200, coordinator: 200, admin: 200, volunteer: 200 };
const ADMIN_PAGE: Answers = { visitor: S, own: 403, other: NA, instructor: 403, coordinator: 403, admin: 200, volunteer: 403 };
const LEARNER_PAGE: Answers = { visitor: S, own: 200, other: NA, instructor: 403, coordinator: 403, admin: 403, volunteer: 200 };
const COORDINATOR_READ: Answers = { visitor: 401, own: 403, other: NA, instructor: 403, coordinator: 200, admin: 200, volunteer: 403 };
const COORDINATOR_WRITE: Answers = { visitor: 401, own: 403, other: NA, instructor: 403, coordinator: 400, admin: 400, volunteer: 403 };
const LEARNER_WRITE: Answers = { visitor: 401, own: 400, other: NA, instructor: 403, coordinator: 403, admin: 403, volunteer: 400 };
const ACCOUNT_WRITE: Answers = { visitor: 401, own: 400, other: NA, instructor: 400, coordinator: 400, admin: 400, volunteer: 400 };

const pages: PageRow[] = [
  { kind: 'page', pattern: '/', probe: at('/'), expect: PUBLIC },
  {
    kind: 'page',
    pattern: '/admin/users',
    probe: at('/admin/users'),
    expect: { visitor: S, own: 403, other: NA, instructor: 403, coordinator: 403, admin: 200, volunteer: 403 },
  },
  { kind: 'page', pattern: '/admin/invitations', probe: at('/admin/invitations'), expect: ADMIN_PAGE },
  // The invitee's page: public, the token is the only credential (an unknown one says so).
  { kind: 'page', pattern: '/invitation', probe: at('/invitation?token=AAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAA'), expect: PUBLIC },
  { kind: 'page', pattern: '/desk/audit', probe: at('/desk/audit?action=user.roles_changed&from=2026-01-01'), expect: COORDINATOR_PAGE },
  { kind: 'page', pattern: '/desk/import', probe: at('/desk/import'), expect: COORDINATOR_PAGE },
  {
    kind: 'page',
    pattern: '/admin/program',
    probe: at('/admin/program'),
    expect: { visitor: S, own: 403, other: NA, instructor: 403, coordinator: 403, admin: 200, volunteer: 403 },
  },
  { kind: 'page', pattern: '/bench', probe: at('/bench'), expect: PUBLIC },
  // Another learner's enrollment number in the address shows nothing of theirs.
  {
    kind: 'page',
    pattern: '/checkout/cancel',
    probe: (fx, s) => ({ path: `/checkout/cancel?enrollment=${ab(s, fx.a.enrollmentId, fx.b.enrollmentId)}` }),
    expect: { visitor: S, own: 200, other: 200, instructor: 403, coordinator: 403, admin: 403, volunteer: 200 },
  },
  {
    kind: 'page',
    pattern: '/checkout/success',
    probe: (fx, s) => ({ path: `/checkout/success?enrollment=${ab(s, fx.a.enrollmentId, fx.b.enrollmentId)}` }),
    expect: { visitor: S, own: 200, other: 200, instructor: 403, coordinator: 403, admin: 403, volunteer: 200 },
    bodyIncludes: { other: 'We could not find that checkout' },
  },
  { kind: 'page', pattern: '/confirm-email', probe: at('/confirm-email?token=not-a-token'), expect: PUBLIC },
  { kind: 'page', pattern: '/courses', probe: at('/courses'), expect: PUBLIC },
  { kind: 'page', pattern: '/courses/[course]', probe: at(`/courses/${FLAGSHIP}`), expect: PUBLIC },
  { kind: 'page', pattern: '/courses/[course]/changes', probe: at(`/courses/${FLAGSHIP}/changes`), expect: PUBLIC },
  { kind: 'page', pattern: '/desk', probe: at('/desk'), expect: COORDINATOR_PAGE },
  { kind: 'page', pattern: '/desk/payments', probe: at('/desk/payments'), expect: COORDINATOR_PAGE },
  { kind: 'page', pattern: '/desk/reports', probe: at('/desk/reports'), expect: COORDINATOR_PAGE },
  { kind: 'page', pattern: '/desk/waivers', probe: at('/desk/waivers'), expect: COORDINATOR_PAGE },
  { kind: 'page', pattern: '/desk/workshops', probe: at('/desk/workshops'), expect: COORDINATOR_PAGE },
  { kind: 'page', pattern: '/desk/workshops/[id]', probe: (fx) => ({ path: `/desk/workshops/${fx.workshopId}` }), expect: COORDINATOR_PAGE },
  // Members-only lessons: A reads the flagship's; the refresher's belong to learners enrolled in it (B).
  {
    kind: 'page',
    pattern: '/learn/[course]/[lesson]',
    probe: (_fx, s) => ({ path: s === 'other' ? `/learn/${REFRESHER}/time-and-altitude-review` : `/learn/${FLAGSHIP}/processing` }),
    expect: { visitor: S, own: 200, other: 403, instructor: 200, coordinator: 200, admin: 200, volunteer: 200 },
  },
  // A preview lesson: the same route, open to everyone.
  { kind: 'page', pattern: '/learn/[course]/[lesson]', probe: at(`/learn/${FLAGSHIP}/acidity`), expect: PUBLIC },
  {
    kind: 'page',
    pattern: '/learn/[course]/practical',
    probe: (_fx, s) => ({ path: `/learn/${s === 'other' ? REFRESHER : FLAGSHIP}/practical` }),
    expect: { visitor: S, own: 200, other: 200, instructor: 403, coordinator: 403, admin: 403, volunteer: 200 },
    bodyIncludes: { other: 'The practical is for learners with an active enrollment' },
  },
  { kind: 'page', pattern: '/pantry', probe: at('/pantry'), expect: LEARNER_PAGE },
  {
    kind: 'page',
    pattern: '/quiz/[quiz]',
    probe: (_fx, s) => ({ path: s === 'other' ? `/quiz/${REFRESHER}--quiz` : `/quiz/${FLAGSHIP}--processing` }),
    expect: { visitor: S, own: 200, other: 200, instructor: 403, coordinator: 403, admin: 403, volunteer: 200 },
    bodyIncludes: { other: 'Quizzes are for learners enrolled in this course.' },
  },
  { kind: 'page', pattern: '/register', probe: at('/register'), expect: PUBLIC },
  { kind: 'page', pattern: '/signin', probe: at('/signin'), expect: PUBLIC },
  { kind: 'page', pattern: '/tasting-table', probe: at('/tasting-table'), expect: INSTRUCTOR_PAGE },
  { kind: 'page', pattern: '/tasting-table/questions', probe: at('/tasting-table/questions'), expect: INSTRUCTOR_PAGE },
  {
    kind: 'page',
    pattern: '/tasting-table/submissions/[id]',
    probe: (fx) => ({ path: `/tasting-table/submissions/${fx.practicalId}` }),
    expect: { visitor: S, own: 403, other: 403, instructor: 200, coordinator: 200, admin: 200, volunteer: 200 },
  },
  { kind: 'page', pattern: '/tasting-table/workshops', probe: at('/tasting-table/workshops'), expect: INSTRUCTOR_PAGE },
  { kind: 'page', pattern: '/verify', probe: at('/verify'), expect: PUBLIC },
  // Public by design: anyone holding a serial may check it.
  {
    kind: 'page',
    pattern: '/verify/[serial]',
    probe: (fx, s) => ({ path: `/verify/${ab(s, fx.a.serial, fx.b.serial)}` }),
    expect: { visitor: 200, own: 200, other: 200, instructor: 200, coordinator: 200, admin: 200, volunteer: 200 },
  },
  // Accounts that recover: every signed-in person has an account page; deletion is a learner's own.
  {
    kind: 'page',
    pattern: '/account',
    probe: at('/account'),
    expect: { visitor: S, own: 200, other: NA, instructor: 200, coordinator: 200, admin: 200, volunteer: 200 },
  },
  { kind: 'page', pattern: '/account/delete', probe: at('/account/delete'), expect: LEARNER_PAGE },
  { kind: 'page', pattern: '/forgot-password', probe: at('/forgot-password'), expect: PUBLIC },
  { kind: 'page', pattern: '/reset-password', probe: at('/reset-password?token=not-a-token'), expect: PUBLIC },
  { kind: 'page', pattern: '/confirm-email-change', probe: at('/confirm-email-change?token=not-a-token'), expect: PUBLIC },
  { kind: 'page', pattern: '/privacy', probe: at('/privacy'), expect: PUBLIC },
];

const tool = (name: string, query: string): RouteRow => ({
  kind: 'route',
  pattern: `/api/tools/${name}`,
  method: 'GET',
  probe: at(`/api/tools/${name}?${query}`),
  expect: PUBLIC,
});

const ADMIN_WRITE: Answers = { visitor: 401, own: 403, other: NA, instructor: 403, coordinator: 403, admin: 404, volunteer: 403 };

const routes: RouteRow[] = [
  // An account that does not exist: the admin is let through, then told so (404); nobody's roles or access change.
  {
    kind: 'route',
    pattern: '/api/admin/users/[id]/roles',
    method: 'POST',
    probe: () => ({ path: '/api/admin/users/999999999/roles', body: { roles: ['learner'] } }),
    expect: ADMIN_WRITE,
  },
  // Nothing filled in: the admin is told what is missing (400); nobody is invited.
  {
    kind: 'route',
    pattern: '/api/admin/invitations',
    method: 'POST',
    probe: () => ({ path: '/api/admin/invitations', body: {} }),
    expect: { ...ADMIN_WRITE, admin: 400 },
  },
  // Public (the token is the credential): a form without a token is refused on its merits for everyone.
  {
    kind: 'route',
    pattern: '/api/invitations/accept',
    method: 'POST',
    probe: () => ({ path: '/api/invitations/accept', body: {} }),
    expect: { visitor: 400, own: 400, other: NA, instructor: 400, coordinator: 400, admin: 400, volunteer: 400 },
  },
  { kind: 'route', pattern: '/api/admin/users/[id]/deactivate', method: 'POST', probe: at('/api/admin/users/999999999/deactivate'), expect: ADMIN_WRITE },
  { kind: 'route', pattern: '/api/admin/users/[id]/reactivate', method: 'POST', probe: at('/api/admin/users/999999999/reactivate'), expect: ADMIN_WRITE },
  // Staff may read an attempt (question results, reviews); another learner may not.
  {
    kind: 'route',
    pattern: '/api/attempts/[id]',
    method: 'GET',
    probe: (fx, s) => ({ path: `/api/attempts/${ab(s, fx.a.attemptId, fx.b.attemptId)}` }),
    expect: { visitor: 401, own: 200, other: 403, instructor: 200, coordinator: 200, admin: 200, volunteer: 200 },
  },
  {
    kind: 'route',
    pattern: '/api/attempts/[id]/submit',
    method: 'POST',
    probe: (fx, s) => ({ path: `/api/attempts/${ab(s, fx.a.attemptId, fx.b.attemptId)}/submit`, body: { answers: {} } }),
    expect: { visitor: 401, own: 200, other: 403, instructor: 403, coordinator: 403, admin: 403, volunteer: 403 },
  },
  { kind: 'route', pattern: '/api/auth/[...nextauth]', method: 'GET', probe: at('/api/auth/session'), expect: PUBLIC },
  // Signing out needs next-auth's CSRF token; a bare POST is sent back to the sign-out page.
  {
    kind: 'route',
    pattern: '/api/auth/[...nextauth]',
    method: 'POST',
    probe: () => ({ path: '/api/auth/signout', body: '', headers: { 'content-type': 'application/x-www-form-urlencoded' } }),
    expect: { visitor: 302, own: 302, other: NA, instructor: 302, coordinator: 302, admin: 302, volunteer: 302 },
  },
  // The PDF: its owner and the desk; to anyone else the serial does not exist.
  {
    kind: 'route',
    pattern: '/api/certificates/[serial]/pdf',
    method: 'GET',
    probe: (fx, s) => ({ path: `/api/certificates/${ab(s, fx.a.serial, fx.b.serial)}/pdf` }),
    expect: { visitor: 401, own: 200, other: 404, instructor: 404, coordinator: 200, admin: 200, volunteer: 404 },
  },
  { kind: 'route', pattern: '/api/program', method: 'GET', probe: at('/api/program'), expect: PUBLIC },
  { kind: 'route', pattern: '/api/program/logo', method: 'GET', probe: at('/api/program/logo'), expect: PUBLIC },
  // The admin's program page: empty fields, and an upload without a logo, are refused on their merits.
  { kind: 'route', pattern: '/api/program', method: 'POST', probe: () => ({ path: '/api/program', body: {} }), expect: { ...ADMIN_WRITE, admin: 400 } },
  {
    kind: 'route',
    pattern: '/api/program/logo',
    method: 'POST',
    probe: () => ({ path: '/api/program/logo', body: new FormData() }),
    expect: { ...ADMIN_WRITE, admin: 400 },
  },
  {
    kind: 'route',
    pattern: '/api/certificates/[serial]',
    method: 'GET',
    probe: (fx, s) => ({ path: `/api/certificates/${ab(s, fx.a.serial, fx.b.serial)}` }),
    expect: { visitor: 200, own: 200, other: 200, instructor: 200, coordinator: 200, admin: 200, volunteer: 200 },
  },
  // A's refresher enrollment is withdrawn (not complete: 409); B's is not A's to claim (404).
  {
    kind: 'route',
    pattern: '/api/certificates/refresher',
    method: 'POST',
    probe: (fx, s) => ({ path: '/api/certificates/refresher', body: { enrollmentId: ab(s, fx.a.refresherEnrollmentId, fx.b.refresherEnrollmentId) } }),
    expect: { visitor: 401, own: 409, other: 404, instructor: 403, coordinator: 403, admin: 403, volunteer: 404 },
  },
  { kind: 'route', pattern: '/api/courses/[course]/workshops', method: 'GET', probe: at(`/api/courses/${FLAGSHIP}/workshops`), expect: PUBLIC },
  {
    kind: 'route',
    pattern: '/api/desk/certificates/[id]/reissue',
    method: 'POST',
    probe: (fx) => ({ path: `/api/desk/certificates/${fx.b.certificateId}/reissue`, body: {} }),
    expect: COORDINATOR_WRITE,
  },
  {
    kind: 'route',
    pattern: '/api/desk/certificates/[id]/revoke',
    method: 'POST',
    probe: (fx) => ({ path: `/api/desk/certificates/${fx.b.certificateId}/revoke`, body: {} }),
    expect: COORDINATOR_WRITE,
  },
  // An enrollment that does not exist: answered per id (200, not_found), nothing issued.
  {
    kind: 'route',
    pattern: '/api/desk/certificates',
    method: 'POST',
    probe: () => ({ path: '/api/desk/certificates', body: { enrollmentIds: [2_000_000_000] } }),
    expect: COORDINATOR_READ,
  },
  { kind: 'route', pattern: '/api/desk/enrollments', method: 'GET', probe: at('/api/desk/enrollments'), expect: COORDINATOR_READ },
  // The holder import with no file text, and a workshop with nothing filled in: field errors, nothing written.
  { kind: 'route', pattern: '/api/desk/import', method: 'POST', probe: () => ({ path: '/api/desk/import', body: {} }), expect: COORDINATOR_WRITE },
  {
    kind: 'route',
    pattern: '/api/desk/import/preview',
    method: 'POST',
    probe: () => ({ path: '/api/desk/import/preview', body: {} }),
    expect: COORDINATOR_WRITE,
  },
  { kind: 'route', pattern: '/api/desk/workshops', method: 'POST', probe: () => ({ path: '/api/desk/workshops', body: {} }), expect: COORDINATOR_WRITE },
  {
    kind: 'route',
    pattern: '/api/desk/workshops/[id]',
    method: 'POST',
    probe: (fx) => ({ path: `/api/desk/workshops/${fx.workshopId}`, body: {} }),
    expect: COORDINATOR_WRITE,
  },
  { kind: 'route', pattern: '/api/desk/options', method: 'GET', probe: at('/api/desk/options'), expect: COORDINATOR_READ },
  { kind: 'route', pattern: '/api/desk/roster', method: 'GET', probe: at('/api/desk/roster'), expect: COORDINATOR_READ },
  // The workshop's instructor and the desk mark attendance; a learner not even their own.
  {
    kind: 'route',
    pattern: '/api/enrollments/[id]/attendance',
    method: 'POST',
    probe: (fx, s) => ({ path: `/api/enrollments/${ab(s, fx.a.enrollmentId, fx.b.enrollmentId)}/attendance`, body: { attended: false } }),
    expect: { visitor: 401, own: 403, other: 403, instructor: 200, coordinator: 200, admin: 200, volunteer: 403 },
  },
  // The fixtures' enrollments have no payment, so the desk is let through and told there is nothing to refund (409).
  {
    kind: 'route',
    pattern: '/api/enrollments/[id]/refund',
    method: 'POST',
    probe: (fx, s) => ({ path: `/api/enrollments/${ab(s, fx.a.enrollmentId, fx.b.enrollmentId)}/refund`, body: {} }),
    expect: { visitor: 401, own: 403, other: 403, instructor: 403, coordinator: 409, admin: 409, volunteer: 403 },
  },
  // Someone else's enrollment is answered as missing (its existence is not revealed).
  {
    kind: 'route',
    pattern: '/api/enrollments/[id]',
    method: 'GET',
    probe: (fx, s) => ({ path: `/api/enrollments/${ab(s, fx.a.enrollmentId, fx.b.enrollmentId)}` }),
    expect: { visitor: 401, own: 200, other: 404, instructor: 404, coordinator: 200, admin: 200, volunteer: 404 },
  },
  { kind: 'route', pattern: '/api/enrollments', method: 'POST', probe: () => ({ path: '/api/enrollments', body: {} }), expect: LEARNER_WRITE },
  { kind: 'route', pattern: '/api/health', method: 'GET', probe: at('/api/health'), expect: PUBLIC },
  {
    kind: 'route',
    pattern: '/api/pantry',
    method: 'GET',
    probe: at('/api/pantry'),
    expect: { visitor: 401, own: 200, other: NA, instructor: 403, coordinator: 403, admin: 403, volunteer: 200 },
  },
  // The fixtures' photos are loose uploads (not yet in a submission): only their owner may read them.
  {
    kind: 'route',
    pattern: '/api/photos/[id]',
    method: 'GET',
    probe: (fx, s) => ({ path: `/api/photos/${ab(s, fx.a.photoId, fx.b.photoId)}?size=thumb` }),
    expect: { visitor: 401, own: 200, other: 403, instructor: 403, coordinator: 403, admin: 403, volunteer: 403 },
  },
  {
    kind: 'route',
    pattern: '/api/photos',
    method: 'POST',
    probe: (fx) => {
      const form = new FormData();
      form.set('course', FLAGSHIP);
      form.set('photo', new Blob([fx.jpeg as BlobPart], { type: 'image/jpeg' }), 'batch.jpg');
      return { path: '/api/photos', body: form };
    },
    expect: { visitor: 401, own: 201, other: NA, instructor: 403, coordinator: 403, admin: 403, volunteer: 201 },
  },
  // A missing submission: the guard lets staff through, then 404 (claiming the demo's waiting round would change shared data).
  {
    kind: 'route',
    pattern: '/api/practicals/[id]/claim',
    method: 'POST',
    probe: () => ({ path: '/api/practicals/999999999/claim' }),
    expect: { visitor: 401, own: 403, other: NA, instructor: 404, coordinator: 404, admin: 404, volunteer: 404 },
  },
  {
    kind: 'route',
    pattern: '/api/practicals/[id]/claim',
    method: 'DELETE',
    probe: () => ({ path: '/api/practicals/999999999/claim' }),
    expect: { visitor: 401, own: 403, other: NA, instructor: 404, coordinator: 404, admin: 404, volunteer: 404 },
  },
  {
    kind: 'route',
    pattern: '/api/practicals/[id]/review',
    method: 'POST',
    probe: (fx) => ({ path: `/api/practicals/${fx.practicalId}/review`, body: {} }),
    expect: { visitor: 401, own: 403, other: NA, instructor: 400, coordinator: 400, admin: 400, volunteer: 400 },
  },
  { kind: 'route', pattern: '/api/practicals', method: 'POST', probe: () => ({ path: '/api/practicals', body: {} }), expect: LEARNER_WRITE },
  {
    kind: 'route',
    pattern: '/api/progress',
    method: 'GET',
    probe: at(`/api/progress?course=${FLAGSHIP}`),
    expect: { visitor: 401, own: 200, other: NA, instructor: 403, coordinator: 403, admin: 403, volunteer: 200 },
  },
  // The volunteer read the lesson when they took the course: marked already (200), nothing new.
  {
    kind: 'route',
    pattern: '/api/progress',
    method: 'POST',
    probe: () => ({ path: '/api/progress', body: { courseSlug: FLAGSHIP, lessonSlug: 'acidity' } }),
    expect: { visitor: 401, own: 201, other: NA, instructor: 403, coordinator: 403, admin: 403, volunteer: 200 },
  },
  // A starts a quiz of their course (201, once per walk); the refresher's are for learners enrolled in it.
  {
    kind: 'route',
    pattern: '/api/quizzes/[quiz]/attempts',
    method: 'POST',
    probe: (_fx, s) => ({ path: `/api/quizzes/${s === 'other' ? `${REFRESHER}--quiz` : `${FLAGSHIP}--jars-packing-and-headspace`}/attempts`, body: {} }),
    expect: { visitor: 401, own: 201, other: 403, instructor: 403, coordinator: 403, admin: 403, volunteer: 201 },
  },
  {
    kind: 'route',
    pattern: '/api/register',
    method: 'POST',
    probe: () => ({ path: '/api/register', body: {} }),
    expect: { visitor: 400, own: 400, other: NA, instructor: 400, coordinator: 400, admin: 400, volunteer: 400 },
  },
  {
    kind: 'route',
    pattern: '/api/tasting-table/submissions',
    method: 'GET',
    probe: at('/api/tasting-table/submissions'),
    expect: { visitor: 401, own: 403, other: NA, instructor: 200, coordinator: 200, admin: 200, volunteer: 200 },
  },
  tool('batch', 'product=fresh-pack-dill-pickles&jar=pint&jars=7'),
  tool('boiling-point', 'altitudeFt=5000'),
  tool('brine', 'vinegarMl=500&vinegarAcidityPct=5&waterMl=500'),
  tool('convert', 'value=1&from=cup&to=mL'),
  tool('crisping', 'agent=calcium-chloride&jar=pint&jars=7'),
  tool('headspace', 'product=fresh-pack-dill-pickles&measuredIn=0.5'),
  tool('pressure', 'gauge=weighted&altitudeFt=1500'),
  tool('processing-time', 'product=fresh-pack-dill-pickles&jar=pint&altitudeFt=0'),
  tool('salt', 'salt=canning&amount=1&unit=tbsp'),
  tool('sugar', 'sugar=granulated&amount=1&unit=cup'),
  { kind: 'route', pattern: '/api/waivers', method: 'GET', probe: at('/api/waivers'), expect: COORDINATOR_READ },
  { kind: 'route', pattern: '/api/waivers', method: 'POST', probe: () => ({ path: '/api/waivers', body: {} }), expect: COORDINATOR_WRITE },
  // Called by the payment service: the signature on the raw body is the only check, for everyone.
  {
    kind: 'route',
    pattern: '/api/webhooks/payments',
    method: 'POST',
    probe: () => ({ path: '/api/webhooks/payments', body: '{}', headers: { 'content-type': 'application/json' } }),
    expect: { visitor: 400, own: 400, other: NA, instructor: 400, coordinator: 400, admin: 400, volunteer: 400 },
  },
  // Accounts that recover. The bodies fail validation, so no demo account changes; the demo accounts are confirmed (409: nothing to send).
  {
    kind: 'route',
    pattern: '/api/password-reset',
    method: 'POST',
    probe: () => ({ path: '/api/password-reset', body: {} }),
    expect: { visitor: 400, own: 400, other: NA, instructor: 400, coordinator: 400, admin: 400, volunteer: 400 },
  },
  {
    kind: 'route',
    pattern: '/api/password-reset/complete',
    method: 'POST',
    probe: () => ({ path: '/api/password-reset/complete', body: {} }),
    expect: { visitor: 400, own: 400, other: NA, instructor: 400, coordinator: 400, admin: 400, volunteer: 400 },
  },
  { kind: 'route', pattern: '/api/account/password', method: 'POST', probe: () => ({ path: '/api/account/password', body: {} }), expect: ACCOUNT_WRITE },
  { kind: 'route', pattern: '/api/account/email', method: 'POST', probe: () => ({ path: '/api/account/email', body: {} }), expect: ACCOUNT_WRITE },
  { kind: 'route', pattern: '/api/account/name', method: 'POST', probe: () => ({ path: '/api/account/name', body: {} }), expect: ACCOUNT_WRITE },
  {
    kind: 'route',
    pattern: '/api/account/sign-out-everywhere',
    method: 'POST',
    probe: () => ({ path: '/api/account/sign-out-everywhere', body: {} }),
    expect: ACCOUNT_WRITE,
  },
  {
    kind: 'route',
    pattern: '/api/account/confirmation',
    method: 'POST',
    probe: at('/api/account/confirmation'),
    expect: { visitor: 401, own: 409, other: NA, instructor: 409, coordinator: 409, admin: 409, volunteer: 409 },
  },
  {
    kind: 'route',
    pattern: '/api/account/export',
    method: 'GET',
    probe: at('/api/account/export'),
    expect: { visitor: 401, own: 200, other: NA, instructor: 200, coordinator: 200, admin: 200, volunteer: 200 },
  },
  { kind: 'route', pattern: '/api/account', method: 'DELETE', probe: () => ({ path: '/api/account', body: {} }), expect: { ...LEARNER_WRITE, volunteer: 403 } },
];

const actions: ActionRow[] = [];

export const MATRIX: MatrixRow[] = [...pages, ...routes, ...actions];

/** The key a row and a discovered route share: "page /desk", "route POST /api/waivers", "action /desk/workshops saveWorkshopAction". */
export function rowKey(row: MatrixRow): string {
  if (row.kind === 'page') return `page ${row.pattern}`;
  if (row.kind === 'route') return `route ${row.method} ${row.pattern}`;
  return `action ${row.pattern} ${row.action}`;
}
