'use strict';

// Demo data only (the invented Cedar Hollow County program): two more learners for the
// Certificate desk. Ines has done everything the flagship course asks, so the coordinator can
// issue her certificate; Wren was certified almost three years ago, so her Pantry offers the
// refresher course.
const fs = require('node:fs');
const path = require('node:path');
const bcrypt = require('bcryptjs');
const matter = require('gray-matter');

/** The flagship's lesson slugs required under `version` (front matter `since`, default 1), in order. */
function flagshipLessons(version) {
  const dir = path.join(__dirname, '..', 'content', 'lessons', 'pickling-and-canning');
  return fs
    .readdirSync(dir)
    .filter((file) => file.endsWith('.mdx'))
    .map((file) => ({ slug: file.replace(/^\d+-/, '').replace(/\.mdx$/, ''), data: matter(fs.readFileSync(path.join(dir, file), 'utf8')).data }))
    .filter((lesson) => (lesson.data.since ?? 1) <= version)
    .sort((a, b) => a.data.order - b.data.order)
    .map((lesson) => lesson.slug);
}

const LEARNERS = [
  { email: 'ines@cedarhollow.example', name: 'Inés Alvarado', password: 'demo-ines-pass' },
  { email: 'wren@cedarhollow.example', name: 'Wren Castellanos', password: 'demo-wren-pass' },
];
// Lesson slugs and quiz slugs of the flagship course under content version 1, the version these
// enrollments begin under (enrollments.contentVersion's default), read from the content itself.
const LESSONS = flagshipLessons(1);
const QUIZZES = [...LESSONS.map((l) => `pickling-and-canning--${l}`), 'pickling-and-canning--final-exam'];
// A serial in the product's format (lib/certificates/serial.ts), with its check character.
const WREN_SERIAL = 'XJC3-GMFM-3AEY-FWPY';
const PLACE = 'Cedar Hollow Grange Hall, 14 Mill Road, Cedar Hollow';
const DAY = 24 * 60 * 60 * 1000;

const addMonths = (date, months) => {
  const d = new Date(date.getTime());
  const day = d.getUTCDate();
  d.setUTCDate(1);
  d.setUTCMonth(d.getUTCMonth() + months);
  const last = new Date(Date.UTC(d.getUTCFullYear(), d.getUTCMonth() + 1, 0)).getUTCDate();
  d.setUTCDate(Math.min(day, last));
  return d;
};

// The approved practical of both learners, every field as the practical form stores it
// (lib/validations/practical.ts): seven pints of quick fresh-pack dill pickles at 5,200 ft, processed
// 15 minutes, the time the USDA Complete Guide to Home Canning (2015), Guide 6, gives for pints at
// 1,001-6,000 ft, so no flag. The brine is that recipe's solution (6 cups of 5 % vinegar to 8 cups of
// water) in the amount seven pints take: 1,420 mL and 1,893 mL.
const approvedBatch = (submittedAt) => ({
  product: 'fresh-pack-dill-pickles',
  recipeTitle: 'Quick fresh-pack dill pickles',
  recipeSource: 'USDA Complete Guide to Home Canning (AIB 539, rev. 2015), Guide 6',
  jar: 'pint',
  jars: 7,
  pack: 'raw',
  vinegarAcidityPct: 5,
  vinegarMl: 1420,
  waterMl: 1893,
  headspaceIn: 0.5,
  method: 'boiling-water',
  altitudeFt: 5200,
  minutes: 15,
  batchDate: new Date(submittedAt.getTime() - 2 * DAY).toISOString().slice(0, 10),
  sealedJars: 7,
  unsealedJars: 0,
  notes: 'Cucumbers picked the morning of the batch; blossom ends trimmed.',
});

