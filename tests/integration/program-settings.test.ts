// The program's identity: the admin's page (its two route handlers), the logo, and where the name appears.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import sharp from 'sharp';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { GET as logoRoute, POST as uploadLogo } from '@/app/api/program/logo/route';
import { GET as programRoute, POST as saveProgram } from '@/app/api/program/route';
import { issueCertificate } from '@/lib/certificates/issue';
import { getEnv } from '@/lib/env';
import { getProgramIdentity } from '@/lib/program/settings';
import { diskDriver, setStorage } from '@/lib/storage';
import { db } from '@/models';
import { createCourses, createUser, resetDatabase } from '../support/db';
import { jsonRequest } from '../support/request';
import { actAs } from '../support/session';
import { eligibleEnrollment } from '../support/certificate-fixtures';

const root = fs.mkdtempSync(path.join(os.tmpdir(), 'brinewright-program-'));
setStorage(diskDriver(root));
afterAll(() => {
  setStorage(undefined);
  fs.rmSync(root, { recursive: true, force: true });
});

const save = (fields: Record<string, string>) => saveProgram(jsonRequest('/api/program', fields), {} as never);

function upload(logo: Buffer): Promise<Response> {
  const data = new FormData();
  data.set('logo', new File([new Uint8Array(logo)], 'logo.png', { type: 'image/png' }));
  return uploadLogo(new Request('http://localhost:3000/api/program/logo', { method: 'POST', body: data }), {} as never);
}

const UPPER_FORK = {
  name: 'Upper Fork County home-preserving program',
  shortName: 'Upper Fork Preserving',
  contactEmail: 'Preserving@UpperFork.example',
  contactPhone: '(555) 010-2290',
  postalAddress: '220 Aspen Street, Upper Fork',
  timeZone: 'America/Boise',
};

beforeEach(async () => {
  await resetDatabase();
  actAs(null);
});

describe('program settings', () => {
  it('falls back to CERTIFICATE_PROGRAM_NAME before an admin fills the page in', async () => {
    expect(await getProgramIdentity()).toMatchObject({ name: getEnv().CERTIFICATE_PROGRAM_NAME, shortName: null, configured: false });
    expect(await (await programRoute(new Request('http://localhost/api/program'), {} as never)).json()).toMatchObject({
      name: getEnv().CERTIFICATE_PROGRAM_NAME,
      shortName: null,
      logo: null,
    });
  });

  it('saves the page with a logo re-encoded as a PNG of at most 256 px, audited; the header route, certificates and e-mails use it', async () => {
    const admin = await createUser('admin');
    actAs(admin);
    // A 1200 x 600 JPEG with EXIF: the stored logo must be a 256 x 128 PNG without it.
    const jpeg = await sharp({ create: { width: 1200, height: 600, channels: 3, background: '#2a6b55' } })
      .jpeg()
      .withMetadata({ exif: { IFD0: { Copyright: 'camera data' } } })
      .toBuffer();
    const saved = await save(UPPER_FORK);
    expect(saved.status).toBe(200);
    expect((await upload(jpeg)).status).toBe(201);

    const program = await getProgramIdentity();
    expect(program).toMatchObject({ ...UPPER_FORK, contactEmail: 'preserving@upperfork.example', configured: true });
    const logo = await logoRoute(new Request('http://localhost/api/program/logo'), {} as never);
    expect(logo.headers.get('content-type')).toBe('image/png');
    const bytes = Buffer.from(await logo.arrayBuffer());
    const meta = await sharp(bytes).metadata();
    expect({ format: meta.format, width: meta.width, height: meta.height, exif: meta.exif }).toEqual({
      format: 'png',
      width: 256,
      height: 128,
      exif: undefined,
    });
    const audit = await db().AuditLog.findOne({ where: { action: 'program.settings_saved' } });
    expect(audit).toMatchObject({ actorId: admin.id, subjectType: 'program' });
    expect((audit!.data as { changed: string[] }).changed.sort()).toEqual(Object.keys(UPPER_FORK).sort());
    expect(await db().AuditLog.findOne({ where: { action: 'program.logo_saved' } })).toMatchObject({ actorId: admin.id, subjectType: 'program' });
    expect(await (await programRoute(new Request('http://localhost/api/program'), {} as never)).json()).toMatchObject({
      shortName: 'Upper Fork Preserving',
      logo: expect.stringMatching(/^\/api\/program\/logo\?v=/),
    });

    const courses = await createCourses();
    const { enrollmentId } = await eligibleEnrollment(courses.flagship);
    await issueCertificate(enrollmentId, admin.id);
    expect((await db().Certificate.findOne({ where: { enrollmentId } }))!.programName).toBe('Upper Fork County home-preserving program');
    const mail = (await db().OutboxEmail.findOne({ where: { kind: 'certificate.issued' } }))!;
    expect(mail.textBody).toContain('Upper Fork County home-preserving program\npreserving@upperfork.example\n(555) 010-2290\n220 Aspen Street, Upper Fork');
    expect(mail.htmlBody).toContain('Upper Fork County home-preserving program<br>preserving@upperfork.example');
  });

  it('refuses bad fields and a file that is not an image, keeping what was saved', async () => {
    actAs(await createUser('admin'));
    const bad = await save({ ...UPPER_FORK, contactEmail: 'not-an-address', timeZone: 'Mars/Olympus' });
    expect(bad.status).toBe(400);
    const { fields } = (await bad.json()) as { fields: Record<string, string[]> };
    expect(fields.contactEmail?.[0]).toMatch(/valid e-mail/);
    expect(fields.timeZone?.[0]).toMatch(/time-zone name/);
    // A logo before the program has a name has nowhere to go.
    const png = await sharp({ create: { width: 20, height: 20, channels: 3, background: '#2a6b55' } })
      .png()
      .toBuffer();
    const early = await upload(png);
    expect([early.status, ((await early.json()) as { fields: Record<string, string[]> }).fields.logo]).toEqual([409, ['Save the program’s name first.']]);
    expect(await db().ProgramSetting.count()).toBe(0);

    expect((await save(UPPER_FORK)).status).toBe(200);
    const notImage = await upload(Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"></svg>'));
    expect(notImage.status).toBe(400);
    expect(((await notImage.json()) as { fields: Record<string, string[]> }).fields.logo).toEqual(['Not a PNG, JPEG or WebP image.']);
    expect((await getProgramIdentity()).logoKey).toBeNull();
  });
});
