import 'server-only';
import { QueryTypes, UniqueConstraintError, type Transaction } from 'sequelize';
import { audit } from '@/lib/audit';
import { enqueueEmail } from '@/lib/email/outbox';
import { getEnv } from '@/lib/env';
import { AppError } from '@/lib/errors';
import { getProgramIdentity } from '@/lib/program/settings';
import { roleAllows } from '@/lib/roles';
import { db } from '@/models';
import { certificateIssuedEmail, certificateRevokedEmail } from '@/lib/email/templates';
import { transitionEnrollment } from '@/lib/enrollment/state';
import { requireConfirmedAddress } from '@/lib/account/confirmed';
import type { RequirementKey } from './eligibility';
import { loadStandings } from './facts';
import { renderCertificatePdf } from './pdf';
import { verificationUrl } from './qr';
import { generateSerial } from './serial';
import { REFRESHER_COURSE_SLUG, validUntilFor } from './validity';

export type IssueOutcome =
  | { enrollmentId: number; outcome: 'issued'; certificateId: number; serial: string }
  | { enrollmentId: number; outcome: 'exists'; certificateId: number; serial: string }
  | { enrollmentId: number; outcome: 'not_eligible'; missing: RequirementKey[] }
  | { enrollmentId: number; outcome: 'not_found' };

/** The name certificates carry: the program's settings page, else CERTIFICATE_PROGRAM_NAME. */
export const programName = async (transaction?: Transaction) => (await getProgramIdentity({ transaction })).name;

export const SIGNER_TITLE = 'Program coordinator';

/** Who signs: the coordinator or admin who issues; a certificate the learner claims (the refresher) has no signer. */
async function signerFor(actorId: number | null, transaction: Transaction): Promise<{ signerName: string | null; signerTitle: string | null }> {
  if (actorId === null) return { signerName: null, signerTitle: null };
  const actor = await db().User.findByPk(actorId, { attributes: ['name', 'roles'], transaction });
  if (!actor || !roleAllows(actor.roles, ['coordinator'])) return { signerName: null, signerTitle: null };
  return { signerName: actor.name, signerTitle: SIGNER_TITLE };
}

async function existing(enrollmentId: number, transaction?: Transaction) {
  // Raw SQL: two columns read inside the issuing transaction, without building a model instance.
  const [row] = await db().sequelize.query<{ id: number; serial: string }>('SELECT id, serial FROM certificates WHERE enrollmentId = :enrollmentId', {
    replacements: { enrollmentId },
    type: QueryTypes.SELECT,
    transaction,
  });
  return row ? { id: Number(row.id), serial: row.serial } : null;
}

type Wording = { holderName: string; courseTitle: string; programName: string; signerName: string | null; signerTitle: string | null };

/** The holder's e-mail with the PDF attached, in the caller's transaction. */
async function queueCertificateEmail(c: { to: string; wording: Wording; serial: string; issuedAt: Date; validUntil: Date }, transaction: Transaction) {
  const env = getEnv();
  const pdf = await renderCertificatePdf({ ...c.wording, serial: c.serial, issuedAt: c.issuedAt, validUntil: c.validUntil, appUrl: env.APP_URL });
  await enqueueEmail(
    certificateIssuedEmail({
      to: c.to,
      name: c.wording.holderName,
      courseTitle: c.wording.courseTitle,
      serial: c.serial,
      validUntil: c.validUntil,
      verifyUrl: verificationUrl(env.APP_URL, c.serial),
      pdf: { filename: `certificate-${c.serial}.pdf`, contentType: 'application/pdf', contentBase64: Buffer.from(pdf).toString('base64') },
    }),
    { transaction },
  );
}

/**
 * Issues the certificate of one enrollment, at most once. In one transaction: lock the enrollment
 * row, re-check eligibility on fresh data, create the certificate (the unique key on enrollmentId
 * is the last word if two servers race), mark the enrollment completed, write the audit entry and
 * queue the learner's e-mail with the PDF attached. A second call answers 'exists'.
 */
