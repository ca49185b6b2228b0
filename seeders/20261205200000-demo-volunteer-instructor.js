'use strict';

// Demo data only (the invented Cedar Hollow County program): Tomas, the demo instructor, is also a
// certified volunteer. He took the flagship course 34 months ago under Priya, so his certificate
// runs out within the year and his Pantry offers the refresher.
const { approvedPractical, flagshipLessons } = require('./20261201170000-demo-certificates.js');

const TOMAS = 'instructor@cedarhollow.example';
// A serial in the product's format (lib/certificates/serial.ts), with its check character.
const TOMAS_SERIAL = 'R7KD-M3QW-HT2C-9PXQ';
const PLACE = 'Cedar Hollow Grange Hall, 14 Mill Road, Cedar Hollow (winter session)';

const monthsAgo = (now, months) => {
  const d = new Date(now.getTime());
  d.setUTCDate(1);
  d.setUTCMonth(d.getUTCMonth() - months);
  d.setUTCDate(Math.min(now.getUTCDate(), 28));
  d.setUTCHours(16, 0, 0, 0);
  return d;
};

/** @type {import('sequelize-cli').Migration} */
module.exports = {
  TOMAS_SERIAL,
  async up(queryInterface) {
    const q = (sql, replacements) => queryInterface.sequelize.query(sql, { replacements }).then(([rows]) => rows);
    const now = new Date();
    const when = monthsAgo(now, 34);
    const [course] = await q("SELECT id, title, validityMonths FROM courses WHERE slug = 'pickling-and-canning'");
    const [tomas] = await q('SELECT id, name FROM users WHERE email = ?', [TOMAS]);
    const [priya] = await q("SELECT id, name FROM users WHERE email = 'coordinator@cedarhollow.example'");
    await queryInterface.bulkInsert('workshops', [
      {
        courseId: course.id,
        instructorId: priya.id,
        startsAt: when,
        endsAt: new Date(when.getTime() + 5 * 3600 * 1000),
        timeZone: 'America/Denver',
        place: PLACE,
        seats: 10,
        attendanceRequired: true,
        createdAt: when,
        updatedAt: when,
      },
    ]);
    const [workshop] = await q('SELECT id FROM workshops WHERE courseId = ? AND place = ?', [course.id, PLACE]);
    await queryInterface.bulkInsert('enrollments', [
      {
        userId: tomas.id,
        courseId: course.id,
        workshopId: workshop.id,
        runKey: String(workshop.id),
        status: 'completed',
        feeCents: 4500,
        attendedAt: when,
        completedAt: when,
        createdAt: when,
        updatedAt: when,
      },
    ]);
    const [enrollment] = await q('SELECT id FROM enrollments WHERE userId = ? AND courseId = ?', [tomas.id, course.id]);
    await queryInterface.bulkInsert(
      'lesson_progress',
      flagshipLessons(1).map((lessonSlug) => ({ userId: tomas.id, courseId: course.id, lessonSlug, readAt: when, createdAt: when, updatedAt: when })),
    );
    await queryInterface.bulkInsert('practicals', [approvedPractical(enrollment.id, tomas.id, when)]);
    const validUntil = new Date(when.getTime());
    validUntil.setUTCMonth(validUntil.getUTCMonth() + course.validityMonths);
    await queryInterface.bulkInsert('certificates', [
      {
        enrollmentId: enrollment.id,
        userId: tomas.id,
        issuedById: priya.id,
        serial: TOMAS_SERIAL,
        holderName: tomas.name,
        courseTitle: course.title,
        programName: 'Cedar Hollow County home-preserving program',
        signerName: priya.name,
        signerTitle: 'Program coordinator',
        issuedAt: when,
        validUntil,
        createdAt: when,
        updatedAt: when,
      },
    ]);
  },

  async down(queryInterface) {
    const q = (sql, replacements) => queryInterface.sequelize.query(sql, { replacements }).then(([rows]) => rows);
    const [tomas] = await q('SELECT id FROM users WHERE email = ?', [TOMAS]);
    if (!tomas) return;
    const enrollments = await q('SELECT id, workshopId FROM enrollments WHERE userId = ? AND status = ?', [tomas.id, 'completed']);
    const ids = enrollments.map((e) => e.id);
    if (ids.length) {
      await queryInterface.bulkDelete('certificates', { enrollmentId: ids });
      await queryInterface.bulkDelete('practicals', { enrollmentId: ids });
    }
    await queryInterface.bulkDelete('lesson_progress', { userId: tomas.id });
    await queryInterface.bulkDelete('enrollments', { id: ids });
    await queryInterface.bulkDelete('workshops', { place: PLACE });
  },
};
