import 'server-only';
import { QueryTypes } from 'sequelize';
import { getEnv } from '@/lib/env';
import { AppError } from '@/lib/errors';
import { pruneThrottles, take } from '@/lib/throttle';
import { roleAllows } from '@/lib/roles';
import type { SessionUser } from '@/lib/auth/users';
import { db } from '@/models';
import { renderCertificatePdf } from './pdf';
import { normalizeSerial } from './serial';
import { certificateState, type CertificateState } from './validity';

/** What the public verification shows: the state, the name, the course and the dates, nothing more. */
export type Verification =
  | { found: false; serial: string; reason: 'malformed' | 'unknown' }
  | {
      found: true;
      serial: string;
      state: CertificateState;
      learnerName: string;
      courseTitle: string;
      programName: string;
      issuedAt: string;
      validUntil: string;
      revokedAt: string | null;
      /** Set when this serial is an earlier wording, corrected by a reissue under `bySerial`. */
      replaced: { at: string; bySerial: string } | null;
    };

type CertificateRecord = {
  id: number;
  serial: string;
  userId: number;
  issuedAt: Date;
  validUntil: Date;
  revokedAt: Date | null;
  holderName: string;
  courseTitle: string;
  programName: string;
  signerName: string | null;
  signerTitle: string | null;
  replacedAt: Date | null;
  /** The current serial, when this one was replaced by a reissue. */
  currentSerial: string;
};

// Only what was stored at issue: the holder's or the course's name today does not matter.
const STORED = 'ce.id, ce.userId, ce.issuedAt, ce.validUntil, ce.revokedAt, ce.serial AS currentSerial';
const WORDING = 'holderName, courseTitle, programName, signerName, signerTitle';

async function findBySerial(serial: string, legacy = false): Promise<CertificateRecord | null> {
  // An imported certificate is also found by the serial of the program's earlier records.
  // Raw SQL: one UNION ALL over certificates and their replaced versions answers either serial in one round trip.
  const [row] = await db().sequelize.query<CertificateRecord>(
    `SELECT ${STORED}, ce.serial, ${WORDING.split(', ')
      .map((f) => `ce.${f}`)
      .join(', ')}, NULL AS replacedAt FROM certificates ce WHERE ce.${legacy ? 'legacySerial' : 'serial'} = :serial
     UNION ALL
     SELECT ${STORED}, v.serial, ${WORDING.split(', ')
       .map((f) => `v.${f}`)
       .join(', ')}, v.replacedAt FROM certificate_versions v JOIN certificates ce ON ce.id = v.certificateId WHERE v.serial = :serial
     LIMIT 1`,
    { replacements: { serial }, type: QueryTypes.SELECT },
  );
  if (!row) return null;
  const d = (v: unknown) => (v === null ? null : new Date(v as string));
  return {
    ...row,
    id: Number(row.id),
    userId: Number(row.userId),
    issuedAt: d(row.issuedAt)!,
    validUntil: d(row.validUntil)!,
    revokedAt: d(row.revokedAt),
    replacedAt: d(row.replacedAt),
  };
}

/** Looks a serial up for the public check; no throttle (see verifyForAddress). */
export async function verifySerial(input: string, now: Date = new Date()): Promise<Verification> {
  const serial = normalizeSerial(input);
  const old = input.trim().slice(0, 40);
  const cert = (serial ? await findBySerial(serial) : null) ?? (old ? await findBySerial(old, true) : null);
  if (!cert) return serial ? { found: false, serial, reason: 'unknown' } : { found: false, serial: input.slice(0, 40), reason: 'malformed' };
  return {
    found: true,
    serial: serial && cert ? serial : old,
    state: certificateState(cert, now),
    learnerName: cert.holderName,
    courseTitle: cert.courseTitle,
    programName: cert.programName,
    issuedAt: cert.issuedAt.toISOString(),
    validUntil: cert.validUntil.toISOString(),
    revokedAt: cert.revokedAt?.toISOString() ?? null,
    replaced: cert.replacedAt ? { at: cert.replacedAt.toISOString(), bySerial: cert.currentSerial } : null,
  };
}

