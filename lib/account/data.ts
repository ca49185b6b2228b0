import 'server-only';
import { Op } from 'sequelize';
import { ZipFile } from 'yazl';
import { audit } from '@/lib/audit';
import { endSessions } from '@/lib/auth/sessions';
import { AppError } from '@/lib/errors';
import { getStorage } from '@/lib/storage';
import { db } from '@/models';
import { checkPresentPassword } from './profile';

/** The name and address an erased account keeps, so payments, certificates and the audit log still add up. */
export const pseudonymFor = (userId: number) => ({ name: `Deleted account #${userId}`, email: `deleted-${userId}@erased.invalid` });

type Json = Record<string, unknown>;

/** Everything held about a person, as plain JSON (the photos' bytes are added by exportZip). */
export async function collectPersonalData(userId: number) {
  const { User, Enrollment, Payment, QuizAttempt, Practical, PracticalPhoto, Review, Certificate, LessonProgress, Course, Workshop } = db();
  const user = await User.findByPk(userId, { rejectOnEmpty: new AppError('unauthorized') });
  const enrollments = await Enrollment.findAll({
    where: { userId },
    include: [
      { model: Course, as: 'course', attributes: ['slug', 'title'] },
      { model: Workshop, as: 'workshop', attributes: ['startsAt', 'endsAt', 'place'] },
    ],
    order: [['id', 'ASC']],
  });
  const enrollmentIds = enrollments.map((e) => e.id);
  const [payments, attempts, practicals, photos, certificates, progress] = await Promise.all([
    Payment.findAll({ where: { enrollmentId: enrollmentIds }, order: [['id', 'ASC']], raw: true }),
    QuizAttempt.findAll({
      where: { userId },
      attributes: ['id', 'quizSlug', 'answers', 'scorePct', 'passed', 'startedAt', 'submittedAt'],
      order: [['id', 'ASC']],
      raw: true,
    }),
    Practical.findAll({
      where: { userId },
      include: [{ model: Review, as: 'reviews', attributes: ['decision', 'rubric', 'comment', 'createdAt'] }],
      order: [['id', 'ASC']],
    }),
    PracticalPhoto.findAll({ where: { userId }, order: [['id', 'ASC']], raw: true }),
    Certificate.findAll({
      where: { userId },
      attributes: ['serial', 'holderName', 'courseTitle', 'programName', 'issuedAt', 'validUntil', 'revokedAt', 'revokeReason'],
      order: [['id', 'ASC']],
      raw: true,
    }),
    LessonProgress.findAll({ where: { userId }, attributes: ['lessonSlug', 'readAt'], order: [['id', 'ASC']], raw: true }),
  ]);
  const profile: Json = {
    id: user.id,
    name: user.name,
    email: user.email,
    emailConfirmedAt: user.emailVerifiedAt,
    createdAt: user.createdAt,
  };
  return {
    profile,
    enrollments: enrollments.map((e) => ({
      id: e.id,
      course: (e.get('course') as { slug: string; title: string } | null)?.title ?? null,
      workshop: e.get('workshop') ?? null,
      status: e.status,
      feeCents: e.feeCents,
      attendedAt: e.attendedAt,
      completedAt: e.completedAt,
      createdAt: e.createdAt,
    })),
    lessonsRead: progress,
    payments: payments.map((p) => ({
      enrollmentId: p.enrollmentId,
      amountCents: p.amountCents,
      currency: p.currency,
      status: p.status,
      refundedCents: p.refundedCents,
      paidAt: p.paidAt,
      createdAt: p.createdAt,
    })),
    quizAttempts: attempts,
    practicals: practicals.map((p) => ({
      id: p.id,
      enrollmentId: p.enrollmentId,
      round: p.round,
      status: p.status,
      details: p.details,
      flags: p.flags,
      submittedAt: p.submittedAt,
      reviews: p.get('reviews'),
      photos: photos.filter((ph) => ph.practicalId === p.id).map((ph) => photoEntry(ph)),
    })),
    unsubmittedPhotos: photos.filter((ph) => ph.practicalId === null).map((ph) => photoEntry(ph)),
    certificates,
    photoKeys: photos.map((ph) => ({ file: photoFile(ph), key: ph.storageKey })),
  };
}

const photoFile = (photo: { id: number; storageKey: string }) => `photos/${photo.id}${photo.storageKey.slice(photo.storageKey.lastIndexOf('.'))}`;
const photoEntry = (photo: { id: number; storageKey: string; caption: string | null; width: number; height: number; createdAt: Date }) => ({
  file: photoFile(photo),
  caption: photo.caption,
  width: photo.width,
  height: photo.height,
  uploadedAt: photo.createdAt,
});

