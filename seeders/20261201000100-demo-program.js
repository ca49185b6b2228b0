'use strict';

// Demo data only: the Cedar Hollow County home-preserving program, an invented scenario.
const bcrypt = require('bcryptjs');

// `roles`: MariaDB's SET column, comma-separated. Tomas teaches and is also a certified volunteer (learner).
const ACCOUNTS = [
  { email: 'learner@cedarhollow.example', name: 'Maren Osei', roles: 'learner', password: 'demo-learner-pass' },
  { email: 'instructor@cedarhollow.example', name: 'Tomas Lindqvist', roles: 'learner,instructor', password: 'demo-instructor-pass' },
  { email: 'coordinator@cedarhollow.example', name: 'Priya Halvorsen', roles: 'coordinator', password: 'demo-coordinator-pass' },
  { email: 'admin@cedarhollow.example', name: 'Dale Okafor', roles: 'admin', password: 'demo-admin-pass' },
];

const DAY = 24 * 60 * 60 * 1000;

/** @type {import('sequelize-cli').Migration} */
module.exports = {
  ACCOUNTS,
  async up(queryInterface) {
    const now = new Date();
    await queryInterface.bulkInsert(
      'users',
      ACCOUNTS.map((a) => ({
        email: a.email,
        name: a.name,
        roles: a.roles,
        passwordHash: bcrypt.hashSync(a.password, 10),
        emailVerifiedAt: now,
        createdAt: now,
        updatedAt: now,
      })),
    );
    // Course rows come from content/courses/ through `npm run db:migrate` (lib/courses/sync.ts), as in a real program.
    const [[course]] = await queryInterface.sequelize.query("SELECT id, feeCents FROM courses WHERE slug = 'pickling-and-canning'");
    if (!course) throw new Error('the courses table is empty: run `npm run db:migrate` (it brings the courses in from content/courses/) before seeding');
    const [[instructor]] = await queryInterface.sequelize.query("SELECT id FROM users WHERE email = 'instructor@cedarhollow.example'");
    // Workshops start at 9:00 local time (Mountain time, UTC-7 in winter) two and five weeks from the seed.
    const at = (days, hourUtc) => {
      const d = new Date(now.getTime() + days * DAY);
      d.setUTCHours(hourUtc, 0, 0, 0);
      return d;
    };
    await queryInterface.bulkInsert('workshops', [
      {
        courseId: course.id,
        instructorId: instructor.id,
        startsAt: at(14, 16),
        endsAt: at(14, 21),
        timeZone: 'America/Denver',
        place: 'Cedar Hollow Grange Hall, 14 Mill Road, Cedar Hollow',
        seats: 12,
        attendanceRequired: true,
        createdAt: now,
        updatedAt: now,
      },
      {
        courseId: course.id,
        instructorId: instructor.id,
        startsAt: at(35, 16),
        endsAt: at(35, 21),
        timeZone: 'America/Denver',
        place: 'Upper Fork Community Kitchen, 220 Aspen Street, Upper Fork',
        seats: 10,
        attendanceRequired: true,
        createdAt: now,
        updatedAt: now,
      },
    ]);
    // The demo learner has paid for the first workshop, so the members-only lessons open for her.
    const [[learner]] = await queryInterface.sequelize.query("SELECT id FROM users WHERE email = 'learner@cedarhollow.example'");
    const [[workshop]] = await queryInterface.sequelize.query('SELECT id FROM workshops WHERE courseId = ? ORDER BY startsAt LIMIT 1', {
      replacements: [course.id],
    });
    await queryInterface.bulkInsert('enrollments', [
      {
        userId: learner.id,
        courseId: course.id,
        workshopId: workshop.id,
        runKey: String(workshop.id),
        status: 'active',
        feeCents: course.feeCents,
        createdAt: now,
        updatedAt: now,
      },
    ]);
    const [[enrollment]] = await queryInterface.sequelize.query('SELECT id FROM enrollments WHERE userId = ?', { replacements: [learner.id] });
    await queryInterface.bulkInsert('payments', [
      {
        enrollmentId: enrollment.id,
        provider: 'stripe',
        checkoutSessionId: 'cs_demo_seeded_0001',
        paymentIntentId: 'pi_demo_seeded_0001',
        amountCents: 4500,
        currency: 'usd',
        status: 'paid',
        refundedCents: 0,
        paidAt: now,
        createdAt: now,
        updatedAt: now,
      },
    ]);
  },

  async down(queryInterface) {
    await queryInterface.bulkDelete('payments', { checkoutSessionId: 'cs_demo_seeded_0001' });
    await queryInterface.bulkDelete('enrollments', {});
    await queryInterface.bulkDelete('workshops', {});
    await queryInterface.bulkDelete('users', { email: ACCOUNTS.map((a) => a.email) });
  },
};