export async function issueCertificate(enrollmentId: number, actorId: number | null, options: { now?: Date } = {}): Promise<IssueOutcome> {
  const { sequelize, Certificate } = db();
  for (let attempt = 0; attempt < 3; attempt++) {
    try {
      return await sequelize.transaction(async (transaction) => {
        const now = options.now ?? new Date();
        // Raw SQL: a row lock only (FOR UPDATE on the id), so two desks issuing at once serialise on the enrollment.
        const locked = await sequelize.query('SELECT id FROM enrollments WHERE id = :enrollmentId FOR UPDATE', {
          replacements: { enrollmentId },
          type: QueryTypes.SELECT,
          transaction,
        });
        if (locked.length === 0) return { enrollmentId, outcome: 'not_found' as const };
        const already = await existing(enrollmentId, transaction);
        if (already) return { enrollmentId, outcome: 'exists' as const, certificateId: already.id, serial: already.serial };

        const standing = (await loadStandings([enrollmentId], { transaction, now })).get(enrollmentId)!;
        if (!standing.eligibility.eligible) return { enrollmentId, outcome: 'not_eligible' as const, missing: standing.eligibility.missing };
        const { row } = standing;
        const serial = generateSerial();
        const validUntil = validUntilFor({ courseSlug: row.courseSlug, validityMonths: row.validityMonths, issuedAt: now, prior: standing.prior });
        // What the certificate says is fixed here: later renames never reach it (a correction is a reissue).
        const wording = {
          holderName: row.learnerName,
          courseTitle: row.courseTitle,
          programName: await programName(transaction),
          ...(await signerFor(actorId, transaction)),
        };
        const certificate = await Certificate.create(
          { enrollmentId, userId: row.userId, issuedById: actorId, serial, issuedAt: now, validUntil, ...wording },
          { transaction },
        );
        // Through the one state machine (it audits the move as well).
        if (row.status === 'active') await transitionEnrollment(enrollmentId, 'completed', { transaction, actorId, reason: 'certificate', data: { serial } });
        await audit(
          {
            actorId,
            action: 'certificate.issued',
            subjectType: 'certificate',
            subjectId: certificate.id,
            data: { enrollmentId, serial, validUntil: validUntil.toISOString() },
          },
          { transaction },
        );
        await queueCertificateEmail({ to: row.learnerEmail, wording, serial, issuedAt: now, validUntil }, transaction);
        return { enrollmentId, outcome: 'issued' as const, certificateId: certificate.id, serial };
      });
    } catch (error) {
      if (!(error instanceof UniqueConstraintError)) throw error;
      // Another server issued it between our check and our insert: the unique key kept one.
      const already = await existing(enrollmentId);
      if (already) return { enrollmentId, outcome: 'exists', certificateId: already.id, serial: already.serial };
      // Otherwise the random serial collided (75 bits: practically never); draw again.
    }
  }
  throw new Error('could not draw a unique serial');
}

/**
 * Corrects an issued certificate by issuing it again: what it said moves to certificate_versions
 * under its old serial (verification shows it as replaced), and the certificate gets a new serial
 * with today's wording (the holder's name as given or as the account has it now, the course title
 * and program name of today, the reissuing coordinator as signer). Its dates stay as certified.
 */
export async function reissueCertificate(
  certificateId: number,
  actorId: number,
  input: { reason: string; holderName?: string | null },
  options: { now?: Date } = {},
) {
  const { sequelize, Certificate, CertificateVersion, User, Course, Enrollment } = db();
  for (let attempt = 0; attempt < 3; attempt++) {
    try {
      return await sequelize.transaction(async (transaction) => {
        const certificate = await Certificate.findByPk(certificateId, { transaction, lock: transaction.LOCK.UPDATE });
        if (!certificate) throw new AppError('not_found', 'There is no certificate with that id.');
        if (certificate.revokedAt) throw new AppError('conflict', 'This certificate was revoked; a revoked certificate is not reissued.');
        const now = options.now ?? new Date();
        const holder = (await User.findByPk(certificate.userId, { attributes: ['name', 'email'], transaction }))!;
        const enrollment = (await Enrollment.findByPk(certificate.enrollmentId, { attributes: ['courseId'], transaction }))!;
        const course = (await Course.findByPk(enrollment.courseId, { attributes: ['title'], transaction }))!;
        const previous = { serial: certificate.serial, version: certificate.version };
        await CertificateVersion.create(
          {
            certificateId: certificate.id,
            version: certificate.version,
            serial: certificate.serial,
            holderName: certificate.holderName,
            courseTitle: certificate.courseTitle,
            programName: certificate.programName,
            signerName: certificate.signerName,
            signerTitle: certificate.signerTitle,
            issuedAt: certificate.issuedAt,
            validUntil: certificate.validUntil,
            replacedAt: now,
            replacedById: actorId,
            reason: input.reason,
          },
          { transaction },
        );
        const wording: Wording = {
          holderName: input.holderName?.trim() || holder.name,
          courseTitle: course.title,
          programName: await programName(transaction),
          ...(await signerFor(actorId, transaction)),
        };
        await certificate.update({ ...wording, serial: generateSerial(), version: certificate.version + 1 }, { transaction });
        await audit(
          {
            actorId,
            action: 'certificate.reissued',
            subjectType: 'certificate',
            subjectId: certificate.id,
            data: { fromSerial: previous.serial, toSerial: certificate.serial, version: certificate.version, reason: input.reason },
          },
          { transaction },
        );
        await queueCertificateEmail(
          { to: holder.email, wording, serial: certificate.serial, issuedAt: certificate.issuedAt, validUntil: certificate.validUntil },
          transaction,
        );
        return { id: certificate.id, serial: certificate.serial, version: certificate.version, replacedSerial: previous.serial };
      });
    } catch (error) {
      // A drawn serial that already exists (75 bits: practically never): draw again.
      if (!(error instanceof UniqueConstraintError)) throw error;
    }
  }
  throw new Error('could not draw a unique serial');
}