/** One ZIP: a JSON file per kind of record and each photo as stored (read through the storage driver). */
export async function exportZip(userId: number): Promise<Buffer> {
  const { photoKeys, ...data } = await collectPersonalData(userId);
  const zip = new ZipFile();
  const json = (value: unknown) => Buffer.from(JSON.stringify(value, null, 2) + '\n', 'utf8');
  zip.addBuffer(
    Buffer.from(
      'Everything Brinewright holds about you, as of the date of this file.\nEach .json file is one kind of record; photos/ holds your practical photos as stored.\n',
    ),
    'README.txt',
  );
  for (const [name, value] of Object.entries(data)) zip.addBuffer(json(value), `${name}.json`);
  const storage = getStorage();
  for (const { file, key } of photoKeys) {
    const stored = await storage.get(key);
    if (stored) zip.addBuffer(stored.data, file);
  }
  zip.end();
  const chunks: Buffer[] = [];
  for await (const chunk of zip.outputStream) chunks.push(chunk as Buffer);
  return Buffer.concat(chunks);
}

/**
 * Erases an account at its holder's request, after the present password: progress, quiz attempts,
 * practicals, photos, tokens and queued e-mail go; enrollments, payments, issued certificates and
 * the audit log stay, under a pseudonym; every session ends and the account cannot sign in again.
 */
/** Why an account that holds a staff role cannot erase itself (app/api/account, the deletion page). */
export const STAFF_DELETION = 'Your account also holds a staff role. An admin closes staff accounts: ask an admin to remove your staff roles first.';

export async function eraseAccount(userId: number, currentPassword: string): Promise<void> {
  const { User, LessonProgress, QuizAttempt, Practical, PracticalPhoto, AccountToken, OutboxEmail, Certificate, CertificateVersion, sequelize } = db();
  const user = await User.findByPk(userId, { rejectOnEmpty: new AppError('unauthorized') });
  await checkPresentPassword(user, currentPassword);
  const pseudonym = pseudonymFor(user.id);
  const formerEmail = user.email;
  const photos = await PracticalPhoto.findAll({ where: { userId }, attributes: ['storageKey', 'thumbnailKey'], raw: true });
  await sequelize.transaction(async (transaction) => {
    await LessonProgress.destroy({ where: { userId }, transaction });
    await QuizAttempt.destroy({ where: { userId }, transaction });
    await PracticalPhoto.destroy({ where: { userId }, transaction });
    await Practical.destroy({ where: { userId }, transaction });
    await AccountToken.destroy({ where: { userId }, transaction });
    await OutboxEmail.destroy({ where: { toAddress: formerEmail }, transaction });
    const certificateIds = (await Certificate.findAll({ where: { userId }, attributes: ['id'], transaction, raw: true })).map((c) => c.id);
    await Certificate.update({ holderName: pseudonym.name }, { where: { userId }, transaction });
    if (certificateIds.length) await CertificateVersion.update({ holderName: pseudonym.name }, { where: { certificateId: certificateIds }, transaction });
    await user.update(
      { name: pseudonym.name, email: pseudonym.email, passwordHash: '!erased', emailVerifiedAt: null, deactivatedAt: new Date(), erasedAt: new Date() },
      { transaction },
    );
    await endSessions(user.id, transaction);
    await sequelize.query('DELETE FROM rate_limits WHERE bucket LIKE :pattern', {
      replacements: { pattern: `%${formerEmail.replace(/[\\%_]/g, '\\$&')}%` },
      transaction,
    });
    await audit({ actorId: user.id, action: 'user.erased', subjectType: 'user', subjectId: user.id }, { transaction });
  });
  // The photos' files go after the rows: a failed delete leaves an orphan file, never a row without one.
  const storage = getStorage();
  await Promise.allSettled(photos.flatMap((p) => [storage.delete(p.storageKey), storage.delete(p.thumbnailKey)]));
}

/** What the deletion page lists before anything happens. */
export async function erasurePreview(userId: number) {
  const { QuizAttempt, Practical, PracticalPhoto, Enrollment, Certificate } = db();
  const enrollmentIds = (await Enrollment.findAll({ where: { userId }, attributes: ['id'], raw: true })).map((e) => e.id);
  const [attempts, practicals, photos, certificates, payments] = await Promise.all([
    QuizAttempt.count({ where: { userId } }),
    Practical.count({ where: { userId } }),
    PracticalPhoto.count({ where: { userId } }),
    Certificate.count({ where: { userId } }),
    db().Payment.count({ where: { enrollmentId: { [Op.in]: enrollmentIds.length ? enrollmentIds : [0] } } }),
  ]);
  return { attempts, practicals, photos, enrollments: enrollmentIds.length, certificates, payments, pseudonym: pseudonymFor(userId).name };
}
