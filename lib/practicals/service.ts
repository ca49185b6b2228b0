import 'server-only';
import { randomUUID } from 'node:crypto';
import { Op, type Transaction } from 'sequelize';
import { findActiveEnrollment } from '@/lib/access';
import { audit } from '@/lib/audit';
import type { SessionUser } from '@/lib/auth/users';
import { enqueueEmail } from '@/lib/email/outbox';
import { practicalReviewedEmail } from '@/lib/email/templates';
import { getEnv } from '@/lib/env';
import { AppError } from '@/lib/errors';
import { roleAllows } from '@/lib/roles';
import { getStorage } from '@/lib/storage';
import type { PracticalForm, ReviewInput } from '@/lib/validations/practical';
import { db, type Practical } from '@/models';
import { checkPractical, type Flag } from './checks';
import { REFUSAL, decisionRight } from './decision-rights';
import { PhotoRejected, processPhoto } from './images';

// A learner may keep only so many uploaded photos that are not yet part of a submission.
const MAX_LOOSE_PHOTOS = 30;
// How long an uploaded photo may wait to become part of a submission before the worker removes it.
export const LOOSE_PHOTO_DAYS = 7;

async function requireEnrollment(user: SessionUser, courseSlug: string) {
  const enrollment = await findActiveEnrollment(user.id, courseSlug);
  if (!enrollment) throw new AppError('forbidden', 'Only a learner with an active enrollment in this course can submit a practical.');
  return enrollment;
}

export type AcceptedPhoto = {
  id: number;
  receivedAs: 'jpeg' | 'png' | 'webp';
  width: number;
  height: number;
  bytes: number;
  url: string;
  thumbnailUrl: string;
};

export const photoUrl = (id: number, size: 'full' | 'thumb' = 'full') => `/api/photos/${id}${size === 'thumb' ? '?size=thumb' : ''}`;

/** Checks, re-encodes and stores one photo for the learner's practical; nothing is stored when it is refused. */
export async function acceptPhoto(user: SessionUser, courseSlug: string, input: Buffer): Promise<AcceptedPhoto> {
  await requireEnrollment(user, courseSlug);
  const { PracticalPhoto } = db();
  const loose = await PracticalPhoto.count({ where: { userId: user.id, practicalId: null } });
  if (loose >= MAX_LOOSE_PHOTOS) throw new AppError('conflict', 'You have many photos waiting that are not part of a submission. Submit your practical first.');
  let processed;
  try {
    processed = await processPhoto(input);
  } catch (error) {
    if (error instanceof PhotoRejected) throw new AppError(error.reason === 'too-large' ? 'too_large' : 'unsupported_media', error.message);
    throw error;
  }
  const storage = getStorage();
  const base = `${user.id}/${randomUUID()}`;
  const storageKey = `photos/${base}.jpg`;
  const thumbnailKey = `thumbs/${base}.jpg`;
  try {
    await storage.put(storageKey, processed.image.data, processed.image.contentType);
    await storage.put(thumbnailKey, processed.thumbnail.data, processed.thumbnail.contentType);
    const row = await PracticalPhoto.create({
      userId: user.id,
      practicalId: null,
      storageKey,
      thumbnailKey,
      contentType: processed.image.contentType,
      width: processed.image.width,
      height: processed.image.height,
      bytes: processed.image.data.length,
    });
    return {
      id: row.id,
      receivedAs: processed.format,
      width: row.width,
      height: row.height,
      bytes: row.bytes,
      url: photoUrl(row.id),
      thumbnailUrl: photoUrl(row.id, 'thumb'),
    };
  } catch (error) {
    // Keep the store and the database in step: no row, no files (deleting a key never stored is a no-op).
    await Promise.allSettled([storage.delete(storageKey), storage.delete(thumbnailKey)]);
    throw error;
  }
}

/**
 * Removes photos that were uploaded but never became part of a submission within LOOSE_PHOTO_DAYS
 * (a form left half done): at most `limit` a run, oldest first. The row goes first, and only while
 * it is still loose (a submission taking the photo at that moment locks the row and keeps it; a
 * learner who submits a removed photo is asked to upload it again), then its two objects. A crash
 * between the two leaves objects without a row (space, never a broken photo). Returns how many went.
 */
export async function pruneLoosePhotos(options: { now?: Date; limit?: number } = {}): Promise<number> {
  const { PracticalPhoto } = db();
  const before = new Date((options.now ?? new Date()).getTime() - LOOSE_PHOTO_DAYS * 86_400_000);
  const loose = await PracticalPhoto.findAll({
    where: { practicalId: null, createdAt: { [Op.lt]: before } },
    attributes: ['id', 'storageKey', 'thumbnailKey'],
    order: [['id', 'ASC']],
    limit: options.limit ?? 200,
  });
  const storage = getStorage();
  let pruned = 0;
  for (const photo of loose) {
    if (!(await PracticalPhoto.destroy({ where: { id: photo.id, practicalId: null } }))) continue;
    await Promise.all([storage.delete(photo.storageKey), storage.delete(photo.thumbnailKey)]);
    pruned += 1;
  }
  return pruned;
}

