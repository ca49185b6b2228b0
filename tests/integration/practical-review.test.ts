import { describe, expect, it } from 'vitest';
import { POST as uploadPhoto } from '@/app/api/photos/route';
import { POST as review } from '@/app/api/practicals/[id]/review/route';
import { POST as submit } from '@/app/api/practicals/route';
import { GET as submissions } from '@/app/api/tasting-table/submissions/route';
import { fetchLearnerPracticals, fetchSubmission } from '@/lib/practicals/data';
import { RUBRIC_CRITERIA, type PracticalForm } from '@/lib/validations/practical';
import { db } from '@/models';
import { createUser } from '../support/db';
import { jsonRequest, params } from '../support/request';
import { actAs } from '../support/session';
import { enrolledLearner, GOOD_BATCH, makeJpeg, photoRequest, practicalSetting, type SessionUser } from '../support/practical-fixtures';

const fixture = practicalSetting();

async function upload(user: SessionUser, count = 2): Promise<number[]> {
  actAs(user);
  const ids: number[] = [];
  for (let i = 0; i < count; i++) {
    const response = await uploadPhoto(photoRequest(await makeJpeg(200 + i, 150), `p${i}.jpg`, 'image/jpeg'), {});
    expect(response.status).toBe(201);
    ids.push((await response.json()).photo.id);
  }
  return ids;
}

const post = (practical: Partial<PracticalForm> & { photoIds: number[] }, course = 'pickling-and-canning') =>
  submit(jsonRequest('/api/practicals', { course, practical: { ...GOOD_BATCH(practical.photoIds), ...practical } }), {});

const rubric = (notMet: string[] = []) =>
  Object.fromEntries(
    RUBRIC_CRITERIA.map((c) => [
      c.id,
      notMet.includes(c.id) ? { verdict: 'not_met', comment: 'Lids were reused from last year.' } : { verdict: 'met', comment: '' },
    ]),
  );

const decide = (id: number, body: unknown) => review(jsonRequest(`/api/practicals/${id}/review`, body), params({ id: String(id) }));

describe('POST /api/practicals', () => {
  it('stores a round linked to the enrollment, with its photos and the automatic flags, and never blocks on a flag', async () => {
    const { learner, enrollment } = await enrolledLearner(fixture.current.flagship.id, 'active', fixture.current.workshop.id);
    const photoIds = await upload(learner);
    // 10 minutes at 5,200 ft: USDA Guide 6 quick fresh-pack dill pints need 15 min at 1,001–6,000 ft.
    const response = await post({ photoIds, minutes: 10 });
    expect(response.status).toBe(201);
    const { practical } = await response.json();
    expect(practical.round).toBe(1);
    expect(practical.flags.map((f: { check: string }) => f.check)).toEqual(['processing-time']);
    expect(practical.flags[0]).toMatchObject({ expected: '15 min', actual: '10 min' });

    const row = await db().Practical.findByPk(practical.id);
    expect(row).toMatchObject({ enrollmentId: enrollment.id, userId: learner.id, status: 'submitted', round: 1, flagCount: 1 });
    expect((row!.details as { minutes: number }).minutes).toBe(10);
    expect(row!.details).not.toHaveProperty('photoIds');
    const photos = await db().PracticalPhoto.findAll({ where: { practicalId: practical.id }, order: [['id', 'ASC']] });
    expect(photos.map((p) => p.id)).toEqual(photoIds);
    expect(await db().AuditLog.count({ where: { action: 'practical.submitted', subjectId: String(practical.id) } })).toBe(1);
  });

  it('refuses photos that are not the learner’s, too few photos, and a batch that does not add up', async () => {
    const { learner } = await enrolledLearner(fixture.current.flagship.id);
    const { learner: other } = await enrolledLearner(fixture.current.flagship.id);
    const othersPhotos = await upload(other);
    const own = await upload(learner, 1);
    actAs(learner);
    const stolen = await post({ photoIds: [own[0], othersPhotos[0]] });
    expect(stolen.status).toBe(400);
    expect((await stolen.json()).fields['practical.photoIds']).toBeDefined();
    const tooFew = await post({ photoIds: own });
    expect(tooFew.status).toBe(400);
    expect((await tooFew.json()).fields['practical.photoIds'][0]).toMatch(/at least 2 photos/);
    const badCounts = await post({ photoIds: [own[0], othersPhotos[1]], sealedJars: 3, unsealedJars: 1 });
    expect(badCounts.status).toBe(400);
    expect((await badCounts.json()).fields['practical.unsealedJars'][0]).toMatch(/add up/);
    const noRecipe = await post({ photoIds: [own[0], othersPhotos[1]], recipeTitle: '' });
    expect((await noRecipe.json()).fields['practical.recipeTitle'][0]).toMatch(/tested recipe/);
    expect(await db().Practical.count()).toBe(0);
    expect(await db().PracticalPhoto.count({ where: { practicalId: null } })).toBe(3);
  });

  it('is only for a learner with an active or completed enrollment in that course', async () => {
    const { learner } = await enrolledLearner(fixture.current.flagship.id);
    const photoIds = await upload(learner);
    await db().Enrollment.update({ status: 'withdrawn' }, { where: { userId: learner.id } });
    actAs(learner);
    expect((await post({ photoIds })).status).toBe(403);
    expect((await post({ photoIds }, 'volunteer-refresher')).status).toBe(403);
    actAs(fixture.current.instructor);
    expect((await post({ photoIds })).status).toBe(403);
    actAs(null);
    expect((await post({ photoIds })).status).toBe(401);
    expect(await db().Practical.count()).toBe(0);
  });
});

