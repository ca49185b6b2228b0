import { parse } from 'csv-parse/sync';
import { beforeEach, describe, expect, it } from 'vitest';
import { GET as rosterRoute } from '@/app/api/desk/roster/route';
import { issueCertificate } from '@/lib/certificates/issue';
import { fetchDeskReports } from '@/lib/desk/reports';
import { createCourses, createUser, resetDatabase } from '../support/db';
import { actAs } from '../support/session';
import { eligibleEnrollment } from '../support/certificate-fixtures';

beforeEach(async () => {
  await resetDatabase();
  actAs(null);
});

describe('GET /api/desk/roster', () => {
  it('exports a CSV with a UTF-8 BOM that parses back to the same names, commas and accents intact', async () => {
    const courses = await createCourses();
    const names = ['Okafor, Adaeze', 'Zoë Brontë-Ångström', 'José "Pepe" Muñoz', '=HYPERLINK("x")'];
    const ids = [];
    for (const name of names) ids.push((await eligibleEnrollment(courses.flagship, { name })).enrollmentId);
    const issued = (await issueCertificate(ids[0], null)) as { serial: string };
    expect((await rosterRoute(new Request('http://localhost/api/desk/roster'), {})).status).toBe(401);
    actAs(await createUser('learner'));
    expect((await rosterRoute(new Request('http://localhost/api/desk/roster'), {})).status).toBe(403);
    actAs(await createUser('coordinator'));

    const response = await rosterRoute(new Request(`http://localhost/api/desk/roster?ids=${ids.join(',')}`), {});
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toBe('text/csv; charset=utf-8');
    expect(response.headers.get('content-disposition')).toMatch(/^attachment; filename="brinewright-roster-\d{4}-\d{2}-\d{2}\.csv"$/);
    const bytes = new Uint8Array(await response.arrayBuffer());
    expect([...bytes.subarray(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
    const records = parse(Buffer.from(bytes), { bom: true, columns: true, skip_empty_lines: true }) as Record<string, string>[];
    expect(records.map((r) => r.Learner)).toEqual(['Okafor, Adaeze', 'Zoë Brontë-Ångström', 'José "Pepe" Muñoz', `'=HYPERLINK("x")`]);
    expect(records[0]).toMatchObject({
      Course: 'Safe Pickling and Water-Bath Canning',
      Eligible: 'certified',
      'Certificate serial': issued.serial,
      'Certificate state': 'valid',
    });
    expect(records[1]).toMatchObject({ Eligible: 'yes', 'Certificate serial': '', Missing: '' });

    const filtered = await rosterRoute(new Request('http://localhost/api/desk/roster?eligible=certified'), {});
    const only = parse(Buffer.from(await filtered.arrayBuffer()), { bom: true, columns: true }) as Record<string, string>[];
    expect(only.map((r) => r.Learner)).toEqual(['Okafor, Adaeze']);
    expect((await rosterRoute(new Request('http://localhost/api/desk/roster?ids=1,x'), {})).status).toBe(400);
  });
});

describe('fetchDeskReports', () => {
  it('counts enrollments by status, completion per workshop, certificates per month and fees', async () => {
    const courses = await createCourses();
    const a = await eligibleEnrollment(courses.flagship);
    await eligibleEnrollment(courses.flagship, { workshopId: a.workshopId, skip: { practical: true } });
    const now = new Date();
    await issueCertificate(a.enrollmentId, null, { now });
    const r = await fetchDeskReports({ now });
    expect(r.byStatus).toEqual([
      { status: 'awaiting_payment', count: 0 },
      { status: 'active', count: 1 },
      { status: 'completed', count: 1 },
      { status: 'withdrawn', count: 0 },
    ]);
    expect(r.workshops).toHaveLength(1);
    expect(r.workshops[0]).toMatchObject({ enrolled: 2, completed: 1, certified: 1, completionPct: 50 });
    expect(r.certificatesByMonth).toHaveLength(12);
    expect(r.certificatesByMonth.at(-1)).toMatchObject({ issued: 1, revoked: 0 });
    // Two paid fees of 45.00 USD this month (certificate-fixtures), none refunded.
    expect(r.feeTotals).toEqual([{ currency: 'usd', collectedCents: 9000, refundedCents: 0, netCents: 9000 }]);
  });
});