/**
 * The public check, throttled per client address (VERIFY_MAX_PER_ADDRESS per VERIFY_WINDOW_MINUTES,
 * counted in MariaDB): throws AppError 429 with retryAfterSeconds when the address is over.
 */
export async function verifyForAddress(input: string, address: string, now: Date = new Date()): Promise<Verification> {
  const env = getEnv();
  const limit = await take([{ bucket: `verify:${address}`, max: env.VERIFY_MAX_PER_ADDRESS, windowSeconds: env.VERIFY_WINDOW_MINUTES * 60 }], now);
  // Housekeeping now and then: windows that ended a day ago are of no use to anyone.
  if (Math.random() < 0.01) await pruneThrottles(86_400, now);
  if (!limit.allowed) {
    throw new AppError('rate_limit', 'Too many certificate checks from your address. Please wait a few minutes and try again.', {
      extra: { retryAfterSeconds: limit.retryAfterSeconds },
    });
  }
  return verifySerial(input, now);
}

/**
 * The PDF of a certificate for a signed-in viewer: its owner, or a coordinator or admin.
 * Others get 404, so the existence of a serial is not revealed to them.
 */
export async function certificatePdfFor(serialInput: string, viewer: SessionUser): Promise<{ serial: string; pdf: Uint8Array }> {
  const serial = normalizeSerial(serialInput);
  const cert = serial ? await findBySerial(serial) : null;
  const staff = roleAllows(viewer.roles, ['coordinator']);
  // An earlier wording is not handed out again: the current serial's PDF replaces it.
  if (!cert || cert.replacedAt || (!staff && cert.userId !== viewer.id))
    throw new AppError('not_found', 'There is no certificate with that serial for your account.');
  if (cert.revokedAt && !staff) throw new AppError('conflict', 'This certificate was revoked, so it can no longer be downloaded.');
  const env = getEnv();
  const pdf = await renderCertificatePdf({
    holderName: cert.holderName,
    courseTitle: cert.courseTitle,
    programName: cert.programName,
    signerName: cert.signerName,
    signerTitle: cert.signerTitle,
    serial: cert.serial,
    issuedAt: cert.issuedAt,
    validUntil: cert.validUntil,
    appUrl: env.APP_URL,
  });
  return { serial: cert.serial, pdf };
}

export type LearnerCertificate = {
  id: number;
  serial: string;
  courseSlug: string;
  courseTitle: string;
  issuedAt: Date;
  validUntil: Date;
  revokedAt: Date | null;
  state: CertificateState;
};

/** A learner's certificates, newest first, for the Pantry. */
export async function fetchLearnerCertificates({ userId, now = new Date() }: { userId: number; now?: Date }): Promise<LearnerCertificate[]> {
  // Raw SQL: a three-table join read as flat rows (the course slug beside each certificate), no model instances needed.
  const rows = await db().sequelize.query<Omit<LearnerCertificate, 'state'>>(
    `SELECT ce.id, ce.serial, c.slug AS courseSlug, ce.courseTitle, ce.issuedAt, ce.validUntil, ce.revokedAt
       FROM certificates ce JOIN enrollments e ON e.id = ce.enrollmentId JOIN courses c ON c.id = e.courseId
      WHERE ce.userId = :userId ORDER BY ce.issuedAt DESC`,
    { replacements: { userId }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => {
    const cert = {
      ...r,
      id: Number(r.id),
      issuedAt: new Date(r.issuedAt),
      validUntil: new Date(r.validUntil),
      revokedAt: r.revokedAt ? new Date(r.revokedAt) : null,
    };
    return { ...cert, state: certificateState(cert, now) };
  });
}
