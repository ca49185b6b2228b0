'use strict';

// Demo data only (the invented Cedar Hollow County program): a fee waiver code for volunteers, a
// workshop that took place yesterday with two learners so attendance can be marked at the Tasting
// table, and a refresher workshop.
const bcrypt = require('bcryptjs');

const LEARNERS = [
  { email: 'hollis.park@cedarhollow.example', name: 'Hollis Park' },
  { email: 'olu.bright@cedarhollow.example', name: 'Olu Bright' },
];
const WAIVER = 'CEDAR-VOLUNTEER';
const PAST_PLACE = 'Cedar Hollow Grange Hall, 14 Mill Road, Cedar Hollow (autumn session)';
const REFRESHER_PLACE = 'Cedar Hollow Library meeting room, 3 Main Street, Cedar Hollow';
const DAY = 24 * 60 * 60 * 1000;

/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface) {
    const now = new Date();
    const q = (sql, replacements) => queryInterface.sequelize.query(sql, { replacements }).then(([rows]) => rows);
    const [flagship] = await q("SELECT id FROM courses WHERE slug = 'pickling-and-canning'");
    const [refresher] = await q("SELECT id FROM courses WHERE slug = 'volunteer-refresher'");
    const [instructor] = await q("SELECT id FROM users WHERE email = 'instructor@cedarhollow.example'");
    const [coordinator] = await q("SELECT id FROM users WHERE email = 'coordinator@cedarhollow.example'");

    await queryInterface.bulkInsert(
      'users',
      LEARNERS.map((l) => ({
        ...l,
        roles: 'learner',
        passwordHash: bcrypt.hashSync('demo-learner-pass', 10),
        emailVerifiedAt: now,
        createdAt: now,
        updatedAt: now,
      })),
    );
    await queryInterface.bulkInsert('fee_waivers', [
      {
        code: WAIVER,
        courseId: null,
        createdById: coordinator.id,
        maxUses: 10,
        uses: 0,
        expiresAt: new Date(now.getTime() + 90 * DAY),
        note: 'Returning Cedar Hollow volunteers',
        createdAt: now,
        updatedAt: now,
      },
    ]);
    // Yesterday 9:00–14:00 Mountain time (16:00–21:00 UTC in winter).
    const yesterday = new Date(now.getTime() - DAY);
    const at = (d, h) => new Date(Date.UTC(d.getUTCFullYear(), d.getUTCMonth(), d.getUTCDate(), h));
    const inThreeWeeks = new Date(now.getTime() + 21 * DAY);
    await queryInterface.bulkInsert('workshops', [
      {
        courseId: flagship.id,
        instructorId: instructor.id,
        startsAt: at(yesterday, 16),
        endsAt: at(yesterday, 21),
        timeZone: 'America/Denver',
        place: PAST_PLACE,
        seats: 8,
        attendanceRequired: true,
        createdAt: now,
        updatedAt: now,
      },
      {
        courseId: refresher.id,
        instructorId: instructor.id,
        startsAt: at(inThreeWeeks, 1),
        endsAt: at(inThreeWeeks, 3),
        timeZone: 'America/Denver',
        place: REFRESHER_PLACE,
        seats: 16,
        attendanceRequired: false,
        createdAt: now,
        updatedAt: now,
      },
    ]);
    const [past] = await q('SELECT id FROM workshops WHERE place = ?', [PAST_PLACE]);
    const learners = await q('SELECT id, email FROM users WHERE email IN (?)', [LEARNERS.map((l) => l.email)]);
    await queryInterface.bulkInsert(
      'enrollments',
      learners.map((l) => ({
        userId: l.id,
        courseId: flagship.id,
        workshopId: past.id,
        runKey: String(past.id),
        status: 'active',
        feeCents: 4500,
        createdAt: now,
        updatedAt: now,
      })),
    );
    const enrollments = await q('SELECT id FROM enrollments WHERE workshopId = ?', [past.id]);
    await queryInterface.bulkInsert(
      'payments',
      enrollments.map((e, i) => ({
        enrollmentId: e.id,
        provider: 'stripe',
        checkoutSessionId: `cs_demo_seeded_past_${i + 1}`,
        paymentIntentId: `pi_demo_seeded_past_${i + 1}`,
        amountCents: 4500,
        currency: 'usd',
        status: 'paid',
        refundedCents: 0,
        paidAt: now,
        createdAt: now,
        updatedAt: now,
      })),
    );
  },

  async down(queryInterface) {
    const q = (sql, replacements) => queryInterface.sequelize.query(sql, { replacements }).then(([rows]) => rows);
    const workshops = await q('SELECT id FROM workshops WHERE place IN (?)', [[PAST_PLACE, REFRESHER_PLACE]]);
    const ids = workshops.map((w) => w.id);
    if (ids.length) {
      const enrollments = await q('SELECT id FROM enrollments WHERE workshopId IN (?)', [ids]);
      if (enrollments.length) await queryInterface.bulkDelete('payments', { enrollmentId: enrollments.map((e) => e.id) });
      await queryInterface.bulkDelete('enrollments', { workshopId: ids });
      await queryInterface.bulkDelete('workshops', { id: ids });
    }
    await queryInterface.bulkDelete('fee_waivers', { code: WAIVER });
    await queryInterface.bulkDelete('users', { email: LEARNERS.map((l) => l.email) });
  },
};