/**
 * The stored bytes of a photo for a viewer allowed to see it: its owner; instructors and
 * coordinators only once it is part of a submission (a loose upload is the learner's own draft).
 */
export async function readPhotoFor(viewer: SessionUser, photoId: number, size: 'full' | 'thumb') {
  const photo = await db().PracticalPhoto.findByPk(photoId);
  if (!photo) throw new AppError('not_found', 'There is no such photo.');
  if (photo.userId !== viewer.id) {
    if (!roleAllows(viewer.roles, ['instructor'])) throw new AppError('forbidden', 'This photo belongs to another learner.');
    if (photo.practicalId === null) throw new AppError('forbidden', 'This photo is not part of a submission yet; only the learner who uploaded it can see it.');
  }
  const stored = await getStorage().get(size === 'thumb' ? photo.thumbnailKey : photo.storageKey);
  if (!stored) throw new AppError('not_found', 'The photo file is missing from storage.');
  return stored;
}

export type SubmittedPractical = { id: number; round: number; flags: Flag[] };

/** Submits a round of the learner's practical, linked to the enrollment that grants access. */
export async function submitPractical(user: SessionUser, courseSlug: string, form: PracticalForm): Promise<SubmittedPractical> {
  const enrollment = await requireEnrollment(user, courseSlug);
  const { Practical, PracticalPhoto, sequelize } = db();
  const { photoIds, ...details } = form;
  const flags = checkPractical(details);
  return sequelize.transaction(async (transaction) => {
    const latest = await Practical.findOne({ where: { enrollmentId: enrollment.id }, order: [['round', 'DESC']], lock: transaction.LOCK.UPDATE, transaction });
    if (latest?.status === 'submitted')
      throw new AppError('conflict', 'Your last batch is still waiting at the Tasting table; you can send another once an instructor has decided on it.');
    if (latest?.status === 'approved') throw new AppError('conflict', 'Your practical batch has already passed the table.');
    const photos = await PracticalPhoto.findAll({
      where: { id: { [Op.in]: photoIds }, userId: user.id, practicalId: null },
      lock: transaction.LOCK.UPDATE,
      transaction,
    });
    if (photos.length !== photoIds.length) {
      throw new AppError('bad_request', 'Some of the photos are not yours or already belong to a submission. Upload them again.', {
        fields: { 'practical.photoIds': ['Upload the photos again.'] },
      });
    }
    const practical = await Practical.create(
      {
        enrollmentId: enrollment.id,
        userId: user.id,
        round: (latest?.round ?? 0) + 1,
        status: 'submitted',
        details,
        flags,
        flagCount: flags.length,
        submittedAt: new Date(),
      },
      { transaction },
    );
    // Keep the learner's order of photos.
    for (const [index, id] of photoIds.entries()) {
      await PracticalPhoto.update({ practicalId: practical.id, caption: `Photo ${index + 1}` }, { where: { id }, transaction });
    }
    await audit(
      {
        actorId: user.id,
        action: 'practical.submitted',
        subjectType: 'practical',
        subjectId: practical.id,
        data: { round: practical.round, flags: flags.map((f) => f.check) },
      },
      { transaction },
    );
    return { id: practical.id, round: practical.round, flags };
  });
}

/** The instructor of the workshop a practical's enrollment is in, or null (self-paced, no instructor). */
async function workshopInstructorOf(enrollmentId: number, transaction?: Transaction): Promise<number | null> {
  const { Enrollment, Workshop } = db();
  const enrollment = await Enrollment.findByPk(enrollmentId, { attributes: ['id', 'workshopId'], transaction });
  const workshop = enrollment?.workshopId ? await Workshop.findByPk(enrollment.workshopId, { attributes: ['id', 'instructorId'], transaction }) : null;
  return workshop?.instructorId ?? null;
}

/** Throws 403 with the reason unless the viewer may approve or ask for changes (lib/practicals/decision-rights.ts). */
function requireDecisionRight(viewer: SessionUser, practical: Practical, workshopInstructorId: number | null) {
  const right = decisionRight({ viewer, learnerId: practical.userId, workshopInstructorId, claimedById: practical.claimedById ?? null });
  if (!right.may) throw new AppError('forbidden', REFUSAL[right.reason]);
}

