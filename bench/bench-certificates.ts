/**
 * npm run bench:certificates — issues 500 certificates with their PDFs in one bulk action, against
 * a database of its own (BENCH_DATABASE_NAME, default brinewright_bench: dropped and rebuilt), and
 * prints the wall time, the rate and the peak resident memory. Goal: under 60 s, memory bounded.
 *
 * Run through package.json (it sets DATABASE_URL and the react-server condition that lets the
 * server-only modules load outside Next).
 */
import { QueryTypes } from 'sequelize';
import { rebuildDatabase } from '../lib/migrator';
import { writeBenchResults } from './bench-results';

const COUNT = Number(process.env.BENCH_COUNT ?? 500);
const CONCURRENCY = Number(process.env.BENCH_CONCURRENCY ?? 4);

async function main() {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('DATABASE_URL is not set: run `npm run bench:certificates`');
  process.env.NEXTAUTH_SECRET ??= 'bench-secret-0123456789abcdef';
  await rebuildDatabase(url, { allowed: /^brinewright_bench\w*$/, purpose: 'benchmarks' });

  // Loaded after DATABASE_URL is final: these read the environment once.
  const { db } = await import('../models');
  const { issueCertificates } = await import('../lib/certificates/issue');
  const { requirementsForCourse } = await import('../lib/certificates/requirements');
  const { sequelize } = db();
  const q = (sql: string, replacements: Record<string, unknown> = {}) => sequelize.query(sql, { replacements });
  const now = new Date();

  console.log(`[bench] seeding ${COUNT} eligible enrollments…`);
  await q(
    `INSERT INTO users (email, name, passwordHash, roles, createdAt, updatedAt) VALUES ('bench-coordinator@bench.example', 'Bench Coordinator', 'x', 'coordinator', :now, :now)`,
    { now },
  );
  await q(
    `INSERT INTO courses (slug, title, feeCents, currency, passMarkPct, validityMonths, createdAt, updatedAt)
     VALUES ('pickling-and-canning', 'Safe Pickling and Water-Bath Canning', 4500, 'usd', 80, 36, :now, :now)`,
    { now },
  );
  const [[coordinator]] = (await q("SELECT id FROM users WHERE email = 'bench-coordinator@bench.example'")) as [{ id: number }[], unknown];
  const [[course]] = (await q("SELECT id FROM courses WHERE slug = 'pickling-and-canning'")) as [{ id: number }[], unknown];
  await q(
    `INSERT INTO workshops (courseId, startsAt, endsAt, timeZone, place, seats, attendanceRequired, createdAt, updatedAt)
     VALUES (:courseId, :now, :now, 'America/Denver', 'Bench Hall', 1000, 1, :now, :now)`,
    { courseId: course.id, now },
  );
  const [[workshop]] = (await q('SELECT id FROM workshops LIMIT 1')) as [{ id: number }[], unknown];
  const req = requirementsForCourse('pickling-and-canning');
  const quizzes = [...req.quizSlugs, ...(req.finalExam ? [req.finalExam] : [])];
  const names = ['Adaeze Okafor', 'Zoë Brontë', 'José Muñoz', 'Łucja Wiśniewska', 'Henrik Ødegaard'];
  const BATCH = 100;
  for (let start = 0; start < COUNT; start += BATCH) {
    const n = Math.min(BATCH, COUNT - start);
    const users = Array.from({ length: n }, (_, i) => ({
      email: `learner${start + i}@bench.example`,
      name: `${names[(start + i) % names.length]} ${start + i}`,
    }));
    await sequelize.getQueryInterface().bulkInsert(
      'users',
      users.map((u) => ({ ...u, passwordHash: 'x', roles: 'learner', createdAt: now, updatedAt: now })),
    );
    const ids = (
      await sequelize.query<{ id: number }>('SELECT id FROM users WHERE email IN (:emails) ORDER BY id', {
        replacements: { emails: users.map((u) => u.email) },
        type: QueryTypes.SELECT,
      })
    ).map((r) => r.id);
    const qi = sequelize.getQueryInterface();
    await qi.bulkInsert(
      'enrollments',
      ids.map((userId) => ({
        userId,
        courseId: course.id,
        workshopId: workshop.id,
        runKey: String(workshop.id),
        status: 'active',
        feeCents: 4500,
        attendedAt: now,
        createdAt: now,
        updatedAt: now,
      })),
    );
    const enrollments = await sequelize.query<{ id: number; userId: number }>('SELECT id, userId FROM enrollments WHERE userId IN (:ids)', {
      replacements: { ids },
      type: QueryTypes.SELECT,
    });
    await qi.bulkInsert(
      'payments',
      enrollments.map((e) => ({
        enrollmentId: e.id,
        provider: 'stripe',
        checkoutSessionId: `cs_bench_${e.id}`,
        amountCents: 4500,
        currency: 'usd',
        status: 'paid',
        refundedCents: 0,
        paidAt: now,
        createdAt: now,
        updatedAt: now,
      })),
    );
    await qi.bulkInsert(
      'lesson_progress',
      ids.flatMap((userId) => req.lessonSlugs.map((lessonSlug) => ({ userId, courseId: course.id, lessonSlug, readAt: now, createdAt: now, updatedAt: now }))),
    );
    await qi.bulkInsert(
      'quiz_attempts',
      ids.flatMap((userId) =>
        quizzes.map((quizSlug) => ({
          userId,
          courseId: course.id,
          quizSlug,
          drawn: '[]',
          answers: '{}',
          scorePct: 100,
          passed: true,
          startedAt: now,
          submittedAt: now,
          createdAt: now,
          updatedAt: now,
        })),
      ),
    );
    await qi.bulkInsert(
      'practicals',
      enrollments.map((e) => ({
        enrollmentId: e.id,
        userId: e.userId,
        round: 1,
        status: 'approved',
        details: '{}',
        flags: '[]',
        submittedAt: now,
        createdAt: now,
        updatedAt: now,
      })),
    );
  }
  const ids = (await sequelize.query<{ id: number }>('SELECT id FROM enrollments ORDER BY id', { type: QueryTypes.SELECT })).map((r) => r.id);

  let peakRss = process.memoryUsage().rss;
  const baselineRss = peakRss;
  const sampler = setInterval(() => {
    peakRss = Math.max(peakRss, process.memoryUsage().rss);
  }, 20);
  console.log(`[bench] issuing ${ids.length} certificates with PDFs (concurrency ${CONCURRENCY})…`);
  const t0 = process.hrtime.bigint();
  const results = await issueCertificates(ids, coordinator.id, { concurrency: CONCURRENCY });
  const seconds = Number(process.hrtime.bigint() - t0) / 1e9;
  clearInterval(sampler);
  peakRss = Math.max(peakRss, process.memoryUsage().rss);

  const issued = results.filter((r) => r.outcome === 'issued').length;
  const [[counts]] = (await q(
    "SELECT (SELECT COUNT(*) FROM certificates) AS certificates, (SELECT COUNT(*) FROM outbox_emails WHERE kind = 'certificate.issued') AS emails, (SELECT AVG(LENGTH(attachments)) FROM outbox_emails) AS avgAttachment",
  )) as [{ certificates: number; emails: number; avgAttachment: number }[], unknown];
  const mb = (b: number) => (b / 1024 / 1024).toFixed(1);
  console.log(
    JSON.stringify(
      {
        requested: ids.length,
        issued,
        certificatesInDb: Number(counts.certificates),
        emailsWithPdf: Number(counts.emails),
        avgAttachmentKb: Math.round(Number(counts.avgAttachment) / 1024),
        seconds: Number(seconds.toFixed(2)),
        perSecond: Number((issued / seconds).toFixed(1)),
        baselineRssMb: Number(mb(baselineRss)),
        peakRssMb: Number(mb(peakRss)),
        goalUnder60s: seconds < 60,
      },
      null,
      2,
    ),
  );
  // For `npm run bench` (bench/bench.ts): the same figures as JSON.
  writeBenchResults({
    bench: 'certificates',
    figures: [
      { name: `${ids.length} certificates with PDFs in one bulk action`, value: Number(seconds.toFixed(2)), unit: 's', goal: '< 60 s', met: seconds < 60 },
      { name: 'certificates issued', value: issued, unit: `of ${ids.length}`, met: issued === ids.length },
      {
        name: 'peak RSS during the bulk action',
        value: Number(mb(peakRss)),
        unit: 'MB',
        anchor: { name: 'before', value: Number(mb(baselineRss)), unit: 'MB' },
      },
    ],
  });
  await sequelize.close();
  if (issued !== ids.length) process.exitCode = 1;
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