/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface) {
    const q = (sql, replacements) => queryInterface.sequelize.query(sql, { replacements });
    const now = new Date();
    await queryInterface.bulkInsert(
      'users',
      LEARNERS.map((a) => ({
        email: a.email,
        name: a.name,
        roles: 'learner',
        passwordHash: bcrypt.hashSync(a.password, 10),
        emailVerifiedAt: now,
        createdAt: now,
        updatedAt: now,
      })),
    );
    const [[course]] = await q("SELECT id, title, validityMonths FROM courses WHERE slug = 'pickling-and-canning'");
    const [[instructor]] = await q("SELECT id FROM users WHERE email = 'instructor@cedarhollow.example'");
    const [[ines]] = await q('SELECT id FROM users WHERE email = ?', [LEARNERS[0].email]);
    const [[wren]] = await q('SELECT id, name FROM users WHERE email = ?', [LEARNERS[1].email]);

    // Two past workshops: three weeks ago (Inés) and nearly three years ago (Wren).
    const past = (msAgo) => {
      const d = new Date(now.getTime() - msAgo);
      d.setUTCHours(16, 0, 0, 0);
      return d;
    };
    const recent = past(21 * DAY);
    const longAgo = addMonths(past(0), -34);
    for (const startsAt of [recent, longAgo]) {
      await queryInterface.bulkInsert('workshops', [
        {
          courseId: course.id,
          instructorId: instructor.id,
          startsAt,
          endsAt: new Date(startsAt.getTime() + 5 * 3600 * 1000),
          timeZone: 'America/Denver',
          place: PLACE,
          seats: 12,
          attendanceRequired: true,
          createdAt: now,
          updatedAt: now,
        },
      ]);
    }
    const [[recentWorkshop]] = await q('SELECT id FROM workshops WHERE courseId = ? AND startsAt = ?', [course.id, recent]);
    const [[oldWorkshop]] = await q('SELECT id FROM workshops WHERE courseId = ? AND startsAt = ?', [course.id, longAgo]);

    await queryInterface.bulkInsert('enrollments', [
      {
        userId: ines.id,
        courseId: course.id,
        workshopId: recentWorkshop.id,
        runKey: String(recentWorkshop.id),
        status: 'active',
        feeCents: 4500,
        attendedAt: recent,
        createdAt: now,
        updatedAt: now,
      },
      {
        userId: wren.id,
        courseId: course.id,
        workshopId: oldWorkshop.id,
        runKey: String(oldWorkshop.id),
        status: 'completed',
        feeCents: 4500,
        attendedAt: longAgo,
        completedAt: longAgo,
        createdAt: longAgo,
        updatedAt: longAgo,
      },
    ]);
    const [[inesEnrollment]] = await q('SELECT id FROM enrollments WHERE userId = ?', [ines.id]);
    const [[wrenEnrollment]] = await q('SELECT id FROM enrollments WHERE userId = ?', [wren.id]);

    await queryInterface.bulkInsert('payments', [
      {
        enrollmentId: inesEnrollment.id,
        provider: 'stripe',
        checkoutSessionId: 'cs_demo_seeded_h7_ines',
        paymentIntentId: 'pi_demo_seeded_h7_ines',
        amountCents: 4500,
        currency: 'usd',
        status: 'paid',
        refundedCents: 0,
        paidAt: past(30 * DAY),
        createdAt: now,
        updatedAt: now,
      },
      {
        enrollmentId: wrenEnrollment.id,
        provider: 'stripe',
        checkoutSessionId: 'cs_demo_seeded_h7_wren',
        paymentIntentId: 'pi_demo_seeded_h7_wren',
        amountCents: 4500,
        currency: 'usd',
        status: 'paid',
        refundedCents: 0,
        paidAt: longAgo,
        createdAt: longAgo,
        updatedAt: longAgo,
      },
    ]);
    for (const [user, when] of [
      [ines, recent],
      [wren, longAgo],
    ]) {
      await queryInterface.bulkInsert(
        'lesson_progress',
        LESSONS.map((lessonSlug) => ({ userId: user.id, courseId: course.id, lessonSlug, readAt: when, createdAt: when, updatedAt: when })),
      );
      await queryInterface.bulkInsert(
        'quiz_attempts',
        QUIZZES.map((quizSlug) => ({
          userId: user.id,
          courseId: course.id,
          quizSlug,
          drawn: '[]',
          answers: '{}',
          scorePct: 100,
          passed: true,
          startedAt: when,
          submittedAt: when,
          createdAt: when,
          updatedAt: when,
        })),
      );
    }
    for (const [enrollment, user, when] of [
      [inesEnrollment, ines, recent],
      [wrenEnrollment, wren, longAgo],
    ]) {
      await queryInterface.bulkInsert('practicals', [approvedPractical(enrollment.id, user.id, when)]);
    }
    const [[coordinator]] = await q("SELECT id, name FROM users WHERE email = 'coordinator@cedarhollow.example'");
    await queryInterface.bulkInsert('certificates', [
      {
        enrollmentId: wrenEnrollment.id,
        userId: wren.id,
        issuedById: coordinator.id,
        serial: WREN_SERIAL,
        holderName: wren.name,
        courseTitle: course.title,
        programName: 'Cedar Hollow County home-preserving program',
        signerName: coordinator.name,
        signerTitle: 'Program coordinator',
        issuedAt: longAgo,
        validUntil: addMonths(longAgo, course.validityMonths),
        createdAt: longAgo,
        updatedAt: longAgo,
      },
    ]);
  },

  async down(queryInterface) {
    const q = (sql, replacements) => queryInterface.sequelize.query(sql, { replacements });
    const [users] = await q('SELECT id FROM users WHERE email IN (?)', [LEARNERS.map((l) => l.email)]);
    const ids = users.map((u) => u.id);
    if (ids.length === 0) return;
    const [enrollments] = await q('SELECT id, workshopId FROM enrollments WHERE userId IN (?)', [ids]);
    const enrollmentIds = enrollments.map((e) => e.id);
    if (enrollmentIds.length) {
      await queryInterface.bulkDelete('certificates', { enrollmentId: enrollmentIds });
      await queryInterface.bulkDelete('practicals', { enrollmentId: enrollmentIds });
      await queryInterface.bulkDelete('payments', { enrollmentId: enrollmentIds });
    }
    await queryInterface.bulkDelete('quiz_attempts', { userId: ids });
    await queryInterface.bulkDelete('lesson_progress', { userId: ids });
    await queryInterface.bulkDelete('enrollments', { userId: ids });
    const workshopIds = enrollments.map((e) => e.workshopId).filter(Boolean);
    if (workshopIds.length) await queryInterface.bulkDelete('workshops', { id: workshopIds });
    await queryInterface.bulkDelete('users', { id: ids });
  },
};

/** The row of a practical batch approved in its first round, as the certified demo learners have. */
function approvedPractical(enrollmentId, userId, when) {
  return {
    enrollmentId,
    userId,
    round: 1,
    status: 'approved',
    details: JSON.stringify(approvedBatch(when)),
    flags: '[]',
    submittedAt: when,
    createdAt: when,
    updatedAt: when,
  };
}
module.exports.approvedPractical = approvedPractical;

// For tests/unit/demo-seed-flags.test.ts (the migrator reads only up and down).
module.exports.approvedBatch = approvedBatch;
module.exports.flagshipLessons = flagshipLessons;