/** Who may decide on a round, for the submission page: the same rule the review route applies. */
export async function decisionRightFor(viewer: SessionUser, practicalId: number) {
  const practical = await db().Practical.findByPk(practicalId, { attributes: ['id', 'userId', 'enrollmentId', 'claimedById'] });
  if (!practical) return null;
  return decisionRight({
    viewer,
    learnerId: practical.userId,
    workshopInstructorId: await workshopInstructorOf(practical.enrollmentId),
    claimedById: practical.claimedById ?? null,
  });
}

/** An instructor takes a waiting round to decide on it; one claimant at a time (409 while another holds it). */
export async function claimPractical(viewer: SessionUser, practicalId: number) {
  const { Practical, sequelize } = db();
  return sequelize.transaction(async (transaction) => {
    const practical = await Practical.findByPk(practicalId, { lock: transaction.LOCK.UPDATE, transaction });
    if (!practical) throw new AppError('not_found', 'There is no such submission.');
    if (practical.userId === viewer.id) throw new AppError('forbidden', REFUSAL.own);
    if (practical.status !== 'submitted') throw new AppError('conflict', 'This batch has already been decided on.');
    if (practical.claimedById === viewer.id) return { practicalId: practical.id, claimedById: viewer.id };
    if (practical.claimedById !== null) throw new AppError('conflict', REFUSAL.claimed_by_other);
    await practical.update({ claimedById: viewer.id, claimedAt: new Date() }, { transaction });
    await audit(
      { actorId: viewer.id, action: 'practical.claimed', subjectType: 'practical', subjectId: practical.id, data: { round: practical.round } },
      { transaction },
    );
    return { practicalId: practical.id, claimedById: viewer.id };
  });
}

/** The claimant gives a round back, or a coordinator releases someone else's claim. */
export async function releasePractical(viewer: SessionUser, practicalId: number) {
  const { Practical, sequelize } = db();
  return sequelize.transaction(async (transaction) => {
    const practical = await Practical.findByPk(practicalId, { lock: transaction.LOCK.UPDATE, transaction });
    if (!practical) throw new AppError('not_found', 'There is no such submission.');
    if (practical.claimedById === null) throw new AppError('conflict', 'Nobody has claimed this submission.');
    if (practical.claimedById !== viewer.id && !roleAllows(viewer.roles, ['coordinator'])) {
      throw new AppError('forbidden', 'Only the instructor who claimed this submission or a coordinator can release it.');
    }
    const from = practical.claimedById;
    await practical.update({ claimedById: null, claimedAt: null }, { transaction });
    await audit(
      { actorId: viewer.id, action: 'practical.released', subjectType: 'practical', subjectId: practical.id, data: { claimedById: from } },
      { transaction },
    );
    return { practicalId: practical.id, claimedById: null };
  });
}

/**
 * Records a rubric and decision on a waiting round and e-mails the learner, all in one transaction;
 * only a coordinator, the workshop's instructor or the claimant may, never the learner themself.
 */
export async function reviewPractical(reviewer: SessionUser, practicalId: number, input: ReviewInput) {
  const { Practical, Review, User, Enrollment, Course, sequelize } = db();
  return sequelize.transaction(async (transaction) => {
    const practical = await Practical.findByPk(practicalId, { lock: transaction.LOCK.UPDATE, transaction });
    if (!practical) throw new AppError('not_found', 'There is no such submission.');
    requireDecisionRight(reviewer, practical, await workshopInstructorOf(practical.enrollmentId, transaction));
    if (practical.status !== 'submitted') throw new AppError('conflict', 'This batch has already been decided on.');
    const [learner, enrollment] = await Promise.all([
      User.findByPk(practical.userId, { transaction }),
      Enrollment.findByPk(practical.enrollmentId, { transaction }),
    ]);
    const course = enrollment ? await Course.findByPk(enrollment.courseId, { transaction }) : null;
    if (!learner || !course) throw new AppError('not_found', 'The learner or course of this submission is missing.');
    const review = await Review.create(
      { practicalId: practical.id, reviewerId: reviewer.id, decision: input.decision, rubric: input.rubric, comment: input.comment || null },
      { transaction },
    );
    await practical.update({ status: input.decision }, { transaction });
    const message = practicalReviewedEmail({
      to: learner.email,
      name: learner.name,
      courseTitle: course.title,
      round: practical.round,
      review: input,
      reviewerName: reviewer.name,
      url: new URL(`/learn/${course.slug}/practical`, getEnv().APP_URL).toString(),
    });
    await enqueueEmail(message, { transaction });
    await audit(
      {
        actorId: reviewer.id,
        action: `practical.${input.decision}`,
        subjectType: 'practical',
        subjectId: practical.id,
        data: { round: practical.round, reviewId: review.id },
      },
      { transaction },
    );
    return { id: review.id, practicalId: practical.id, status: input.decision };
  });
}
