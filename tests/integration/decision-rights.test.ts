import { describe, expect, it } from 'vitest';
import { GET as getPhoto } from '@/app/api/photos/[id]/route';
import { POST as uploadPhoto } from '@/app/api/photos/route';
import { DELETE as release, POST as claim } from '@/app/api/practicals/[id]/claim/route';
import { POST as review } from '@/app/api/practicals/[id]/review/route';
import { GET as submissions } from '@/app/api/tasting-table/submissions/route';
import { REFUSAL } from '@/lib/practicals/decision-rights';
import { acceptPhoto, decisionRightFor, submitPractical } from '@/lib/practicals/service';
import { RUBRIC_CRITERIA } from '@/lib/validations/practical';
import { db } from '@/models';
import { createUser } from '../support/db';
import { jsonRequest, params } from '../support/request';
import { actAs } from '../support/session';
import { enrolledLearner, GOOD_BATCH, makeJpeg, photoRequest, practicalSetting, type SessionUser } from '../support/practical-fixtures';

const fixture = practicalSetting();

const rubric = Object.fromEntries(RUBRIC_CRITERIA.map((c) => [c.id, { verdict: 'met', comment: '' }]));
const approve = (viewer: SessionUser, id: number) => {
  actAs(viewer);
  return review(jsonRequest(`/api/practicals/${id}/review`, { decision: 'approved', rubric, comment: '' }), params({ id: String(id) }));
};
const claimAs = (viewer: SessionUser, id: number) => {
  actAs(viewer);
  return claim(new Request(`http://localhost:3000/api/practicals/${id}/claim`, { method: 'POST' }), params({ id: String(id) }));
};
const releaseAs = (viewer: SessionUser, id: number) => {
  actAs(viewer);
  return release(new Request(`http://localhost:3000/api/practicals/${id}/claim`, { method: 'DELETE' }), params({ id: String(id) }));
};

/** A learner in the setting's workshop (or self-paced) with one waiting round; returns its id and photo ids. */
async function waitingRound(workshopId: number | null = fixture.current.workshop.id, learner?: SessionUser) {
  const enrolled = learner
    ? {
        learner,
        enrollment: await db().Enrollment.create({
          userId: learner.id,
          courseId: fixture.current.flagship.id,
          workshopId,
          runKey: workshopId ? String(workshopId) : 'self-paced',
          status: 'active',
          feeCents: 4500,
        }),
      }
    : await enrolledLearner(fixture.current.flagship.id, 'active', workshopId);
  // Through the service, not the learner-only routes: the account may hold a staff role as well.
  const photoIds = [];
  for (let i = 0; i < 2; i++) photoIds.push((await acceptPhoto(enrolled.learner, 'pickling-and-canning', await makeJpeg(240 + i, 180))).id);
  const practical = await submitPractical(enrolled.learner, 'pickling-and-canning', GOOD_BATCH(photoIds));
  return { learner: enrolled.learner, practicalId: practical.id, photoId: photoIds[0] };
}

