'use strict';

// Demo data only: two invented Cedar Hollow learners whose practical batches wait at the Tasting
// table, each with two generated photos (plain colour fields, no real pictures) and the flags the
// automatic checks give for their numbers (lib/practicals/checks.ts; tests/unit/demo-seed-flags.test.ts
// checks that they still agree).
const fs = require('node:fs');
const path = require('node:path');
const bcrypt = require('bcryptjs');
const sharp = require('sharp');

const DAY = 24 * 60 * 60 * 1000;
const GUIDE6 = 'USDA Complete Guide to Home Canning (AIB 539, rev. 2015), Guide 6';

const LEARNERS = [
  {
    email: 'idris.fairweather@cedarhollow.example',
    name: 'Idris Fairweather',
    daysAgo: 3,
    colours: ['#7a1f3d', '#a83a5b'],
    details: {
      product: 'pickled-beets',
      recipeTitle: 'Pickled beets',
      recipeSource: `${GUIDE6}, p. 6-14`,
      jar: 'pint',
      jars: 6,
      pack: 'hot',
      vinegarAcidityPct: 5,
      vinegarMl: 473,
      waterMl: 237,
      headspaceIn: 0.25,
      method: 'boiling-water',
      altitudeFt: 5200,
      minutes: 35,
      batchDate: null,
      sealedJars: 6,
      unsealedJars: 0,
      notes: 'Beets cooked 25 minutes before packing.',
    },
    flags: [
      {
        check: 'processing-time',
        message:
          'Processed 35 min, shorter than the published 40 min for a pint of Pickled beets at 3,001–6,000 ft. Time starts when the water returns to a full boil.',
        expected: '40 min',
        actual: '35 min',
        source: `${GUIDE6}, "Pickled beets", recommended process time table (four altitude bands)`,
      },
      {
        check: 'headspace',
        message:
          'Headspace 0.25 in is less than the recommended 0.5 in. Too little headspace: food and liquid can bubble out while the jar is processed, and food left on the rim can keep the lid from sealing.',
        expected: '0.5 in',
        actual: '0.25 in',
        source: `${GUIDE6}, "Pickled beets", recommended process time table (four altitude bands)`,
      },
    ],
  },
  {
    email: 'lena.marsh@cedarhollow.example',
    name: 'Lena Marsh',
    daysAgo: 1,
    colours: ['#3f6f4f', '#6b8f3a'],
    details: {
      product: 'dilly-beans',
      recipeTitle: 'Pickled dilly beans',
      recipeSource: `${GUIDE6}`,
      jar: 'pint',
      jars: 4,
      pack: 'raw',
      vinegarAcidityPct: 5,
      vinegarMl: 591,
      waterMl: 591,
      headspaceIn: 0.5,
      method: 'boiling-water',
      altitudeFt: 5200,
      minutes: 5,
      batchDate: null,
      sealedJars: 4,
      unsealedJars: 0,
      notes: '',
    },
    flags: [
      {
        check: 'processing-time',
        message:
          'Processed 5 min, shorter than the published 10 min for a pint of Pickled dilly beans at 1,001–6,000 ft. Time starts when the water returns to a full boil.',
        expected: '10 min',
        actual: '5 min',
        source: `${GUIDE6}, "Pickled dilly beans", recommended process time table`,
      },
      {
        check: 'sterilized-jars',
        message:
          'Processed 5 min, under 10 minutes: the jars must be sterilised before filling (boil the empty jars 15 minutes at 5,200 ft). Say in the notes how the jars were sterilised.',
        expected: 'jars boiled empty 15 min',
        actual: '5 min process',
        source:
          'USDA Complete Guide to Home Canning (AIB 539, rev. 2015), Guide 1, "Sterilization of empty jars": products processed less than 10 minutes go into sterile jars; boil empty jars 10 minutes below 1,000 ft and 1 more minute for each further 1,000 ft',
      },
    ],
  },
];

