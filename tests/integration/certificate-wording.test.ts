// An issued certificate says what it said on the day: later renames reach it only through a reissue.
import { PDFParse } from 'pdf-parse';
import { beforeEach, describe, expect, it } from 'vitest';
import { GET as pdfRoute } from '@/app/api/certificates/[serial]/pdf/route';
import { POST as reissueRoute } from '@/app/api/desk/certificates/[id]/reissue/route';
import { issueCertificate } from '@/lib/certificates/issue';
import { verifySerial } from '@/lib/certificates/lookup';
import { db } from '@/models';
import { createCourses, createUser, resetDatabase } from '../support/db';
import { jsonRequest, params } from '../support/request';
import { actAs } from '../support/session';
import { eligibleEnrollment } from '../support/certificate-fixtures';

let courses: Awaited<ReturnType<typeof createCourses>>;

beforeEach(async () => {
  await resetDatabase();
  actAs(null);
  courses = await createCourses();
});

async function pdfText(serial: string): Promise<string> {
  const response = await pdfRoute(new Request(`http://localhost/api/certificates/${serial}/pdf`), params({ serial }));
  expect(response.status).toBe(200);
  const parser = new PDFParse({ data: new Uint8Array(await response.arrayBuffer()) });
  try {
    return (await parser.getText()).text;
  } finally {
    await parser.destroy();
  }
}

async function issued(name: string) {
  const coordinator = await createUser('coordinator', { name: 'Priya Coordinator' });
  const { enrollmentId, userId } = await eligibleEnrollment(courses.flagship, { name });
  const outcome = await issueCertificate(enrollmentId, coordinator.id);
  if (outcome.outcome !== 'issued') throw new Error(`not issued: ${outcome.outcome}`);
  return { coordinator, userId, certificateId: outcome.certificateId, serial: outcome.serial };
}

describe('what an issued certificate says', () => {
  it('stores the holder, course, program and signer at issue; renames afterwards change neither the verification nor the PDF', async () => {
    const { coordinator, userId, certificateId, serial } = await issued('Ada Lindqvist');
    const cert = (await db().Certificate.findByPk(certificateId))!;
    expect({
      holderName: cert.holderName,
      courseTitle: cert.courseTitle,
      programName: cert.programName,
      signerName: cert.signerName,
      signerTitle: cert.signerTitle,
      version: cert.version,
    }).toEqual({
      holderName: 'Ada Lindqvist',
      courseTitle: 'Safe Pickling and Water-Bath Canning',
      programName: process.env.CERTIFICATE_PROGRAM_NAME ?? 'Cedar Hollow County home-preserving program',
      signerName: 'Priya Coordinator',
      signerTitle: 'Program coordinator',
      version: 1,
    });

    await db().User.update({ name: 'Ada Renamed' }, { where: { id: userId } });
    await db().Course.update({ title: 'A Retitled Course' }, { where: { id: courses.flagship.id } });
    const check = await verifySerial(serial);
    expect(check).toMatchObject({ found: true, learnerName: 'Ada Lindqvist', courseTitle: 'Safe Pickling and Water-Bath Canning', replaced: null });

    actAs(coordinator);
    const text = await pdfText(serial);
    expect(text).toContain('Ada Lindqvist');
    expect(text).toContain('Safe Pickling and Water-Bath Canning');
    expect(text).toContain('Signed by Priya Coordinator, Program coordinator');
    expect(text).not.toContain('Ada Renamed');
  });

  it('a correction is a reissue: a new serial and version, the old serial verifies as replaced, with what it said', async () => {
    const { coordinator, userId, certificateId, serial: first } = await issued('Ada Lindqvst');
    await db().User.update({ name: 'Ada Lindqvist' }, { where: { id: userId } });

    actAs(coordinator);
    const response = await reissueRoute(
      jsonRequest(`/api/desk/certificates/${certificateId}/reissue`, { reason: 'Misspelt surname' }),
      params({ id: String(certificateId) }),
    );
    expect(response.status).toBe(200);
    const { certificate } = (await response.json()) as { certificate: { serial: string; version: number; replacedSerial: string } };
    expect(certificate.version).toBe(2);
    expect(certificate.replacedSerial).toBe(first);
    expect(certificate.serial).not.toBe(first);

    const current = await verifySerial(certificate.serial);
    expect(current).toMatchObject({ found: true, state: 'valid', learnerName: 'Ada Lindqvist', replaced: null });
    const old = await verifySerial(first);
    expect(old).toMatchObject({ found: true, learnerName: 'Ada Lindqvst', replaced: { bySerial: certificate.serial } });
    // The dates certified do not move with a correction.
    expect(old.found && current.found && old.validUntil === current.validUntil && old.issuedAt === current.issuedAt).toBe(true);

    expect(await pdfText(certificate.serial)).toContain('Ada Lindqvist');
    const oldPdf = await pdfRoute(new Request(`http://localhost/api/certificates/${first}/pdf`), params({ serial: first }));
    expect(oldPdf.status).toBe(404);
    const auditRow = await db().AuditLog.findOne({ where: { action: 'certificate.reissued' } });
    expect(auditRow!.data).toEqual({ fromSerial: first, toSerial: certificate.serial, version: 2, reason: 'Misspelt surname' });
    expect(await db().OutboxEmail.count({ where: { kind: 'certificate.issued' } })).toBe(2);
  });

  it('refuses to reissue a revoked certificate, a learner, and a bad body', async () => {
    const { coordinator, certificateId } = await issued('Ada Lindqvist');
    await db().Certificate.update({ revokedAt: new Date(), revokeReason: 'test' }, { where: { id: certificateId } });
    actAs(coordinator);
    const revoked = await reissueRoute(
      jsonRequest(`/api/desk/certificates/${certificateId}/reissue`, { reason: 'Misspelt surname' }),
      params({ id: String(certificateId) }),
    );
    expect(revoked.status).toBe(409);
    const bad = await reissueRoute(jsonRequest(`/api/desk/certificates/${certificateId}/reissue`, { reason: 'x' }), params({ id: String(certificateId) }));
    expect(bad.status).toBe(400);
    actAs(await createUser('learner'));
    const learner = await reissueRoute(
      jsonRequest(`/api/desk/certificates/${certificateId}/reissue`, { reason: 'Misspelt surname' }),
      params({ id: String(certificateId) }),
    );
    expect(learner.status).toBe(403);
    expect(await db().CertificateVersion.count()).toBe(0);
  });
});
