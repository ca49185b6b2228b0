import 'server-only';
import { QueryTypes, UniqueConstraintError, type Transaction } from 'sequelize';
import { audit } from '@/lib/audit';
import { enqueueEmail } from '@/lib/email/outbox';
import { getEnv } from '@/lib/env';
import { AppError } from '@/lib/errors';
import { db } from '@/models';
import { certificateIssuedEmail, certificateRevokedEmail } from '@/lib/email/templates';
import { transitionEnrollment } from '@/lib/enrollment/state';
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

export const programName = () => getEnv().CERTIFICATE_PROGRAM_NAME;

async function existing(enrollmentId: number, transaction?: Transaction) {
  const [row] = await db().sequelize.query<{ id: number; serial: string }>('SELECT id, serial FROM certificates WHERE enrollmentId = :enrollmentId', {
    replacements: { enrollmentId },
    type: QueryTypes.SELECT,
    transaction,
  });
  return row ? { id: Number(row.id), serial: row.serial } : null;
}

/**
 * Issues the certificate of one enrollment, at most once. In one transaction: lock the enrollment
 * row, re-check eligibility on fresh data, create the certificate (the unique key on enrollmentId
 * is the last word if two servers race), mark the enrollment completed, write the audit entry and
 * queue the learner's e-mail with the PDF attached. A second call answers 'exists'.
 */
export async function issueCertificate(enrollmentId: number, actorId: number | null, options: { now?: Date } = {}): Promise<IssueOutcome> {
  const { sequelize, Certificate } = db();
  const env = getEnv();
  for (let attempt = 0; attempt < 3; attempt++) {
    try {
      return await sequelize.transaction(async (transaction) => {
        const now = options.now ?? new Date();
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
        const certificate = await Certificate.create(
          { enrollmentId, userId: row.userId, issuedById: actorId, serial, issuedAt: now, validUntil },
          { transaction },
        );
        // Through the one state machine (it audits the move as well).
        if (row.status === 'active') await transitionEnrollment(enrollmentId, 'completed', { transaction, actorId, reason: 'certificate', data: { serial } });
        await audit(
          { actorId, action: 'certificate.issued', subjectType: 'certificate', subjectId: certificate.id, data: { enrollmentId, serial, validUntil: validUntil.toISOString() } },
          { transaction },
        );
        const pdf = await renderCertificatePdf({
          learnerName: row.learnerName,
          courseTitle: row.courseTitle,
          programName: env.CERTIFICATE_PROGRAM_NAME,
          serial,
          issuedAt: now,
          validUntil,
          appUrl: env.APP_URL,
        });
        await enqueueEmail(
          certificateIssuedEmail({
            to: row.learnerEmail,
            name: row.learnerName,
            courseTitle: row.courseTitle,
            serial,
            validUntil,
            verifyUrl: verificationUrl(env.APP_URL, serial),
            pdf: { filename: `certificate-${serial}.pdf`, contentType: 'application/pdf', contentBase64: Buffer.from(pdf).toString('base64') },
          }),
          { transaction },
        );
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
 * Issues for many enrollments, a few at a time so the connection pool is shared fairly; every
 * enrollment has its own transaction, so one failure does not undo the others.
 */
export async function issueCertificates(enrollmentIds: readonly number[], actorId: number | null, options: { concurrency?: number; now?: Date } = {}): Promise<IssueOutcome[]> {
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
    await audit({ actorId, action: 'certificate.revoked', subjectType: 'certificate', subjectId: certificate.id, data: { serial: certificate.serial, reason } }, { transaction });
    const [info] = await sequelize.query<{ name: string; email: string; title: string }>(
      'SELECT u.name, u.email, c.title FROM enrollments e JOIN users u ON u.id = e.userId JOIN courses c ON c.id = e.courseId WHERE e.id = :id',
      { replacements: { id: certificate.enrollmentId }, type: QueryTypes.SELECT, transaction },
    );
    await enqueueEmail(certificateRevokedEmail({ to: info.email, name: info.name, courseTitle: info.title, serial: certificate.serial, reason }), { transaction });
    return { id: certificate.id, serial: certificate.serial, revokedAt: now };
  });
}

/**
 * The refresher needs no coordinator: once a learner has done everything it asks, the learner's
 * own request issues its certificate (the flagship course is issued at the desk only).
 */
export async function claimRefresherCertificate(enrollmentId: number, learnerId: number): Promise<IssueOutcome> {
  const [row] = await db().sequelize.query<{ userId: number; slug: string }>(
    'SELECT e.userId, c.slug FROM enrollments e JOIN courses c ON c.id = e.courseId WHERE e.id = :enrollmentId',
    { replacements: { enrollmentId }, type: QueryTypes.SELECT },
  );
  if (!row || Number(row.userId) !== learnerId) throw new AppError('not_found', 'You have no such enrollment.');
  if (row.slug !== REFRESHER_COURSE_SLUG) throw new AppError('forbidden', 'Only the refresher certificate can be claimed by the learner; the coordinator issues the others.');
  const outcome = await issueCertificate(enrollmentId, learnerId);
  if (outcome.outcome === 'not_eligible') throw new AppError('conflict', 'The refresher is not complete yet.', { extra: { missing: outcome.missing } });
  return outcome;
}

/** The learner's refresher enrollments that are complete but have no certificate yet. */
export async function claimableRefreshers(learnerId: number): Promise<number[]> {
  const rows = await db().sequelize.query<{ id: number }>(
    `SELECT e.id FROM enrollments e JOIN courses c ON c.id = e.courseId LEFT JOIN certificates ce ON ce.enrollmentId = e.id
      WHERE e.userId = :learnerId AND c.slug = :slug AND ce.id IS NULL AND e.status IN ('active', 'completed')`,
    { replacements: { learnerId, slug: REFRESHER_COURSE_SLUG }, type: QueryTypes.SELECT },
  );
  const standings = await loadStandings(rows.map((r) => Number(r.id)));
  return [...standings.values()].filter((s) => s.eligibility.eligible).map((s) => s.row.id);
}