const photoRoot = () => path.join(process.env.BRINEWRIGHT_ROOT ?? process.cwd(), '.data', 'photos');

async function writePhoto(key, colour, width, height) {
  const file = path.join(photoRoot(), key);
  fs.mkdirSync(path.dirname(file), { recursive: true });
  const data = await sharp({ create: { width, height, channels: 3, background: colour } })
    .jpeg({ quality: 80 })
    .toBuffer();
  fs.writeFileSync(file, data);
  return data.length;
}

/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface) {
    const now = new Date();
    const [[workshop]] = await queryInterface.sequelize.query(
      "SELECT w.id, w.courseId FROM workshops w JOIN courses c ON c.id = w.courseId WHERE c.slug = 'pickling-and-canning' ORDER BY w.startsAt LIMIT 1",
    );
    for (const learner of LEARNERS) {
      await queryInterface.bulkInsert('users', [
        {
          email: learner.email,
          name: learner.name,
          roles: 'learner',
          passwordHash: bcrypt.hashSync(`${learner.email}-not-a-demo-login`, 10),
          emailVerifiedAt: now,
          createdAt: now,
          updatedAt: now,
        },
      ]);
      const [[user]] = await queryInterface.sequelize.query('SELECT id FROM users WHERE email = ?', { replacements: [learner.email] });
      await queryInterface.bulkInsert('enrollments', [
        {
          userId: user.id,
          courseId: workshop.courseId,
          workshopId: workshop.id,
          runKey: String(workshop.id),
          status: 'active',
          feeCents: 4500,
          createdAt: now,
          updatedAt: now,
        },
      ]);
      const [[enrollment]] = await queryInterface.sequelize.query('SELECT id FROM enrollments WHERE userId = ?', { replacements: [user.id] });
      const submittedAt = new Date(now.getTime() - learner.daysAgo * DAY);
      const details = { ...learner.details, batchDate: new Date(submittedAt.getTime() - 2 * DAY).toISOString().slice(0, 10) };
      await queryInterface.bulkInsert('practicals', [
        {
          enrollmentId: enrollment.id,
          userId: user.id,
          round: 1,
          status: 'submitted',
          details: JSON.stringify(details),
          flags: JSON.stringify(learner.flags),
          flagCount: learner.flags.length,
          submittedAt,
          createdAt: now,
          updatedAt: now,
        },
      ]);
      const [[practical]] = await queryInterface.sequelize.query('SELECT id FROM practicals WHERE enrollmentId = ?', { replacements: [enrollment.id] });
      const photos = [];
      for (const [i, colour] of learner.colours.entries()) {
        const base = `seed/${user.id}-${i + 1}`;
        const bytes = await writePhoto(`photos/${base}.jpg`, colour, 1200, 900);
        await writePhoto(`thumbs/${base}.jpg`, colour, 320, 240);
        photos.push({
          practicalId: practical.id,
          userId: user.id,
          storageKey: `photos/${base}.jpg`,
          thumbnailKey: `thumbs/${base}.jpg`,
          contentType: 'image/jpeg',
          width: 1200,
          height: 900,
          bytes,
          caption: `Photo ${i + 1}`,
          createdAt: now,
          updatedAt: now,
        });
      }
      await queryInterface.bulkInsert('practical_photos', photos);
    }
  },

  async down(queryInterface) {
    const [users] = await queryInterface.sequelize.query('SELECT id FROM users WHERE email IN (?)', { replacements: [LEARNERS.map((l) => l.email)] });
    const ids = users.map((u) => u.id);
    if (!ids.length) return;
    await queryInterface.bulkDelete('practical_photos', { userId: ids });
    await queryInterface.bulkDelete('practicals', { userId: ids });
    await queryInterface.bulkDelete('enrollments', { userId: ids });
    await queryInterface.bulkDelete('users', { id: ids });
  },
};

// For tests/unit/demo-seed-flags.test.ts (the migrator reads only up and down).
module.exports.DEMO_BATCHES = LEARNERS;