describe('the review flow', () => {
  it('asks for changes, takes a resubmission as round 2 keeping round 1 and its review, then approves, e-mailing the learner each time', async () => {
    const { learner, enrollment } = await enrolledLearner(fixture.current.flagship.id, 'active', fixture.current.workshop.id);
    const first = await upload(learner);
    const { practical: round1 } = await (await post({ photoIds: first, minutes: 10 })).json();
    // A second round while the first waits is a conflict.
    const early = await upload(learner);
    actAs(learner);
    expect((await post({ photoIds: early })).status).toBe(409);

    // Only instructors and up review.
    expect((await decide(round1.id, { decision: 'approved', rubric: rubric(), comment: '' })).status).toBe(403);
    actAs(fixture.current.instructor);
    // Approving with a criterion not met, or asking for changes without saying what, is refused.
    const inconsistent = await decide(round1.id, { decision: 'approved', rubric: rubric(['rims-and-lids']), comment: '' });
    expect(inconsistent.status).toBe(400);
    expect((await inconsistent.json()).fields.decision[0]).toMatch(/every criterion is met/);
    const vague = await decide(round1.id, { decision: 'changes_requested', rubric: rubric(['rims-and-lids']), comment: '' });
    expect((await vague.json()).fields.comment[0]).toMatch(/what the learner should change/);
    const noReason = await decide(round1.id, {
      decision: 'changes_requested',
      rubric: { ...rubric(), headspace: { verdict: 'not_met', comment: '' } },
      comment: 'Process for the full time.',
    });
    expect(Object.keys((await noReason.json()).fields)).toEqual(['rubric.headspace.comment']);

    const changes = await decide(round1.id, {
      decision: 'changes_requested',
      rubric: rubric(['rims-and-lids']),
      comment: 'Process pints for 15 minutes at your altitude and use new lids.',
    });
    expect(changes.status).toBe(201);
    expect((await db().Practical.findByPk(round1.id))!.status).toBe('changes_requested');
    const mail1 = await db().OutboxEmail.findAll({ where: { kind: 'practical.reviewed' } });
    expect(mail1).toHaveLength(1);
    expect(mail1[0].toAddress).toBe(learner.email);
    expect(mail1[0].subject).toMatch(/^Needs another batch: /);
    expect(mail1[0].textBody).toContain('Process pints for 15 minutes at your altitude and use new lids.');
    expect(mail1[0].textBody).toContain('Clean rims and proper lids: not met (Lids were reused from last year.)');
    expect(mail1[0].textBody).toContain('/learn/pickling-and-canning/practical');
    // The same round cannot be reviewed twice.
    expect((await decide(round1.id, { decision: 'approved', rubric: rubric(), comment: '' })).status).toBe(409);

    // Resubmission: round 2, the earlier photos already belong to round 1 and cannot be reused.
    actAs(learner);
    expect((await post({ photoIds: first })).status).toBe(400);
    const { practical: round2 } = await (await post({ photoIds: early, minutes: 15 })).json();
    expect(round2).toMatchObject({ round: 2, flags: [] });

    actAs(fixture.current.instructor);
    expect((await decide(round2.id, { decision: 'approved', rubric: rubric(), comment: 'Clean rims, good seals.' })).status).toBe(201);
    const mails = await db().OutboxEmail.findAll({ where: { kind: 'practical.reviewed' }, order: [['id', 'ASC']] });
    expect(mails.map((m) => m.subject)).toEqual([expect.stringMatching(/^Needs another batch: /), expect.stringMatching(/^Passed the table: /)]);
    expect(await db().AuditLog.count({ where: { action: 'practical.approved' } })).toBe(1);
    expect(await db().AuditLog.count({ where: { action: 'practical.changes_requested' } })).toBe(1);

    // Both rounds and both reviews are kept; the submission page shows round 1 as history.
    const history = await fetchLearnerPracticals({ userId: learner.id, enrollmentId: enrollment.id });
    expect(history.map((r) => [r.round, r.status, r.reviews.map((v) => v.decision)])).toEqual([
      [2, 'approved', ['approved']],
      [1, 'changes_requested', ['changes_requested']],
    ]);
    expect(history[1].reviews[0].rubric['rims-and-lids']).toEqual({ verdict: 'not_met', comment: 'Lids were reused from last year.' });
    expect(history[1].photos.map((p) => p.id)).toEqual(first);
    const page = await fetchSubmission({ id: round2.id });
    expect(page?.earlierRounds.map((r) => r.round)).toEqual([1]);
    expect(page?.workshop?.id).toBe(fixture.current.workshop.id);

    // An approved practical takes no further round.
    actAs(learner);
    expect((await post({ photoIds: await upload(learner) })).status).toBe(409);
  });

  it('leaves no review, e-mail or status change behind when the e-mail cannot be written', async () => {
    const { learner } = await enrolledLearner(fixture.current.flagship.id, 'active', fixture.current.workshop.id);
    const { practical } = await (await post({ photoIds: await upload(learner) })).json();
    actAs(fixture.current.instructor);
    // Shrinking the outbox's address column makes the e-mail insert fail inside the review's transaction.
    await db().sequelize.query('ALTER TABLE outbox_emails MODIFY toAddress VARCHAR(3) NOT NULL');
    try {
      const response = await decide(practical.id, { decision: 'approved', rubric: rubric(), comment: '' });
      expect(response.status).toBe(500);
    } finally {
      await db().sequelize.query('ALTER TABLE outbox_emails MODIFY toAddress VARCHAR(254) NOT NULL');
    }
    expect(await db().Review.count()).toBe(0);
    expect((await db().Practical.findByPk(practical.id))!.status).toBe('submitted');
  });
});