/**
 * Issues for many enrollments, a few at a time so the connection pool is shared fairly; every
 * enrollment has its own transaction, so one failure does not undo the others.
 */
export async function issueCertificates(
  enrollmentIds: readonly number[],
  actorId: number | null,
  options: { concurrency?: number; now?: Date } = {},
): Promise<IssueOutcome[]> {
  const ids = [...new Set(enrollmentIds)];
  const results: IssueOutcome[] = new Array(ids.length);
  let next = 0;
  const worker = async () => {
    while (next < ids.length) {
      const index = next++;
      results[index] = await issueCertificate(ids[index], actorId, options);
    }
  };
  await Promise.all(Array.from({ length: Math.min(options.concurrency ?? 4, ids.length) }, worker));
  return results;
}

/** Revokes a certificate with a reason, once; audited, and the learner is told by e-mail. */
export async function revokeCertificate(certificateId: number, actorId: number, reason: string, options: { now?: Date } = {}) {
  const { sequelize, Certificate } = db();
  return sequelize.transaction(async (transaction) => {
    const certificate = await Certificate.findByPk(certificateId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!certificate) throw new AppError('not_found', 'There is no certificate with that id.');
    if (certificate.revokedAt) throw new AppError('conflict', 'This certificate was already revoked.');
    const now = options.now ?? new Date();
    certificate.revokedAt = now;
    certificate.revokeReason = reason;
    await certificate.save({ transaction });
    await audit(
      { actorId, action: 'certificate.revoked', subjectType: 'certificate', subjectId: certificate.id, data: { serial: certificate.serial, reason } },
      { transaction },
    );
    const holder = (await db().User.findByPk(certificate.userId, { attributes: ['email'], transaction }))!;
    await enqueueEmail(
      certificateRevokedEmail({ to: holder.email, name: certificate.holderName, courseTitle: certificate.courseTitle, serial: certificate.serial, reason }),
      { transaction },
    );
    return { id: certificate.id, serial: certificate.serial, revokedAt: now };
  });
}

/**
 * The refresher needs no coordinator: once a learner has done everything it asks, the learner's
 * own request issues its certificate (the flagship course is issued at the desk only).
 */
export async function claimRefresherCertificate(enrollmentId: number, learnerId: number): Promise<IssueOutcome> {
  // Raw SQL: the enrollment's owner and course slug in one join, flat.
  const [row] = await db().sequelize.query<{ userId: number; slug: string }>(
    'SELECT e.userId, c.slug FROM enrollments e JOIN courses c ON c.id = e.courseId WHERE e.id = :enrollmentId',
    { replacements: { enrollmentId }, type: QueryTypes.SELECT },
  );
  if (!row || Number(row.userId) !== learnerId) throw new AppError('not_found', 'You have no such enrollment.');
  if (row.slug !== REFRESHER_COURSE_SLUG)
    throw new AppError('forbidden', 'Only the refresher certificate can be claimed by the learner; the coordinator issues the others.');
  await requireConfirmedAddress(learnerId);
  const outcome = await issueCertificate(enrollmentId, learnerId);
  if (outcome.outcome === 'not_eligible') throw new AppError('conflict', 'The refresher is not complete yet.', { extra: { missing: outcome.missing } });
  return outcome;
}

/** The learner's refresher enrollments that are complete but have no certificate yet. */
export async function claimableRefreshers(learnerId: number): Promise<number[]> {
  // Raw SQL: an anti-join (LEFT JOIN … IS NULL) for enrollments without a certificate, which Sequelize's include expresses less plainly.
  const rows = await db().sequelize.query<{ id: number }>(
    `SELECT e.id FROM enrollments e JOIN courses c ON c.id = e.courseId LEFT JOIN certificates ce ON ce.enrollmentId = e.id
      WHERE e.userId = :learnerId AND c.slug = :slug AND ce.id IS NULL AND e.status IN ('active', 'completed')`,
    { replacements: { learnerId, slug: REFRESHER_COURSE_SLUG }, type: QueryTypes.SELECT },
  );
  const standings = await loadStandings(rows.map((r) => Number(r.id)));
  return [...standings.values()].filter((s) => s.eligibility.eligible).map((s) => s.row.id);
}