describe('who may decide on a practical', () => {
  it('every instructor reads the Tasting table, but another instructor must claim a round before deciding', async () => {
    const { practicalId } = await waitingRound();
    const volunteer = await createUser('instructor');
    actAs(volunteer);
    const table = await submissions(new Request('http://localhost:3000/api/tasting-table/submissions'), {});
    expect(table.status).toBe(200);
    expect((await table.json()).rows.map((r: { id: number }) => r.id)).toContain(practicalId);

    const refused = await approve(volunteer, practicalId);
    expect(refused.status).toBe(403);
    expect((await refused.json()).message).toBe(REFUSAL.claim_first);
    expect(await db().Review.count()).toBe(0);

    expect((await claimAs(volunteer, practicalId)).status).toBe(201);
    // Claiming again is harmless; a second instructor is turned away while the claim stands.
    expect((await claimAs(volunteer, practicalId)).status).toBe(201);
    const second = await createUser('instructor');
    const taken = await claimAs(second, practicalId);
    expect(taken.status).toBe(409);
    expect((await taken.json()).message).toBe(REFUSAL.claimed_by_other);
    expect((await approve(second, practicalId)).status).toBe(403);
    // Nor may the second instructor release someone else's claim.
    expect((await releaseAs(second, practicalId)).status).toBe(403);

    expect((await approve(volunteer, practicalId)).status).toBe(201);
    expect((await db().Practical.findByPk(practicalId))!.status).toBe('approved');
    expect(await db().AuditLog.count({ where: { action: 'practical.claimed', subjectId: String(practicalId) } })).toBe(1);
  });

  it('a coordinator releases a claim, and then another instructor can take it', async () => {
    const { practicalId } = await waitingRound();
    const [first, second] = [await createUser('instructor'), await createUser('instructor')];
    const coordinator = await createUser('coordinator');
    expect((await claimAs(first, practicalId)).status).toBe(201);
    const released = await releaseAs(coordinator, practicalId);
    expect(released.status).toBe(200);
    expect((await released.json()).claim.claimedById).toBeNull();
    expect((await releaseAs(coordinator, practicalId)).status).toBe(409);
    expect((await approve(first, practicalId)).status).toBe(403);
    expect((await claimAs(second, practicalId)).status).toBe(201);
    // The claimant may give it back too.
    expect((await releaseAs(second, practicalId)).status).toBe(200);
    expect(await db().AuditLog.count({ where: { action: 'practical.released' } })).toBe(2);
  });

  it('the workshop instructor and a coordinator decide without claiming; a self-paced round needs a claim from any instructor', async () => {
    const own = await waitingRound();
    expect((await approve(fixture.current.instructor, own.practicalId)).status).toBe(201);
    const other = await waitingRound();
    expect((await approve(await createUser('coordinator'), other.practicalId)).status).toBe(201);
    const selfPaced = await waitingRound(null);
    expect((await approve(fixture.current.instructor, selfPaced.practicalId)).status).toBe(403);
    expect((await claimAs(fixture.current.instructor, selfPaced.practicalId)).status).toBe(201);
    expect((await approve(fixture.current.instructor, selfPaced.practicalId)).status).toBe(201);
  });

  it('nobody decides on or claims their own practical, whatever their role', async () => {
    // An account that teaches and also takes the course: its own round waits for someone else.
    const teacher = await createUser('coordinator');
    await db().Workshop.update({ instructorId: teacher.id }, { where: { id: fixture.current.workshop.id } });
    const { practicalId } = await waitingRound(fixture.current.workshop.id, teacher);
    const refused = await approve(teacher, practicalId);
    expect(refused.status).toBe(403);
    expect((await refused.json()).message).toBe(REFUSAL.own);
    expect((await claimAs(teacher, practicalId)).status).toBe(403);
    expect(await decisionRightFor(teacher, practicalId)).toEqual({ may: false, reason: 'own' });
    expect((await db().Practical.findByPk(practicalId))!.status).toBe('submitted');
    expect((await approve(await createUser('admin'), practicalId)).status).toBe(201);
  });

  it('answers claims on missing or decided rounds with a clear JSON message', async () => {
    const instructor = await createUser('instructor');
    const missing = await claimAs(instructor, 999999);
    expect(missing.status).toBe(404);
    expect((await missing.json()).message).toMatch(/no such submission/);
    const { practicalId } = await waitingRound();
    expect((await approve(fixture.current.instructor, practicalId)).status).toBe(201);
    const decided = await claimAs(instructor, practicalId);
    expect(decided.status).toBe(409);
    expect((await decided.json()).message).toMatch(/already been decided on/);
    actAs(await createUser('learner'));
    expect(
      (await claim(new Request(`http://localhost:3000/api/practicals/${practicalId}/claim`, { method: 'POST' }), params({ id: String(practicalId) }))).status,
    ).toBe(403);
  });
});

describe('loose photos', () => {
  it('are readable only by their owner until they are part of a submission', async () => {
    const { learner } = await enrolledLearner(fixture.current.flagship.id, 'active', fixture.current.workshop.id);
    actAs(learner);
    const loose = (await (await uploadPhoto(photoRequest(await makeJpeg(200, 150), 'draft.jpg', 'image/jpeg'), {})).json()).photo.id as number;
    const read = (viewer: SessionUser, id: number) => {
      actAs(viewer);
      return getPhoto(new Request(`http://localhost:3000/api/photos/${id}`), params({ id: String(id) }));
    };
    expect((await read(learner, loose)).status).toBe(200);
    for (const viewer of [fixture.current.instructor, await createUser('coordinator'), await createUser('admin')]) {
      const answer = await read(viewer, loose);
      expect(answer.status, viewer.roles.join('+')).toBe(403);
      expect(answer.headers.get('content-type')).toMatch(/json/);
    }
    const { photoId } = await waitingRound();
    expect((await read(await createUser('instructor'), photoId)).status).toBe(200);
  });
});