describe('GET /api/tasting-table/submissions', () => {
  const get = (query = '') => submissions(new Request(`http://localhost:3000/api/tasting-table/submissions${query}`), {});

  async function seed() {
    const otherWorkshop = await db().Workshop.create({
      courseId: fixture.current.flagship.id,
      instructorId: fixture.current.instructor.id,
      startsAt: new Date('2027-01-10T16:00:00Z'),
      endsAt: new Date('2027-01-10T21:00:00Z'),
      timeZone: 'America/Denver',
      place: 'Upper Fork Community Kitchen',
      seats: 10,
    });
    const now = Date.now();
    // 25 submissions: every third flagged, every fifth approved, ages 0..24 days, alternating workshops.
    for (let i = 0; i < 25; i++) {
      const { learner, enrollment } = await enrolledLearner(fixture.current.flagship.id, 'active', i % 2 ? otherWorkshop.id : fixture.current.workshop.id, {
        quick: true,
      });
      await db().User.update({ name: `Learner ${String.fromCharCode(65 + (i % 26))}` }, { where: { id: learner.id } });
      await db().Practical.create({
        enrollmentId: enrollment.id,
        userId: learner.id,
        round: 1,
        status: i % 5 === 0 ? 'approved' : 'submitted',
        details: { product: 'dilly-beans' },
        flags: i % 3 === 0 ? [{ check: 'seals', message: 'x' }] : [],
        flagCount: i % 3 === 0 ? 1 : 0,
        submittedAt: new Date(now - i * 86_400_000),
      });
    }
    return { otherWorkshop };
  }

  it('is for instructors and coordinators only', async () => {
    expect((await get()).status).toBe(401);
    actAs(await createUser('learner'));
    expect((await get()).status).toBe(403);
    actAs(await createUser('coordinator'));
    expect((await get()).status).toBe(200);
  });

  it('pages, sorts, filters by status, workshop, flags and age, and counts each status', async () => {
    const { otherWorkshop } = await seed();
    actAs(fixture.current.instructor);
    const all = await (await get()).json();
    expect(all).toMatchObject({ total: 25, page: 1, pageSize: 20, pageCount: 2, counts: { submitted: 20, approved: 5, changes_requested: 0 } });
    expect(all.rows).toHaveLength(20);
    // Oldest first by default: the one submitted 24 days ago.
    expect(new Date(all.rows[0].submittedAt).getTime()).toBeLessThan(new Date(all.rows[1].submittedAt).getTime());
    expect(all.rows[0]).toMatchObject({ product: 'dilly-beans', courseSlug: 'pickling-and-canning', round: 1 });
    const page2 = await (await get('?page=2')).json();
    expect(page2.rows).toHaveLength(5);
    expect(new Set([...all.rows, ...page2.rows].map((r: { id: number }) => r.id)).size).toBe(25);

    const newest = await (await get('?sort=newest')).json();
    expect(newest.rows[0].id).toBe(page2.rows[4].id);
    const byFlags = await (await get('?sort=flags')).json();
    expect(byFlags.rows.slice(0, 9).every((r: { flagCount: number }) => r.flagCount === 1)).toBe(true);
    expect(byFlags.rows[9].flagCount).toBe(0);

    const waiting = await (await get('?status=submitted')).json();
    expect(waiting.total).toBe(20);
    expect(waiting.rows.every((r: { status: string }) => r.status === 'submitted')).toBe(true);
    const flagged = await (await get('?flagged=yes')).json();
    expect(flagged.total).toBe(9);
    expect((await (await get('?flagged=no')).json()).total).toBe(16);
    const atOther = await (await get(`?workshop=${otherWorkshop.id}`)).json();
    expect(atOther.total).toBe(12);
    expect(atOther.rows.every((r: { workshopId: number }) => r.workshopId === otherWorkshop.id)).toBe(true);
    // Waiting at least 10 days: i = 10..24, with a minute of slack for the test's own clock.
    const old = await (await get('?olderThanDays=10&status=submitted')).json();
    expect(old.total).toBe(12);
    expect(old.counts).toEqual({ submitted: 12, approved: 3, changes_requested: 0 });
    const combined = await (await get(`?status=submitted&flagged=yes&workshop=${fixture.current.workshop.id}`)).json();
    expect(
      combined.rows.every(
        (r: { status: string; flagCount: number; workshopId: number }) =>
          r.status === 'submitted' && r.flagCount > 0 && r.workshopId === fixture.current.workshop.id,
      ),
    ).toBe(true);
    // Even i (the first workshop), i % 3 == 0, not approved (i % 5 != 0): 6, 12, 18, 24.
    expect(combined.total).toBe(4);

    expect((await get('?sort=drop-table')).status).toBe(400);
    expect((await get('?page=0')).status).toBe(400);
  }, 90_000);
});
